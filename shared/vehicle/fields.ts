/**
 * The library of ground fields that published rules ask a vehicle's mirrors to show, as
 * functions of the vehicle's dimensions. Every field carries its rule, a status mark for its
 * geometry and a one-line description. Marks (docs/vehicle-sources.md): [P] found in published
 * text, [M] from memory and fairly sure, [M?] from memory and unsure, [D] derived here.
 *
 * Frame: plan x forward from the front bumper, y left, metres. A field "on side S" is given in
 * the rules as (x, u): x forward from the ground point under the midpoint of the ocular points,
 * u ≥ 0 outboard from a side line (the vehicle's outer side or the cab's side).
 */
import type { Pair, Polygon, Ring } from '../geometry/polygon';
import type { Vehicle, VehicleKind, VehicleRuleSet } from '../schemas/vehicle';
import { otherSide, sideSign, vehicleGeometry, type Side, type VehicleGeometry } from './geometry';

export type StatusMark = 'P' | 'M' | 'M?' | 'D';
/** What each mark means, in the words screens and sheets print beside it. */
export const STATUS_MARK_MEANING: Record<StatusMark, string> = {
  P: 'found in published text',
  M: 'from memory, fairly sure',
  'M?': 'from memory, unsure',
  D: 'derived here',
};

export type FieldCode =
  'un-ii' | 'un-iii' | 'un-iv' | 'un-v' | 'un-v-extended' | 'un-vi' | 'us-driver-strip' | 'iso-boundary-1m' | 'iso-circle-12m' | 'user';

export type FieldSpec = {
  code: Exclude<FieldCode, 'user'>;
  /** The open standard's own name for the field. */
  title: string;
  rule: string;
  /** The weakest mark among the figures that shape the field. */
  status: StatusMark;
  /** Which figures carry which mark, in one sentence. */
  basis: string;
  description: string;
  /** Whether what either eye sees counts ('both' ocular points) or one eye point. */
  eyes: 'both' | 'one';
  /** Runs to the horizon in the rule; scored only to the stated far distance. */
  toHorizon: boolean;
};

export const FIELD_SPECS: Record<Exclude<FieldCode, 'user'>, FieldSpec> = {
  'un-ii': {
    code: 'un-ii',
    title: 'Class II (main exterior)',
    rule: 'UN Regulation No. 46',
    status: 'M',
    basis: 'Widths 1 m and 5 m and distances 4 m and 30 m from memory [M].',
    description: 'A strip 1 m wide beside the vehicle from 4 m behind the eyes, widening to 5 m from 30 m behind, to the horizon.',
    eyes: 'both',
    toHorizon: true,
  },
  'un-iii': {
    code: 'un-iii',
    title: 'Class III (main exterior, small)',
    rule: 'UN Regulation No. 46',
    status: 'M',
    basis: 'Widths 1 m and 4 m and distances 4 m and 20 m from memory [M].',
    description: 'A strip 1 m wide beside the vehicle from 4 m behind the eyes, widening to 4 m from 20 m behind, to the horizon.',
    eyes: 'both',
    toHorizon: true,
  },
  'un-iv': {
    code: 'un-iv',
    title: 'Class IV (wide-angle)',
    rule: 'UN Regulation No. 46',
    status: 'M',
    basis: 'Edges from memory [M]; area 307.9 m² published [P]; the taper from 4.5 m to 15 m derived to match that area [D].',
    description: 'Ground 15 m wide beside the vehicle from 10 m to 25 m behind the eyes, tapering to 4.5 m wide at 1.5 m behind.',
    eyes: 'both',
    toHorizon: false,
  },
  'un-v': {
    code: 'un-v',
    title: 'Class V (close-proximity)',
    rule: 'UN Regulation No. 46',
    status: 'M',
    basis: 'Widths from memory [M]; area 5.5 m² published [P]; the forward limit at the front bumper published [P].',
    description:
      'Ground 2 m wide beside the cab on the passenger side, from 1 m ahead of the eyes (or the bumper if nearer) to 1.75 m behind.',
    eyes: 'both',
    toHorizon: false,
  },
  'un-v-extended': {
    code: 'un-v-extended',
    title: 'Class V, extended (mirror 2.4 m up or more)',
    rule: 'UN Regulation No. 46',
    status: 'M?',
    basis: '4.5 m width and 2.4 m mounting height published [P]; 3.0 m forward published [P]; 1.75 m rearward from memory, unsure [M?].',
    description: 'Ground 4.5 m wide beside the cab on the passenger side, from 3 m ahead of the eyes to 1.75 m behind.',
    eyes: 'both',
    toHorizon: false,
  },
  'un-vi': {
    code: 'un-vi',
    title: 'Class VI (front)',
    rule: 'UN Regulation No. 46',
    status: 'M',
    basis: 'Depth 2 m and the 2 m passenger-side overhang from memory [M]; the optional rounded passenger corner is not drawn.',
    description: 'Ground 2 m deep in front of the cab, across the vehicle’s width and 2 m past its passenger side.',
    eyes: 'both',
    toHorizon: false,
  },
  'us-driver-strip': {
    code: 'us-driver-strip',
    title: 'Driver-side strip (passenger cars)',
    rule: 'US FMVSS No. 111',
    status: 'M',
    basis: 'Width 2.4 m and 10.7 m behind the eyes from memory [M].',
    description: 'A strip 2.4 m wide outboard of the driver’s side from 10.7 m behind the driver’s eyes to the horizon.',
    eyes: 'one',
    toHorizon: true,
  },
  'iso-boundary-1m': {
    code: 'iso-boundary-1m',
    title: '1 m boundary',
    rule: 'ISO 5006',
    status: 'D',
    basis:
      'A rectangular boundary 1 m outside the machine’s outline published [P]; scoring the ground band between the outline and that boundary is our reading [D].',
    description: 'The ground band from the machine’s outline to 1 m outside it, all round.',
    eyes: 'one',
    toHorizon: false,
  },
  'iso-circle-12m': {
    code: 'iso-circle-12m',
    title: '12 m visibility circle',
    rule: 'ISO 5006',
    status: 'D',
    basis:
      'A 12 m circle on the ground centred under the seat index point published [P]; scoring a 1 m wide band centred on it is our reading [D].',
    description: 'A band 1 m wide on the ground along the 12 m circle around the seat.',
    eyes: 'one',
    toHorizon: false,
  },
};

