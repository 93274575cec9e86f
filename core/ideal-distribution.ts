/**
 * The ideal braking-force distribution: both axles use the same adhesion, f1 = f2 = z,
 * so T1 = z N1 and T2 = z N2 (71/320/EEC Annex II Appendix point 3.1, the line k = z).
 */
import { type AxleLoadModel, frontAxleLoad, rearAxleLoad } from './axle-loads.ts';

export function idealForces(m: AxleLoadModel, z: number): { front: number; rear: number } {
  return { front: z * frontAxleLoad(m, z), rear: z * rearAxleLoad(m, z) };
}

/** Ideal front share of the total braking force at braking rate z: ψ + χ z. */
export function idealFrontShare(m: AxleLoadModel, z: number): number {
  return m.psi + m.chi * z;
}
