/**
 * Mirrors an installer adds to a vehicle, pure: a starting mirror per class (size, curvature and
 * mounting height), where a tap puts it (outside the body), and a first aim at the field the
 * class is for, which the installer then drags and turns.
 */
import { aimOfPose, type Vec3 } from '@/shared/optics';
import type { CreatePlacementBody, MirrorSpec } from '@/shared/schemas';
import type { MirrorClass, VehicleField, VehicleGeometry } from '@/shared/vehicle';
import { roundRad } from '@/components/plan/plan-edits';
import { ringCentroid, type Pair } from './vehicle-frame';

export interface MirrorTemplate {
  cls: MirrorClass;
  /** Our name for what the mirror does; the class is the open standard's term. */
  name: string;
  spec: MirrorSpec;
  heightM: number;
}

/**
 * Starting mirrors, to be replaced by what is actually fitted. Sizes and radii are trade practice
 * (common practice: truck class IV and V heads 180–250 mm across with r 300–400 mm); main mirrors
 * take a flatter 1.8 m radius, over the 1.2 m least that UN R46 asks of class II (from memory).
 * Close-proximity and front mirrors start at 2.3 m, clear of the 2 m least for classes V and VI.
 */
export const MIRROR_TEMPLATES: Record<MirrorClass, MirrorTemplate> = {
  II: { cls: 'II', name: 'Main rear-view', spec: { shape: 'rect', widthM: 0.2, heightM: 0.38, radiusM: 1.8 }, heightM: 2.1 },
  III: { cls: 'III', name: 'Main rear-view (small)', spec: { shape: 'rect', widthM: 0.18, heightM: 0.12, radiusM: 1.5 }, heightM: 1.1 },
  IV: { cls: 'IV', name: 'Wide-angle', spec: { shape: 'rect', widthM: 0.22, heightM: 0.2, radiusM: 0.35 }, heightM: 2.1 },
  V: { cls: 'V', name: 'Close-proximity', spec: { shape: 'rect', widthM: 0.22, heightM: 0.2, radiusM: 0.35 }, heightM: 2.3 },
  VI: { cls: 'VI', name: 'Front', spec: { shape: 'rect', widthM: 0.25, heightM: 0.2, radiusM: 0.3 }, heightM: 2.3 },
};
export const MIRROR_CLASS_ORDER: readonly MirrorClass[] = ['V', 'IV', 'II', 'VI', 'III'];

/** How far outside the body a tapped mirror is put when the tap lands on the body, metres (an arm's reach). */
export const ARM_M = 0.15;

/** A tap on the body moves out through the nearest side of the box it landed in, so the mirror hangs outside. */
export function outsideBody(p: Pair, g: VehicleGeometry): Pair {
  let q: Pair = [p[0], p[1]];
  for (let pass = 0; pass < g.boxes.length; pass++) {
    const hit = g.boxes.find((b) => q[0] > b.ring[0][0] && q[0] < b.ring[2][0] && q[1] > b.ring[0][1] && q[1] < b.ring[2][1]);
    if (!hit) return q;
    const [[x0, y0], , [x1, y1]] = hit.ring;
    const out: Pair[] = [
      [x1 + ARM_M, q[1]],
      [x0 - ARM_M, q[1]],
      [q[0], y1 + ARM_M],
      [q[0], y0 - ARM_M],
    ];
    const d = (o: Pair) => Math.hypot(o[0] - q[0], o[1] - q[1]);
    q = out.reduce((best, o) => (d(o) < d(best) ? o : best));
  }
  return q;
}

const FIELD_CODES: Record<MirrorClass, readonly string[]> = {
  II: ['un-ii', 'un-iii', 'us-driver-strip'],
  III: ['un-iii', 'un-ii', 'us-driver-strip'],
  IV: ['un-iv'],
  V: ['un-v', 'un-v-extended'],
  VI: ['un-vi'],
};

/** The field a new mirror of this class is first aimed at: its class's field on the mirror's side, else the nearest field. */
export function fieldFor(cls: MirrorClass, at: Pair, fields: readonly VehicleField[]): VehicleField | null {
  const side = at[1] >= 0 ? 'left' : 'right';
  const own = fields.filter((f) => FIELD_CODES[cls].includes(f.code) && (f.side === null || f.side === side));
  if (own.length > 0) return own[0];
  let best: { d: number; f: VehicleField } | null = null;
  for (const f of fields) {
    const c = ringCentroid(f.polygonM[0]);
    const d = Math.hypot(c[0] - at[0], c[1] - at[1]);
    if (!best || d < best.d) best = { d, f };
  }
  return best?.f ?? null;
}

/**
 * The aim that shows the driver the ground at `targetM` in the mirror's centre: the axis halfway
 * between the directions to the eye and to the target (the law of reflection at the vertex).
 */
export function aimAt(vertexM: Vec3, eyeM: Vec3, targetM: Vec3): { azimuthRad: number; tiltDownRad: number } {
  const unit = (a: Vec3, b: Vec3): Vec3 => {
    const d: Vec3 = [b[0] - a[0], b[1] - a[1], b[2] - a[2]];
    const n = Math.hypot(...d) || 1;
    return [d[0] / n, d[1] / n, d[2] / n];
  };
  const e = unit(vertexM, eyeM);
  const t = unit(vertexM, targetM);
  const axis: Vec3 = [e[0] + t[0], e[1] + t[1], e[2] + t[2]];
  const aim = aimOfPose({ vertexM, axis: Math.hypot(...axis) > 1e-9 ? axis : e });
  return { azimuthRad: roundRad(aim.azimuthRad), tiltDownRad: roundRad(aim.tiltDownRad) };
}

const roundMm = (m: number) => Math.round(m * 1000) / 1000;

/** The body of a mirror added by a tap at `tapM` (vehicle plan metres). */
export function newVehicleMirrorBody(
  tapM: Pair,
  cls: MirrorClass,
  g: VehicleGeometry,
  fields: readonly VehicleField[],
  existing: number,
): CreatePlacementBody {
  const t = MIRROR_TEMPLATES[cls];
  const [x, y] = outsideBody(tapM, g);
  const at: Pair = [roundMm(x), roundMm(y)];
  const vertexM: Vec3 = [at[0], at[1], t.heightM];
  const field = fieldFor(cls, at, fields);
  const c = field ? ringCentroid(field.polygonM[0]) : ([at[0] - 3, at[1]] as Pair);
  return {
    label: `${cls}-${existing + 1}`,
    customMirror: t.spec,
    positionM: at,
    heightM: t.heightM,
    ...aimAt(vertexM, g.eyeMidM, [c[0], c[1], 0]),
    mirrorClass: cls,
    servesFieldIds: null,
  };
}
