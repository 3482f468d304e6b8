/**
 * The site plan: grid, walls, zones with their covered share, coverage fans, viewers and mirrors,
 * drawn with react-native-svg in screen pixels for the current view. One responder on the frame
 * handles every gesture (pan, pinch, drag a mirror or viewer, turn the aim handle, tap to place),
 * picking what is under the finger itself, so the same code serves mouse, touch and native.
 */
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { StyleSheet, View, useWindowDimensions, type GestureResponderEvent, type LayoutChangeEvent } from 'react-native';
import Svg, { Defs, G, Line, Path, Pattern, Rect, Text as SvgText } from 'react-native-svg';
import { fonts, palette } from '@/constants/theme';
import type { PlanEvaluation } from '@/hooks/use-plan-evaluation';
import type { PlacementDto, Scene } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';
import { flushFrame } from './flush-frame';
import { markRecomputeStart } from './perf-marks';
import { AimHandle, AIM_HANDLE_PX, CoverageLayer, DraftShape, GAP_HATCH_ID, MARKER_RADIUS_PX, PlacementMarker, Sightline, ViewerMarker, WallsLayer, ZoneGap, ZoneLabel, ZoneShapes } from './plan-layers';
import { pointInPolygon, pointSegmentDistance } from '@/shared/geometry/polygon';
import { alongAzimuth, azimuthBetween, gridLines, multiPolygonToPath, scaleBar, uncoveredPart } from './plan-geometry';
import { boundsOf, fitView, formatTransform, panBy, toPlan, toScreen, zoomAt, type PairM, type PlanView, type Size } from './plan-view';
import type { PlanSelection, PlanTool } from './plan-types';
import { ZoomControls } from './zoom-controls';

export type PlanDrag =
  | { kind: 'placement-move'; id: number; positionM: PairM; done: boolean }
  | { kind: 'placement-aim'; id: number; azimuthRad: number; done: boolean }
  | { kind: 'viewer-move'; id: string; positionM: PairM; done: boolean };

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
  draftPoints: readonly PairM[];
  draftClosed: boolean;
  /** Pixels at the bottom covered by the floating toolbar; "fit" keeps the plan above them. */
  reserveBottom?: number;
}

/** Movement under this many pixels is a tap, not a drag. */
const TAP_SLOP_PX = 6;
/** Finger-sized pick radius (the 48 px target rule, halved). */
const PICK_PX = 24;

type Gesture =
  | { mode: 'pan'; startX: number; startY: number; startView: PlanView; moved: boolean; tapSelection: PlanSelection | 'none' }
  | { mode: 'placement'; id: number; grabDx: number; grabDy: number; startX: number; startY: number; moved: boolean }
  | { mode: 'aim'; id: number; moved: boolean }
  | { mode: 'viewer'; id: string; grabDx: number; grabDy: number; startX: number; startY: number; moved: boolean }
  | { mode: 'pinch'; startDist: number; startView: PlanView; cx: number; cy: number };

interface DomLike {
  getBoundingClientRect: () => { left: number; top: number };
  addEventListener: (type: 'wheel', fn: (e: WheelEvent) => void, opts: { passive: boolean }) => void;
  removeEventListener: (type: 'wheel', fn: (e: WheelEvent) => void) => void;
  querySelector: (sel: string) => { setAttribute: (k: string, v: string) => void } | null;
  setAttribute: (k: string, v: string) => void;
}

/** On the web a View's ref is its DOM element; natively it is not. */
function asDom(node: unknown): DomLike | null {
  return node && typeof (node as Partial<DomLike>).getBoundingClientRect === 'function' ? (node as DomLike) : null;
}

