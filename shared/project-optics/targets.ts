import type { ZoneTarget } from '../schemas';

/**
 * Target heights (m) for "who must be seen". Adult 1.70 m and child 1.00 m are round figures
 * from memory of typical statures (not from a standard); the project can set a custom one.
 */
export const TARGET_HEIGHT_M = { adult: 1.7, child: 1.0 } as const;

export function targetHeightM(t: ZoneTarget): number {
  return t.kind === 'custom' ? t.heightM : TARGET_HEIGHT_M[t.kind];
}

export function targetLabel(t: ZoneTarget): string {
  return t.kind === 'custom' ? 'custom target' : t.kind === 'adult' ? 'standing adult' : 'child';
}
