/**
 * The quick sizing question: a blind spot described by a few measured values, in metres.
 *
 * One frame serves every kind of spot. The viewer's passage runs along +x (y from 0 to
 * `passageWidthM`); at x = 0 an opening on its right-hand side (y < 0) leads into the area
 * that must be seen: x from 0 to `openingWidthM`, y from −`depthM` to 0. What hides it:
 * - corner: a wall along the passage up to the opening and one down its near side;
 * - aisle: racking on both sides of the aisle and along the passage up to it;
 * - doorway: a wall along the passage on both sides of the door.
 * The viewer stands `viewerBackM` before the opening, mid-passage; the mirror goes on the far
 * side of the passage, `mirrorAlongM` past the opening's near edge.
 */
export const spotKinds = ['corner', 'aisle', 'doorway'] as const;
export type SpotKind = (typeof spotKinds)[number];

export const whoKinds = ['adult', 'child', 'vehicle'] as const;
export type WhoKind = (typeof whoKinds)[number];

export interface QuickQuestion {
  spot: SpotKind;
  who: WhoKind;
  /** Width of the passage the viewer is in. */
  passageWidthM: number;
  /** Width of the crossing aisle, the aisle, or the door. */
  openingWidthM: number;
  /** How far into it must be seen (the hidden leg's or the aisle's length, the room's depth). */
  depthM: number;
  /** How far before the opening the viewer stands (or the driver sits). */
  viewerBackM: number;
  eyeHeightM: number;
  /** Where the mirror goes along the far side of the passage, from the opening's near edge. */
  mirrorAlongM: number;
  mirrorHeightM: number;
}

export type QuickField = Exclude<keyof QuickQuestion, 'spot' | 'who'>;

/** What the screen accepts. The eye height follows the scene's viewer rule; the rest keep the spot on a phone's sketch. */
export const QUICK_LIMITS: Record<QuickField, { min: number; max: number; what: string }> = {
  passageWidthM: { min: 1, max: 30, what: 'passage width' },
  openingWidthM: { min: 0.6, max: 30, what: 'opening width' },
  depthM: { min: 1, max: 50, what: 'depth to see' },
  viewerBackM: { min: 0.5, max: 50, what: 'viewer’s distance from the opening' },
  eyeHeightM: { min: 0.3, max: 6, what: 'eye height' },
  mirrorAlongM: { min: -20, max: 40, what: 'mirror’s place along the far side' },
  mirrorHeightM: { min: 0.5, max: 12, what: 'mounting height' },
};

export const QUICK_FIELDS = Object.keys(QUICK_LIMITS) as QuickField[];

/** A first question that reads as a typical warehouse corner (a starting point, not a recommendation). */
export const DEFAULT_QUICK_QUESTION: QuickQuestion = {
  spot: 'corner',
  who: 'adult',
  passageWidthM: 3,
  openingWidthM: 3,
  depthM: 8,
  viewerBackM: 4,
  eyeHeightM: 1.6,
  mirrorAlongM: 1.5,
  mirrorHeightM: 2.5,
};

/** One sentence per field that is missing or out of range; empty when the question can be answered. */
export function quickProblems(q: Partial<Record<QuickField, number | null>>): Partial<Record<QuickField, string>> {
  const out: Partial<Record<QuickField, string>> = {};
  for (const f of QUICK_FIELDS) {
    const v = q[f];
    const { min, max, what } = QUICK_LIMITS[f];
    if (v === null || v === undefined || !Number.isFinite(v)) out[f] = `Enter the ${what}.`;
    else if (v < min || v > max) out[f] = `The ${what} must be between ${min} m and ${max} m.`;
  }
  return out;
}
