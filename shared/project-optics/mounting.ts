/**
 * The one rule for where a mirror may hang: no wall or rack of the plan may pass through its
 * body. Used by the API when a placement is saved and by the evaluation the editor, the plan and
 * the sheet show, so both say the same sentence.
 */
import { moveOutOfWalls, wallsThroughMirror } from '../optics/mount';
import { poseFromAim, type Mirror, type Vec3 } from '../optics';
import type { PlacementDto, Scene } from '../schemas';
import { formatLength, type UnitSystem } from '../units';

export type MountProblem = {
  field: 'positionM';
  message: string;
  /** A position (plan x, y, metres) where the mirror sits on the face instead, when one was found. */
  snapM: [number, number] | null;
};

const KIND_WORD: Record<Scene['walls'][number]['kind'], string> = { wall: 'wall', racking: 'rack', door: 'door' };

/**
 * Null when the placement's mirror is clear of every wall; otherwise a sentence naming the wall
 * it passes through and what to change, with the nearest position where it sits on the face.
 */
export function mountProblem(args: {
  label?: string;
  mirror: Mirror;
  placement: Pick<PlacementDto, 'positionM' | 'heightM' | 'azimuthRad' | 'tiltDownRad' | 'viewerId'>;
  scene: Scene;
  units?: UnitSystem;
}): MountProblem | null {
  const { placement: p, scene } = args;
  const units = args.units ?? 'metric';
  const pose = poseFromAim({ vertexM: [p.positionM[0], p.positionM[1], p.heightM], azimuthRad: p.azimuthRad, tiltDownRad: p.tiltDownRad });
  const walls = scene.walls.map((w) => ({ aM: w.aM, bM: w.bM, heightM: w.heightM }));
  const hits = wallsThroughMirror({ mirror: args.mirror, pose, walls });
  if (hits.length === 0) return null;
  const deepest = hits.reduce((a, b) => (b.depthM > a.depthM ? b : a));
  const wall = scene.walls[deepest.wallIndex];
  const viewer = scene.viewers.find((v) => v.id === p.viewerId);
  const eyeM: Vec3 | undefined = viewer ? [viewer.positionM[0], viewer.positionM[1], viewer.eyeHeightM] : undefined;
  const move = moveOutOfWalls({ mirror: args.mirror, pose, walls, eyeM });
  const name = args.label ? `“${args.label}”` : 'This mirror';
  const others = hits.length > 1 ? ` (and ${hits.length - 1} more)` : '';
  const len = (m: number) => formatLength(m, units);
  // Positions to the centimetre or a tenth of an inch: whole inches could land back in the wall.
  const at = (m: number) => formatLength(m, units, { precision: units === 'imperial' ? 1 : 2 });
  const head = `${name} reaches ${len(deepest.depthM)} into ${KIND_WORD[wall.kind]} “${wall.id}”${others}; a mirror cannot hang inside a wall or rack.`;
  if (!move) {
    return { field: 'positionM', snapM: null, message: `${head} Move it clear so that its back sits on the face it hangs from.` };
  }
  // Rounded away from the wall to the centimetre, so the position typed back is still clear.
  const snapM: [number, number] = [roundAway(p.positionM[0] + move[0], move[0]), roundAway(p.positionM[1] + move[1], move[1])];
  return {
    field: 'positionM',
    snapM,
    message: `${head} Move it ${len(Math.hypot(move[0], move[1]))}, to x ${at(snapM[0])}, y ${at(snapM[1])}, where it sits on the face.`,
  };
}

function roundAway(x: number, direction: number): number {
  if (Math.abs(direction) < 1e-9) return x;
  return direction > 0 ? Math.ceil(x * 100 - 1e-6) / 100 : Math.floor(x * 100 + 1e-6) / 100;
}
