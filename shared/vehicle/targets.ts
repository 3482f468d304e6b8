/**
 * Upright test cylinders seen in a vehicle's mirrors, through the engine's exact point test
 * (visibleInMirror), exact image angles (apparentAngle) and the mirror's traced outline
 * (fanRays). The rule encoded is FMVSS 111 S9.4's [P]: each cylinder's image lies at least 3′
 * of arc inside the edge of the mirror, and, for a cylinder that must be seen at a size, its
 * image is at least 3′ in its shortest and 9′ in its longest dimension.
 */
import type { Pair, Ring } from '../geometry/polygon';
import { cross, dot, norm, sub, type Vec3 } from '../geometry/vec3';
import { apparentAngle, fanRays, OpticsInputError, visibleInMirror, type Mirror, type Pose, type Wall } from '../optics';
import type { PointTarget } from '../schemas/vehicle';

export type TargetView = {
  targetId: string;
  name: string;
  /** Some part of the cylinder is seen in some chosen mirror. */
  visible: boolean;
  /** Every sampled point of its outline is seen in the mirror named below. */
  whollyVisible: boolean;
  mirrorId: string | null;
  /** Angle the image's height and width subtend at the eye, radians (null when not seen). */
  heightAngleRad: number | null;
  widthAngleRad: number | null;
  /** Smallest angle between the image and the mirror's edge as the eye sees it, radians. */
  insideEdgeRad: number | null;
  meetsInsideEdge: boolean;
  /** Whether the image is large enough in both dimensions; null when no size is required. */
  meetsSize: boolean | null;
  /** Whether the image height reaches the detect / recognise angle; null when no angle is given. */
  detected: boolean | null;
  recognised: boolean | null;
  passes: boolean;
};

type Candidate = { id: string; mirror: Mirror; pose: Pose };

/** Outline points of the cylinder that the check samples: at the foot and the top, the two
 *  sides as seen from the mirror and the point nearest it (an approximation of its image's edge). */
export function cylinderSamples(t: PointTarget, towardM: Vec3): Vec3[] {
  const [cx, cy] = t.positionM;
  let tx = towardM[0] - cx;
  let ty = towardM[1] - cy;
  const l = Math.hypot(tx, ty) || 1;
  tx /= l;
  ty /= l;
  const r = t.diameterM / 2;
  const out: Vec3[] = [];
  for (const z of [0, t.heightM]) {
    out.push([cx - ty * r, cy + tx * r, z], [cx + ty * r, cy - tx * r, z], [cx + tx * r, cy + ty * r, z]);
  }
  return out;
}

/**
 * Angular distance (radians) from the direction eye → P to the nearest edge of the outline
 * (points on the mirror), measured in the gnomonic plane about that direction, where great
 * circles are straight lines: atan of the distance to the nearest outline chord.
 */
