/**
 * Brake gain of one axle (two brakes): braking force at the tyres per pascal of line pressure
 * above the threshold, N/Pa. Design-file spec, "Physics":
 *   disc: G = 2 · 2 · μ_pad · A_clamp · r_eff / R, A_clamp = Σ piston areas (sliding caliper)
 *         or half of it (fixed, opposed-piston caliper: the pistons of one side clamp);
 *   drum: G = 2 · C* · A_wc · r_drum / R.
 */
import type { Brake } from './design.ts';

export function pistonArea(diameterM: number): number {
  return (Math.PI / 4) * diameterM * diameterM;
}

/** Clamp area of one caliper, m². */
export function clampArea(brake: Extract<Brake, { type: 'disc' }>): number {
  const total = brake.piston_diameters_mm.reduce((s, d) => s + pistonArea(d * 1e-3), 0);
  return brake.caliper === 'fixed' ? total / 2 : total;
}

export function brakeGain(brake: Brake, tyreRadiusM: number): number {
  if (brake.type === 'disc') {
    return (2 * 2 * brake.pad_friction * clampArea(brake) * brake.effective_radius_m) / tyreRadiusM;
  }
  const area = pistonArea(brake.wheel_cylinder_diameter_mm * 1e-3);
  return (2 * brake.brake_factor * area * brake.drum_radius_m) / tyreRadiusM;
}
