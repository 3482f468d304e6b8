/**
 * Plausibility sentences: things a plan may hold that no installer would build, said beside the
 * numbers rather than refused (the installer may know better: a bracket, a column, a drawing not
 * yet finished). Each rule is pure and takes the same inputs the evaluation does; the editor and
 * the sheet print what they return, in the reader's units.
 */
import { wallNames } from '../datum';
import { EYE_MARGIN } from '../geometry/tolerance';
import { placeMirror, type Mirror } from '../optics/mirror';
import type { PlacementDto, Scene, SceneViewer } from '../schemas';
import { formatLength, type UnitSystem } from '../units';

/**
 * How far (plan distance, metres, from the mirror's centre to the wall's line) a mirror may sit
 * from a wall or rack behind it and still count as hanging on it: a wall arm holds a panel
 * a few hundred millimetres off the face (common practice for wall-mounted convex mirrors).
 */
export const HANGS_WITHIN_M = 0.5;

type Pose2 = Pick<PlacementDto, 'positionM' | 'heightM' | 'azimuthRad'>;

const nameOf = (label: string | undefined) => (label ? `“${label}”` : 'This mirror');

/** Distance from p to the segment a–b and the segment's nearest point. */
function nearestOnSegment(p: readonly [number, number], a: readonly [number, number], b: readonly [number, number]) {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const t = len2 > 0 ? Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2)) : 0;
  const foot: [number, number] = [a[0] + t * dx, a[1] + t * dy];
  return { distanceM: Math.hypot(p[0] - foot[0], p[1] - foot[1]), foot };
}

/**
 * The walls and racks a mirror hangs on: within `HANGS_WITHIN_M` of its centre on the plan and
 * behind it (not on the side it is aimed at). Indices into `scene.walls`.
 */
export function wallsMirrorHangsOn(placement: Pose2, scene: Pick<Scene, 'walls'>): number[] {
  const p = placement.positionM;
  const aim = [Math.cos(placement.azimuthRad), Math.sin(placement.azimuthRad)];
  const out: number[] = [];
  scene.walls.forEach((w, i) => {
    const { distanceM, foot } = nearestOnSegment(p, w.aM, w.bM);
    if (distanceM > HANGS_WITHIN_M) return;
    // A wall the mirror looks toward is not one it hangs on (the foot is on the aimed side).
    if ((foot[0] - p[0]) * aim[0] + (foot[1] - p[1]) * aim[1] > 1e-9) return;
    out.push(i);
  });
  return out;
}

/**
 * A mirror whose centre is higher than every wall or rack it hangs on has nothing to hang from
 * there. Null when it is at or below the top of the tallest of them, when it hangs on none
 * (a post, a ceiling) or when it is a full dome (those hang from the ceiling).
 */
export function aboveWallsSentence(args: {
  label?: string;
  mirror?: Mirror | null;
  placement: Pose2;
  scene: Pick<Scene, 'walls'>;
  units: UnitSystem;
}): string | null {
  if (args.mirror?.shape === 'dome' && args.mirror.portion === 'full') return null;
  const hangsOn = wallsMirrorHangsOn(args.placement, args.scene);
  if (hangsOn.length === 0) return null;
  const tallest = hangsOn.reduce((a, b) => (args.scene.walls[b].heightM > args.scene.walls[a].heightM ? b : a));
  const wall = args.scene.walls[tallest];
  if (args.placement.heightM <= wall.heightM) return null;
  const len = (m: number) => formatLength(m, args.units);
  const name = wallNames(args.scene.walls)[tallest];
  const what = wall.kind === 'racking' ? `rack ${name}` : wall.kind === 'door' ? 'the door' : `wall ${name}`;
  const others = hangsOn.length > 1 ? ' (the tallest it hangs on)' : '';
  return (
    `${nameOf(args.label)} is mounted at ${len(args.placement.heightM)}, above the top of ${what}${others}, ` +
    `which is ${len(wall.heightM)} high. Check the mounting height or the ${wall.kind === 'racking' ? 'rack' : 'wall'}’s height, ` +
    'or note the bracket, column or ceiling fixing that holds it.'
  );
}

/**
 * A viewer whose eye is behind the mirror's mounting surface cannot see its face: behind the
 * plane of a panel's face (square to its axis at the centre), or behind one of a dome's flat
 * faces (the wall or ceiling it sits on). The paraxial ranges depend only on the eye's
 * distance, so without this sentence the summary would still show a range. Null when the eye
 * is in front, or when there is no viewer.
 */
export function eyeBehindMountSentence(args: {
  label?: string;
  mirror: Mirror;
  placement: Pick<PlacementDto, 'positionM' | 'heightM' | 'azimuthRad' | 'tiltDownRad'>;
  viewer: Pick<SceneViewer, 'name' | 'positionM' | 'eyeHeightM'> | null;
  units: UnitSystem;
}): string | null {
  const { viewer, placement: p } = args;
  if (!viewer) return null;
  const c = Math.cos(p.tiltDownRad);
  const axis: [number, number, number] = [c * Math.cos(p.azimuthRad), c * Math.sin(p.azimuthRad), -Math.sin(p.tiltDownRad)];
  const vertex: [number, number, number] = [p.positionM[0], p.positionM[1], p.heightM];
  const eye: [number, number, number] = [viewer.positionM[0], viewer.positionM[1], viewer.eyeHeightM];
  let behind: boolean;
  if (args.mirror.shape === 'dome') {
    const pm = placeMirror(args.mirror, { vertexM: vertex, axis });
    const e = [eye[0] - pm.C[0], eye[1] - pm.C[1], eye[2] - pm.C[2]];
    const dist = Math.hypot(e[0], e[1], e[2]);
    // The engine's own margin, so the sentence and its refusal to trace agree at the edge.
    behind = pm.portion.some(({ k }) => (e[0] * k[0] + e[1] * k[1] + e[2] * k[2]) / dist <= EYE_MARGIN);
  } else {
    behind = (eye[0] - vertex[0]) * axis[0] + (eye[1] - vertex[1]) * axis[1] + (eye[2] - vertex[2]) * axis[2] <= EYE_MARGIN;
  }
  if (!behind) return null;
  const surface = args.mirror.shape === 'dome' ? 'the surface the dome is mounted on' : 'the plane of its face';
  return (
    `The eye of viewer “${viewer.name}” is behind ${surface}, so ${viewer.name} cannot see ${nameOf(args.label).replace(/^This/, 'this')}: ` +
    'its ranges are not what this viewer sees. Aim the mirror toward the viewer, or choose a viewer in front of it.'
  );
}

/** Every plausibility sentence for one placement, in the order the sheet and the editor print them. */
export function plausibilitySentences(args: {
  label?: string;
  mirror: Mirror | null;
  placement: Pick<PlacementDto, 'positionM' | 'heightM' | 'azimuthRad' | 'tiltDownRad' | 'viewerId'>;
  scene: Scene;
  units: UnitSystem;
}): string[] {
  // A vehicle's mirrors hang on the body, not on walls, and its eyes are not the scene's viewers.
  if (args.scene.vehicle) return [];
  const viewer = args.scene.viewers.find((v) => v.id === args.placement.viewerId) ?? null;
  const out = [aboveWallsSentence(args), args.mirror ? eyeBehindMountSentence({ ...args, mirror: args.mirror, viewer }) : null];
  return out.filter((s): s is string => s !== null);
}
