/**
 * The braking-rate range in which a category's front axle must lock first (front adhesion-utilisation
 * curve above the rear one), 71/320/EEC Annex II Appendix point 3.1.1, as tabulated in
 * verified: M1 0.15–0.80, N1 0.15–0.50,
 * other power-driven categories 0.15–0.30; surfaces k from 0.2 to 0.8 (point 3.1.1 heading [V]).
 * Only the main rule: the permitted deviations (M1 inversion zone 0.30–0.45, N1 ±0.08 corridor,
 * band for other categories) are not applied here, so a verdict from this table errs on the strict side.
 * Used by the limits (regeneration) where the regulation checks of core/checks are not available.
 */
import type { Vehicle } from './design.ts';

export interface LockOrderRange {
  category: Vehicle['category'];
  /** Braking rates where the rear axle must not lock first. */
  z_from: number;
  z_to: number;
  /** Surfaces the requirement covers. */
  k_from: number;
  k_to: number;
  source: string;
  status: 'V' | 'P' | 'M';
  note: string;
}

export function lockOrderRange(category: Vehicle['category']): LockOrderRange {
  const zTo = category === 'M1' ? 0.8 : category === 'N1' ? 0.5 : 0.3;
  return {
    category,
    z_from: 0.15,
    z_to: zTo,
    k_from: 0.2,
    k_to: 0.8,
    source: '71/320/EEC Annex II Appendix 3.1.1 (UN R13 Annex 10 / R13-H Annex 5 carry the same logic)',
    status: 'V',
    note:
      'main rule only (front locks first); the permitted deviations are not applied, and a rear lock below ' +
      `z = 0.15 is counted as a violation too (strict side)`,
  };
}

/**
 * Whether a first lock is allowed by the range: the rear axle alone locking first at a braking rate up to
 * z_to, on a surface inside k_from…k_to, is not. Surfaces outside the range are always "allowed".
 */
export function lockAllowed(r: LockOrderRange, adhesion: number, firstAxle: string, brakingRate: number): boolean {
  if (adhesion < r.k_from - 1e-12 || adhesion > r.k_to + 1e-12) return true;
  return !(firstAxle === 'rear' && brakingRate <= r.z_to + 1e-12);
}
