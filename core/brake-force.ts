/**
 * The force law of the hydraulic brakes, written once (design-file spec, "Physics"): an axle's brake force at
 * line pressure p is T = G·max(0, p − threshold), G the brake gain (N per Pa, core/brake-gain.ts), threshold the
 * pressure that first brings the linings into contact. The rear line is at valve(p) (core/valves/). Every path
 * from pressure to force (distribution, pedal travel, roller tester, valve failure, robustness) uses it.
 */
import type { ForcesAt } from './distribution.ts';
import { rearPressure, type ValveLaw } from './valves/index.ts';

/** Brake gains (N per Pa) and threshold pressures (Pa) of the two axles. */
export interface BrakeAxles {
  G1: number;
  G2: number;
  threshold1: number;
  threshold2: number;
}

/** Brake force of one axle at line pressure p, N: G·max(0, p − threshold). */
export function axleBrakeForce(G: number, p: number, threshold: number): number {
  return G * Math.max(0, p - threshold);
}

/** Both axles' brake forces at master pressure p, the rear through the valve law, with both line pressures. */
export function forcesAtPressure(h: BrakeAxles, law: ValveLaw, p: number): ForcesAt {
  const p2 = rearPressure(law, p);
  return { front: axleBrakeForce(h.G1, p, h.threshold1), rear: axleBrakeForce(h.G2, p2, h.threshold2), p, p2 };
}

/** The total brake force at master pressure p, N, without building an object (it runs in every evaluation). */
export function totalForceAtPressure(h: BrakeAxles, law: ValveLaw, p: number): number {
  return axleBrakeForce(h.G1, p, h.threshold1) + axleBrakeForce(h.G2, rearPressure(law, p), h.threshold2);
}
