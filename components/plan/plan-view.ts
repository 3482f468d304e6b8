/**
 * The plan's viewport: plan coordinates are metres with y north (up); the screen's y grows down.
 * screenX = offsetX + xM · scale, screenY = offsetY − yM · scale, relative to the canvas's top-left.
 * The same three numbers are published on the canvas (data-transform) so browser tests can click
 * at a plan point.
 */
import type { Bounds } from '@/shared/geometry/bounds';

export type PairM = [number, number];

export interface PlanView {
  /** Pixels per metre. */
  scale: number;
  offsetX: number;
  offsetY: number;
}

export interface Size {
  width: number;
  height: number;
}

/** Length of the aim handle drawn from the selected mirror, pixels. */
export const AIM_HANDLE_PX = 64;
/** Radius of a mirror's marker, pixels. */
export const MARKER_RADIUS_PX = 14;

export const MIN_SCALE = 2;
export const MAX_SCALE = 400;

export const toScreen = (v: PlanView, p: readonly [number, number]): PairM => [v.offsetX + p[0] * v.scale, v.offsetY - p[1] * v.scale];
export const toPlan = (v: PlanView, x: number, y: number): PairM => [(x - v.offsetX) / v.scale, (v.offsetY - y) / v.scale];

/** "scale offsetX offsetY", what data-transform carries. */
export const formatTransform = (v: PlanView): string => `${round3(v.scale)} ${round3(v.offsetX)} ${round3(v.offsetY)}`;
const round3 = (n: number) => Math.round(n * 1000) / 1000;

/** Bounds of plan points: the shared function (shared/geometry/bounds.ts) under the plan's name. */
export { boundsOfPoints as boundsOf, type Bounds } from '@/shared/geometry/bounds';

/**
 * A view showing the whole bounds inside the canvas with a margin; `reserveBottom` keeps the
 * lower strip (the toolbar on a phone) from hiding part of the plan, `reserveTop` the upper one
 * (the calibration card).
 */
export function fitView(bounds: Bounds | null, size: Size, margin = 24, reserveBottom = 0, reserveTop = 0): PlanView {
  const b = bounds ?? { minX: 0, minY: 0, maxX: 20, maxY: 20 };
  const w = Math.max(b.maxX - b.minX, 1);
  const h = Math.max(b.maxY - b.minY, 1);
  const availW = Math.max(size.width - 2 * margin, 40);
  const availH = Math.max(size.height - 2 * margin - reserveBottom - reserveTop, 40);
  const scale = clampScale(Math.min(availW / w, availH / h));
  const offsetX = margin + (availW - w * scale) / 2 - b.minX * scale;
  const offsetY = margin + reserveTop + (availH - h * scale) / 2 + b.maxY * scale;
  return { scale, offsetX, offsetY };
}

export const clampScale = (s: number) => Math.min(MAX_SCALE, Math.max(MIN_SCALE, s));

/** Zoom by `factor` keeping the screen point (x, y) over the same plan point. */
export function zoomAt(v: PlanView, factor: number, x: number, y: number): PlanView {
  const scale = clampScale(v.scale * factor);
  const k = scale / v.scale;
  return { scale, offsetX: x - (x - v.offsetX) * k, offsetY: y - (y - v.offsetY) * k };
}

/** The same scale, moved so that a plan point sits in the middle of the frame (the phone's drawer re-centres on the selection). */
export function centreOn(v: PlanView, size: Size, pointM: readonly [number, number]): PlanView {
  return { scale: v.scale, offsetX: size.width / 2 - pointM[0] * v.scale, offsetY: size.height / 2 + pointM[1] * v.scale };
}

export const panBy = (v: PlanView, dx: number, dy: number): PlanView => ({ ...v, offsetX: v.offsetX + dx, offsetY: v.offsetY + dy });
