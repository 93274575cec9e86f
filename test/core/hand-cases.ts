/**
 * Hand-derived systems shared by several test files (not a test file). The first two: Both are built so that the
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

/**
 * A second hand-check system, as design-file input: one 50 mm sliding-caliper piston front, 20 mm drum wheel
 * cylinders rear (brake factor 2), effective and drum radius 0.12 m on 0.3 m tyres, 20 mm master cylinder,
 * pedal ratio 4, no booster; N1, wheelbase 3 m, 2000 kg laden (1000 kg front, CG 0.6 m). Its gains are
 * G1 = 4 · 0.4 · 1963.495e-6 m² · 0.12/0.3 = 125.664 N/bar and G2 = 2 · 2 · 314.159e-6 m² · 0.12/0.3 = 50.265 N/bar.
 */
export function simpleSystemInput(rearValve: unknown = { type: 'none' }) {
  return {
    format: 'lockstep-design/1',
    name: 'Simple hand-check system',
    vehicle: { category: 'N1', wheelbase_m: 3, abs: false, drive: 'rear' },
    load_states: [{ id: 'laden', label: 'Laden', kind: 'laden', mass_kg: 2000, front_axle_kg: 1000, cg_height_m: 0.6 }] as unknown[],
    axles: {
      front: {
        tyre_radius_m: 0.3,
        brake: { type: 'disc', caliper: 'sliding', piston_diameters_mm: [50], effective_radius_m: 0.12, pad_friction: 0.4, threshold_pressure_bar: 0 },
      },
      rear: {
        tyre_radius_m: 0.3,
        brake: { type: 'drum', wheel_cylinder_diameter_mm: 20, drum_radius_m: 0.12, brake_factor: 2, threshold_pressure_bar: 0 },
      },
    },
    hydraulics: { master_cylinder_bore_mm: 20, pedal_ratio: 4, booster_ratio: 1, circuit_split: 'front_rear', rear_valve: rearValve },
  };
}
