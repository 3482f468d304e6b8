import { useMemo, useState } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import { AppText } from '@/components/ui/text';
import { fonts, palette, spacing } from '@/constants/theme';
import { fanRays, type FanRay } from '@/shared/optics';
import { drawnRangeM, type EvaluatedPlacement } from '@/shared/project-optics';
import { placeLabel, type LabelBox, type Segment } from '@/shared/label-placement';
import { formatLength, type UnitSystem } from '@/shared/units';

export interface ElevationViewProps {
  evaluation: EvaluatedPlacement | null;
  units: UnitSystem;
  testID?: string;
}

/** A side view: the vertical plane through the viewer's eye and the mirror, drawn orthographically. */
interface SidePoint {
  s: number;
  z: number;
}

const HEIGHT_PX = 230;
const PAD = { left: 16, right: 16, top: 22, bottom: 34 };
/** Heights fill at least this share of the drawing; when that needs stretching, the caption says so. */
const MIN_FILL = 0.7;

export function ElevationView({ evaluation, units, testID = 'placement-elevation' }: ElevationViewProps) {
  const [width, setWidth] = useState(340);
  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.max(240, Math.round(e.nativeEvent.layout.width)));

  const drawing = useMemo(() => {
    if (!evaluation?.pose || !evaluation.eyeM || !evaluation.mirror) return null;
    const eye = evaluation.eyeM;
    const v = evaluation.pose.vertexM;
    const dx = v[0] - eye[0];
    const dy = v[1] - eye[1];
    const horizontal = Math.hypot(dx, dy);
    // The side plane runs from the eye toward the mirror; with the mirror straight overhead, use the aim.
    const u: [number, number] =
      horizontal > 1e-6 ? [dx / horizontal, dy / horizontal] : unitOf(evaluation.pose.axis[0], evaluation.pose.axis[1]);
    const side = (p: readonly number[]): SidePoint => ({ s: (p[0] - eye[0]) * u[0] + (p[1] - eye[1]) * u[1], z: p[2] });
    let rays: FanRay[] = [];
    if (evaluation.numbers) {
      try {
        const maxRangeM = drawnRangeM(evaluation.numbers);
        rays = fanRays({ mirror: evaluation.mirror, pose: evaluation.pose, eyeM: eye, maxRangeM, samples: 24 });
      } catch {
        // The engine could not trace this pose; the sightline and heights still help.
        rays = [];
      }
    }
    const rayEnds = rays.map((r) => ({ from: side(r.fromM), to: side(r.toM), floor: r.meetsPlane }));
    const floorHits = rayEnds.filter((r) => r.floor).map((r) => r.to.s);
    const near = floorHits.length ? Math.min(...floorHits) : null;
    const far = floorHits.length ? Math.max(...floorHits) : null;
    return { eye: side(eye), mirror: side(v), rayEnds, near, far, horizontal };
  }, [evaluation]);

  if (!drawing) {
    return (
      <View style={styles.empty} testID={testID}>
        <AppText tone="muted">The side view appears once the mirror has a viewer.</AppText>
      </View>
    );
  }

  const points = [drawing.eye, drawing.mirror, ...drawing.rayEnds.flatMap((r) => [r.from, r.to])];
  const sMin = Math.min(...points.map((p) => p.s));
  const sMax = Math.max(...points.map((p) => p.s));
  const zMax = Math.max(...points.map((p) => p.z), 0.5);
  const spanS = Math.max(sMax - sMin, 0.5);
  const innerW = width - PAD.left - PAD.right;
  const innerH = HEIGHT_PX - PAD.top - PAD.bottom;
  const kzFit = innerH / zMax;
  // True proportions when they fit; a tall, narrow scene keeps them by drawing narrower.
  const kx = Math.min(innerW / spanS, kzFit);
  const kz = Math.min(kzFit, Math.max(kx, MIN_FILL * kzFit));
  const stretch = kz / kx;
  const X = (s: number) => PAD.left + (s - sMin) * kx;
  const Z = (z: number) => PAD.top + innerH - z * kz;
  const floorY = Z(0);
  const label = (m: number) => formatLength(m, units);
  const sightline = `M${X(drawing.eye.s)} ${Z(drawing.eye.z)} L${X(drawing.mirror.s)} ${Z(drawing.mirror.z)}`;
  const labels = sideViewLabels(
    {
      eye: [X(drawing.eye.s), Z(drawing.eye.z)],
      mirror: [X(drawing.mirror.s), Z(drawing.mirror.z)],
      floorY,
      rays: drawing.rayEnds.map((r): Segment => [
        [X(r.from.s), Z(r.from.z)],
        [X(r.to.s), Z(r.to.z)],
      ]),
      width,
    },
    { eye: `eye ${label(drawing.eye.z)}`, mirror: `mirror ${label(drawing.mirror.z)}`, apart: `${label(drawing.horizontal)} apart` },
  );

  return (
    <View onLayout={onLayout} testID={testID} style={styles.box}>
      <Svg
        width={width}
        height={HEIGHT_PX}
        role="img"
        aria-label={`Side view: eye at ${label(drawing.eye.z)}, mirror at ${label(drawing.mirror.z)}, ${label(drawing.horizontal)} apart.`}
      >
        <Rect x={0} y={floorY} width={width} height={HEIGHT_PX - floorY} fill={palette.ruleSoft} />
        <Line x1={0} y1={floorY} x2={width} y2={floorY} stroke={palette.asphalt} strokeWidth={2} />
        <G>
          {drawing.rayEnds.map((r, i) => (
            <Line
              key={i}
              x1={X(r.from.s)}
              y1={Z(r.from.z)}
              x2={X(r.to.s)}
              y2={Z(r.to.z)}
              stroke={palette.beaconPressed}
              strokeOpacity={r.floor ? 0.75 : 0.35}
              strokeWidth={1.5}
            />
          ))}
        </G>
        {drawing.near !== null && drawing.far !== null ? (
          <Line
            x1={X(drawing.near)}
            y1={floorY}
            x2={X(drawing.far)}
            y2={floorY}
            stroke={palette.beacon}
            strokeWidth={6}
            strokeLinecap="round"
          />
        ) : null}
        <Path d={sightline} stroke={palette.glass} strokeWidth={2.5} strokeDasharray="7 5" fill="none" />
        {/* Height ticks from the floor to the eye and to the mirror. */}
        <Line
          x1={X(drawing.eye.s)}
          y1={floorY}
          x2={X(drawing.eye.s)}
          y2={Z(drawing.eye.z)}
          stroke={palette.haze}
          strokeWidth={1}
          strokeDasharray="2 3"
        />
        <Line
          x1={X(drawing.mirror.s)}
          y1={floorY}
          x2={X(drawing.mirror.s)}
          y2={Z(drawing.mirror.z)}
          stroke={palette.haze}
          strokeWidth={1}
          strokeDasharray="2 3"
        />
        <Circle cx={X(drawing.eye.s)} cy={Z(drawing.eye.z)} r={7} fill={palette.card} stroke={palette.glass} strokeWidth={3} />
        <Circle cx={X(drawing.eye.s)} cy={Z(drawing.eye.z)} r={2.5} fill={palette.glass} />
        <Rect
          x={X(drawing.mirror.s) - 4}
          y={Z(drawing.mirror.z) - 9}
          width={8}
          height={18}
          rx={3}
          fill={palette.glass}
          stroke={palette.asphalt}
          strokeWidth={1.5}
        />
        {labels.map((l) => (
          <SvgText
            key={l.key}
            testID={`${testID}-label-${l.key}`}
            x={l.box.x}
            y={l.box.y + LABEL_SIZE_PX}
            fontSize={LABEL_SIZE_PX}
            fontFamily={l.key === 'apart' ? fonts.medium : fonts.semibold}
            fill={palette.asphalt}
          >
            {l.text}
          </SvgText>
        ))}
      </Svg>
      <AppText variant="small" tone="muted" testID={`${testID}-caption`}>
        {`Seen from the side, looking across the line from the eye to the mirror. The dashed line is the sightline; amber lines are the reflected edge rays, the thick amber band is the floor they reach.${
          stretch > 1.05 ? ` Heights are drawn ${formatStretch(stretch)} times taller than lengths so they can be read.` : ''
        }`}
      </AppText>
    </View>
  );
}

