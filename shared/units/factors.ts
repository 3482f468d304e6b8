/**
 * Conversion factors, exact by definition (international yard and pound agreement, 1959):
 * 1 in = 25.4 mm, 1 ft = 12 in = 0.3048 m. In their own file so every units module can import them
 * without an import cycle through index.ts.
 */
export const M_PER_IN = 0.0254;
export const M_PER_FT = 0.3048;
export const M2_PER_FT2 = M_PER_FT * M_PER_FT;
