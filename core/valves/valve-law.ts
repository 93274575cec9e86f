/**
 * The characteristic every rear valve is reduced to for one load state (design-file spec, "Physics"): rear line
 * pressure p up to the knee, knee + ratio·(p − knee) above it. Pressures in Pa.
 */

/** A valve reduced to its characteristic for one load state: knee (Pa) and slope above it. */
export interface ValveLaw {
  /** Knee pressure, Pa; Infinity when the rear pressure always equals the master pressure. */
  knee: number;
  /** dp2/dp above the knee (0 for a limiting valve). */
  ratio: number;
}

/** The law of no valve at all (and of a valve stuck open): the rear line at master pressure. */
export const FULL_PRESSURE: ValveLaw = Object.freeze({ knee: Infinity, ratio: 1 });

/** Rear line pressure for master pressure p, Pa. */
export function rearPressure(law: ValveLaw, p: number): number {
  return p <= law.knee ? p : law.knee + law.ratio * (p - law.knee);
}

/** The master pressure at which the rear line reaches pressure q, Pa; Infinity when it never does. */
export function masterPressureForRear(law: ValveLaw, q: number): number {
  if (q <= law.knee) return q;
  return law.ratio > 0 ? law.knee + (q - law.knee) / law.ratio : Infinity;
}
