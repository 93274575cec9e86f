/**
 * Adhesion utilisation f_i = T_i / N_i (71/320/EEC Annex II Appendix point 2, symbol f_i).
 * Null beyond rear-axle lift-off (N2 ≤ 0), where the two-axle model no longer holds.
 */
import { type AxleLoadModel, frontAxleLoad, rearAxleLoad } from './axle-loads.ts';
import { type Distribution, forcesAt } from './distribution.ts';

export interface Utilisation {
  front: number | null;
  rear: number | null;
}

export function utilisation(m: AxleLoadModel, d: Distribution, z: number): Utilisation {
  const n2 = rearAxleLoad(m, z);
  if (!(n2 > 0)) return { front: null, rear: null };
  const f = forcesAt(d, z);
  return { front: f.front / frontAxleLoad(m, z), rear: f.rear / n2 };
}
