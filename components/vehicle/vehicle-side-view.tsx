/**
 * The vehicle from the side, front to the right, drawn to one scale both ways: the body boxes with
 * the cab's window line, the driver's eye, each mirror at its height with the line from the eye to
 * the selected one, and the 2 m line under which no part of a class V or VI mirror should hang.
 */
import { useState } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Rect, Text as SvgText } from 'react-native-svg';
import { AppText } from '@/components/ui/text';
import { fonts, palette, spacing } from '@/constants/theme';
import type { VehicleEvaluation, VehiclePlacement } from '@/hooks/use-vehicle-evaluation';
import { formatLength, type UnitSystem } from '@/shared/units';
import { LOW_MIRROR_M } from '@/shared/vehicle';

const PAD = { left: 12, right: 12, top: 16, bottom: 22 };
const MAX_HEIGHT_PX = 190;

export interface VehicleSideViewProps {
  evaluation: VehicleEvaluation;
  placements: readonly VehiclePlacement[];
  selectedId: number | null;
  units: UnitSystem;
}

export function VehicleSideView({ evaluation, placements, selectedId, units }: VehicleSideViewProps) {
  const [width, setWidth] = useState(340);
  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.max(240, Math.round(e.nativeEvent.layout.width)));
  const g = evaluation.geometry;
  const eye = g.eyeMidM;
  const front = Math.max(0.5, ...placements.map((p) => p.positionM[0] + 0.3));
  const rear = g.rearX - 0.5;
  const top = Math.max(eye[2], LOW_MIRROR_M, ...g.boxes.map((b) => b.box.heightM), ...placements.map((p) => p.heightM)) + 0.4;
  const scale = Math.min((width - PAD.left - PAD.right) / (front - rear), (MAX_HEIGHT_PX - PAD.top - PAD.bottom) / top);
  const height = Math.round(top * scale + PAD.top + PAD.bottom);
  const sx = (x: number) => PAD.left + (x - rear) * scale;
  const sz = (z: number) => height - PAD.bottom - z * scale;
  const selected = placements.find((p) => p.id === selectedId);
  const len = (m: number) => formatLength(m, units);

  return (
    <View style={styles.box} onLayout={onLayout} testID="vehicle-side-view">
      <AppText variant="caps">From the side, front to the right</AppText>
      <Svg width={width} height={height} role="img" aria-label="Vehicle from the side with the driver's eye and the mirrors' heights">
        <Line x1={0} y1={sz(0)} x2={width} y2={sz(0)} stroke={palette.asphalt} strokeWidth={2} />
        <Line
          x1={sx(rear)}
          y1={sz(LOW_MIRROR_M)}
          x2={sx(front)}
          y2={sz(LOW_MIRROR_M)}
          stroke={palette.stop}
          strokeWidth={1}
          strokeDasharray="5 4"
        />

        {g.boxes.map((b) => {
          const x0 = sx(-b.box.rearBehindM);
          const x1 = sx(-b.box.frontBehindM);
          return (
            <G key={b.box.id}>
              <Rect
                x={x0}
                y={sz(b.box.heightM)}
                width={x1 - x0}
                height={b.box.heightM * scale}
                fill={palette.rule}
                fillOpacity={0.55}
                stroke={palette.asphalt}
                strokeWidth={1.2}
              />
              {b.box.windowLineM !== null ? (
                <Rect
                  x={x0 + 1}
                  y={sz(b.box.heightM) + 1}
                  width={Math.max(0, x1 - x0 - 2)}
                  height={Math.max(0, (b.box.heightM - b.box.windowLineM) * scale - 2)}
                  fill={palette.glassSoft}
                />
              ) : null}
            </G>
          );
        })}
        {selected ? (
          <Line
            x1={sx(eye[0])}
            y1={sz(eye[2])}
            x2={sx(selected.positionM[0])}
            y2={sz(selected.heightM)}
            stroke={palette.beaconPressed}
            strokeWidth={2}
            strokeDasharray="4 3"
          />
        ) : null}
        <Circle cx={sx(eye[0])} cy={sz(eye[2])} r={4.5} fill={palette.beacon} stroke={palette.asphalt} strokeWidth={1.5} />
        {/* Labels sit in the strips above the body and below the ground, where nothing else is drawn. */}
        <SvgText x={sx(eye[0])} y={PAD.top - 3} textAnchor="middle" fontFamily={fonts.semibold} fontSize={11} fill={palette.asphalt}>
          {`eye ${len(eye[2])}`}
        </SvgText>
        <Line x1={sx(eye[0])} y1={PAD.top} x2={sx(eye[0])} y2={sz(eye[2]) - 5} stroke={palette.haze} strokeWidth={1} />
        {placements.map((p) => {
          const on = p.id === selectedId;
          return (
            <G key={p.id}>
              <Line
                x1={sx(p.positionM[0])}
                y1={sz(p.heightM) - 6}
                x2={sx(p.positionM[0])}
                y2={sz(p.heightM) + 6}
                stroke={on ? palette.beaconPressed : palette.glass}
                strokeWidth={on ? 5 : 4}
                strokeLinecap="round"
              />
              {on ? (
                <SvgText
                  x={Math.min(width - 4, sx(p.positionM[0]) + 4)}
                  y={sz(0) + 15}
                  textAnchor="end"
                  fontFamily={fonts.semibold}
                  fontSize={11}
                  fill={palette.asphalt}
                >
                  {`${p.label} ${len(p.heightM)}`}
                </SvgText>
              ) : null}
            </G>
          );
        })}
      </Svg>
      <AppText variant="small" tone="muted">
        {`Dashed red line: ${len(LOW_MIRROR_M)}, under which no part of a class V or VI mirror should hang (UN R46). Shaded blue: glass.`}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: spacing.xs },
});
