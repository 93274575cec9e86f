/**
 * The searches core/regen.ts used for the regeneration limits before they were solved piecewise, kept as the
 * references the exact solutions are compared with (test/core/regen-limits.test.ts) and timed against
 * (bench/evaluate.ts): the plain bisection on the predicate itself, to a tolerance far below 1e-6 N.
 */
import type { AxleLoadModel } from '../../core/axle-loads.ts';
import type { Distribution } from '../../core/distribution.ts';
import { firstLock } from '../../core/lock-order.ts';
import { lockAllowed, type LockOrderRange } from '../../core/lock-order-range.ts';
import { regenDistribution, type RegenBlendingSpec } from '../../core/regen.ts';
import { checkCurveRule } from '../../core/checks/curve-check.ts';
import type { CurveRule } from '../../core/rules/rule-types.ts';

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


/**
 * The force up to which every rule passes at every force (the former bisection's question, asked of the passing
 * set from zero upwards): a scan in `steps` equal steps up to rMax finds the first failing force, then a
 * bisection between it and the last passing one narrows it to `toleranceN`. A failing stretch shorter than one
 * step can be missed (the scan's own tolerance); null when every sampled force passes.
 */
export function scanFirstFailingForce(
  rules: readonly CurveRule[],
  loads: AxleLoadModel,
  friction: Distribution,
  frontShare: number,
  blending: RegenBlendingSpec,
  rMax: number,
  steps = 400,
  toleranceN = 1e-9,
): number | null {
  const passes = (R: number) => {
    const d = regenDistribution(friction, R, frontShare, blending);
    return rules.every((rule) => checkCurveRule(rule, loads, d).passed);
  };
  let lo = 0;
  let up = NaN;
  for (let i = 1; i <= steps; i++) {
    const R = (rMax * i) / steps;
    if (!passes(R)) {
      up = R;
      break;
    }
    lo = R;
  }
  if (Number.isNaN(up)) return null;
  for (let i = 0; i < 200 && up - lo > toleranceN; i++) {
    const mid = (lo + up) / 2;
    if (passes(mid)) lo = mid;
    else up = mid;
  }
  return lo;
}
