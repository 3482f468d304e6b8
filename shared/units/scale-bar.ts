/**
 * The scale bar's length, chosen once for the plan on screen and the plan on the sheet: a round
 * number of metres (metric) or feet (imperial) whose drawn length falls in the wanted range.
 */
import { M_PER_FT, type UnitSystem } from './index';

/** Round counts a bar may show, in metres or feet. */
export const SCALE_BAR_COUNTS = [0.5, 1, 2, 5, 10, 20, 25, 50, 100, 200, 500, 1000] as const;

export interface ScaleBar {
  /** The length the bar stands for, metres. */
  lengthM: number;
  /** "5 m", "20 ft". */
  label: string;
}

/**
 * The bar for a drawing at `drawnPerM` (pixels or points per metre): the shortest round length at
 * least `atLeast` long when that is given, else the longest at most `atMost` long.
 */
export function chooseScaleBar(units: UnitSystem, drawnPerM: number, want: { atLeast: number } | { atMost: number }): ScaleBar {
  const unitM = units === 'metric' ? 1 : M_PER_FT;
  const drawn = (n: number) => n * unitM * drawnPerM;
  const counts: readonly number[] = SCALE_BAR_COUNTS;
  const count =
    'atLeast' in want
      ? (counts.find((n) => drawn(n) >= want.atLeast) ?? counts[counts.length - 1])
      : ([...counts].reverse().find((n) => drawn(n) <= want.atMost) ?? counts[0]);
  return { lengthM: count * unitM, label: `${count} ${units === 'metric' ? 'm' : 'ft'}` };
}