/** Fields "to the horizon" are scored only this far behind the eyes (our choice, stated on every such field). */
export const HORIZON_SCORED_TO_M = 60;
/** Width of the band scored along the ISO 5006 circle, metres (ours). */
export const ISO_CIRCLE_BAND_M = 1;

export type VehicleField = {
  /** Unique within a vehicle: the code plus the side, or the user field's id. */
  id: string;
  code: FieldCode;
  side: Side | null;
  name: string;
  rule: string;
  status: StatusMark;
  basis: string;
  description: string;
  eyes: 'both' | 'one';
  /** The field on the ground, plan metres (an outer ring and possibly a hole). */
  polygonM: Polygon;
  /** Share that must be seen to pass; null when the rule gives no pass mark (no verdict shown). */
  requiredShare: number | null;
  requiredShareBasis: string;
  /** Set when the field runs to the horizon: the sentence saying how far it is scored. */
  scoredToNote: string | null;
};

export type FieldOptions = {
  /** How far behind the eyes fields "to the horizon" are scored (default {@link HORIZON_SCORED_TO_M}). */
  horizonM?: number;
};

/** The rule's outline in (x, u) on a side: x from the eyes, u outboard from `yRef`. */
function sideRing(g: VehicleGeometry, side: Side, yRef: number, xu: Pair[]): Ring {
  const s = sideSign(side);
  return xu.map(([x, u]) => [g.eyeMidM[0] + x, yRef + s * u]);
}

/**
 * The geometry of one library field for a vehicle (side: which side of the vehicle, where the
 * field has one). Polygons only; {@link libraryField} adds the words and the threshold.
 */
