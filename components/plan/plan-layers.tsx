/**
 * The pieces of the plan drawing, each in screen pixels for the current view. Split so that, while
 * one mirror is dragged, React skips every other mirror's layer (their props do not change).
 */
import { memo } from 'react';
import { Circle, G, Line, Path, Rect, Text as SvgText, TSpan } from 'react-native-svg';
import { fonts, palette } from '@/constants/theme';
import type { EvaluatedPlacement } from '@/shared/project-optics';
import type { PlacementDto, SceneViewer, SceneWall, SceneZone } from '@/shared/schemas';
import { alongAzimuth, multiPolygonToPath, ringsToPath } from './plan-geometry';
import { AIM_HANDLE_PX, MARKER_RADIUS_PX, toScreen, type PairM, type PlanView } from './plan-view';
import { bandColours, bandWords, formatCoveredShare, zoneBand } from './zone-quality';

export const GAP_HATCH_ID = 'plan-gap-hatch';
/** Pixels per metre from which viewer names are drawn. */
export const NAME_MIN_SCALE = 14;

/** Splits a sentence into lines of about `width` characters for SVG text, which does not wrap. */
export function wrapWords(text: string, width: number, maxLines: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    if (line && (line + ' ' + word).length > width) {
      lines.push(line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(line);
  if (lines.length > maxLines) {
    const kept = lines.slice(0, maxLines);
    kept[maxLines - 1] = `${kept[maxLines - 1]}…`;
    return kept;
  }
  return lines;
}

/** A light plate behind text so labels stay readable over grid, fans and hatching. */
function LabelPlate({ x, y, width, lines, lineHeight = 16 }: { x: number; y: number; width: number; lines: number; lineHeight?: number }) {
  return (
    <Rect
      pointerEvents="none"
      x={x - 4}
      y={y - lineHeight + 3}
      width={width + 8}
      height={lines * lineHeight + 4}
      rx={4}
      fill={palette.card}
      fillOpacity={0.9}
    />
  );
}

export const approxWidth = (text: string, px = 7.4) => text.length * px;

/** The plate (LabelPlate's rectangle) around text whose first baseline starts at (x, y). */
export const plateBox = (x: number, y: number, width: number, lines: number, lineHeight = 16) => ({
  x: x - 4,
  y: y - lineHeight + 3,
  w: width + 8,
  h: lines * lineHeight + 4,
});
/** The text's first baseline for a plate placed at `box` (the inverse of plateBox). */
const textAt = (box: { x: number; y: number }, lineHeight = 16): PairM => [box.x + 4, box.y + lineHeight - 3];

export const WallsLayer = memo(function WallsLayer({
  walls,
  view,
  selectedId,
}: {
  walls: readonly SceneWall[];
  view: PlanView;
  selectedId: string | null;
}) {
  return (
    <G pointerEvents="none">
      {walls.map((w) => {
        const [ax, ay] = toScreen(view, w.aM);
        const [bx, by] = toScreen(view, w.bM);
        const selected = w.id === selectedId;
        const style = wallStyle[w.kind];
        return (
          <G key={w.id}>
            {selected ? (
              <Line x1={ax} y1={ay} x2={bx} y2={by} stroke={palette.beacon} strokeWidth={style.width + 8} strokeLinecap="round" />
            ) : null}
            <Line
              x1={ax}
              y1={ay}
              x2={bx}
              y2={by}
              stroke={style.colour}
              strokeWidth={style.width}
              strokeDasharray={style.dash}
              strokeLinecap={w.kind === 'door' ? 'butt' : 'square'}
            />
            {w.kind === 'racking' ? (
              <Line x1={ax} y1={ay} x2={bx} y2={by} stroke={palette.card} strokeWidth={1.5} strokeDasharray="2 6" />
            ) : null}
          </G>
        );
      })}
    </G>
  );
});

/** Walls solid and heavy; racking lighter with a broken white core (reads as shelving); doors dashed. */
const wallStyle = {
  wall: { colour: palette.asphalt, width: 5, dash: undefined },
  racking: { colour: palette.asphaltRaised, width: 4, dash: undefined },
  door: { colour: palette.haze, width: 3, dash: '8 5' },
} as const;

export function ZoneShapes({ zone, fraction, view, selected }: { zone: SceneZone; fraction: number; view: PlanView; selected: boolean }) {
  const colours = bandColours[zoneBand(fraction)];
  const d = ringsToPath(view, [zone.polygonM]);
  return (
    <G pointerEvents="none">
      <Path d={d} fill={colours.fill} fillOpacity={0.55} stroke="none" />
      <Path
        d={d}
        fill="none"
        stroke={selected ? palette.beacon : colours.stroke}
        strokeWidth={selected ? 4 : 2.5}
        strokeDasharray={selected ? undefined : '10 4'}
      />
    </G>
  );
}

export function ZoneGap({ d }: { d: string }) {
  return d ? (
    <Path
      pointerEvents="none"
      d={d}
      fill={`url(#${GAP_HATCH_ID})`}
      fillRule="evenodd"
      stroke={palette.stop}
      strokeWidth={1}
      strokeOpacity={0.6}
    />
  ) : null;
}

/** A zone label's text, its width, and where it sits when nothing is in the way (centred on the zone's box). */
export function zoneLabelParts(zone: SceneZone, fraction: number, view: PlanView) {
  const band = zoneBand(fraction);
  const xs = zone.polygonM.map((p) => p[0]);
  const ys = zone.polygonM.map((p) => p[1]);
  const anchor = toScreen(view, [(Math.min(...xs) + Math.max(...xs)) / 2, (Math.min(...ys) + Math.max(...ys)) / 2]);
  const pct = formatCoveredShare(fraction);
  const name = zone.name.length > 28 ? `${zone.name.slice(0, 27)}…` : zone.name;
  const second = bandWords[band];
  const width = Math.max(approxWidth(`${name} · ${pct}`), approxWidth(second));
  return { band, pct, name, second, width, anchor, preferred: plateBox(anchor[0] - width / 2, anchor[1] - 4, width, 2) };
}

export function ZoneLabel({
  zone,
  fraction,
  view,
  plateX,
  plateY,
}: {
  zone: SceneZone;
  fraction: number;
  view: PlanView;
  /** Where the label layout put the plate (plan-labels.ts); its preferred spot when not given. */
  plateX?: number;
  plateY?: number;
}) {
  const { band, pct, name, second, width, preferred } = zoneLabelParts(zone, fraction, view);
  const [x, y] = textAt({ x: plateX ?? preferred.x, y: plateY ?? preferred.y });
  const cy = y + 4;
  return (
    <G>
      <LabelPlate x={x} y={cy - 4} width={width} lines={2} />
      <SvgText
        pointerEvents="none"
        testID={`zone-label-${zone.id}`}
        x={x}
        y={cy - 4}
        fontFamily={fonts.semibold}
        fontSize={13}
        fill={palette.asphalt}
      >
        <TSpan>{`${name} · `}</TSpan>
        <TSpan testID={`zone-pct-${zone.id}`} fontFamily={fonts.bold} fill={bandColours[band].text}>
          {pct}
        </TSpan>
      </SvgText>
      <SvgText
        pointerEvents="none"
        testID={`zone-quality-${zone.id}`}
        x={x}
        y={cy + 12}
        fontFamily={fonts.medium}
        fontSize={12}
        fill={bandColours[band].text}
      >
        {second}
      </SvgText>
    </G>
  );
}

export const CoverageLayer = memo(function CoverageLayer({
  placementId,
  evaluated,
  view,
  selected,
}: {
  placementId: number;
  evaluated: EvaluatedPlacement | undefined;
  view: PlanView;
  selected: boolean;
}) {
  const d = evaluated?.coverage ? multiPolygonToPath(view, evaluated.coverage.region) : '';
  return (
    <Path
      pointerEvents="none"
      testID={`placement-fan-${placementId}`}
      d={d}
      fill={palette.glass}
      fillOpacity={selected ? 0.32 : 0.2}
      fillRule="evenodd"
      stroke={palette.glass}
      strokeOpacity={0.8}
      strokeWidth={selected ? 2 : 1}
    />
  );
});

/** A viewer's name plate where nothing is in the way: centred under the marker. */
export function viewerNamePlate(viewer: SceneViewer, view: PlanView) {
  const [x, y] = toScreen(view, viewer.positionM);
  const w = approxWidth(viewer.name, 6.6);
  return plateBox(x - w / 2, y + MARKER_RADIUS_PX + 15, w, 1);
}

export const ViewerMarker = memo(function ViewerMarker({
  viewer,
  view,
  selected,
  plateX,
  plateY,
  nameHidden,
}: {
  viewer: SceneViewer;
  view: PlanView;
  selected: boolean;
  /** Where the label layout put the name's plate; hidden when it found no clear spot. */
  plateX?: number;
  plateY?: number;
  nameHidden?: boolean;
}) {
  const [x, y] = toScreen(view, viewer.positionM);
  const r = MARKER_RADIUS_PX;
  const preferredName = viewerNamePlate(viewer, view);
  const nameAt = textAt({ x: plateX ?? preferredName.x, y: plateY ?? preferredName.y });
  // An almond eye: two arcs meeting at the corners, a pupil in the middle.
  const eye = `M${x - 10} ${y}Q${x} ${y - 9} ${x + 10} ${y}Q${x} ${y + 9} ${x - 10} ${y}Z`;
  return (
    <G>
      <Circle
        testID={`viewer-marker-${viewer.id}`}
        cx={x}
        cy={y}
        r={r}
        fill={palette.card}
        stroke={selected ? palette.beacon : palette.asphalt}
        strokeWidth={selected ? 4 : 2}
      />
      <Path pointerEvents="none" d={eye} fill="none" stroke={palette.asphalt} strokeWidth={1.8} />
      <Circle pointerEvents="none" cx={x} cy={y} r={3.2} fill={palette.asphalt} />
      {/* Names crowd the zone labels when zoomed far out; the selected one always shows. */}
      {(selected || view.scale >= NAME_MIN_SCALE) && !nameHidden ? (
        <G>
          <LabelPlate x={nameAt[0]} y={nameAt[1]} width={approxWidth(viewer.name, 6.6)} lines={1} />
          <SvgText pointerEvents="none" x={nameAt[0]} y={nameAt[1]} fontFamily={fonts.medium} fontSize={12} fill={palette.asphalt}>
            {viewer.name}
          </SvgText>
        </G>
      ) : null}
    </G>
  );
});

/** A mirror's label plate where nothing is in the way: behind the mirror (its back is usually against a wall), clear of its fan. */
export function mirrorLabelPlate(placement: Pick<PlacementDto, 'label' | 'positionM' | 'azimuthRad'>, view: PlanView) {
  const p = toScreen(view, placement.positionM);
  const labelW = approxWidth(placement.label);
  const back = alongAzimuth(p, placement.azimuthRad + Math.PI, MARKER_RADIUS_PX + 10);
  const bx = Math.cos(placement.azimuthRad + Math.PI);
  const labelX = bx > 0.3 ? back[0] : bx < -0.3 ? back[0] - labelW : back[0] - labelW / 2;
  const labelY = back[1] + 5 - 8 * Math.sin(placement.azimuthRad + Math.PI);
  return plateBox(labelX, labelY, labelW, 1);
}

export const PlacementMarker = memo(function PlacementMarker({
  placement,
  problem,
  view,
  selected,
  plateX,
  plateY,
  labelHidden,
}: {
  placement: Pick<PlacementDto, 'id' | 'label' | 'positionM' | 'azimuthRad'>;
  problem: string | null;
  view: PlanView;
  selected: boolean;
  /** Where the label layout put the label's plate; hidden when it found no clear spot. */
  plateX?: number;
  plateY?: number;
  labelHidden?: boolean;
}) {
  const p = toScreen(view, placement.positionM);
  const r = MARKER_RADIUS_PX;
  // The mirror's face drawn across the aim direction, bulging toward where it looks (convex).
  const left = alongAzimuth(p, placement.azimuthRad + Math.PI / 2, 13);
  const right = alongAzimuth(p, placement.azimuthRad - Math.PI / 2, 13);
  const bulge = alongAzimuth(p, placement.azimuthRad, 9);
  const face = `M${left[0]} ${left[1]}Q${bulge[0]} ${bulge[1]} ${right[0]} ${right[1]}`;
  const tip = alongAzimuth(p, placement.azimuthRad, 22);
  const problemLines = problem ? wrapWords(problem, 34, 3) : [];
  const labelW = approxWidth(placement.label);
  const preferred = mirrorLabelPlate(placement, view);
  const [labelX, labelY] = textAt({ x: plateX ?? preferred.x, y: plateY ?? preferred.y });
  return (
    <G>
      <Circle
        testID={`placement-marker-${placement.id}`}
        cx={p[0]}
        cy={p[1]}
        r={r}
        fill={palette.glassSoft}
        stroke={selected ? palette.beacon : palette.glass}
        strokeWidth={selected ? 4 : 2}
      />
      <Line pointerEvents="none" x1={p[0]} y1={p[1]} x2={tip[0]} y2={tip[1]} stroke={palette.glass} strokeWidth={2} />
      <Path pointerEvents="none" d={face} fill="none" stroke={palette.glass} strokeWidth={4} strokeLinecap="round" />
      {labelHidden ? null : (
        <G testID={`placement-label-${placement.id}`}>
          <LabelPlate x={labelX} y={labelY} width={labelW} lines={1} />
          <SvgText pointerEvents="none" x={labelX} y={labelY} fontFamily={fonts.bold} fontSize={13} fill={palette.glass}>
            {placement.label}
          </SvgText>
        </G>
      )}
      {problemLines.length > 0 ? (
        <G testID={`placement-problem-${placement.id}`}>
          <LabelPlate
            x={p[0] + r + 4}
            y={p[1] + 14}
            width={Math.max(...problemLines.map((l) => approxWidth(l, 6.4)))}
            lines={problemLines.length}
            lineHeight={15}
          />
          {problemLines.map((line, i) => (
            <SvgText
              pointerEvents="none"
              key={i}
              x={p[0] + r + 4}
              y={p[1] + 14 + i * 15}
              fontFamily={fonts.medium}
              fontSize={12}
              fill={palette.stop}
            >
              {line}
            </SvgText>
          ))}
        </G>
      ) : null}
    </G>
  );
});

export function AimHandle({ from, azimuthRad }: { from: PairM; azimuthRad: number }) {
  const end = alongAzimuth(from, azimuthRad, AIM_HANDLE_PX);
  return (
    <G>
      <Line
        pointerEvents="none"
        x1={from[0]}
        y1={from[1]}
        x2={end[0]}
        y2={end[1]}
        stroke={palette.asphalt}
        strokeWidth={2}
        strokeDasharray="4 3"
      />
      <Circle testID="aim-handle" cx={end[0]} cy={end[1]} r={13} fill={palette.beacon} stroke={palette.asphalt} strokeWidth={2.5} />
      <Circle pointerEvents="none" cx={end[0]} cy={end[1]} r={3} fill={palette.asphalt} />
    </G>
  );
}

export function Sightline({ from, to }: { from: PairM; to: PairM }) {
  return (
    <Line
      pointerEvents="none"
      x1={from[0]}
      y1={from[1]}
      x2={to[0]}
      y2={to[1]}
      stroke={palette.asphalt}
      strokeWidth={1.6}
      strokeDasharray="2 5"
      strokeLinecap="round"
    />
  );
}

/** The sketch: points of a zone or wall being drawn, joined in order (not saved until finished). */
export function SketchShape({ points, closed, view }: { points: readonly PairM[]; closed: boolean; view: PlanView }) {
  if (points.length === 0) return null;
  const screen = points.map((p) => toScreen(view, p));
  const d = screen.map((p, i) => `${i === 0 ? 'M' : 'L'}${p[0]} ${p[1]}`).join('') + (closed && points.length > 2 ? 'Z' : '');
  return (
    <G testID="plan-sketch" pointerEvents="none">
      <Path
        d={d}
        fill={closed ? palette.beaconSoft : 'none'}
        fillOpacity={0.6}
        stroke={palette.beaconPressed}
        strokeWidth={3}
        strokeDasharray="6 4"
      />
      {screen.map((p, i) => (
        <Circle key={i} cx={p[0]} cy={p[1]} r={6} fill={palette.beacon} stroke={palette.asphalt} strokeWidth={2} />
      ))}
    </G>
  );
}
