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

/** Coverage outlines are simplified within this (metres) before they are drawn or compared: 1 mm. */
export const OUTLINE_SIMPLIFY_M = 1e-3;

/** Pieces of a region smaller than this (square metres: 1 mm²) are slivers of a boolean, not area. */
export const SLIVER_AREA_M2 = 1e-6;

/** Added before flooring a ratio that should be whole, so 0.3/0.1 lands on 3, not 2. */
export const FLOOR_SLACK = 1e-9;
