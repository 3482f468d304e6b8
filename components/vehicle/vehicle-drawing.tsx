/**
 * The vehicle's top view for one view, forward up: the ground fields as outlined areas with their
 * share, the parts no mirror shows hatched, the body boxes, the driver's two eye points, the
 * mirrors with their aim, and a scale bar. Draws only; the canvas owns gestures and the view.
 */
import { useMemo } from 'react';
import { Circle, G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import { fonts, palette } from '@/constants/theme';
import type { VehicleEvaluation, VehiclePlacement } from '@/hooks/use-vehicle-evaluation';
import type { MultiPolygon } from '@/shared/geometry/polygon';
import type { FieldScore } from '@/shared/vehicle';
import { formatFieldShare } from '@/shared/project-optics';
import type { UnitSystem } from '@/shared/units';
import { DrawingFrame } from '@/components/plan/drawing-frame';
import { alongAzimuth, multiPolygonToPath, ringsToPath } from '@/components/plan/plan-geometry';
import { AIM_HANDLE_PX, toScreen, type PlanView, type Size } from '@/components/plan/plan-view';
import { azimuthToDisplay, polygonToDisplay, ringCentroid, ringToDisplay, toDisplay } from './vehicle-frame';
import { fieldLabel } from './vehicle-words';
import { AIM_KNOB_PX, MARKER_PX, MIRROR_LABEL_H, markerRing, mirrorLabelBox, shortMirrorLabel } from './mirror-label';
import type { PartPlacing } from './vehicle-parts-editor';
import type { LabelBox } from '@/shared/label-placement';

/** The vehicle's gaps: 8 px, at −35° (the site plan's run the other way). */
const HATCH = { id: 'vehicle-gap-hatch', sizePx: 8, rotateDeg: -35, strokeWidth: 2.5, opacity: 0.7 };

export interface VehicleDrawingProps {
  evaluation: VehicleEvaluation;
  placements: readonly VehiclePlacement[];
  selectedId: number | null;
  canEdit: boolean;
  units: UnitSystem;
  view: PlanView;
  size: Size;
  placing?: PartPlacing;
}

const verdictColour = (v: string | undefined) => (v === 'pass' ? palette.go : v === 'short' ? palette.stop : palette.glass);

export function VehicleDrawing({ evaluation, placements, selectedId, canEdit, units, view, size, placing = null }: VehicleDrawingProps) {
  const scores = useMemo(() => new Map((evaluation.score?.fields ?? []).map((s) => [s.field.id, s])), [evaluation.score]);
  const fieldsD = useMemo(
    () => evaluation.fields.map((f) => ({ f, d: ringsToPath(view, polygonToDisplay(f.polygonM)) })),
    [evaluation.fields, view],
  );
  const gapsD = useMemo(
    () =>
      (evaluation.score?.fields ?? []).map((s) => ({
        id: s.field.id,
        d: multiPolygonToPath(view, s.gapsM.map((p) => polygonToDisplay(p)) as MultiPolygon),
      })),
    [evaluation.score, view],
  );
  // What the selected mirror shows the driver on the ground (from either eye), under the gaps.
  const footprintD = useMemo(() => {
    const region = selectedId === null ? null : evaluation.mirrors.get(selectedId)?.coverage?.region;
    return region ? multiPolygonToPath(view, region.map((p) => polygonToDisplay(p)) as MultiPolygon) : '';
  }, [evaluation.mirrors, selectedId, view]);
  const g = evaluation.geometry;
  const outline = ringsToPath(view, [ringToDisplay(g.outline)]);
  const selected = placements.find((p) => p.id === selectedId);

  return (
    <DrawingFrame testID="vehicle-canvas" scaleLabelTestID="vehicle-scale-label" view={view} size={size} units={units} hatch={HATCH}>
      <G pointerEvents="none">
        {fieldsD.map(({ f, d }) => (
          <Path
            key={f.id}
            testID={`vehicle-field-${f.id}`}
            d={d}
            fillRule="evenodd"
            fill={palette.glassSoft}
            fillOpacity={0.45}
            stroke={verdictColour(scores.get(f.id)?.verdict)}
            strokeWidth={2}
            strokeDasharray="7 4"
          />
        ))}
        {footprintD ? (
          <Path
            testID="vehicle-footprint"
            d={footprintD}
            fillRule="evenodd"
            fill={palette.glass}
            fillOpacity={0.22}
            stroke={palette.glass}
            strokeWidth={1}
          />
        ) : null}
        {gapsD.map(({ id, d }) =>
          d ? <Path key={id} testID={`vehicle-gap-${id}`} d={d} fillRule="evenodd" fill={`url(#${HATCH.id})`} /> : null,
        )}
        {g.boxes.map((b) => (
          <Path
            key={b.box.id}
            d={ringsToPath(view, [ringToDisplay(b.ring)])}
            fill={b.box.windowLineM !== null ? palette.asphaltRaised : palette.rule}
            fillOpacity={b.box.windowLineM !== null ? 0.85 : 0.9}
            stroke={palette.asphalt}
            strokeWidth={1.5}
          />
        ))}
        <Path d={outline} fill="none" stroke={palette.asphalt} strokeWidth={2} />
        <EyePoints evaluation={evaluation} view={view} />
        <Cylinders evaluation={evaluation} view={view} placing={placing} />
        <Corners evaluation={evaluation} view={view} placing={placing} />
        {fieldLabels(evaluation, scores, view).map(({ id, text, x, y, w, verdict }) => (
          <G key={id}>
            <Rect x={x - w / 2} y={y - 11} width={w} height={20} rx={4} fill={palette.card} fillOpacity={0.92} />
            <SvgText
              testID={`vehicle-field-label-${id}`}
              x={x}
              y={y + 4}
              textAnchor="middle"
              fontFamily={fonts.semibold}
              fontSize={12}
              fill={verdictColour(verdict)}
            >
              {text}
            </SvgText>
          </G>
        ))}
      </G>
      {placements.map((p) => (
        <MirrorMarker
          key={p.id}
          placement={p}
          view={view}
          selected={p.id === selectedId}
          withHandle={p.id === selectedId && canEdit}
          others={placements.filter((o) => o.id !== p.id).map((o) => markerRing(toScreen(view, toDisplay(o.positionM))))}
          size={size}
          problem={evaluation.mirrors.get(p.id)?.problem?.message ?? null}
        />
      ))}
      {selected && canEdit ? <AimHandle placement={selected} view={view} /> : null}
    </DrawingFrame>
  );
}

/**
 * Each field's label ("V 81 %") at the middle of its area (a ring with a hole: at its outer
 * corner), in screen pixels; a label that would sit on one placed before it moves down a line.
 */
export function fieldLabels(
  evaluation: Pick<VehicleEvaluation, 'fields'>,
  scores: ReadonlyMap<string, FieldScore>,
  view: PlanView,
): { id: string; text: string; x: number; y: number; w: number; verdict: FieldScore['verdict'] | undefined }[] {
  const placed: { id: string; text: string; x: number; y: number; w: number; verdict: FieldScore['verdict'] | undefined }[] = [];
  for (const f of evaluation.fields) {
    const s = scores.get(f.id);
    const anchor = f.polygonM.length > 1 ? f.polygonM[0][0] : ringCentroid(f.polygonM[0]);
    const [x, y0] = toScreen(view, toDisplay(anchor));
    const text = `${fieldLabel(f.code)} ${s ? formatFieldShare(s.share) : '—'}`;
    const w = text.length * 6.8 + 8;
    let y = y0;
    for (let tries = 0; tries < 6; tries++) {
      const clash = placed.find((p) => Math.abs(p.y - y) < 21 && Math.abs(p.x - x) < (p.w + w) / 2);
      if (!clash) break;
      y = clash.y + 22;
    }
    placed.push({ id: f.id, text, x, y, w, verdict: s?.verdict });
  }
  return placed;
}

function EyePoints({ evaluation, view }: { evaluation: VehicleEvaluation; view: PlanView }) {
  const [a, b] = evaluation.geometry.ocularM;
  const pa = toScreen(view, toDisplay([a[0], a[1]]));
  const pb = toScreen(view, toDisplay([b[0], b[1]]));
  // The two points are 65 mm apart: drawn at least 8 px apart so both stay visible at any zoom.
  const mid: [number, number] = [(pa[0] + pb[0]) / 2, (pa[1] + pb[1]) / 2];
  const half = Math.max(4, Math.hypot(pa[0] - pb[0], pa[1] - pb[1]) / 2);
  return (
    <G testID="vehicle-eyes">
      <Circle cx={mid[0] - half} cy={mid[1]} r={3.5} fill={palette.beacon} stroke={palette.asphalt} strokeWidth={1.2} />
      <Circle cx={mid[0] + half} cy={mid[1]} r={3.5} fill={palette.beacon} stroke={palette.asphalt} strokeWidth={1.2} />
      <SvgText x={mid[0]} y={mid[1] - 8} textAnchor="middle" fontFamily={fonts.semibold} fontSize={11} fill={palette.onAsphalt}>
        eyes
      </SvgText>
    </G>
  );
}

/** A mirror as a short bar across its aim with a notch toward where it looks; red when it cannot be computed. */
function MirrorMarker({
  placement,
  view,
  selected,
  withHandle,
  size,
  others,
  problem,
}: {
  placement: VehiclePlacement;
  view: PlanView;
  selected: boolean;
  withHandle: boolean;
  size: Size;
  others: readonly LabelBox[];
  problem: string | null;
}) {
  const c = toScreen(view, toDisplay(placement.positionM));
  const az = azimuthToDisplay(placement.azimuthRad);
  const across = alongAzimuth([0, 0], az + Math.PI / 2, MARKER_PX);
  const ahead = alongAzimuth(c, az, MARKER_PX * 0.9);
  const colour = problem ? palette.stop : palette.glass;
  // Beside the marker, clear of its aim line and (picked) the aim handle, whatever the zoom.
  const text = shortMirrorLabel(placement.label);
  const label = mirrorLabelBox(c, az, text, withHandle, { x: 0, y: 0, w: size.width, h: size.height }, others);
  return (
    <G testID={`vehicle-marker-${placement.id}`} pointerEvents="none">
      <Circle
        cx={c[0]}
        cy={c[1]}
        r={MARKER_PX + 5}
        fill={selected ? palette.beaconSoft : palette.card}
        fillOpacity={0.85}
        stroke={selected ? palette.beaconPressed : 'none'}
        strokeWidth={2}
      />
      <Line
        x1={c[0] - across[0]}
        y1={c[1] - across[1]}
        x2={c[0] + across[0]}
        y2={c[1] + across[1]}
        stroke={colour}
        strokeWidth={5}
        strokeLinecap="round"
      />
      <Line x1={c[0]} y1={c[1]} x2={ahead[0]} y2={ahead[1]} stroke={colour} strokeWidth={2.5} />
      <Rect x={label.x} y={label.y} width={label.w} height={label.h} rx={3} fill={palette.card} fillOpacity={0.85} />
      <SvgText
        testID={`vehicle-mirror-label-${placement.id}`}
        x={label.x + label.w / 2}
        y={label.y + label.h - 4}
        textAnchor="middle"
        fontFamily={fonts.semibold}
        fontSize={12}
        fill={palette.asphalt}
      >
        {text}
      </SvgText>
    </G>
  );
}

function AimHandle({ placement, view }: { placement: VehiclePlacement; view: PlanView }) {
  const c = toScreen(view, toDisplay(placement.positionM));
  const end = alongAzimuth(c, azimuthToDisplay(placement.azimuthRad), AIM_HANDLE_PX);
  return (
    <G testID="vehicle-aim-handle" pointerEvents="none">
      <Line x1={c[0]} y1={c[1]} x2={end[0]} y2={end[1]} stroke={palette.beaconPressed} strokeWidth={2.5} strokeDasharray="4 3" />
      <Circle cx={end[0]} cy={end[1]} r={AIM_KNOB_PX} fill={palette.beacon} stroke={palette.asphalt} strokeWidth={2} />
    </G>
  );
}

/** The test cylinders to scale (at least a dot): green when seen and meeting their image rule, amber when seen only, red when not seen. */
function Cylinders({ evaluation, view, placing }: { evaluation: VehicleEvaluation; view: PlanView; placing: PartPlacing }) {
  const seen = new Map((evaluation.score?.targets ?? []).map((t) => [t.targetId, t]));
  return (
    <G testID="vehicle-cylinders">
      {evaluation.vehicle.targets.map((t) => {
        const c = toScreen(view, toDisplay(t.positionM));
        const r = Math.max(5, (t.diameterM / 2) * view.scale);
        const s = seen.get(t.id);
        const colour = !s ? palette.glass : !s.visible ? palette.stop : s.passes ? palette.go : palette.beaconPressed;
        const picked = placing?.kind === 'target' && placing.id === t.id;
        const short = t.name.split(',')[0].slice(0, 12);
        return (
          <G key={t.id} testID={`vehicle-cylinder-mark-${t.id}`}>
            <Circle
              cx={c[0]}
              cy={c[1]}
              r={r}
              fill={colour}
              fillOpacity={0.75}
              stroke={picked ? palette.beaconPressed : palette.asphalt}
              strokeWidth={picked ? 3 : 1.2}
            />
            <SvgText x={c[0] + r + 3} y={c[1] + 4} fontFamily={fonts.semibold} fontSize={11} fill={palette.asphalt}>
              {short}
            </SvgText>
          </G>
        );
      })}
    </G>
  );
}

/** The numbered corners of the own field whose corner is being placed. */
function Corners({ evaluation, view, placing }: { evaluation: VehicleEvaluation; view: PlanView; placing: PartPlacing }) {
  if (placing?.kind !== 'corner') return null;
  const f = evaluation.vehicle.groundFields.find((g) => g.id === placing.id);
  if (!f) return null;
  return (
    <G testID="vehicle-field-corners">
      {f.polygonM.map((p, i) => {
        const c = toScreen(view, toDisplay(p));
        const on = i === placing.index;
        return (
          <G key={i}>
            <Circle
              cx={c[0]}
              cy={c[1]}
              r={on ? 9 : 6}
              fill={on ? palette.beacon : palette.card}
              stroke={palette.asphalt}
              strokeWidth={1.5}
            />
            <SvgText
              x={c[0]}
              y={c[1] - 12}
              textAnchor="middle"
              fontFamily={fonts.semibold}
              fontSize={MIRROR_LABEL_H - 5}
              fill={palette.asphalt}
            >
              {String(i + 1)}
            </SvgText>
          </G>
        );
      })}
    </G>
  );
}
