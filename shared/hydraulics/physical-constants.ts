/**
 * Standard acceleration of gravity, g_n = 9.80665 m/s2 (exact by definition;
 * 3rd CGPM 1901, BIPM SI Brochure, 9th edition 2019).
 * @example
 * STANDARD_GRAVITY // => 9.80665
 */
export const STANDARD_GRAVITY = 9.80665;
