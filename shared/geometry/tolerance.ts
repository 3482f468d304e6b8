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
