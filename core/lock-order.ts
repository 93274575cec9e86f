/**
 * First lock on a surface of adhesion k: the smallest braking rate at which f1 or f2 reaches k.
 * On each linear piece T_i = a + b z and N_i is linear in z, so T_i − k N_i = 0 is solved exactly.
 * "both" when the two axles lock within SIMULTANEOUS_LOCK_DZ of each other (design-file spec).
 * Braking efficiency = z_lock / k.
 */
import type { AxleLoadModel } from './axle-loads.ts';
import { SIMULTANEOUS_LOCK_DZ } from './constants.ts';
import { type Distribution, type Segment, segments } from './distribution.ts';

export type FirstAxle = 'front' | 'rear' | 'both' | 'none';

export interface LockResult {
  adhesion: number;
  /** "none" when the rear axle lifts off before either axle locks. */
  first_axle: FirstAxle;
  braking_rate: number;
  efficiency: number;
  /** Braking rates at which each axle alone would reach k (null when it does not before lift-off). */
  front_lock_braking_rate: number | null;
  rear_lock_braking_rate: number | null;
}

/** Smallest z ≥ 0 with T_i(z) − k N_i(z) ≥ 0, where N_i = n0 + n1 z; null when none below zMax. */
function firstReach(segs: readonly Segment[], axle: 1 | 2, k: number, n0: number, n1: number, zMax: number): number | null {
  for (const s of segs) {
    if (s.zFrom >= zMax) break;
    const a = axle === 1 ? s.a1 : s.a2;
    const b = axle === 1 ? s.b1 : s.b2;
    // g(z) = (a − k n0) + (b − k n1) z on [zFrom, min(zTo, zMax)]
    const c0 = a - k * n0;
    const c1 = b - k * n1;
    const gFrom = c0 + c1 * s.zFrom;
    if (gFrom >= 0) return s.zFrom;
    if (c1 > 0) {
      const root = -c0 / c1;
      if (root <= s.zTo && root < zMax) return root;
    }
  }
  return null;
}

/** `segs` may be passed in when the caller has them already (segments(d) of the same distribution). */
export function firstLock(m: AxleLoadModel, d: Distribution, k: number, segs: readonly Segment[] = segments(d)): LockResult {
  const zFront = firstReach(segs, 1, k, m.P1, m.chi * m.P, m.zLift);
  const zRear = firstReach(segs, 2, k, m.P2, -m.chi * m.P, m.zLift);
  let first: FirstAxle;
  let z: number;
  if (zFront === null && zRear === null) {
    first = 'none';
    z = m.zLift;
  } else if (zRear === null || (zFront !== null && zFront <= zRear)) {
    z = zFront!;
    first = zRear !== null && zRear - zFront! < SIMULTANEOUS_LOCK_DZ ? 'both' : 'front';
  } else {
    z = zRear;
    first = zFront !== null && zFront - zRear < SIMULTANEOUS_LOCK_DZ ? 'both' : 'rear';
  }
  return {
    adhesion: k,
    first_axle: first,
    braking_rate: z,
    efficiency: z / k,
    front_lock_braking_rate: zFront,
    rear_lock_braking_rate: zRear,
  };
}
