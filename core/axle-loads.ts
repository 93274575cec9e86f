/**
 * Axle loads of a two-axle vehicle while braking, 71/320/EEC Annex II Appendix point 3.1.3
 * (symbols of point 2): N1 = P1 + z·(h/E)·P, N2 = P2 − z·(h/E)·P, with P = m·g the vehicle weight.
 */
import { G_N } from './constants.ts';

export interface AxleLoadModel {
  /** Vehicle weight P = m g, N. */
  P: number;
  /** Static front and rear axle loads, N. */
  P1: number;
  P2: number;
  /** Wheelbase E and CG height h, m. */
  E: number;
  h: number;
  /** χ = h / E. */
  chi: number;
  /** Static front share ψ = P1 / P. */
  psi: number;
  /** Braking rate at which the rear axle load reaches zero (rear lift-off): (1 − ψ) / χ. */
  zLift: number;
}

export function axleLoadModel(massKg: number, frontAxleKg: number, cgHeightM: number, wheelbaseM: number): AxleLoadModel {
  const P = massKg * G_N;
  const P1 = frontAxleKg * G_N;
  const P2 = P - P1;
  const chi = cgHeightM / wheelbaseM;
  return { P, P1, P2, E: wheelbaseM, h: cgHeightM, chi, psi: P1 / P, zLift: P2 / (chi * P) };
}

/** Dynamic front axle load N1 at braking rate z, N. */
export function frontAxleLoad(m: AxleLoadModel, z: number): number {
  return m.P1 + z * m.chi * m.P;
}

/** Dynamic rear axle load N2 at braking rate z, N (zero or negative beyond lift-off). */
export function rearAxleLoad(m: AxleLoadModel, z: number): number {
  return m.P2 - z * m.chi * m.P;
}
