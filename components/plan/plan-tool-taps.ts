/**
 * What a tap on the plan does with each tool, as pure functions (the hook use-plan-tool.ts keeps
 * the state and sends the saves). The *sketch* is the shape being drawn: a wall's first end, or the
 * corners of a zone placed so far; it is never saved until it is finished.
 */
import { isSimpleRing } from '@/shared/optics';
import type { CatalogueItemDto, CreatePlacementBody, Scene, SceneWall } from '@/shared/schemas';
import { limitProblem } from '@/shared/schemas/limits';
import { newMirrorBody, roundM, WALL_HEIGHT_M } from './plan-edits';
import type { PlanSelection, PlanTool } from './plan-types';
import type { PairM } from './plan-view';
import { addViewer, addWall } from './scene-edits';

/** A wall's two ends closer than this are taken as a slip of the finger, not a wall. */
export const MIN_WALL_LENGTH_M = 0.05;
/** A new viewer's eye height: a seated forklift driver's 2.1 m (the EYE_HEIGHTS round working figure). */
export const NEW_VIEWER_EYE_HEIGHT_M = 2.1;

export const TAP_SENTENCES = {
  noMirrors: 'The catalogue has no mirrors yet; ask your administrator to add one.',
  wallTooShort: 'The two ends are too close; tap the second end farther away.',
  zoneCrosses: 'The outline crosses itself; tap Cancel and draw the corners in order around the zone.',
} as const;

export interface TapContext {
  tool: PlanTool;
  wallKind: SceneWall['kind'];
  /** The shape being drawn, in metres, in tap order. */
  sketch: readonly PairM[];
  /** The scene without a drag in progress: what an edit starts from. */
  scene: Scene;
  mirrorCount: number;
  catalogue: readonly CatalogueItemDto[];
  /** A fresh scene id with this prefix (w, v, z). */
  newId: (prefix: string) => string;
}

/** What a tap asks for: the sketch afterwards, a sentence to show, and at most one change to send. */
export interface TapOutcome {
  sketch: readonly PairM[];
  problem: string | null;
  /** A scene to save; what to select once it is sent (absent: the selection stays); whether the tool goes back to Select. */
  scene?: { next: Scene; select?: PlanSelection; backToSelect: boolean };
  /** A mirror to create (selected, and the tool back to Select, once it exists). */
  mirror?: CreatePlacementBody;
}

/** The project's limits, said before sending what the server would refuse. */
function limitFor(c: TapContext): string | null {
  switch (c.tool) {
    case 'mirror':
      return limitProblem('mirror', c.scene, c.mirrorCount);
    case 'viewer':
      return limitProblem('viewer', c.scene, 0);
    case 'wall':
      return c.sketch.length === 0 ? limitProblem('wall', c.scene, 0) : null;
    case 'zone':
      return (c.sketch.length === 0 ? limitProblem('zone', c.scene, 0) : null) ?? limitProblem('zoneCorner', c.scene, 0, c.sketch.length);
    case 'select':
      return null;
  }
}

/** A tap at `raw` (metres on the plan) with the context's tool. Positions are kept to the millimetre. */
export function tapWithTool(c: TapContext, raw: PairM): TapOutcome {
  const pointM: PairM = [roundM(raw[0]), roundM(raw[1])];
  const full = limitFor(c);
  if (full) return { sketch: c.sketch, problem: full };
  switch (c.tool) {
    case 'mirror': {
      const body = newMirrorBody(pointM, c.catalogue, c.scene.viewers, c.mirrorCount);
      return body ? { sketch: c.sketch, problem: null, mirror: body } : { sketch: c.sketch, problem: TAP_SENTENCES.noMirrors };
    }
    case 'viewer': {
      const id = c.newId('v');
      const viewer = { id, name: `Viewer ${c.scene.viewers.length + 1}`, positionM: pointM, eyeHeightM: NEW_VIEWER_EYE_HEIGHT_M };
      return {
        sketch: c.sketch,
        problem: null,
        scene: { next: addViewer(c.scene, viewer), select: { kind: 'viewer', id }, backToSelect: true },
      };
    }
    case 'zone':
      return { sketch: [...c.sketch, pointM], problem: null };
    case 'wall': {
      if (c.sketch.length === 0) return { sketch: [pointM], problem: null };
      const a = c.sketch[0];
      if (Math.hypot(pointM[0] - a[0], pointM[1] - a[1]) < MIN_WALL_LENGTH_M) return { sketch: [], problem: TAP_SENTENCES.wallTooShort };
      const wall: SceneWall = { id: c.newId('w'), kind: c.wallKind, aM: a, bM: pointM, heightM: WALL_HEIGHT_M[c.wallKind] };
      return { sketch: [], problem: null, scene: { next: addWall(c.scene, wall), backToSelect: false } };
    }
    case 'select':
      return { sketch: c.sketch, problem: null };
  }
}

/**
 * Finishing a zone's sketch: nothing yet below three corners, a sentence when the outline crosses
 * itself, else the outline to name.
 */
export function finishZoneSketch(sketch: readonly PairM[]): { outline: PairM[] } | { problem: string } | null {
  if (sketch.length < 3) return null;
  const outline = [...sketch];
  return isSimpleRing(outline) ? { outline } : { problem: TAP_SENTENCES.zoneCrosses };
}
