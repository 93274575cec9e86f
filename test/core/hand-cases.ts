/**
 * Hand-derived systems shared by several test files (not a test file). Both are built so that the
 * arithmetic in braking rate z is simple: P from m = 1000 kg, ψ = P1/P = 0.5, χ = h/E = 0.625/2.5 =
 * 0.25 (so N1 = P(0.5 + 0.25 z), N2 = P(0.5 − 0.25 z), lift-off at z = 2), no thresholds, and brake
 * gains G1 = 0.6 P per 100 bar, G2 = 0.4 P per 100 bar, so with equal line pressures z = p/(100 bar)
 * and the front share is φ = 0.6.
 */
import { axleLoadModel } from '../../core/axle-loads.ts';
import { installedDistribution } from '../../core/installed-distribution.ts';

export const loads = axleLoadModel(1000, 500, 0.625, 2.5);
const P = loads.P;
const per100bar = P / 1e7; // N per Pa giving P at 100 bar

/** Limiting valve, knee 50 bar: the rear force stops at 0.4 P × 0.5 = 0.2 P from z = 0.5 on. */
export const limiting = installedDistribution({
  P,
  G1: 0.6 * per100bar,
  G2: 0.4 * per100bar,
  threshold1: 0,
  threshold2: 0,
  valve: { knee: 50e5, ratio: 0 },
});

/** Proportioning valve, knee 30 bar, ratio 0.25: above the knee z = 0.007 x + 0.09 (x = master bar). */
export const proportioning = installedDistribution({
  P,
  G1: 0.6 * per100bar,
  G2: 0.4 * per100bar,
  threshold1: 0,
  threshold2: 0,
  valve: { knee: 30e5, ratio: 0.25 },
});
