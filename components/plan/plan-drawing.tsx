/**
 * The plan drawn for one view: grid, zones with their share, coverage fans, gaps, walls, the
 * selected mirror's sightline, labels, markers, the aim handle, the shape being drawn and the
 * scale bar. Draws only; the canvas owns gestures and the view.
 */
import { useMemo, type ReactNode } from 'react';
import { StyleSheet } from 'react-native';
import Svg, { Defs, G, Line, Path, Pattern, Rect, Text as SvgText } from 'react-native-svg';
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
} from './plan-layers';
import { gridLines, multiPolygonToPath, scaleBar, uncoveredPart } from './plan-geometry';
import { toScreen, type PairM, type PlanView, type Size } from './plan-view';
import type { PlanSelection, PlanTool } from './plan-types';

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
}: DrawingProps) {
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
      <Rect x={0} y={0} width={size.width} height={size.height} fill={palette.card} />
      <Path pointerEvents="none" d={grid.minor} stroke={palette.ruleSoft} strokeWidth={1} />
      <Path pointerEvents="none" d={grid.major} stroke={palette.rule} strokeWidth={1.2} />
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
        <ZoneLabel key={z.id} zone={z} fraction={zoneFraction.get(z.id) ?? Number.NaN} view={view} />
      ))}
      {scene.viewers.map((v) => (
        <ViewerMarker key={v.id} viewer={v} view={view} selected={selection?.kind === 'viewer' && selection.id === v.id} />
      ))}
      {placements.map((p) => (
        <PlacementMarker
          key={p.id}
          placement={p}
          problem={evaluatedById.get(p.id)?.problem?.message ?? null}
          view={view}
          selected={selectedPlacement?.id === p.id}
        />
      ))}
      {selectedPlacement && canEdit ? (
        <AimHandle from={toScreen(view, selectedPlacement.positionM)} azimuthRad={selectedPlacement.azimuthRad} />
      ) : null}
      <SketchShape points={sketchPoints} closed={sketchClosed} view={view} />
      {children}
      <G pointerEvents="none">
        <Rect x={12} y={10} width={bar.lengthPx + 16} height={34} rx={6} fill={palette.card} fillOpacity={0.9} />
        <Path d={`M20 24V34H${20 + bar.lengthPx}V24`} stroke={palette.asphalt} strokeWidth={2.5} fill="none" />
        <SvgText testID="plan-scale-label" x={20} y={22} fontFamily={fonts.semibold} fontSize={12} fill={palette.asphalt}>
          {bar.label}
        </SvgText>
        {gapProblems.map((g, i) => (
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
      </G>
    </Svg>
  );
}

const styles = StyleSheet.create({
  svg: { position: 'absolute', left: 0, top: 0 },
});
