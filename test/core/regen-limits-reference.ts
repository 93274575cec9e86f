/**
 * The search core/regen.ts used for the per-surface limits before they were solved piecewise, kept as the
 * reference the exact solution is compared with (test/core/regen-limits.test.ts) and timed against
 * (bench/evaluate.ts): the plain bisection on the predicate itself, to a tolerance far below 1e-6 N.
 */
import type { AxleLoadModel } from '../../core/axle-loads.ts';
import type { Distribution } from '../../core/distribution.ts';
import { firstLock } from '../../core/lock-order.ts';
import { lockAllowed, type LockOrderRange } from '../../core/lock-order-range.ts';
import { regenDistribution, type RegenBlendingSpec } from '../../core/regen.ts';

/** Bisection for the largest R in [0, k·P] keeping the first lock on surface k allowed (the former maxAllowedRegenForce). */
export function bisectAllowedRegenForce(
  loads: AxleLoadModel,
  friction: Distribution,
  k: number,
  frontShare: number,
  blending: RegenBlendingSpec,
  rule: LockOrderRange,
  toleranceN = 1e-9,
): number | null {
  const allowedWith = (R: number) => {
    const l = firstLock(loads, regenDistribution(friction, R, frontShare, blending), k);
    return lockAllowed(rule, k, l.first_axle, l.braking_rate);
  };
  if (lockAllowed(rule, k, 'rear', 0)) return null;
  const hi = k * friction.P;
  if (!allowedWith(0)) return 0;
  if (allowedWith(hi)) return null;
  let lo = 0;
  let up = hi;
  for (let i = 0; i < 200 && up - lo > toleranceN; i++) {
    const mid = (lo + up) / 2;
    if (allowedWith(mid)) lo = mid;
    else up = mid;
  }
  return lo;
}

