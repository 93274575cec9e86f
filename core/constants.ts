/** Standard acceleration of gravity, m/s² (NIST SP 811, appendix B.8: g_n = 9.80665 m/s², exact). */
export const G_N = 9.80665;

/** One bar in pascals (NIST SP 811, B.8: 1 bar = 1e5 Pa, exact). */
export const PA_PER_BAR = 1e5;

/** Two braking rates closer than this count as a simultaneous lock ("both"), per the design-file spec. */
export const SIMULTANEOUS_LOCK_DZ = 0.001;

/** Upper end of the braking-rate range searched for crossings of the ideal line (design-file spec). */
export const CROSSING_Z_MAX = 1.5;

/** Default surfaces (tyre-road adhesion) analysed when a design names none. */
export const DEFAULT_ADHESION = [0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0] as const;

/** Default braking rates reported in the `at` list when the user asks for none. */
export const DEFAULT_AT = [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0] as const;

/** Grid step of the plotted curves (the spec asks for at most 0.01). */
export const CURVE_STEP = 0.01;
