/**
 * Where a label goes beside the symbol it names, clear of the lines of a drawing: the side views of
 * a mirror on screen (components/placement/elevation-view.tsx) and on the sheet (server/pdf) place
 * their labels with this one rule. Coordinates are the drawing's own (y down, as on a page or screen).
 *
 * The rule: try spots around the anchor, nearest first — above right, above left, below right,
 * below left, right, left, straight above, straight below — at `gap`, then one and two label heights
 * farther out; take the first that lies inside `bounds` and meets no segment and no box already
 * taken. If none is clear, take the spot inside the bounds that meets the fewest, nearest first, so
 * the label still sits next to its symbol.
 */
import { segmentsIntersect, type Pair } from './geometry/polygon';

export interface LabelBox {
  x: number;
  y: number;
  w: number;
  h: number;
}

export type Segment = readonly [readonly [number, number], readonly [number, number]];

export interface Obstacles {
  segments: readonly Segment[];
  boxes: readonly LabelBox[];
}

/** How many rings of spots are tried around the anchor. */
export const LABEL_RINGS = 3;

const inside = (b: LabelBox, p: readonly [number, number]) => p[0] >= b.x && p[0] <= b.x + b.w && p[1] >= b.y && p[1] <= b.y + b.h;

/** True when the segment touches the box (an end inside it, or crossing an edge). */
export function boxMeetsSegment(b: LabelBox, s: Segment): boolean {
  if (inside(b, s[0]) || inside(b, s[1])) return true;
  const c: Pair[] = [
    [b.x, b.y],
    [b.x + b.w, b.y],
    [b.x + b.w, b.y + b.h],
    [b.x, b.y + b.h],
  ];
  const a: Pair = [s[0][0], s[0][1]];
  const z: Pair = [s[1][0], s[1][1]];
  return c.some((p, i) => segmentsIntersect(a, z, p, c[(i + 1) % 4]));
}

export const boxesOverlap = (a: LabelBox, b: LabelBox) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

const within = (b: LabelBox, bounds: LabelBox) =>
  b.x >= bounds.x && b.y >= bounds.y && b.x + b.w <= bounds.x + bounds.w && b.y + b.h <= bounds.y + bounds.h;

/** The spots tried, nearest ring first. */
export function labelCandidates(anchor: readonly [number, number], size: { w: number; h: number }, gap: number): LabelBox[] {
  const [ax, ay] = anchor;
  const { w, h } = size;
  const out: LabelBox[] = [];
  for (let k = 0; k < LABEL_RINGS; k++) {
    const d = gap + k * h;
    out.push(
      { x: ax + d, y: ay - d - h, w, h },
      { x: ax - d - w, y: ay - d - h, w, h },
      { x: ax + d, y: ay + d, w, h },
      { x: ax - d - w, y: ay + d, w, h },
      { x: ax + d, y: ay - h / 2, w, h },
      { x: ax - d - w, y: ay - h / 2, w, h },
      { x: ax - w / 2, y: ay - d - h, w, h },
      { x: ax - w / 2, y: ay + d, w, h },
    );
  }
  return out;
}

export function placeLabel(
  anchor: readonly [number, number],
  size: { w: number; h: number },
  obstacles: Obstacles,
  bounds: LabelBox,
  gap = 4,
): LabelBox {
  const candidates = labelCandidates(anchor, size, gap);
  const hits = (b: LabelBox) =>
    obstacles.segments.filter((s) => boxMeetsSegment(b, s)).length + obstacles.boxes.filter((o) => boxesOverlap(b, o)).length;
  const fitting = candidates.filter((b) => within(b, bounds));
  const pool = fitting.length ? fitting : candidates;
  let best = pool[0];
  let bestHits = Number.POSITIVE_INFINITY;
  for (const b of pool) {
    const n = hits(b);
    if (n === 0) return b;
    if (n < bestHits) {
      best = b;
      bestHits = n;
    }
  }
  return best;
}
