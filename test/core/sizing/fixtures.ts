/**
 * Simple test designs for the sizing assistant (invented, test data only). A one-load-state vehicle
 * with disc brakes, no thresholds and no valve has a fixed front share φ = G1/(G1 + G2), so the
 * fixed-split relations (hand-derived from the axle loads under braking, common practice, no source) apply exactly.
 */
import type { DesignFile } from '../../../core/index.ts';

export function fixedSplitDesign(opts: { category?: DesignFile['vehicle']['category']; massKg?: number; frontKg?: number; cgM?: number; wheelbaseM?: number; frontPistonMm?: number; rearPistonMm?: number; rules?: string[]; kind?: 'laden' | 'unladen' } = {}): DesignFile {
  return {
    format: 'lockstep-design/1',
    name: 'Sizing test vehicle',
    vehicle: { category: opts.category ?? 'N1', wheelbase_m: opts.wheelbaseM ?? 3, abs: false, drive: 'rear' },
    load_states: [{ id: 'only', label: 'Only state', kind: opts.kind ?? 'laden', mass_kg: opts.massKg ?? 2000, front_axle_kg: opts.frontKg ?? 1100, cg_height_m: opts.cgM ?? 0.6 }],
    axles: {
      front: { tyre_radius_m: 0.3, brake: { type: 'disc', caliper: 'sliding', piston_diameters_mm: [opts.frontPistonMm ?? 54], effective_radius_m: 0.12, pad_friction: 0.4, threshold_pressure_bar: 0 } },
      rear: { tyre_radius_m: 0.3, brake: { type: 'disc', caliper: 'sliding', piston_diameters_mm: [opts.rearPistonMm ?? 34], effective_radius_m: 0.12, pad_friction: 0.4, threshold_pressure_bar: 0 } },
    },
    hydraulics: { master_cylinder_bore_mm: 22.2, pedal_ratio: 4, booster_ratio: 4, circuit_split: 'front_rear', rear_valve: { type: 'none' } },
    ...(opts.rules ? { rules: opts.rules } : {}),
  };
}
