import Svg, { Circle, Line, Path } from 'react-native-svg';
import { palette } from '@/constants/theme';
import type { MultiPolygon, Pair } from '@/shared/geometry/polygon';
import { quickEye, quickMirrorPosition, quickWalls, quickZoneRing, type QuickQuestion } from '@/shared/quick';
import { pathOf, sketchFrame } from './quick-sketch';

export interface QuickSketchProps {
  question: QuickQuestion;
  /** What the mirror shows on the floor, clipped to the recognisable range. */
  fan: MultiPolygon;
  /** Where the option's mirror hangs (its vertex); the mirror's place on the far wall when absent. */
  mirrorM?: Pair;
  width: number;
  maxHeight: number;
  label: string;
  testID: string;
}

/** Walls dark, the area to see outlined in amber, the fan in glass blue, viewer and mirror as dots. */
export function QuickSketch({ question, fan, mirrorM, width, maxHeight, label, testID }: QuickSketchProps) {
  const f = sketchFrame(question, width, maxHeight);
  const [ex, ey] = f.toPx([quickEye(question)[0], quickEye(question)[1]]);
  const [mx, my] = f.toPx(mirrorM ?? quickMirrorPosition(question));
  return (
    <Svg width={f.width} height={f.height} role="img" aria-label={label} testID={testID}>
      <Path d={pathOf(f, [[quickZoneRing(question)]])} fill={palette.beaconSoft} stroke={palette.beaconPressed} strokeWidth={1.5} />
      <Path d={pathOf(f, fan)} fill={palette.glass} fillOpacity={0.35} stroke={palette.glass} strokeWidth={1} testID={`${testID}-fan`} />
      {quickWalls(question).map((w) => {
        const [ax, ay] = f.toPx(w.aM);
        const [bx, by] = f.toPx(w.bM);
        return <Line key={w.id} x1={ax} y1={ay} x2={bx} y2={by} stroke={palette.asphalt} strokeWidth={3} />;
      })}
      <Circle cx={ex} cy={ey} r={4} fill={palette.asphalt} />
      <Circle cx={mx} cy={my} r={5} fill={palette.glass} stroke={palette.asphalt} strokeWidth={1.5} />
    </Svg>
  );
}
