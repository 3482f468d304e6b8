import { ARCMIN_RAD } from '../optics';
import type { ZoneTarget } from '../schemas';

/**
 * Target heights (m) for "who must be recognisable". Adult 1.70 m and child 1.00 m are round
 * figures from memory of typical statures (not from a standard); the project can set a custom one.
 */
export const TARGET_HEIGHT_M = { adult: 1.7, child: 1.0 } as const;

/**
 * Smallest angle at which a person counts as recognisable in the mirror: 3 minutes of arc, the
 * FMVSS No. 111 S9.4 threshold for a test cylinder's image in a school-bus mirror (confirmed in
 * SOURCES.md). Three times the 1-arcmin resolution of 20/20 acuity.
 */
export const DEFAULT_MIN_ANGLE_RAD = 3 * ARCMIN_RAD;

export function targetHeightM(t: ZoneTarget): number {
  return t.kind === 'custom' ? t.heightM : TARGET_HEIGHT_M[t.kind];
}

export function targetLabel(t: ZoneTarget): string {
  return t.kind === 'custom' ? 'custom target' : t.kind === 'adult' ? 'standing adult' : 'child';
}
