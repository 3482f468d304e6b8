/**
 * Turning plan geometry (metres) into SVG path strings (pixels), and the drawing helpers that are
 * pure arithmetic on the view: grid lines, the scale bar, the uncovered part of a zone.
 */
import type { MultiPolygon } from '@/shared/geometry/polygon';
import { chooseScaleBar, M_PER_FT, type UnitSystem } from '@/shared/units';
import { toScreen, type PairM, type PlanView, type Size } from './plan-view';

const r1 = (n: number) => Math.round(n * 10) / 10;

/** One closed subpath per ring; with fillRule evenodd the holes stay empty. */
export function ringsToPath(v: PlanView, rings: readonly (readonly (readonly [number, number])[])[]): string {
  let d = '';
  for (const ring of rings) {
    if (ring.length < 2) continue;
    ring.forEach((p, i) => {
      const [x, y] = toScreen(v, p);
      d += `${i === 0 ? 'M' : 'L'}${r1(x)} ${r1(y)}`;
    });
    d += 'Z';
  }
  return d;
}

export const multiPolygonToPath = (v: PlanView, mp: MultiPolygon): string => ringsToPath(v, mp.flat());

// The uncovered part of a zone is one rule for the plan and the sheet (shared/geometry/uncovered.ts).
export { uncoveredPart, type UncoveredPart } from '@/shared/geometry/uncovered';

export interface GridLines {
  minor: string;
  major: string;
}

/** The length of one grid unit in metres: a metre, or a foot in imperial. */
export const gridUnitM = (units: UnitSystem) => (units === 'metric' ? 1 : M_PER_FT);

/**
 * Grid over the visible area: 1 m minor / 5 m major (1 ft / 5 ft in imperial), coarsened by 5 or
 * 10 when zoomed out so lines never crowd closer than 8 px.
 */
export function gridLines(v: PlanView, size: Size, units: UnitSystem): GridLines {
  const unit = gridUnitM(units);
  const steps = [1, 5, 10, 50, 100, 500];
  const minorUnits = steps.find((s) => s * unit * v.scale >= 8) ?? 500;
  const stepM = minorUnits * unit;
  const [x0, y1] = [(0 - v.offsetX) / v.scale, (v.offsetY - 0) / v.scale];
  const [x1, y0] = [(size.width - v.offsetX) / v.scale, (v.offsetY - size.height) / v.scale];
  let minor = '';
  let major = '';
  const i0 = Math.floor(x0 / stepM);
  const i1 = Math.ceil(x1 / stepM);
  for (let i = i0; i <= i1; i++) {
    const x = r1(v.offsetX + i * stepM * v.scale);
    const seg = `M${x} 0V${r1(size.height)}`;
    if (i % 5 === 0) major += seg;
    else minor += seg;
  }
  const j0 = Math.floor(y0 / stepM);
  const j1 = Math.ceil(y1 / stepM);
  for (let j = j0; j <= j1; j++) {
    const y = r1(v.offsetY - j * stepM * v.scale);
    const seg = `M0 ${y}H${r1(size.width)}`;
    if (j % 5 === 0) major += seg;
    else minor += seg;
  }
  return { minor, major };
}

/** A scale bar 60–150 px long at a round length in the person's units. */
export function scaleBar(v: PlanView, units: UnitSystem): { lengthPx: number; label: string } {
  const bar = chooseScaleBar(units, v.scale, { atLeast: 60 });
  return { lengthPx: bar.lengthM * v.scale, label: bar.label };
}

/** A point `lengthPx` pixels from `from` (screen) toward plan azimuth `azimuthRad` (0 = east, π/2 = north). */
export function alongAzimuth(from: PairM, azimuthRad: number, lengthPx: number): PairM {
  return [from[0] + Math.cos(azimuthRad) * lengthPx, from[1] - Math.sin(azimuthRad) * lengthPx];
}

/** The plan azimuth from screen point a toward screen point b (screen y grows down). */
export const azimuthBetween = (a: PairM, b: PairM): number => Math.atan2(-(b[1] - a[1]), b[0] - a[0]);
