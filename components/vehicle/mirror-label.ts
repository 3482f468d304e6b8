/**
 * Where a mirror's label ("V-1") goes on the vehicle's top view: beside its marker, clear of the
 * marker's ring, its aim line and, for the picked mirror, the aim handle and its knob, at any
 * zoom (everything here is in screen pixels, so zoom changes nothing but the anchor). Uses the
 * shared label rule (shared/label-placement.ts).
 */
import { placeLabel, type LabelBox, type Segment } from '@/shared/label-placement';
import { alongAzimuth } from '@/components/plan/plan-geometry';
import { markerBox } from '@/components/plan/plan-labels';
import { AIM_HANDLE_PX } from '@/components/plan/plan-view';

export const MARKER_PX = 13;
/** The marker's ring around the bar: the radius the drawing uses. */
export const MARKER_RING_PX = MARKER_PX + 5;
export const AIM_KNOB_PX = 11;
export const MIRROR_LABEL_H = 16;
/** Width of a label in the 12 px semibold face, a little generous (common practice: ~0.62 em per character). */
export const mirrorLabelWidth = (text: string) => text.length * 7.4 + 6;

/** The ring a mirror's marker takes on screen, for other labels to keep clear of. */
export const markerRing = (c: readonly [number, number]): LabelBox => markerBox(c, MARKER_RING_PX);

/** The label's box for a mirror at screen point `c` aiming along display azimuth `az`. */
export function mirrorLabelBox(
  c: readonly [number, number],
  azDisplayRad: number,
  text: string,
  withHandle: boolean,
  bounds: LabelBox,
  /** Other symbols to keep clear of (the other mirrors' rings). */
  others: readonly LabelBox[] = [],
): LabelBox {
  const ring = markerRing(c);
  const reach = withHandle ? AIM_HANDLE_PX : MARKER_PX * 0.9;
  const end = alongAzimuth([c[0], c[1]], azDisplayRad, reach);
  const segments: Segment[] = [
    [
      [c[0], c[1]],
      [end[0], end[1]],
    ],
  ];
  const boxes: LabelBox[] = [ring, ...others];
  if (withHandle) boxes.push(markerBox(end, AIM_KNOB_PX));
  return placeLabel(c, { w: mirrorLabelWidth(text), h: MIRROR_LABEL_H }, { segments, boxes }, bounds, 4);
}

/**
 * The label's text on the top view: the mirror's name up to its first space ("X-L" of "X-L
 * cross-view, left fender"), at most 10 characters; the whole name is in the details. A long
 * name drawn in full reached across the other mirror and read as its label on a phone.
 */
export const shortMirrorLabel = (label: string): string => label.trim().split(/\s+/)[0].slice(0, 10);
