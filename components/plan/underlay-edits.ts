/**
 * Every change to the plan underlay (`scene.underlay`), pure: each returns a new underlay or scene
 * and touches nothing else, so walls, zones, viewers and mirrors stay where they are in metres.
 * Where pixels land is decided only by shared/geometry/underlay.ts.
 */
import { metresPerPixel, planToUnderlay, underlayToPlan } from '@/shared/geometry/underlay';
import type { Scene } from '@/shared/schemas';
import type { FileDto, Underlay } from '@/shared/schemas/files';
import type { PairM, PlanView } from './plan-view';
import { toScreen } from './plan-view';

type Pt = readonly [number, number];

/** How wide a plan is taken to be before it is calibrated, metres: a mid-sized warehouse bay (common practice, a guess to start from). */
export const UNCALIBRATED_WIDTH_M = 30;

/** Opacity choices offered on the screen (the schema allows 0.1 to 1). */
export const UNDERLAY_OPACITIES = [0.25, 0.5, 0.75, 1] as const;

/** Shift per nudge, metres, and turn per nudge, radians (half a degree). */
export const NUDGE_M = 0.1;
export const NUDGE_RAD = (0.5 * Math.PI) / 180;

/**
 * A freshly uploaded plan: its width taken as UNCALIBRATED_WIDTH_M until calibrated, its top-left
 * corner placed so the image's bottom-left sits on the plan's origin, square to the grid.
 */
export function newUnderlay(file: Pick<FileDto, 'id' | 'widthPx' | 'heightPx'>, opacity = 0.5): Underlay {
  const s = UNCALIBRATED_WIDTH_M / file.widthPx;
  return {
    fileId: file.id,
    calibration: { aPx: [0, 0], bPx: [file.widthPx, 0], distanceM: UNCALIBRATED_WIDTH_M },
    originM: [0, round6(file.heightPx * s)],
    rotationRad: 0,
    opacity,
  };
}

/** The same underlay with its origin moved so that image pixel `px` lands on `pointM` again. */
function keepPixelAt(u: Underlay, px: Pt, pointM: Pt): Underlay {
  const now = underlayToPlan(u, px);
  return { ...u, originM: [u.originM[0] + pointM[0] - now[0], u.originM[1] + pointM[1] - now[1]] };
}

/**
 * Calibrated from two image pixels and the real distance between them. The first point stays
 * where it was on the plan (so the image grows or shrinks about it); the turn is kept.
 */
export function calibrateUnderlay(u: Underlay, aPx: Pt, bPx: Pt, distanceM: number): Underlay {
  const anchor = underlayToPlan(u, aPx);
  const next: Underlay = { ...u, calibration: { aPx: [aPx[0], aPx[1]], bPx: [bPx[0], bPx[1]], distanceM } };
  return keepPixelAt(next, aPx, anchor);
}

/** Moved by (dx, dy) metres on the plan. */
export function shiftUnderlay(u: Underlay, dxM: number, dyM: number): Underlay {
  return { ...u, originM: [u.originM[0] + dxM, u.originM[1] + dyM] };
}

/** An angle brought into (−π, π], inside the schema's ±2π. */
export function normaliseAngle(rad: number): number {
  const turn = 2 * Math.PI;
  let a = rad % turn;
  if (a <= -Math.PI) a += turn;
  if (a > Math.PI) a -= turn;
  return a;
}

/** Turned to `rotationRad` (anticlockwise) about a plan point, which stays where it is. */
export function turnUnderlayTo(u: Underlay, rotationRad: number, aboutM: Pt): Underlay {
  const px = planToUnderlay(u, aboutM);
  return keepPixelAt({ ...u, rotationRad: normaliseAngle(rotationRad) }, px, aboutM);
}

/** Where the first calibration point lies on the plan: the natural pivot for turning. */
export function calibrationPointsM(u: Underlay): { aM: PairM; bM: PairM } {
  return { aM: underlayToPlan(u, u.calibration.aPx), bM: underlayToPlan(u, u.calibration.bPx) };
}

/**
 * Turned about the first calibration point so that the calibrated line runs along the grid axis
 * nearest to it: the installer taps along a wall, and the wall then lies square to the drawing.
 */
export function squareToGrid(u: Underlay): Underlay {
  const { aM, bM } = calibrationPointsM(u);
  const along = Math.atan2(bM[1] - aM[1], bM[0] - aM[0]);
  const quarter = Math.PI / 2;
  const target = Math.round(along / quarter) * quarter;
  return turnUnderlayTo(u, u.rotationRad + (target - along), aM);
}

/** The scene with this underlay, or without any (removed). Nothing else in the scene changes. */
export function setUnderlay(scene: Scene, u: Underlay | undefined): Scene {
  if (u) return { ...scene, underlay: u };
  const { underlay: _gone, ...rest } = scene;
  return rest;
}

/**
 * The SVG matrix that draws the image's pixels where they land on screen for this view: the image
 * of pixel (0, 0), and of one pixel step along x and along y, through shared/geometry/underlay.ts.
 */
export function underlayMatrix(u: Underlay, view: PlanView): [number, number, number, number, number, number] {
  const o = toScreen(view, underlayToPlan(u, [0, 0]));
  const x = toScreen(view, underlayToPlan(u, [1, 0]));
  const y = toScreen(view, underlayToPlan(u, [0, 1]));
  return [x[0] - o[0], x[1] - o[1], y[0] - o[0], y[1] - o[1], o[0], o[1]];
}

/** The image's four corners on the plan, metres (for fitting the view to the plan). */
export function underlayCornersM(u: Underlay, widthPx: number, heightPx: number): PairM[] {
  return [
    underlayToPlan(u, [0, 0]),
    underlayToPlan(u, [widthPx, 0]),
    underlayToPlan(u, [widthPx, heightPx]),
    underlayToPlan(u, [0, heightPx]),
  ];
}

/** Millimetres on the plan per image pixel, for the sentence under the plan's name. */
export function millimetresPerPixel(u: Underlay): number {
  return metresPerPixel(u) * 1000;
}

const round6 = (n: number) => Math.round(n * 1e6) / 1e6;
