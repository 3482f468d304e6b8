/**
 * The site plan: grid, walls, zones with their covered share, coverage fans, viewers and mirrors,
 * drawn with react-native-svg in screen pixels for the current view. One responder on the frame
 * handles every gesture (pan, pinch, drag a mirror or viewer, turn the aim handle, tap to place),
 * picking what is under the finger itself, so the same code serves mouse, touch and native.
 * The parts: usePlanFrame and CanvasFrame (canvas-frame.tsx: the viewport, the gestures over the
 * pure machine in plan-gesture.ts with hit-testing in plan-hit-test.ts, the zoom buttons; shared
 * with the vehicle's top view), and PlanDrawing.
 */
import { useEffect, useLayoutEffect, useMemo, useRef, type ReactNode } from 'react';
import type { PlanEvaluation } from '@/hooks/use-plan-evaluation';
import type { PlacementDto, Scene } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';
import { PlanDrawing, type UnderlayImage } from './plan-drawing';
import { underlayCornersM } from './underlay-edits';
import { SceneHandles } from './scene-handles';
import type { PlanDrag } from './plan-gesture';
import { boundsOf, type PairM, type PlanView } from './plan-view';
import type { PlanSelection, PlanTool } from './plan-types';
import { CanvasFrame, usePlanFrame } from './canvas-frame';
import { MarkerFocusLayer } from './marker-focus-layer';

export type { PlanDrag } from './plan-gesture';

export interface PlanCanvasProps {
  scene: Scene;
  placements: readonly PlacementDto[];
  evaluation: PlanEvaluation | null;
  units: UnitSystem;
  tool: PlanTool;
  canEdit: boolean;
  selection: PlanSelection;
  onSelect: (selection: PlanSelection) => void;
  /** A tap with a placing tool (mirror, viewer, zone corner, wall end), in plan metres. */
  onTapPlan: (pointM: PairM) => void;
  onDrag: (drag: PlanDrag) => void;
  sketchPoints: readonly PairM[];
  sketchClosed: boolean;
  /** The next tap gives a point for a comment (any role); see GestureContext.pinning. */
  pinning?: boolean;
  /** Drawn over the plan in screen pixels for the current view (the review's comment markers). */
  overlay?: (view: PlanView) => ReactNode;
  /** Pixels at the bottom covered by the floating toolbar; "fit" keeps the plan above them. */
  reserveBottom?: number;
  /**
   * An item to keep in the middle of the frame (the phone's drawer, open over the plan): the plan
   * re-centres on it when the key changes or the frame changes size, not while it is dragged.
   */
  focus?: { key: string; pointM: PairM } | null;
  /** On a phone the zoom buttons sit in a row this many pixels above the plan's bottom edge, within thumb reach. */
  zoomAtBottom?: number;
  /** The customer's plan under the drawing; its corners count when the view is fitted. */
  underlay?: UnderlayImage | null;
  /** When this changes (a new plan underlay), the view is fitted again, and once more after the frame's next resize. */
  fitKey?: string | null;
  /** Pixels at the top covered by a card over the plan (the calibration card); "fit" keeps the plan below them. */
  reserveTop?: number;
}

export function PlanCanvas(props: PlanCanvasProps) {
  const { scene, placements, evaluation, units, tool, canEdit, selection, sketchPoints, sketchClosed, reserveBottom = 0 } = props;
  const planBounds = useMemo(() => {
    const pts: (readonly [number, number])[] = [];
    scene.walls.forEach((w) => pts.push(w.aM, w.bM));
    scene.zones.forEach((z) => pts.push(...z.polygonM));
    scene.viewers.forEach((v) => pts.push(v.positionM));
    placements.forEach((p) => pts.push(p.positionM));
    const u = props.underlay;
    if (u) pts.push(...underlayCornersM(u.underlay, u.widthPx, u.heightPx));
    return boundsOf(pts);
  }, [scene, placements, props.underlay]);

  const frame = usePlanFrame(
    planBounds,
    reserveBottom,
    {
      context: { scene, placements, selection, canEdit, tool, pinning: props.pinning },
      onSelect: props.onSelect,
      onTapPlan: props.onTapPlan,
      onDrag: props.onDrag,
    },
    props.reserveTop ?? 0,
  );
  const { viewport } = frame;
  const { size, view } = viewport;
  const focusRef = useRef(props.focus);
  useLayoutEffect(() => {
    focusRef.current = props.focus;
  });
  const focusKey = props.focus?.key ?? null;
  const { centre } = viewport;
  useEffect(() => {
    const f = focusRef.current;
    if (focusKey !== null && f) centre(f.pointM);
  }, [focusKey, centre]);
  // A new plan underlay: show all of it (once its size is known), not only what was drawn before.
  const fitKey = props.fitKey ?? null;
  const fitRef = useRef(viewport.fitAndFollow);
  useLayoutEffect(() => {
    fitRef.current = viewport.fitAndFollow;
  });
  const lastFitKey = useRef(fitKey);
  useEffect(() => {
    if (fitKey === lastFitKey.current) return;
    lastFitKey.current = fitKey;
    if (fitKey !== null) fitRef.current();
  }, [fitKey]);

  return (
    <CanvasFrame
      frame={frame}
      label="Site plan: walls, zones, viewers and mirrors with their coverage"
      overFrame={
        <MarkerFocusLayer scene={scene} placements={placements} view={view} size={size} selection={selection} onSelect={props.onSelect} />
      }
      zoomAtBottom={props.zoomAtBottom}
    >
      <PlanDrawing
        {...{ scene, placements, evaluation, units, canEdit, selection, sketchPoints, sketchClosed, view, size, tool }}
        underlay={props.underlay}
      >
        {props.overlay?.(view)}
        {canEdit && tool === 'select' ? <SceneHandles scene={scene} selection={selection} view={view} /> : null}
      </PlanDrawing>
    </CanvasFrame>
  );
}
