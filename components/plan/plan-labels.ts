/**
 * Where the plan's labels go at the current zoom, so none overlaps another, a marker or the aim
 * handle (pure: screen pixels in, boxes out). Labels are placed in order of priority — the selected
 * item's first, then zone verdicts, mirror names, viewer names — each at its preferred spot or
 * the nearest clear spot around its anchor (shared/label-placement.ts, the side views' rule). A
 * label with no clear spot is hidden, except the selected item's and the zones' (their share and
 * verdict must stay readable), which take the spot that meets the fewest others.
 */
import { boxesOverlap, labelCandidates, type LabelBox } from '@/shared/label-placement';

export interface PlanLabelRequest {
  key: string;
  /** The point the label names (the marker's or the zone's centre), in screen pixels. */
  anchor: readonly [number, number];
  /** The plate's size, padding included. */
  w: number;
  h: number;
  /** Where it goes when nothing is in the way (the plate's top-left corner). */
  preferred: LabelBox;
  /** Pixels from the anchor a moved label keeps (a marker's radius and a gap; 0 for a zone's centre). */
  clearance: number;
  /** Lower first. */
  priority: number;
  mustShow: boolean;
}

/** Priorities, lower placed first. */
export const LABEL_PRIORITY = { selected: 0, zone: 1, mirror: 2, viewer: 3 } as const;

/** Pixels between a marker's edge and a label moved away from it. */
const GAP_PX = 6;

/**
 * Places the labels; a label that must show has a priority no lower than any that may hide (the
 * plan's selected item and zones), so a label shown by choice is clear of every other.
 */
export function layoutPlanLabels(
  requests: readonly PlanLabelRequest[],
  obstacles: readonly LabelBox[],
  bounds: LabelBox,
): Map<string, LabelBox | null> {
  const placed = new Map<string, LabelBox | null>();
  const taken: LabelBox[] = [];
  const order = [...requests].sort((a, b) => a.priority - b.priority || a.key.localeCompare(b.key));
  for (const r of order) {
    const spots = [r.preferred, ...labelCandidates(r.anchor, { w: r.w, h: r.h }, r.clearance + GAP_PX)];
    const meets = (b: LabelBox) => obstacles.filter((o) => boxesOverlap(b, o)).length + taken.filter((t) => boxesOverlap(b, t)).length;
    const inBounds = (b: LabelBox) =>
      b.x >= bounds.x && b.y >= bounds.y && b.x + b.w <= bounds.x + bounds.w && b.y + b.h <= bounds.y + bounds.h;
    let choice: LabelBox | null = spots.find((b) => inBounds(b) && meets(b) === 0) ?? null;
    if (!choice && r.mustShow) {
      // The spot that meets the fewest others, on screen if any spot is.
      const onScreen = spots.filter(inBounds);
      const pool = onScreen.length ? onScreen : spots;
      choice = pool.reduce((best, b) => (meets(b) < meets(best) ? b : best), pool[0]);
    }
    placed.set(r.key, choice);
    if (choice) taken.push(choice);
  }
  return placed;
}

/** The square a round marker of radius `r` covers, for labels to keep clear of. */
export const markerBox = (centre: readonly [number, number], r: number): LabelBox => ({
  x: centre[0] - r,
  y: centre[1] - r,
  w: 2 * r,
  h: 2 * r,
});
