/**
 * Tolerances used by the geometry and optics code, in one place so that every comparison
 * with a fudge factor can be found and argued about.
 */

/** Lengths closer than this (metres) are treated as equal: one micrometre. */
export const LENGTH_EPS_M = 1e-6;

/** Angles closer than this (radians) are treated as equal. */
export const ANGLE_EPS_RAD = 1e-12;

/** Relative tolerance for comparing dimensionless quantities such as cosines. */
export const REL_EPS = 1e-12;

/** Convergence tolerance of the reflection-point solver (radians of arc on the sphere). */
export const SOLVER_EPS_RAD = 1e-15;

/**
 * Margin within which an eye counts as on a surface (and so cannot see it): a fraction of the
 * sphere's radius, a cosine, or metres (1 nm) where compared with a length.
 */
export const EYE_MARGIN = 1e-9;

// Still written inline, to move here once their files settle: shared/optics/coverage.ts (1e-3 m
// outline simplification, 1e-6 m² sliver area), trace.ts (1e-12), walls.ts (1e-12), rank.ts (1e-9).