export function PlanCanvas(props: PlanCanvasProps) {
  const { scene, placements, evaluation, units, tool, canEdit, selection, draftPoints, draftClosed, reserveBottom = 0 } = props;
  const frameRef = useRef<View>(null);
  const originRef = useRef<PairM>([0, 0]);
  const windowSize = useWindowDimensions();
  // Until the first layout arrives (and where none ever does, as in tests), guess the window's size.
  const [size, setSize] = useState<Size>(() => ({ width: windowSize.width, height: Math.max(200, windowSize.height - 200) }));
  const measured = useRef(false);
  const [view, setView] = useState<PlanView | null>(null);
  /** Set once the person pans or zooms; until then a new size refits the plan. */
  const touched = useRef(false);
  const viewRef = useRef<PlanView | null>(null);
  viewRef.current = view;
  const latest = useRef(props);
  latest.current = props;

  const planBounds = useMemo(() => {
    const pts: (readonly [number, number])[] = [];
    scene.walls.forEach((w) => pts.push(w.aM, w.bM));
    scene.zones.forEach((z) => pts.push(...z.polygonM));
    scene.viewers.forEach((v) => pts.push(v.positionM));
    placements.forEach((p) => pts.push(p.positionM));
    return boundsOf(pts);
  }, [scene, placements]);

  const fit = useCallback(() => {
    setView(fitView(planBounds, size, 28, reserveBottom));
  }, [planBounds, size, reserveBottom]);

  const onLayout = (e: LayoutChangeEvent) => {
    const { width, height } = e.nativeEvent.layout;
    setSize((old) => (old.width === width && old.height === height ? old : { width, height }));
    if (!measured.current && !touched.current) {
      measured.current = true;
      setView(null);
    }
    frameRef.current?.measureInWindow((x, y) => {
      originRef.current = [x, y];
    });
  };

  // The first layout fits the plan; later size changes keep the person's own pan and zoom.
  useEffect(() => {
    if (!view) fit();
  }, [view, fit]);

  // Publish the view on the web so browser tests can click at plan coordinates.
  useLayoutEffect(() => {
    const dom = asDom(frameRef.current);
    if (!dom || !view) return;
    const t = formatTransform(view);
    dom.setAttribute('data-transform', t);
    dom.querySelector('svg')?.setAttribute('data-transform', t);
  }, [view]);

  // Mouse wheel zooms about the pointer (web only; pinch covers touch screens).
  useEffect(() => {
    const dom = asDom(frameRef.current);
    if (!dom) return;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      const v = viewRef.current;
      if (!v) return;
      const rect = dom.getBoundingClientRect();
      touched.current = true;
      setView(zoomAt(v, Math.exp(-e.deltaY * 0.0015), e.clientX - rect.left, e.clientY - rect.top));
    };
    dom.addEventListener('wheel', onWheel, { passive: false });
    return () => dom.removeEventListener('wheel', onWheel);
  }, []);

  /* ---------- gestures ---------- */

  const gesture = useRef<Gesture | null>(null);
  const frame = useRef<number | null>(null);
  const pending = useRef<(() => void) | null>(null);

  /** At most one view or drag update per animation frame; the last position wins. */
  const schedule = (apply: () => void) => {
    pending.current = apply;
    if (frame.current !== null) return;
    frame.current = requestAnimationFrame(() => {
      frame.current = null;
      const run = pending.current;
      pending.current = null;
      if (run) {
        markRecomputeStart();
        flushFrame(run);
      }
    });
  };
  const flushNow = () => {
    if (frame.current !== null) cancelAnimationFrame(frame.current);
    frame.current = null;
    pending.current = null;
  };
  useEffect(() => () => flushNow(), []);

  const localPoint = (e: GestureResponderEvent): PairM => {
    const dom = asDom(frameRef.current);
    const { pageX, pageY } = e.nativeEvent;
    if (dom) {
      const r = dom.getBoundingClientRect();
      return [pageX - r.left, pageY - r.top];
    }
    return [pageX - originRef.current[0], pageY - originRef.current[1]];
  };

  const pick = (v: PlanView, pt: PairM): { hit: PlanSelection; aim?: boolean } => {
    const p = latest.current;
    const sel = p.selection;
    if (sel?.kind === 'placement' && p.canEdit) {
      const pl = p.placements.find((x) => x.id === sel.id);
      if (pl) {
        const end = alongAzimuth(toScreen(v, pl.positionM), pl.azimuthRad, AIM_HANDLE_PX);
        if (Math.hypot(end[0] - pt[0], end[1] - pt[1]) <= PICK_PX) return { hit: sel, aim: true };
      }
    }
    let best: { d: number; hit: PlanSelection } | null = null;
    for (const pl of p.placements) {
      const s = toScreen(v, pl.positionM);
      const d = Math.hypot(s[0] - pt[0], s[1] - pt[1]);
      if (d <= Math.max(PICK_PX, MARKER_RADIUS_PX + 6) && (!best || d < best.d)) best = { d, hit: { kind: 'placement', id: pl.id } };
    }
    for (const vw of p.scene.viewers) {
      const s = toScreen(v, vw.positionM);
      const d = Math.hypot(s[0] - pt[0], s[1] - pt[1]);
      if (d <= PICK_PX && (!best || d < best.d)) best = { d, hit: { kind: 'viewer', id: vw.id } };
    }
    if (best) return { hit: best.hit };
    let wall: { d: number; id: string } | null = null;
    for (const w of p.scene.walls) {
      const d = pointSegmentDistance(pt, toScreen(v, w.aM), toScreen(v, w.bM));
      if (d <= 10 && (!wall || d < wall.d)) wall = { d, id: w.id };
    }
    if (wall) return { hit: { kind: 'wall', id: wall.id } };
    const planPt = toPlan(v, pt[0], pt[1]);
    const zone = [...p.scene.zones].reverse().find((z) => pointInPolygon([z.polygonM], planPt));
    return { hit: zone ? { kind: 'zone', id: zone.id } : null };
  };

  const touchesOf = (e: GestureResponderEvent) => e.nativeEvent.touches ?? [];

  const startPinch = (e: GestureResponderEvent, v: PlanView) => {
    const [a, b] = touchesOf(e);
    const origin = localPoint(e);
    const offX = origin[0] - e.nativeEvent.pageX;
    const offY = origin[1] - e.nativeEvent.pageY;
    gesture.current = {
      mode: 'pinch',
      startDist: Math.max(1, Math.hypot(a.pageX - b.pageX, a.pageY - b.pageY)),
      startView: v,
      cx: (a.pageX + b.pageX) / 2 + offX,
      cy: (a.pageY + b.pageY) / 2 + offY,
    };
  };

  const onGrant = (e: GestureResponderEvent) => {
    const v = viewRef.current;
    if (!v) return;
    if (touchesOf(e).length >= 2) return startPinch(e, v);
    const pt = localPoint(e);
    const p = latest.current;
    const { hit, aim } = pick(v, pt);
    const selecting = p.tool === 'select' || !p.canEdit;
    if (aim && hit?.kind === 'placement') {
      gesture.current = { mode: 'aim', id: hit.id, moved: false };
      return;
    }
    if (selecting && hit?.kind === 'placement') {
      p.onSelect(hit);
      const pl = p.placements.find((x) => x.id === hit.id)!;
      const s = toScreen(v, pl.positionM);
      gesture.current = { mode: 'placement', id: hit.id, grabDx: s[0] - pt[0], grabDy: s[1] - pt[1], startX: pt[0], startY: pt[1], moved: false };
      return;
    }
    if (selecting && hit?.kind === 'viewer') {
      p.onSelect(hit);
      const vw = p.scene.viewers.find((x) => x.id === hit.id)!;
      const s = toScreen(v, vw.positionM);
      gesture.current = { mode: 'viewer', id: hit.id, grabDx: s[0] - pt[0], grabDy: s[1] - pt[1], startX: pt[0], startY: pt[1], moved: false };
      return;
    }
    gesture.current = { mode: 'pan', startX: pt[0], startY: pt[1], startView: v, moved: false, tapSelection: selecting ? hit : 'none' };
  };

  const onMove = (e: GestureResponderEvent) => {
    const g = gesture.current;
    const v = viewRef.current;
    if (!g || !v) return;
    if (touchesOf(e).length >= 2 && g.mode !== 'pinch') return startPinch(e, v);
    if (g.mode === 'pinch') {
      const [a, b] = touchesOf(e);
      if (!a || !b) return;
      const k = Math.hypot(a.pageX - b.pageX, a.pageY - b.pageY) / g.startDist;
      touched.current = true;
      schedule(() => setView(zoomAt(g.startView, k, g.cx, g.cy)));
      return;
    }
    const pt = localPoint(e);
    const p = latest.current;
    if (g.mode === 'pan') {
      if (!g.moved && Math.hypot(pt[0] - g.startX, pt[1] - g.startY) < TAP_SLOP_PX) return;
      g.moved = true;
      touched.current = true;
      schedule(() => setView(panBy(g.startView, pt[0] - g.startX, pt[1] - g.startY)));
      return;
    }
    if (!p.canEdit) return;
    if (g.mode === 'aim') {
      const pl = p.placements.find((x) => x.id === g.id);
      if (!pl) return;
      g.moved = true;
      const azimuthRad = azimuthBetween(toScreen(v, pl.positionM), pt);
      schedule(() => p.onDrag({ kind: 'placement-aim', id: g.id, azimuthRad, done: false }));
      return;
    }
    if (!g.moved && Math.hypot(pt[0] - g.startX, pt[1] - g.startY) < TAP_SLOP_PX) return;
    g.moved = true;
    const positionM = toPlan(v, pt[0] + g.grabDx, pt[1] + g.grabDy);
    if (g.mode === 'placement') schedule(() => p.onDrag({ kind: 'placement-move', id: g.id, positionM, done: false }));
    else schedule(() => p.onDrag({ kind: 'viewer-move', id: g.id, positionM, done: false }));
  };

  const onEnd = (e: GestureResponderEvent) => {
    const g = gesture.current;
    gesture.current = null;
    const v = viewRef.current;
    if (!g || !v) return;
    const p = latest.current;
    if (g.mode === 'pinch') return;
    const pt = localPoint(e);
    if (g.mode === 'pan') {
      if (g.moved) {
        // Apply the final position now so a release between frames is not lost.
        flushNow();
        setView(panBy(g.startView, pt[0] - g.startX, pt[1] - g.startY));
        return;
      }
      if (g.tapSelection !== 'none') p.onSelect(g.tapSelection);
      else if (p.canEdit) p.onTapPlan(toPlan(v, pt[0], pt[1]));
      return;
    }
    if (!g.moved || !p.canEdit) return;
    flushNow();
    if (g.mode === 'aim') {
      const pl = p.placements.find((x) => x.id === g.id);
      if (pl) p.onDrag({ kind: 'placement-aim', id: g.id, azimuthRad: azimuthBetween(toScreen(v, pl.positionM), pt), done: true });
      return;
    }
    const positionM = toPlan(v, pt[0] + g.grabDx, pt[1] + g.grabDy);
    if (g.mode === 'placement') p.onDrag({ kind: 'placement-move', id: g.id, positionM, done: true });
    else p.onDrag({ kind: 'viewer-move', id: g.id, positionM, done: true });
  };

  const zoomBy = (k: number) => {
    touched.current = true;
    if (view) setView(zoomAt(view, k, size.width / 2, (size.height - reserveBottom) / 2));
  };

  return (
    <View style={styles.outer}>
    <View
      ref={frameRef}
      style={styles.frame}
      onLayout={onLayout}
      onStartShouldSetResponder={() => true}
      onResponderTerminationRequest={() => false}
      onResponderGrant={onGrant}
      onResponderMove={onMove}
      onResponderRelease={onEnd}
      onResponderTerminate={onEnd}
      role="img"
      aria-label="Site plan: walls, zones, viewers and mirrors with their coverage"
    >
      {view ? (
        <PlanDrawing {...{ scene, placements, evaluation, units, canEdit, selection, draftPoints, draftClosed, view, size, tool }} />
      ) : (
        <View testID="plan-canvas" style={styles.fill} />
      )}
    </View>
      <ZoomControls onZoomIn={() => zoomBy(1.4)} onZoomOut={() => zoomBy(1 / 1.4)} onFit={fit} />
    </View>
  );
}

