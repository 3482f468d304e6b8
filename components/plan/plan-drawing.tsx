/**
 * The plan drawn for one view: grid, zones with their share, coverage fans, gaps, walls, the
 * selected mirror's sightline, labels, markers, the aim handle, the shape being drawn and the
 * scale bar. Draws only; the canvas owns gestures and the view.
 */
import { useMemo, type ReactNode } from 'react';
import { G, Image as SvgImage, Text as SvgText } from 'react-native-svg';
import { fonts, palette } from '@/constants/theme';
import type { PlanEvaluation } from '@/hooks/use-plan-evaluation';
import type { PlacementDto, Scene } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';
import {
  AimHandle,
  CoverageLayer,
  SketchShape,
  GAP_HATCH_ID,
  PlacementMarker,
  Sightline,
  ViewerMarker,
  WallsLayer,
  ZoneGap,
  ZoneLabel,
  ZoneShapes,
  mirrorLabelPlate,
  NAME_MIN_SCALE,
  viewerNamePlate,
  zoneLabelParts,
} from './plan-layers';
import { DrawingFrame, scaleBarPlate } from './drawing-frame';
import { alongAzimuth, multiPolygonToPath, scaleBar, uncoveredPart } from './plan-geometry';
import { LABEL_PRIORITY, layoutPlanLabels, markerBox, type PlanLabelRequest } from './plan-labels';
import { AIM_HANDLE_PX, MARKER_RADIUS_PX, toScreen, type PairM, type PlanView, type Size } from './plan-view';
import type { LabelBox } from '@/shared/label-placement';
import type { PlanSelection, PlanTool } from './plan-types';
import { underlayMatrix } from './underlay-edits';
import type { Underlay } from '@/shared/schemas/files';

/** A plan underlay ready to draw: the scene's placement of it and the stored image's address and size. */
export interface UnderlayImage {
  underlay: Underlay;
  href: string;
  widthPx: number;
  heightPx: number;
}

export interface DrawingProps {
  scene: Scene;
  placements: readonly PlacementDto[];
  evaluation: PlanEvaluation | null;
  units: UnitSystem;
  canEdit: boolean;
  tool: PlanTool;
  selection: PlanSelection;
  sketchPoints: readonly PairM[];
  sketchClosed: boolean;
  view: PlanView;
  size: Size;
  /** Drawn above the plan's own marks, below the scale bar (comment markers). */
  children?: ReactNode;
  /** The customer's plan drawn under everything, grid included, at its calibrated scale. */
  underlay?: UnderlayImage | null;
}

export function PlanDrawing({
  scene,
  placements,
  evaluation,
  units,
  canEdit,
  selection,
  sketchPoints,
  sketchClosed,
  view,
  size,
  children,
  underlay,
}: DrawingProps) {
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
  const labels = useMemo(
    () =>
      planLabelLayout(
        scene,
        placements,
        zoneFraction,
        view,
        size,
        selection,
        selectedPlacement && canEdit ? selectedPlacement : undefined,
        scaleBarPlate(bar.lengthPx),
      ),
    [scene, placements, zoneFraction, view, size, selection, selectedPlacement, canEdit, bar.lengthPx],
  );
  const at = (key: string) => {
    const b = labels.get(key);
    return b ? { plateX: b.x, plateY: b.y } : {};
  };

  return (
    <DrawingFrame
      testID="plan-canvas"
      scaleLabelTestID="plan-scale-label"
      view={view}
      size={size}
      units={units}
      hatch={PLAN_GAP_HATCH}
      background={
        underlay ? (
          <SvgImage
            testID="plan-underlay"
            pointerEvents="none"
            href={underlay.href}
            x={0}
            y={0}
            width={underlay.widthPx}
            height={underlay.heightPx}
            preserveAspectRatio="none"
            opacity={underlay.underlay.opacity}
            transform={underlayMatrix(underlay.underlay, view)}
          />
        ) : null
      }
      notes={gapProblems.map((g, i) => (
        <SvgText
          key={g.id}
          testID={`plan-gap-problem-${g.id}`}
          x={12}
          y={62 + i * 16}
          fontFamily={fonts.semibold}
          fontSize={12}
          fill={palette.stop}
        >
          {g.problem}
        </SvgText>
      ))}
    >
      {scene.zones.map((z) => (
        <ZoneShapes
          key={z.id}
          zone={z}
          fraction={zoneFraction.get(z.id) ?? Number.NaN}
          view={view}
          selected={selection?.kind === 'zone' && selection.id === z.id}
        />
      ))}
      <G>
        {placements.map((p) => (
          <CoverageLayer
            key={p.id}
            placementId={p.id}
            evaluated={evaluatedById.get(p.id)}
            view={view}
            selected={selectedPlacement?.id === p.id}
          />
        ))}
      </G>
      {gaps.map((g) => (
        <ZoneGap key={g.id} d={g.d} />
      ))}
      <WallsLayer walls={scene.walls} view={view} selectedId={selection?.kind === 'wall' ? selection.id : null} />
      {selectedPlacement && selectedViewer ? (
        <Sightline from={toScreen(view, selectedViewer.positionM)} to={toScreen(view, selectedPlacement.positionM)} />
      ) : null}
      {scene.zones.map((z) => (
        <ZoneLabel key={z.id} zone={z} fraction={zoneFraction.get(z.id) ?? Number.NaN} view={view} {...at(`zone-${z.id}`)} />
      ))}
      {scene.viewers.map((v) => (
        <ViewerMarker
          key={v.id}
          viewer={v}
          view={view}
          selected={selection?.kind === 'viewer' && selection.id === v.id}
          nameHidden={labels.get(`viewer-${v.id}`) === null}
          {...at(`viewer-${v.id}`)}
        />
      ))}
      {placements.map((p) => (
        <PlacementMarker
          key={p.id}
          placement={p}
          problem={evaluatedById.get(p.id)?.problem?.message ?? null}
          view={view}
          selected={selectedPlacement?.id === p.id}
          labelHidden={labels.get(`placement-${p.id}`) === null}
          {...at(`placement-${p.id}`)}
        />
      ))}
      {selectedPlacement && canEdit ? (
        <AimHandle from={toScreen(view, selectedPlacement.positionM)} azimuthRad={selectedPlacement.azimuthRad} />
      ) : null}
      <SketchShape points={sketchPoints} closed={sketchClosed} view={view} />
      {children}
    </DrawingFrame>
  );
}