export function angleInsideOutline(eyeM: Vec3, P: Vec3, outline: readonly Vec3[]): number {
  const d0 = sub(P, eyeM);
  const dl = norm(d0);
  const d: Vec3 = [d0[0] / dl, d0[1] / dl, d0[2] / dl];
  const a: Vec3 = Math.abs(d[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
  const e1r = cross(a, d);
  const e1l = norm(e1r);
  const e1: Vec3 = [e1r[0] / e1l, e1r[1] / e1l, e1r[2] / e1l];
  const e2 = cross(d, e1);
  const ring: Ring = outline.map((q) => {
    const w = sub(q, eyeM);
    const z = dot(w, d);
    return [dot(w, e1) / z, dot(w, e2) / z] as Pair;
  });
  let best = Infinity;
  for (let i = 0; i < ring.length; i++) {
    const p = ring[i];
    const q = ring[(i + 1) % ring.length];
    const ex = q[0] - p[0];
    const ey = q[1] - p[1];
    const l2 = ex * ex + ey * ey;
    const s = l2 > 0 ? Math.max(0, Math.min(1, -(p[0] * ex + p[1] * ey) / l2)) : 0;
    best = Math.min(best, Math.hypot(p[0] + s * ex, p[1] + s * ey));
  }
  return Math.atan(best);
}

function safeVisible(c: Candidate, eyeM: Vec3, pointM: Vec3, walls: readonly Wall[]) {
  try {
    return visibleInMirror({ mirror: c.mirror, pose: c.pose, eyeM, pointM, walls });
  } catch (e) {
    if (e instanceof OpticsInputError && e.field === 'eyeM') return null;
    throw e;
  }
}

/** The best view of one test cylinder over the given mirrors and eye points. */
export function targetView(args: {
  target: PointTarget;
  eyes: readonly Vec3[];
  mirrors: readonly Candidate[];
  walls: readonly Wall[];
  detectAngleRad?: number;
  recogniseAngleRad?: number;
}): TargetView {
  const t = args.target;
  let best: TargetView = {
    targetId: t.id,
    name: t.name,
    visible: false,
    whollyVisible: false,
    mirrorId: null,
    heightAngleRad: null,
    widthAngleRad: null,
    insideEdgeRad: null,
    meetsInsideEdge: false,
    meetsSize: t.minShortRad === null && t.minLongRad === null ? null : false,
    detected: args.detectAngleRad === undefined ? null : false,
    recognised: args.recogniseAngleRad === undefined ? null : false,
    passes: false,
  };
  const rank = (x: TargetView): number[] => [
    x.passes ? 1 : 0,
    x.whollyVisible ? 1 : 0,
    x.insideEdgeRad ?? -1,
    x.heightAngleRad ?? -1,
    x.visible ? 1 : 0,
  ];
  const better = (a: TargetView, b: TargetView): boolean => {
    const ra = rank(a);
    const rb = rank(b);
    for (let i = 0; i < ra.length; i++) if (ra[i] !== rb[i]) return ra[i] > rb[i];
    return false;
  };
  for (const c of args.mirrors) {
    const samples = cylinderSamples(t, c.pose.vertexM);
    for (const eyeM of args.eyes) {
      const seen = samples.map((p) => safeVisible(c, eyeM, p, args.walls));
      if (seen.some((s) => s === null)) continue; // the eye is behind this mirror
      const visible = seen.some((s) => s?.visible);
      if (!visible) continue;
      const whollyVisible = seen.every((s) => s?.visible);
      const near = samples[2];
      const side = samples[0];
      const across: Vec3 = [samples[1][0] - side[0], samples[1][1] - side[1], 0];
      const heightAngleRad = apparentAngle({ mirror: c.mirror, pose: c.pose, eyeM, pointM: near, targetSizeM: t.heightM });
      const widthAngleRad = apparentAngle({
        mirror: c.mirror,
        pose: c.pose,
        eyeM,
        pointM: [side[0], side[1], t.heightM / 2],
        targetSizeM: t.diameterM,
        directionM: across,
      });
      let insideEdgeRad: number | null = null;
      if (whollyVisible) {
        const outline = fanRays({ mirror: c.mirror, pose: c.pose, eyeM, maxRangeM: 1, samples: 256 }).map((r) => r.fromM);
        insideEdgeRad = Math.min(...seen.map((s) => angleInsideOutline(eyeM, s!.reflectionPointM!, outline)));
      }
      const short = heightAngleRad !== null && widthAngleRad !== null ? Math.min(heightAngleRad, widthAngleRad) : null;
      const long = heightAngleRad !== null && widthAngleRad !== null ? Math.max(heightAngleRad, widthAngleRad) : null;
      const meetsInsideEdge = insideEdgeRad !== null && insideEdgeRad >= t.insideEdgeRad;
      const meetsSize =
        t.minShortRad === null && t.minLongRad === null
          ? null
          : short !== null &&
            long !== null &&
            (t.minShortRad === null || short >= t.minShortRad) &&
            (t.minLongRad === null || long >= t.minLongRad);
      const view: TargetView = {
        targetId: t.id,
        name: t.name,
        visible,
        whollyVisible,
        mirrorId: c.id,
        heightAngleRad,
        widthAngleRad,
        insideEdgeRad,
        meetsInsideEdge,
        meetsSize,
        detected: args.detectAngleRad === undefined ? null : heightAngleRad !== null && heightAngleRad >= args.detectAngleRad,
        recognised: args.recogniseAngleRad === undefined ? null : heightAngleRad !== null && heightAngleRad >= args.recogniseAngleRad,
        passes: whollyVisible && meetsInsideEdge && meetsSize !== false,
      };
      if (better(view, best)) best = view;
    }
  }
  return best;
}
