/**
 * What every plan-like drawing starts and ends with (the site plan and a vehicle's top view): the
 * SVG at the frame's size, the hatch its gaps are filled with, the card background, the grid in
 * round lengths of the person's units, and the scale bar on a plate at the top left, drawn over
 * everything. Each drawing puts its own marks in between.
 */
import { useMemo, type ReactNode } from 'react';
import { StyleSheet } from 'react-native';
import Svg, { Defs, G, Line, Path, Pattern, Rect, Text as SvgText } from 'react-native-svg';
import { fonts, palette } from '@/constants/theme';
import type { UnitSystem } from '@/shared/units';
import { gridLines, scaleBar } from './plan-geometry';
import type { PlanView, Size } from './plan-view';

/** A diagonal hatch: lines `sizePx` apart, turned `rotateDeg`, in the stop colour. */
export interface GapHatch {
  id: string;
  sizePx: number;
  rotateDeg: number;
  strokeWidth: number;
  opacity: number;
}

/** The scale bar's plate (its left, top and the room around the bar), for labels to keep clear of. */
export const scaleBarPlate = (lengthPx: number) => ({ x: 0, y: 0, w: lengthPx + 32, h: 48 });

export interface DrawingFrameProps {
  testID: string;
  scaleLabelTestID: string;
  view: PlanView;
  size: Size;
  units: UnitSystem;
  hatch: GapHatch;
  /** The drawing's own marks, over the grid and under the scale bar. */
  children: ReactNode;
  /** Lines under the scale bar, on top of everything (sentences about what could not be drawn). */
  notes?: ReactNode;
  /** Drawn on the background, under the grid (the site plan's uploaded underlay). */
  background?: ReactNode;
}

export function DrawingFrame({ testID, scaleLabelTestID, view, size, units, hatch, children, notes, background }: DrawingFrameProps) {
  const grid = useMemo(() => gridLines(view, size, units), [view, size, units]);
  const bar = scaleBar(view, units);
  return (
    <Svg testID={testID} width={size.width} height={size.height} style={styles.svg}>
      <Defs>
        <Pattern
          id={hatch.id}
          patternUnits="userSpaceOnUse"
          width={hatch.sizePx}
          height={hatch.sizePx}
          patternTransform={`rotate(${hatch.rotateDeg})`}
        >
          <Line
            x1={0}
            y1={0}
            x2={0}
            y2={hatch.sizePx}
            stroke={palette.stop}
            strokeWidth={hatch.strokeWidth}
            strokeOpacity={hatch.opacity}
          />
        </Pattern>
      </Defs>
      <Rect x={0} y={0} width={size.width} height={size.height} fill={palette.card} />
      {background}
      <Path pointerEvents="none" d={grid.minor} stroke={palette.ruleSoft} strokeWidth={1} />
      <Path pointerEvents="none" d={grid.major} stroke={palette.rule} strokeWidth={1.2} />
      {children}
      <G pointerEvents="none">
        <Rect x={12} y={10} width={bar.lengthPx + 16} height={34} rx={6} fill={palette.card} fillOpacity={0.9} />
        <Path d={`M20 24V34H${20 + bar.lengthPx}V24`} stroke={palette.asphalt} strokeWidth={2.5} fill="none" />
        <SvgText testID={scaleLabelTestID} x={20} y={22} fontFamily={fonts.semibold} fontSize={12} fill={palette.asphalt}>
          {bar.label}
        </SvgText>
        {notes}
      </G>
    </Svg>
  );
}

const styles = StyleSheet.create({
  svg: { position: 'absolute', left: 0, top: 0 },
});
