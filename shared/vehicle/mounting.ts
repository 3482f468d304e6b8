/**
 * Mounting checks that produce a sentence for the installer, never a refusal: mirrors fitted
 * low, sticking out, too strongly curved for their class, or facing away from the driver.
 * Figures and marks as in docs/vehicle-sources.md.
 */
import { dot, norm, sub, type Vec3 } from '../geometry/vec3';
import type { Mirror, Pose } from '../optics';
import type { MirrorClass, Vehicle } from '../schemas/vehicle';
import type { VehicleGeometry } from './geometry';

export type { MirrorClass };

/** Least radius of curvature per class, metres: III 1,200 mm [P]; II 1,200 mm, IV and V 300 mm [M]; VI 200 mm [M?] (200 or 300 mm). */
export const MIN_RADIUS_M: Record<MirrorClass, number> = { II: 1.2, III: 1.2, IV: 0.3, V: 0.3, VI: 0.2 };
/** Class V and VI mirrors: no part lower than 2 m above the ground [M]; the EU retrofit guidance uses the same 2 m [P]. */
export const LOW_MIRROR_M = 2;
/** A mirror whose lower edge is under 2 m may project at most 250 mm beyond the vehicle's width [M]. */
export const MAX_PROJECTION_M = 0.25;

export type MountingNote = { mirrorId: string; check: 'low' | 'projection' | 'radius' | 'faces-away'; sentence: string };

type Fitted = { id: string; label?: string; mirror: Mirror; pose: Pose; mirrorClass?: MirrorClass | null };

/** Radius of the sphere the mirror is cut from (a dome's is half its diameter). */
function radiusOf(m: Mirror): number {
  return m.shape === 'dome' ? m.diameterM / 2 : m.radiusM;
}

/**
 * The mirror's lowest and outermost points (z, |y|), metres, from its rim: a round panel's rim
 * circle or a rectangular panel's corners, set back by the sagitta from the vertex; a dome is
 * bounded by its whole sphere (a safe overestimate of its reach).
 */
export function mirrorExtent(m: Mirror, pose: Pose): { lowestZ: number; outermostAbsY: number } {
  const n = norm(pose.axis);
  const w: Vec3 = [pose.axis[0] / n, pose.axis[1] / n, pose.axis[2] / n];
  const V = pose.vertexM;
  if (m.shape === 'dome') {
    const R = m.diameterM / 2;
    const C: Vec3 = [V[0] - R * w[0], V[1] - R * w[1], V[2] - R * w[2]];
    return { lowestZ: C[2] - R, outermostAbsY: Math.abs(C[1]) + R };
  }
  // u horizontal across the face, v = w × u: the engine's pose frame (shared/optics/pose.ts).
  const uh = Math.hypot(w[0], w[1]);
  const u: Vec3 = uh > 0 ? [-w[1] / uh, w[0] / uh, 0] : [1, 0, 0];
  const v: Vec3 = [w[1] * u[2] - w[2] * u[1], w[2] * u[0] - w[0] * u[2], w[0] * u[1] - w[1] * u[0]];
  const R = m.radiusM;
  const pts: [number, number][] =
    m.shape === 'round'
      ? Array.from({ length: 72 }, (_, k) => [
          (m.diameterM / 2) * Math.cos((k * Math.PI) / 36),
          (m.diameterM / 2) * Math.sin((k * Math.PI) / 36),
        ])
      : [
          [m.widthM / 2, m.heightM / 2],
          [-m.widthM / 2, m.heightM / 2],
          [m.widthM / 2, -m.heightM / 2],
          [-m.widthM / 2, -m.heightM / 2],
        ];
  let lowestZ = Infinity;
  let outermostAbsY = 0;
  for (const [a, b] of pts) {
    const s = R - Math.sqrt(Math.max(0, R * R - a * a - b * b));
    const p: Vec3 = [V[0] + a * u[0] + b * v[0] - s * w[0], V[1] + a * u[1] + b * v[1] - s * w[1], V[2] + a * u[2] + b * v[2] - s * w[2]];
    lowestZ = Math.min(lowestZ, p[2]);
    outermostAbsY = Math.max(outermostAbsY, Math.abs(p[1]));
  }
  return { lowestZ, outermostAbsY };
}

const mm = (m: number): string => `${Math.round(m * 1000)} mm`;

export function mountingNotes(v: Vehicle, g: VehicleGeometry, mirrors: readonly Fitted[]): MountingNote[] {
  const notes: MountingNote[] = [];
  for (const f of mirrors) {
    const name = f.label ?? f.id;
    const { lowestZ, outermostAbsY } = mirrorExtent(f.mirror, f.pose);
    if (f.mirror.shape !== 'dome' && dot(sub(g.eyeMidM, f.pose.vertexM), f.pose.axis) <= 0) {
      notes.push({
        mirrorId: f.id,
        check: 'faces-away',
        sentence: `${name} faces away from the driver’s eyes, so it shows the driver nothing; turn it toward the cab.`,
      });
    }
    if ((f.mirrorClass === 'V' || f.mirrorClass === 'VI') && lowestZ < LOW_MIRROR_M) {
      notes.push({
        mirrorId: f.id,
        check: 'low',
        sentence: `${name} (class ${f.mirrorClass}) reaches down to ${mm(lowestZ)} above the ground; UN R46 asks that no part of a class V or VI mirror be lower than 2 m.`,
      });
    }
    const beyond = outermostAbsY - v.widthM / 2;
    if (lowestZ < LOW_MIRROR_M && beyond > MAX_PROJECTION_M) {
      notes.push({
        mirrorId: f.id,
        check: 'projection',
        sentence: `${name} has its lower edge under 2 m and sticks out ${mm(beyond)} beyond the vehicle’s width; UN R46 allows at most 250 mm there.`,
      });
    }
    if (f.mirrorClass) {
      const min = MIN_RADIUS_M[f.mirrorClass];
      const r = radiusOf(f.mirror);
      if (r < min) {
        notes.push({
          mirrorId: f.id,
          check: 'radius',
          sentence: `${name} has a radius of curvature of ${mm(r)}, under the ${mm(min)} that UN R46 sets for a class ${f.mirrorClass} mirror.`,
        });
      }
    }
  }
  return notes;
}
