/**
 * Vehicle jobs, pure: the ground fields published rules ask a vehicle's mirrors to show, and
 * their scoring through the optics engine. No React, no server, no ORM.
 */
export { EYE_OFFSETS, OCULAR_SEPARATION_M, eyeMidpointM } from './eye';
export type { Side, VehicleGeometry } from './geometry';
export { bodyWalls, boxAt, otherSide, sideSign, vehicleGeometry } from './geometry';
export type { FieldChoice, FieldCode, FieldOptions, FieldSpec, RuleSetId, StatusMark, VehicleField } from './fields';
export {
  FIELD_SPECS,
  HORIZON_SCORED_TO_M,
  ISO_CIRCLE_BAND_M,
  RULE_SETS,
  STATUS_MARK_MEANING,
  defaultRuleSet,
  fieldPolygon,
  libraryField,
  ruleSetChoices,
  vehicleFields,
} from './fields';
export type { FieldScore, ScoreInput, TraceAccuracy, VehicleMirror, VehicleScore, Verdict } from './score';
export { VEHICLE_ACCURACY, eyesFor, mirrorFootprint, scoreVehicle, verdictFor } from './score';
export type { TargetView } from './targets';
export { angleInsideOutline, cylinderSamples, targetView } from './targets';
export type { MirrorClass, MountingNote } from './mounting';
export { LOW_MIRROR_M, MAX_PROJECTION_M, MIN_RADIUS_M, mirrorExtent, mountingNotes } from './mounting';
export { mirrorAzimuthAcross, mirrorPoseAcross, mirrorVehicleAcross, remapServedFieldIds } from './handedness';
export type { FieldCriteria } from './criteria';
export { fieldCriteria, fieldGrid } from './criteria';
