/** Words the vehicle screens print: kinds, verdicts, and the line every vehicle view carries. */
import type { VehicleKind } from '@/shared/schemas/vehicle';
import { vehicleFieldClass, verdictText } from '@/shared/project-optics';
import type { FieldCode, RuleSetId, Verdict } from '@/shared/vehicle';

export const KIND_LABELS: Record<VehicleKind, string> = {
  'car-van': 'Car or van',
  'bus-coach': 'Bus or coach',
  'rigid-truck': 'Rigid truck',
  'tractor-unit': 'Tractor unit',
  'school-bus': 'School bus',
  'site-machine': 'Site machine',
};

/** The shared verdict words (shared/project-optics verdictText), capitalised for a badge. */
export const verdictWord = (v: Verdict): string => {
  const t = verdictText(v);
  return t.charAt(0).toUpperCase() + t.slice(1);
};

/** Short names for fields that have no regulation class, for labels on the top view. */
const NO_CLASS_LABEL: Partial<Record<FieldCode, string>> = {
  'us-driver-strip': 'Strip',
  'iso-boundary-1m': '1 m band',
  'iso-circle-12m': '12 m ring',
  user: 'Own',
};

/** A field's short label: its regulation class (shared vehicleFieldClass), else our short name. */
export const fieldLabel = (code: FieldCode): string => NO_CLASS_LABEL[code] ?? vehicleFieldClass(code);

/** Shown with the cautions wherever vehicle fields are shown: the sheet's sentence (shared/cautions.ts). */
export { VEHICLE_FIELDS_NOTE as PLANNING_LINE } from '@/shared/cautions';

export const RULE_SET_ORDER: readonly RuleSetId[] = ['eu-retrofit', 'un-r46', 'fmvss-111', 'iso-5006'];
/** Short names for the rule-set chips; the full title and description come from RULE_SETS. */
export const RULE_SET_SHORT: Record<RuleSetId, string> = {
  'eu-retrofit': 'EU retrofit (trucks)',
  'un-r46': 'UN R46',
  'fmvss-111': 'US FMVSS 111',
  'iso-5006': 'ISO 5006 (machines)',
};
