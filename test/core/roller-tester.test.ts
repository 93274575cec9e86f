// Roller brake tester prediction (core/roller-tester.ts).
// Sources: roller adhesion about 0.85 and efficiency = total roller brake effort ÷ test weight
// (UK MOT practice; practitioner reports, no published source); brake gains from
// the design-file spec ("Physics"); every number below hand-derived in the comments.
import { describe, expect, it } from 'vitest';
import type { DesignFile } from '../../core/design.ts';
import { testerPrediction } from '../../core/roller-tester.ts';
import { stateModel } from '../../core/state-model.ts';

// Front: one 50 mm piston, sliding caliper, pad μ 0.4, r_eff 0.1 m, tyre 0.3 m:
//   G1 = 4 · 0.4 · (π/4 · 0.05²) · 0.1/0.3 = 104.71976 N/bar, no threshold.
// Rear: 20 mm wheel cylinder, C* 2, drum 0.1 m, tyre 0.3 m: G2 = 2 · 2 · (π/4 · 0.02²) · 0.1/0.3 = 41.88790 N/bar,
//   threshold 3 bar. Master cylinder 25 mm (4.90874e-4 m²), pedal ratio 4, booster 3: F = p · A / 12.
const design: DesignFile = {
  format: 'lockstep-design/1',
  name: 'tester case',
  vehicle: { category: 'N1', wheelbase_m: 2.8, abs: false, drive: 'rear' },
  load_states: [
    { id: 'unladen', label: 'light', kind: 'unladen', mass_kg: 1100, front_axle_kg: 800, cg_height_m: 0.6 },
    { id: 'laden', label: 'full', kind: 'laden', mass_kg: 2000, front_axle_kg: 1000, cg_height_m: 0.7 },
  ],
  axles: {
    front: {
      tyre_radius_m: 0.3,
      brake: { type: 'disc', caliper: 'sliding', piston_diameters_mm: [50], effective_radius_m: 0.1, pad_friction: 0.4, threshold_pressure_bar: 0 },
    },
    rear: {
      tyre_radius_m: 0.3,
      brake: { type: 'drum', wheel_cylinder_diameter_mm: 20, drum_radius_m: 0.1, brake_factor: 2, threshold_pressure_bar: 3 },
    },
  },
  hydraulics: { master_cylinder_bore_mm: 25, pedal_ratio: 4, booster_ratio: 3, circuit_split: 'front_rear', rear_valve: { type: 'none' } },
};
const opts = { rollerAdhesion: 0.85, testMassKg: 2000, requiredPct: 50, pedalLimitN: 700, stateKind: 'unladen' };

describe('testerPrediction, unladen 1100 kg (800 front, 300 rear), test mass 2000 kg', () => {
  const r = testerPrediction(stateModel(design, design.load_states[0]!), opts);
  it('slip forces 0.85 × static axle load: 6668.52 N front, 2500.70 N rear', () => {
    // 0.85 · 800 · 9.80665 = 6668.522 N; 0.85 · 300 · 9.80665 = 2500.696 N.
    expect(r.axles[0]!.slip_force_n).toBeCloseTo(6668.522, 2);
    expect(r.axles[1]!.slip_force_n).toBeCloseTo(2500.696, 2);
  });
  it('pressures and pedal forces at slip', () => {
    // front p = 6668.522/104.71976 = 63.6797 bar → F = 63.6797e5 · 4.90874e-4/12 = 260.489 N
    // rear p = 3 + 2500.696/41.88790 = 62.6997 bar → F = 256.480 N
    expect(r.axles[0]!.slip_pressure_bar!).toBeCloseTo(63.6797, 3);
    expect(r.axles[0]!.slip_pedal_force_n!).toBeCloseTo(260.489, 2);
    expect(r.axles[1]!.slip_pressure_bar!).toBeCloseTo(62.6997, 3);
    expect(r.axles[1]!.slip_pedal_force_n!).toBeCloseTo(256.480, 2);
  });
  it('shows 0.85 × 1100/2000 = 46.75 % and flags the early rear slip', () => {
    // Both axles slip before the 700 N pedal limit, so the recorded total is 0.85 × the vehicle weight.
    // Required 50 %: (G1 + G2) p − G2 · 3 bar = 0.5 · 2000 · 9.80665 → p = 67.7476 bar (277.13 N pedal),
    // above the rear slip pressure 62.70 bar. At 62.70 bar: 104.71976 · 62.6997 + 2500.70 = 9066.70 N = 46.227 %.
    expect(r.predicted_pct).toBeCloseTo(46.75, 6);
    expect(r.pedal_force_for_required_n!).toBeCloseTo(277.129, 2);
    expect(r.pct_when_rear_slips!).toBeCloseTo(46.2268, 3);
    expect(r.rear_slips_before_required).toBe(true);
    expect(r.flag).toMatch(/laden or load-simulated/);
  });
});

describe('testerPrediction, laden 2000 kg (1000 / 1000)', () => {
  const r = testerPrediction(stateModel(design, design.load_states[1]!), { ...opts, stateKind: 'laden' });
  it('the pedal limit stops the rear short of slip; the tester reads 78.4 % and no flag', () => {
    // rear slip p = 3 + 0.85 · 9806.65/41.88790 = 202.000 bar → 202.0e5 · 4.90874e-4/12 = 826.3 N > 700 N:
    // the pedal limit comes first; at 700 N p = 700 · 12/4.90874e-4 = 171.123 bar,
    // rear force 41.88790 · (171.123 − 3) = 7042.3 N. Front slips at 0.85 · 9806.65/104.71976 = 79.60 bar.
    // Recorded: 8335.65 + 7042.3 = 15 377.9 N over 19 613.3 N = 78.41 %.
    expect(r.axles[1]!.limited_by).toBe('pedal_limit');
    expect(r.axles[1]!.recorded_force_n).toBeCloseTo(7042.3, 0);
    expect(r.predicted_pct).toBeCloseTo(78.41, 1);
    expect(r.rear_slips_before_required).toBe(false);
    expect(r.flag).toBeNull();
  });
});