export function fieldPolygon(code: Exclude<FieldCode, 'user'>, g: VehicleGeometry, side: Side, opts: FieldOptions = {}): Polygon {
  const far = -(opts.horizonM ?? HORIZON_SCORED_TO_M);
  const yOut = g.outerY[side];
  const yCab = g.cabY[side];
  switch (code) {
    case 'un-ii':
      return [
        sideRing(g, side, yOut, [
          [-4, 0],
          [-4, 1],
          [-30, 1],
          [-30, 5],
          [far, 5],
          [far, 0],
        ]),
      ];
    case 'un-iii':
      return [
        sideRing(g, side, yOut, [
          [-4, 0],
          [-4, 1],
          [-20, 1],
          [-20, 4],
          [far, 4],
          [far, 0],
        ]),
      ];
    case 'un-iv':
      return [
        sideRing(g, side, yOut, [
          [-1.5, 0],
          [-1.5, 4.5],
          [-10, 15],
          [-25, 15],
          [-25, 0],
        ]),
      ];
    case 'un-v': {
      // Forward limit: 1 m ahead of the eyes, or the front bumper if that is nearer [P].
      const xf = Math.min(1.0, g.bumperX - g.eyeMidM[0]);
      return [
        sideRing(g, side, yCab, [
          [xf, 0],
          [xf, 2],
          [-1.75, 2],
          [-1.75, 0],
        ]),
      ];
    }
    case 'un-v-extended':
      return [
        sideRing(g, side, yCab, [
          [3, 0],
          [3, 4.5],
          [-1.75, 4.5],
          [-1.75, 0],
        ]),
      ];
    case 'un-vi': {
      // `side` is the passenger side: the field overhangs it by 2 m.
      const yDriver = g.outerY[otherSide(side)];
      const yFar = yOut + sideSign(side) * 2;
      const x0 = g.cabFrontX;
      return [
        [
          [x0, yDriver],
          [x0 + 2, yDriver],
          [x0 + 2, yFar],
          [x0, yFar],
        ],
      ];
    }
    case 'us-driver-strip':
      return [
        sideRing(g, side, yOut, [
          [-10.7, 0],
          [-10.7, 2.4],
          [far, 2.4],
          [far, 0],
        ]),
      ];
    case 'iso-boundary-1m': {
      const [[x0, y0], , [x1, y1]] = [g.outline[0], g.outline[1], g.outline[2]];
      return [
        [
          [x0 - 1, y0 - 1],
          [x1 + 1, y0 - 1],
          [x1 + 1, y1 + 1],
          [x0 - 1, y1 + 1],
        ],
        [
          [x0, y0],
          [x1, y0],
          [x1, y1],
          [x0, y1],
        ],
      ];
    }
    case 'iso-circle-12m': {
      // Centred under the seat index point, 20 mm behind the eye point for the ISO 5006 offset.
      const c: Pair = [g.eyeMidM[0] - g.seatForwardOffsetM, g.eyeMidM[1]];
      return [symmetricCircle(c, 12 + ISO_CIRCLE_BAND_M / 2, 180), symmetricCircle(c, 12 - ISO_CIRCLE_BAND_M / 2, 180)];
    }
  }
}

/**
 * An inscribed regular polygon for a circle (`segments` even) whose corners come in pairs
 * mirrored exactly across y = centre y, so left- and right-hand drive give mirror-image fields.
 */
function symmetricCircle(c: Pair, r: number, segments: number): Ring {
  const upper: Pair[] = [];
  for (let k = 0; k <= segments / 2; k++) {
    const a = (2 * Math.PI * k) / segments;
    upper.push([r * Math.cos(a), k === 0 || 2 * k === segments ? 0 : r * Math.sin(a)]);
  }
  const lower: Pair[] = upper
    .slice(1, -1)
    .reverse()
    .map(([dx, dy]) => [dx, -dy]);
  return [...upper, ...lower].map(([dx, dy]) => [c[0] + dx, c[1] + dy] as Pair);
}

export type FieldChoice = { code: Exclude<FieldCode, 'user'>; side: Side; requiredShare: number | null; requiredShareBasis: string };

/** Builds a library field with its words, for a side and a pass mark. */
export function libraryField(g: VehicleGeometry, choice: FieldChoice, opts: FieldOptions = {}): VehicleField {
  const spec = FIELD_SPECS[choice.code];
  const horizonM = opts.horizonM ?? HORIZON_SCORED_TO_M;
  const sided = choice.code !== 'iso-boundary-1m' && choice.code !== 'iso-circle-12m' && choice.code !== 'un-vi';
  const sideWord = choice.side === g.driverSide ? 'driver’s side' : 'passenger side';
  return {
    id: sided ? `${choice.code}-${choice.side}` : choice.code,
    code: choice.code,
    side: sided ? choice.side : null,
    name: sided ? `${spec.title}, ${sideWord}` : spec.title,
    rule: spec.rule,
    status: spec.status,
    basis: spec.basis,
    description: spec.description,
    eyes: spec.eyes,
    polygonM: fieldPolygon(choice.code, g, choice.side, opts),
    requiredShare: choice.requiredShare,
    requiredShareBasis: choice.requiredShareBasis,
    scoredToNote: spec.toHorizon
      ? `The rule runs this field to the horizon; it is scored to ${horizonM} m behind the driver’s eyes.`
      : null,
  };
}

export type RuleSetId = VehicleRuleSet;

