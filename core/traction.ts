/**
 * Traction limits: the largest acceleration a drive layout can put on the road, and the steepest
 * gradient the vehicle can start on, with load transfer (quasi-static, two-axle model).
 *
 * Accelerating at x (in g) moves x·χ·P from the front axle to the rear: N1 = P1 − xχP, N2 = P2 + xχP.
 * The drive force needed is (x + f_r)·P with f_r the rolling-resistance coefficient (all wheels lumped).
 * A driven axle with share s of the drive force holds while s(x + f_r)P ≤ μ N_i, giving
 *   front drive  x = (μψ − f_r) / (1 + μχ)
 *   rear drive   x = (μ(1−ψ) − f_r) / (1 − μχ)
 *   all-wheel, fixed front share s: the smaller of (μψ − s f_r)/(s + μχ) and
 *     (μ(1−ψ) − (1−s) f_r)/(1 − s − μχ) (the second only binds where its denominator is positive)
 *   all-wheel, ideal split x = μ − f_r.
 * (Worked examples E6 give these forms; ψ = static front share, χ = h/E.)
 * Beyond x = ψ/χ the front wheels would lift; the result is capped there.
 *
 * Starting on a gradient θ (uphill, from rest): N1 = P(ψ cosθ − χ sinθ), N2 = P((1−ψ) cosθ + χ sinθ)
 * and the force needed is P(sinθ + f_r cosθ); dividing by P cosθ gives the same relations with
 * x = tanθ, so the steepest gradient is 100·x_max %.
 */
import type { AxleLoadModel } from './axle-loads.ts';
import { G_N } from './constants.ts';

export type DriveLayout = 'front' | 'rear' | 'all';

export interface TractionSetup {
  /** Share of the drive force on the front axle for all-wheel drive; null = ideally split. */
  allWheelFrontShare: number | null;
  /** Rolling-resistance coefficient (force / weight), 0 when ignored. */
  rollingResistance: number;
}

export type TractionLimitedBy = 'front_axle' | 'rear_axle' | 'both_axles' | 'front_lift' | 'no_grip';

export interface TractionLimit {
  adhesion: number;
  drive: DriveLayout;
  /** Front share of the drive force used (1 front, 0 rear, fixed or ideal for all-wheel). */
  front_drive_share: number | null;
  max_acceleration_g: number;
  max_acceleration_ms2: number;
  limited_by: TractionLimitedBy;
  /** Steepest gradient the vehicle can start on, % (100·tanθ), and that angle in degrees. */
  max_gradient_pct: number;
  max_gradient_deg: number;
  /** Load on the driven axle(s) while starting on that gradient, N (front + rear for all-wheel). */
  drive_axle_load_on_gradient_n: number;
  is_design_drive: boolean;
}

/** Largest acceleration (in g) for a drive layout; returns the limit and what sets it. */
export function maxAccelerationG(
  loads: AxleLoadModel,
  drive: DriveLayout,
  mu: number,
  setup: TractionSetup,
): { x: number; limitedBy: TractionLimitedBy; share: number | null } {
  const { psi, chi } = loads;
  const fr = setup.rollingResistance;
  const lift = chi > 0 ? psi / chi : Infinity;
  let x: number;
  let limitedBy: TractionLimitedBy;
  let share: number | null;
  if (drive === 'front') {
    share = 1;
    x = (mu * psi - fr) / (1 + mu * chi);
    limitedBy = 'front_axle';
  } else if (drive === 'rear') {
    share = 0;
    const den = 1 - mu * chi;
    x = den > 0 ? (mu * (1 - psi) - fr) / den : Infinity;
    limitedBy = 'rear_axle';
  } else if (setup.allWheelFrontShare === null) {
    share = null;
    x = mu - fr;
    limitedBy = 'both_axles';
  } else {
    const s = setup.allWheelFrontShare;
    share = s;
    const xFront = s > 0 || mu * chi > 0 ? (mu * psi - s * fr) / (s + mu * chi) : Infinity;
    const den = 1 - s - mu * chi;
    const xRear = den > 0 ? (mu * (1 - psi) - (1 - s) * fr) / den : Infinity;
    if (Math.abs(xFront - xRear) < 1e-12) {
      x = xFront;
      limitedBy = 'both_axles';
    } else if (xFront < xRear) {
      x = xFront;
      limitedBy = 'front_axle';
    } else {
      x = xRear;
      limitedBy = 'rear_axle';
    }
  }
  if (x > lift) {
    x = lift;
    limitedBy = 'front_lift';
  }
  if (!(x > 0)) {
    x = 0;
    limitedBy = 'no_grip';
  }
  return { x, limitedBy, share };
}

/** Load on the driven axle(s) on a gradient with tanθ = t, N. */
export function driveAxleLoadOnGradient(loads: AxleLoadModel, drive: DriveLayout, t: number): number {
  const cos = 1 / Math.sqrt(1 + t * t);
  const sin = t * cos;
  const front = loads.P * (loads.psi * cos - loads.chi * sin);
  const rear = loads.P * ((1 - loads.psi) * cos + loads.chi * sin);
  if (drive === 'front') return Math.max(0, front);
  if (drive === 'rear') return rear;
  return Math.max(0, front) + rear;
}

export function tractionLimit(
  loads: AxleLoadModel,
  drive: DriveLayout,
  mu: number,
  setup: TractionSetup,
  designDrive: DriveLayout,
): TractionLimit {
  const { x, limitedBy, share } = maxAccelerationG(loads, drive, mu, setup);
  return {
    adhesion: mu,
    drive,
    front_drive_share: share,
    max_acceleration_g: x,
    max_acceleration_ms2: x * G_N,
    limited_by: limitedBy,
    max_gradient_pct: 100 * x,
    max_gradient_deg: (Math.atan(x) * 180) / Math.PI,
    drive_axle_load_on_gradient_n: driveAxleLoadOnGradient(loads, drive, x),
    is_design_drive: drive === designDrive,
  };
}

/** The design's own drive first, then the two others, on every surface. */
export function tractionTable(
  loads: AxleLoadModel,
  designDrive: DriveLayout,
  adhesions: readonly number[],
  setup: TractionSetup,
): TractionLimit[] {
  const order: DriveLayout[] = [designDrive, ...(['front', 'rear', 'all'] as const).filter((d) => d !== designDrive)];
  const out: TractionLimit[] = [];
  for (const drive of order) for (const mu of adhesions) out.push(tractionLimit(loads, drive, mu, setup, designDrive));
  return out;
}