const LABEL_SIZE_PX = 13;
/** Average advance of a character of the label face, as a share of its size (Barlow semibold, measured by eye). */
const CHAR_WIDTH = 0.56;

export interface SideViewLabel {
  key: 'eye' | 'mirror' | 'apart';
  text: string;
  /** Top-left and size, pixels. */
  box: LabelBox;
}

/**
 * The three labels of the side view, beside the eye, the mirror and the floor between them, clear of
 * the sightline, the rays, the height ticks and the floor (the sheet's rule: shared/label-placement.ts).
 */
export function sideViewLabels(
  g: { eye: [number, number]; mirror: [number, number]; floorY: number; rays: readonly Segment[]; width: number },
  text: { eye: string; mirror: string; apart: string },
): SideViewLabel[] {
  const segments: Segment[] = [
    [g.eye, g.mirror],
    [
      [0, g.floorY],
      [g.width, g.floorY],
    ],
    [[g.eye[0], g.floorY], g.eye],
    [[g.mirror[0], g.floorY], g.mirror],
    ...g.rays,
  ];
  const taken: LabelBox[] = [
    { x: g.eye[0] - 7, y: g.eye[1] - 7, w: 14, h: 14 },
    { x: g.mirror[0] - 4, y: g.mirror[1] - 9, w: 8, h: 18 },
  ];
  const bounds = { x: 0, y: 0, w: g.width, h: HEIGHT_PX };
  const out: SideViewLabel[] = [];
  const anchors: Record<SideViewLabel['key'], [number, number]> = {
    eye: g.eye,
    mirror: g.mirror,
    apart: [(g.eye[0] + g.mirror[0]) / 2, g.floorY],
  };
  for (const key of ['eye', 'mirror', 'apart'] as const) {
    const size = { w: text[key].length * LABEL_SIZE_PX * CHAR_WIDTH, h: LABEL_SIZE_PX + 3 };
    // The symbols are larger on screen than on paper: keep 10 px clear of them.
    const box = placeLabel(anchors[key], size, { segments, boxes: taken }, bounds, 10);
    taken.push(box);
    out.push({ key, text: text[key], box });
  }
  return out;
}

function unitOf(x: number, y: number): [number, number] {
  const n = Math.hypot(x, y);
  return n > 1e-9 ? [x / n, y / n] : [1, 0];
}

function formatStretch(k: number): string {
  return k < 10 ? k.toFixed(1) : k.toFixed(0);
}

const styles = StyleSheet.create({
  box: { gap: spacing.sm, alignSelf: 'stretch' },
  empty: { padding: spacing.lg, borderWidth: 1, borderStyle: 'dashed', borderColor: palette.rule, borderRadius: 8 },
});