export const RULE_SETS: Record<RuleSetId, { title: string; description: string }> = {
  'eu-retrofit': {
    title: 'EU retrofit rule for trucks (Directive 2007/38/EC)',
    description:
      'Trucks over 3.5 t: the passenger-side mirrors together show at least 95 % of the class IV field and 85 % of the class V field [P]; other fields as UN R46.',
  },
  'un-r46': {
    title: 'UN Regulation No. 46',
    description: 'The fields each kind of vehicle needs [M], each to be seen but for bodywork hiding under 10 % of it [P].',
  },
  'fmvss-111': {
    title: 'US FMVSS No. 111',
    description: 'The driver-side strip for passenger cars [M]; school buses by test cylinders the installer places.',
  },
  'iso-5006': {
    title: 'ISO 5006 (earth-moving machinery)',
    description:
      'The share of the 1 m boundary and of the 12 m circle seen; the standard’s pass tables are not public, so no verdict is given.',
  },
};

/** The rule set offered first for each kind of vehicle. */
export function defaultRuleSet(kind: VehicleKind): RuleSetId {
  if (kind === 'rigid-truck' || kind === 'tractor-unit') return 'eu-retrofit';
  if (kind === 'school-bus') return 'fmvss-111';
  if (kind === 'site-machine') return 'iso-5006';
  return 'un-r46';
}

/** 100 % less the bodywork allowance: R46 tolerates bodywork hiding under 10 % of a field [P]. */
const R46_SHARE = 0.9;
const R46_BASIS = '100 % less the 10 % of a field that bodywork may hide (UN R46) [P].';

/** The fields a rule set asks of a vehicle, with their pass marks. */
export function ruleSetChoices(ruleSet: RuleSetId, v: Pick<Vehicle, 'kind' | 'driverSide'>): FieldChoice[] {
  const d: Side = v.driverSide;
  const p: Side = otherSide(d);
  const r46 = (code: FieldChoice['code'], side: Side): FieldChoice => ({
    code,
    side,
    requiredShare: R46_SHARE,
    requiredShareBasis: R46_BASIS,
  });
  const truck = (): FieldChoice[] => [r46('un-ii', d), r46('un-ii', p), r46('un-iv', d), r46('un-iv', p), r46('un-v', p), r46('un-vi', p)];
  switch (ruleSet) {
    case 'eu-retrofit':
      return truck().map((c) =>
        c.side === p && c.code === 'un-iv'
          ? {
              ...c,
              requiredShare: 0.95,
              requiredShareBasis: 'At least 95 % of the class IV field on the passenger side (Directive 2007/38/EC) [P].',
            }
          : c.side === p && c.code === 'un-v'
            ? { ...c, requiredShare: 0.85, requiredShareBasis: 'At least 85 % of the class V field (Directive 2007/38/EC) [P].' }
            : c,
      );
    case 'un-r46':
      // Which vehicles need which class [M]: N2/N3 trucks II, IV, V, VI; buses II; cars and vans III.
      if (v.kind === 'rigid-truck' || v.kind === 'tractor-unit') return truck();
      if (v.kind === 'car-van') return [r46('un-iii', d), r46('un-iii', p)];
      return [r46('un-ii', d), r46('un-ii', p)];
    case 'fmvss-111':
      // The strip is the passenger-car rule; school buses are judged by the installer's test cylinders.
      if (v.kind !== 'car-van') return [];
      return [
        {
          code: 'us-driver-strip',
          side: d,
          requiredShare: 0.99,
          requiredShareBasis: 'The whole strip, less 1 % for the accuracy of the traced outline (ours) [D].',
        },
      ];
    case 'iso-5006':
      return [
        {
          code: 'iso-boundary-1m',
          side: d,
          requiredShare: null,
          requiredShareBasis: 'No pass mark: the standard’s tables are not public.',
        },
        { code: 'iso-circle-12m', side: d, requiredShare: null, requiredShareBasis: 'No pass mark: the standard’s tables are not public.' },
      ];
  }
}

/** The vehicle's fields under a rule set, followed by the installer's own ground fields. */
export function vehicleFields(v: Vehicle, ruleSet: RuleSetId = defaultRuleSet(v.kind), opts: FieldOptions = {}): VehicleField[] {
  const g = vehicleGeometry(v);
  const lib = ruleSetChoices(ruleSet, v).map((c) => libraryField(g, c, opts));
  const own: VehicleField[] = v.groundFields.map((f) => ({
    id: f.id,
    code: 'user',
    side: null,
    name: f.name,
    rule: 'Installer’s own field',
    status: 'D',
    basis: 'Drawn by the installer.',
    description: 'A ground area the installer asked to be seen.',
    eyes: f.eyes,
    polygonM: [f.polygonM.map(([x, y]) => [x, y] as Pair)],
    requiredShare: f.requiredShare,
    requiredShareBasis: 'Set by the installer.',
    scoredToNote: null,
  }));
  return [...lib, ...own];
}
