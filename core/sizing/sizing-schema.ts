/**
 * Optional design-file blocks of the sizing assistant (docs/sizing.md):
 *  - `tolerances`: how well the inputs are known, for the robustness analysis;
 *  - `hydraulics.balance_bar`: two master cylinders worked by a balance bar.
 * Defaults are stated here and marked "common practice, no source" unless a reference is named.
 */
import { z } from 'zod';
import { boundedNumber as num } from '../bounded-number.ts';
import { length, mass, percent, pressure, ratio, shortLength, withField } from '../field-registry.ts';

/**
 * Tolerances as ± limits. In the Monte Carlo a ± limit is read as two standard deviations (about
 * 95 % of a normal distribution inside it) or as the bounds of a uniform distribution; the worst-case
 * corners sit at the ± limits.
 */
export const Tolerances = z.strictObject({
  /** Pad (lining) friction, ± per cent of the nominal value, front and rear brakes separately. */
  pad_friction_front_pct: num(0, 50, percent('Front pad friction tolerance')).optional(),
  pad_friction_rear_pct: num(0, 50, percent('Rear pad friction tolerance')).optional(),
  /** CG height, ± m (a load state's cg_height_uncertainty_m, a standard uncertainty, takes precedence: ± = 2 u). */
  cg_height_m: num(0, 1, length('CG height tolerance')).optional(),
  /** Front axle load, ± kg (vehicle mass unchanged: what the front gains the rear loses). */
  front_axle_kg: num(0, 5000, mass('Front axle load tolerance')).optional(),
  /** Dynamic tyre radius, ± per cent (the same tyres front and rear drawn together). */
  tyre_radius_pct: num(0, 20, percent('Tyre radius tolerance')).optional(),
  /**
   * Rear valve knee, ± per cent of the knee pressure (limiting and proportioning valves; a load-sensing
   * valve's whole knee table moves together, as a change of its spring preload would move it).
   */
  valve_knee_pct: num(0, 50, percent('Valve knee tolerance')).optional(),
  /** Rear valve ratio above the knee, ± per cent (proportioning and load-sensing valves; never above 1). */
  valve_ratio_pct: num(0, 50, percent('Valve ratio tolerance')).optional(),
  /** Threshold (push-out) pressure of the front and rear brakes, ± bar (never below 0). */
  threshold_front_bar: num(0, 10, pressure('Front threshold pressure tolerance')).optional(),
  threshold_rear_bar: num(0, 10, pressure('Rear threshold pressure tolerance')).optional(),
  /** Shape of the Monte Carlo draws inside the ± limits. */
  distribution: z.enum(['normal', 'uniform']).optional(),
});
export type Tolerances = z.infer<typeof Tolerances>;

/**
 * Defaults when a design gives no `tolerances`:
 *  - pad friction ± 15 %: replacement friction material must stay within ± 15 % of the original
 *    by the UN R90 Annex 8 method (New Zealand Gazette notice 2004-au85,
 *    https://gazette.govt.nz/notice/id/2004-au85); one market's pad sheet states ± 0.05 on about 0.4
 *    (practitioner reports, no published source), about ± 12 %;
 *  - CG height ± 0.05 m, front axle load ± 20 kg (weighbridge reading and load placement), tyre
 *    radius ± 2 % (wear and pressure): common practice, no source;
 *  - rear valve knee ± 10 % and ratio ± 5 %: from memory (valve makers' data sheets state knee
 *    pressures to roughly ± 10 %), not from a named source;
 *  - threshold pressure ± 0.3 bar front, ± 0.5 bar rear: from memory (a disc's push-out pressure is a
 *    few tenths of a bar, a drum's return-spring threshold spreads more), not from a named source.
 */
export const DEFAULT_TOLERANCES = {
  pad_friction_front_pct: 15,
  pad_friction_rear_pct: 15,
  cg_height_m: 0.05,
  front_axle_kg: 20,
  tyre_radius_pct: 2,
  valve_knee_pct: 10,
  valve_ratio_pct: 5,
  threshold_front_bar: 0.3,
  threshold_rear_bar: 0.5,
  distribution: 'normal',
} as const satisfies Required<Tolerances>;

/**
 * Two master cylinders (front and rear circuit) pushed by one balance bar. The front master
 * cylinder's bore is `hydraulics.master_cylinder_bore_mm`; the bar sends `setting_front_share` of the
 * pushrod force to it and the rest to the rear one. Front line pressure p1 = s·F / A_f, rear master
 * pressure = (1 − s)·F / A_r (before the rear valve, if any).
 */
export const BalanceBar = z.strictObject({
  rear_bore_mm: num(10, 60, shortLength('Rear master cylinder bore')),
  setting_front_share: withField(z
    .number({ error: (iss) => (iss.input === undefined ? 'is required: a number above 0 and below 1' : 'is not a number; allowed: above 0 and below 1') })
    .gt(0, { error: (iss) => `${String(iss.input)} is not above 0 and below 1 (the share of the pushrod force sent to the front master cylinder)` })
    .lt(1, { error: (iss) => `${String(iss.input)} is not above 0 and below 1 (the rear master cylinder gets 1 − setting_front_share of the pushrod force)` }), ratio('Balance bar setting, front share')),
  /** True when the driver can reach the adjuster (cockpit knob or cable). Some inspection regimes refuse that. */
  driver_adjustable: z.boolean().optional(),
});
export type BalanceBar = z.infer<typeof BalanceBar>;

/** Rear master pressure per front line pressure for a balance bar: ((1 − s) / s) · (A_f / A_r). */
export function balanceBarPressureRatio(frontBoreMm: number, bar: BalanceBar): number {
  const s = bar.setting_front_share;
  return ((1 - s) / s) * (frontBoreMm / bar.rear_bore_mm) ** 2;
}

/** The setting that gives a rear/front pressure ratio λ (inverse of balanceBarPressureRatio). */
export function balanceBarSettingForRatio(frontBoreMm: number, rearBoreMm: number, lambda: number): number {
  return 1 / (1 + lambda * (rearBoreMm / frontBoreMm) ** 2);
}
