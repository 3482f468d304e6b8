/** Words the vehicle screens print: kinds, verdicts, and the line every vehicle view carries. */
import type { VehicleKind } from '@/shared/schemas/vehicle';
import type { FieldCode, RuleSetId, Verdict } from '@/shared/vehicle';

export const KIND_LABELS: Record<VehicleKind, string> = {
  'car-van': 'Car or van',
  'bus-coach': 'Bus or coach',
  'rigid-truck': 'Rigid truck',
  'tractor-unit': 'Tractor unit',
  'school-bus': 'School bus',
  'site-machine': 'Site machine',
};

export const VERDICT_WORDS: Record<Verdict, string> = {
  pass: 'Passes',
  short: 'Short',
  'no-verdict': 'No verdict',
};

/** The regulation's class for a field (the open standard's term), or what stands in for it. */
export const FIELD_CLASS: Record<FieldCode, string> = {
  'un-ii': 'II',
  'un-iii': 'III',
  'un-iv': 'IV',
  'un-v': 'V',
  'un-v-extended': 'V (extended)',
  'un-vi': 'VI',
  'us-driver-strip': 'Driver side',
  'iso-boundary-1m': '1 m boundary',
  'iso-circle-12m': '12 m circle',
  user: 'Own field',
};

/** Shown with the cautions wherever vehicle fields are shown (product decision). */
export const PLANNING_LINE =
  'The fields shown are for planning: the vehicle’s type approval and the local rules decide which fields a mirror must show and whether it does.';

export const RULE_SET_ORDER: readonly RuleSetId[] = ['eu-retrofit', 'un-r46', 'fmvss-111', 'iso-5006'];
/** Short names for the rule-set chips; the full title and description come from RULE_SETS. */
export const RULE_SET_SHORT: Record<RuleSetId, string> = {
  'eu-retrofit': 'EU retrofit (trucks)',
  'un-r46': 'UN R46',
  'fmvss-111': 'US FMVSS 111',
  'iso-5006': 'ISO 5006 (machines)',
};
