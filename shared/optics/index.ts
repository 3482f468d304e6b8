/**
 * Sightfan optics engine: the public contract. SI inside (metres, radians); z up, floor z = 0.
 * Pure TypeScript; runs in the browser, the server and tests alike.
 */
export type { Vec3 } from '../geometry/vec3';
export { reflect } from '../geometry/vec3';
export type { Pair, Ring, Polygon, MultiPolygon } from '../geometry/polygon';
export { multiPolygonArea, polygonArea, pointInMultiPolygon, isSimpleRing } from '../geometry/polygon';
export { OpticsInputError } from './errors';
export type { Mirror } from './mirror';
export { checkMirror, domeMountTiltRad, sphereRadiusM } from './mirror';
export type { Pose } from './pose';
export { poseFromAim, aimOfPose } from './pose';
export type { ConvexImage, PerceivedDistance } from './paraxial';
export { ARCMIN_RAD, convexImage, focalLength, paraxialAngle, perceivedDistance, recognisableRange, sagitta } from './paraxial';
export { fieldOfView, rimSqueeze, reflectedRimAngle } from './field-of-view';
export type { CoverageInput, CoverageResult } from './coverage';
export { coverage } from './coverage';
export type { FanRay } from './fan';
export { fanRays } from './fan';
export type { Wall } from './walls';
export type { Visibility, VisibilityInput } from './visibility';
export { apparentAngle, visibleInMirror } from './visibility';
export { sphereReflectionPoint } from './alhazen';
export { checkZone, zoneCoverage } from './zones';
export type { MountFace } from './mount';
export { vertexOnFace } from './mount';
export type { Aim, CatalogueItem, MountPoint, RankFigures, RankInput, RankedOption, Target } from './rank';
export { defaultAims, rankOptions, rankOrder } from './rank';