/** The plan's gaps: 9 px, at 45°. */
const PLAN_GAP_HATCH = { id: GAP_HATCH_ID, sizePx: 9, rotateDeg: 45, strokeWidth: 3, opacity: 0.75 };

/**
 * The plan's labels for this view, placed clear of each other, the markers and the aim handle
 * (plan-labels.ts). Viewer names show only from NAME_MIN_SCALE up, or when selected.
 */
function planLabelLayout(
  scene: Scene,
  placements: readonly PlacementDto[],
  zoneFraction: Map<string, number>,
  view: PlanView,
  size: Size,
  selection: PlanSelection,
  aimed: PlacementDto | undefined,
  /** The scale bar's plate at the top left, drawn over everything. */
  scaleBarBox: LabelBox,
): Map<string, LabelBox | null> {
  const isSelected = (kind: string, id: string | number) => selection?.kind === kind && selection.id === id;
  const requests: PlanLabelRequest[] = [];
  for (const z of scene.zones) {
    const parts = zoneLabelParts(z, zoneFraction.get(z.id) ?? Number.NaN, view);
    const b = parts.preferred;
    requests.push({
      key: `zone-${z.id}`,
      anchor: parts.anchor,
      w: b.w,
      h: b.h,
      preferred: b,
      clearance: 0,
      priority: isSelected('zone', z.id) ? LABEL_PRIORITY.selected : LABEL_PRIORITY.zone,
      mustShow: true,
    });
  }
  for (const p of placements) {
    const b = mirrorLabelPlate(p, view);
    const selected = isSelected('placement', p.id);
    requests.push({
      key: `placement-${p.id}`,
      anchor: toScreen(view, p.positionM),
      w: b.w,
      h: b.h,
      preferred: b,
      clearance: MARKER_RADIUS_PX,
      priority: selected ? LABEL_PRIORITY.selected : LABEL_PRIORITY.mirror,
      mustShow: selected,
    });
  }
  for (const v of scene.viewers) {
    const selected = isSelected('viewer', v.id);
    if (!selected && view.scale < NAME_MIN_SCALE) continue;
    const b = viewerNamePlate(v, view);
    requests.push({
      key: `viewer-${v.id}`,
      anchor: toScreen(view, v.positionM),
      w: b.w,
      h: b.h,
      preferred: b,
      clearance: MARKER_RADIUS_PX,
      priority: selected ? LABEL_PRIORITY.selected : LABEL_PRIORITY.viewer,
      mustShow: selected,
    });
  }
  // Markers drawn a little larger than their radius (the selected one's thick ring), and the aim handle.
  const obstacles: LabelBox[] = [
    scaleBarBox,
    ...placements.map((p) => markerBox(toScreen(view, p.positionM), MARKER_RADIUS_PX + 3)),
    ...scene.viewers.map((v) => markerBox(toScreen(view, v.positionM), MARKER_RADIUS_PX + 3)),
  ];
  if (aimed) obstacles.push(markerBox(alongAzimuth(toScreen(view, aimed.positionM), aimed.azimuthRad, AIM_HANDLE_PX), 16));
  return layoutPlanLabels(requests, obstacles, { x: 0, y: 0, w: size.width, h: size.height });
}