interface DrawingProps {
  scene: Scene;
  placements: readonly PlacementDto[];
  evaluation: PlanEvaluation | null;
  units: UnitSystem;
  canEdit: boolean;
  tool: PlanTool;
  selection: PlanSelection;
  draftPoints: readonly PairM[];
  draftClosed: boolean;
  view: PlanView;
  size: Size;
}

function PlanDrawing({ scene, placements, evaluation, units, canEdit, selection, draftPoints, draftClosed, view, size }: DrawingProps) {
  const grid = useMemo(() => gridLines(view, size, units), [view, size, units]);
  const bar = scaleBar(view, units);
  const evaluatedById = useMemo(() => new Map((evaluation?.placements ?? []).map((e) => [e.placementId, e])), [evaluation]);
  const zoneFraction = useMemo(() => new Map((evaluation?.zones ?? []).map((z) => [z.zoneId, z.fraction])), [evaluation]);
  // The gap of each zone: the part no mirror shows for that zone's target (in metres, kept while panning).
  const gapsM = useMemo(() => {
    const covered = new Map((evaluation?.zones ?? []).map((z) => [z.zoneId, z]));
    return scene.zones.map((z) => {
      const ev = covered.get(z.id);
      return { id: z.id, gap: ev && !ev.problem ? uncoveredPart(z.polygonM, [ev.covered], z.name) : null };
    });
  }, [evaluation, scene.zones]);
  const gaps = useMemo(() => gapsM.map(({ id, gap }) => ({ id, d: gap?.ok ? multiPolygonToPath(view, gap.region) : '' })), [gapsM, view]);
  const gapProblems = gapsM.flatMap(({ id, gap }) => (gap && !gap.ok ? [{ id, problem: gap.problem }] : []));

  const selectedPlacement = selection?.kind === 'placement' ? placements.find((p) => p.id === selection.id) : undefined;
  const selectedViewer = selectedPlacement ? scene.viewers.find((v) => v.id === selectedPlacement.viewerId) : undefined;

  return (
    <Svg testID="plan-canvas" width={size.width} height={size.height} style={styles.svg}>
      <Defs>
        <Pattern id={GAP_HATCH_ID} patternUnits="userSpaceOnUse" width={9} height={9} patternTransform="rotate(45)">
          <Line x1={0} y1={0} x2={0} y2={9} stroke={palette.stop} strokeWidth={3} strokeOpacity={0.75} />
        </Pattern>
      </Defs>
      <Rect x={0} y={0} width={size.width} height={size.height} fill={palette.sheet} />
      <Path pointerEvents="none" d={grid.minor} stroke={palette.ruleSoft} strokeWidth={1} />
      <Path pointerEvents="none" d={grid.major} stroke={palette.rule} strokeWidth={1.2} />
      {scene.zones.map((z) => (
        <ZoneShapes key={z.id} zone={z} fraction={zoneFraction.get(z.id) ?? Number.NaN} view={view} selected={selection?.kind === 'zone' && selection.id === z.id} />
      ))}
      <G>
        {placements.map((p) => (
          <CoverageLayer key={p.id} placementId={p.id} evaluated={evaluatedById.get(p.id)} view={view} selected={selectedPlacement?.id === p.id} />
        ))}
      </G>
      {gaps.map((g) => (
        <ZoneGap key={g.id} d={g.d} />
      ))}
      <WallsLayer walls={scene.walls} view={view} selectedId={selection?.kind === 'wall' ? selection.id : null} />
      {selectedPlacement && selectedViewer ? <Sightline from={toScreen(view, selectedViewer.positionM)} to={toScreen(view, selectedPlacement.positionM)} /> : null}
      {scene.zones.map((z) => (
        <ZoneLabel key={z.id} zone={z} fraction={zoneFraction.get(z.id) ?? Number.NaN} view={view} />
      ))}
      {scene.viewers.map((v) => (
        <ViewerMarker key={v.id} viewer={v} view={view} selected={selection?.kind === 'viewer' && selection.id === v.id} />
      ))}
      {placements.map((p) => (
        <PlacementMarker key={p.id} placement={p} problem={evaluatedById.get(p.id)?.problem?.message ?? null} view={view} selected={selectedPlacement?.id === p.id} />
      ))}
      {selectedPlacement && canEdit ? <AimHandle from={toScreen(view, selectedPlacement.positionM)} azimuthRad={selectedPlacement.azimuthRad} /> : null}
      <DraftShape points={draftPoints} closed={draftClosed} view={view} />
      <G pointerEvents="none">
        <Rect x={12} y={10} width={bar.lengthPx + 16} height={34} rx={6} fill={palette.sheet} fillOpacity={0.9} />
        <Path d={`M20 24V34H${20 + bar.lengthPx}V24`} stroke={palette.asphalt} strokeWidth={2.5} fill="none" />
        <SvgText testID="plan-scale-label" x={20} y={22} fontFamily={fonts.semibold} fontSize={12} fill={palette.asphalt}>
          {bar.label}
        </SvgText>
        {gapProblems.map((g, i) => (
          <SvgText key={g.id} testID={`plan-gap-problem-${g.id}`} x={12} y={62 + i * 16} fontFamily={fonts.semibold} fontSize={12} fill={palette.stop}>
            {g.problem}
          </SvgText>
        ))}
      </G>
    </Svg>
  );
}

const styles = StyleSheet.create({
  outer: { flex: 1 },
  frame: { flex: 1, overflow: 'hidden', backgroundColor: palette.sheet, userSelect: 'none', touchAction: 'none' } as object,
  fill: { flex: 1 },
  svg: { position: 'absolute', left: 0, top: 0 },
});
