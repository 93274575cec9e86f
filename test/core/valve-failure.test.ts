// Sources: 71/320/EEC Annex II Appendix point 6 (failure of the distribution device, held as partial
// [P]); required deceleration and foot-force limits: UN R13 Rev.4 Annex 4 2.2 [V]
// (M1 2.9 m/s² at ≤ 500 N, N 2.2 m/s² at ≤ 700 N). Valve laws and axle loads:
// design-file spec "Physics" (none: p2 = p; proportioning/load-sensing: knee + ratio (p − knee);
// N1 = P1 + z h P / E). Every expected number is hand-derived in the comment beside it.
import { describe, expect, it } from 'vitest';
import {
  demoDesign,
  type DesignFile,
  evaluate,
  failedDistribution,
  failedValves,
  forcesAt,
  readDesign,
  type RearValve,
  stateModel,
  stateModels,
  valveFailureModes,
} from '../../core/index.ts';
import { simpleSystemInput } from './hand-cases.ts';

/** The simple hand-check system of test/core/hand-cases.ts with the given rear valve (and load states). */
function design(rearValve: unknown, loadStates?: unknown[]): DesignFile {
  const base = simpleSystemInput(rearValve);
  const r = readDesign({
    ...base,
    name: 'Valve failure hand-check system',
    load_states: loadStates ?? base.load_states,
    adhesion_coefficients: [0.2, 0.5, 0.8],
  });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}
// hand-derived gains: G1 = 4 · 0.4 · 1963.495e-6 m² · 0.12/0.3 = 125.664 N/bar; G2 = 2 · 2 · 314.159e-6 · 0.12/0.3 = 50.265 N/bar;
// P = 2000 · 9.80665 = 19613.3 N; ψ = 0.5, χ = h/E = 0.2.

describe('failed states per valve type', () => {
  it('no valve: nothing to fail', () => {
    expect(failedValves({ type: 'none' })).toEqual([]);
  });
  it('proportioning and limiting: passes full pressure, blocks the rear', () => {
    for (const v of [{ type: 'limiting', knee_bar: 30 }, { type: 'proportioning', knee_bar: 30, ratio: 0.3 }] as const) {
      expect(failedValves(v).map((f) => f.mode)).toEqual(['passes_full_pressure', 'blocks_rear']);
    }
  });
  it('load-sensing: linkage broken at the lowest and at the highest knee', () => {
    const v: RearValve = { type: 'load_sensing', ratio: 0.3, knee_bar_at_rear_axle_kg: [[800, 20], [1400, 40]] };
    expect(failedValves(v).map((f) => [f.mode, f.law.knee / 1e5])).toEqual([
      ['linkage_broken_lowest_knee', 20],
      ['linkage_broken_highest_knee', 40],
    ]);
  });
});

describe('each failed state changes the curves as its definition says', () => {
  it('passes full pressure: the rear line follows the master pressure (same curves as no valve)', () => {
    const d = design({ type: 'proportioning', knee_bar: 30, ratio: 0.3 });
    const s = stateModel(d, d.load_states[0]!);
    const failed = failedDistribution(s, failedValves(d.hydraulics.rear_valve)[0]!);
    const plain = design({ type: 'none' });
    const sp = stateModel(plain, plain.load_states[0]!);
    for (const z of [0.1, 0.3, 0.5, 0.7, 0.9]) {
      const a = forcesAt(failed, z);
      expect(a.p2).toBeCloseTo(a.p, 3);
      expect(a.rear).toBeCloseTo(forcesAt(sp.dist, z).rear, 6);
    }
    // hand-derived: without the valve the split is fixed at G1 : G2 = 125.664 : 50.265, front share 0.71429;
    // at z = 0.5 the rear force is 0.28571 · 0.5 · 19613.3 = 2801.9 N (the working valve gives less above 30 bar)
    expect(forcesAt(failed, 0.5).rear).toBeCloseTo(2801.9, 0);
    expect(forcesAt(s.dist, 0.5).rear).toBeLessThan(2801.9);
  });

  it('blocks the rear: no rear force, the front locks first on every surface', () => {
    const d = design({ type: 'limiting', knee_bar: 30 });
    const r = valveFailureModes(d, stateModels(d), [0.2, 0.5, 0.8]);
    const blocked = r.find((f) => f.mode === 'blocks_rear')!;
    const s = stateModel(d, d.load_states[0]!);
    const dist = failedDistribution(s, failedValves(d.hydraulics.rear_valve)[1]!);
    expect(dist.t2.every((t) => t === 0)).toBe(true);
    // hand-derived: front alone, zP = k (P1 + z χ P) ⇒ z = k ψ / (1 − k χ): k 0.2 → 0.104167, 0.5 → 0.277778, 0.8 → 0.476190
    expect(blocked.first_axle_on.map((l) => l.first_axle)).toEqual(['front', 'front', 'front']);
    expect(blocked.first_axle_on[0]!.braking_rate).toBeCloseTo(0.104167, 5);
    expect(blocked.first_axle_on[1]!.braking_rate).toBeCloseTo(0.277778, 5);
    expect(blocked.first_axle_on[2]!.braking_rate).toBeCloseTo(0.47619, 5);
    // hand-derived: pedal limit N category 700 N: p = 700 · 4 / 314.159e-6 m² = 89.127 bar; z = 125.664 · 89.127 / 19613.3 = 0.57104 (5.600 m/s²);
    // the front locks on k = 0.8 at z = 0.47619 (4.670 m/s²) first, so 4.670 m/s² ≥ 2.2 m/s²: passed
    expect(blocked.master_pressure_at_limit_bar).toBeCloseTo(89.127, 2);
    expect(blocked.pedal_limited_ms2).toBeCloseTo(5.6, 3);
    expect(blocked.max_deceleration_ms2).toBeCloseTo(4.67, 2);
    expect(blocked.limited_by).toBe('wheel_lock');
    expect(blocked.required_ms2).toBe(2.2);
    expect(blocked.passed).toBe(true);
    expect(blocked.status).toBe('P');
    expect(blocked.verify_note).toMatch(/verify/);
  });

  it('blocks the rear on an M1 with a large master cylinder: fails at the 500 N limit', () => {
    const d = design({ type: 'proportioning', knee_bar: 30, ratio: 0.3 });
    d.vehicle.category = 'M1';
    d.hydraulics.master_cylinder_bore_mm = 30;
    const blocked = valveFailureModes(d, stateModels(d), [0.8]).find((f) => f.mode === 'blocks_rear')!;
    // hand-derived: p = 500 · 4 / 706.858e-6 m² = 28.294 bar; z = 125.664 · 28.294 / 19613.3 = 0.18128, i.e. 1.778 m/s² < 2.9 m/s²
    expect(blocked.pedal_force_limit_n).toBe(500);
    expect(blocked.max_deceleration_ms2).toBeCloseTo(1.778, 3);
    expect(blocked.limited_by).toBe('pedal_force');
    expect(blocked.required_ms2).toBe(2.9);
    expect(blocked.passed).toBe(false);
  });

  it('load-sensing linkage broken: the knee is held whatever the load', () => {
    const states = [
      { id: 'unladen', label: 'Unladen', kind: 'unladen', mass_kg: 1800, front_axle_kg: 1000, cg_height_m: 0.6 },
      { id: 'laden', label: 'Laden', kind: 'laden', mass_kg: 2400, front_axle_kg: 1000, cg_height_m: 0.6 },
    ];
    // rear static axle 800 kg (knee 20 bar) unladen and 1400 kg (knee 40 bar) laden from the table
    // senses "static": the intact valve reads the static rear load, so the knees below are those of the table
    const d = design({ type: 'load_sensing', ratio: 0.3, senses: 'static', knee_bar_at_rear_axle_kg: [[800, 20], [1400, 40]] }, states);
    const [lowest, highest] = failedValves(d.hydraulics.rear_valve);
    const [unladen, laden] = stateModels(d);
    // Lowest knee: the laden curve changes (40 → 20 bar), the unladen one does not.
    const lowLaden = failedDistribution(laden!, lowest!);
    // hand-derived: master 60 bar ⇒ rear 20 + 0.3 · 40 = 32 bar; z = (125.664 · 60 + 50.265 · 32) / (2400 · 9.80665) = 0.38870
    const z60 = (125.66371 * 60 + 50.26548 * 32) / (2400 * 9.80665);
    expect(forcesAt(lowLaden, z60).p / 1e5).toBeCloseTo(60, 3);
    expect(forcesAt(lowLaden, z60).p2 / 1e5).toBeCloseTo(32, 3);
    expect(forcesAt(laden!.dist, z60).p2 / 1e5).toBeGreaterThan(32);
    const lowUnladen = failedDistribution(unladen!, lowest!);
    for (const z of [0.2, 0.5, 0.8]) expect(forcesAt(lowUnladen, z).rear).toBeCloseTo(forcesAt(unladen!.dist, z).rear, 6);
    // Highest knee: the unladen curve changes (20 → 40 bar): at master 60 bar the rear gets 40 + 0.3 · 20 = 46 bar.
    const highUnladen = failedDistribution(unladen!, highest!);
    const z60u = (125.66371 * 60 + 50.26548 * 46) / (1800 * 9.80665);
    expect(forcesAt(highUnladen, z60u).p2 / 1e5).toBeCloseTo(46, 3);
    const highLaden = failedDistribution(laden!, highest!);
    for (const z of [0.2, 0.5, 0.8]) expect(forcesAt(highLaden, z).rear).toBeCloseTo(forcesAt(laden!.dist, z).rear, 6);
  });
});

describe('evaluate result', () => {
  it('carries failure_modes with the contract keys for the demo (load-sensing: 2 modes × 2 states)', () => {
    const r = evaluate(demoDesign());
    expect(r.failure_modes).toHaveLength(4);
    for (const f of r.failure_modes) {
      expect(Object.keys(f)).toEqual(expect.arrayContaining(['mode', 'load_state', 'max_deceleration_ms2', 'required_ms2', 'passed', 'first_axle_on']));
      // demo is N1: R13 Annex 4 2.2 requires 2.2 m/s²
      expect(f.required_ms2).toBe(2.2);
      expect(f.first_axle_on).toHaveLength(r.adhesion_coefficients.length);
    }
  });
});

describe('with a balance bar the failed valve sits behind the rear master cylinder', () => {
  it('a broken load-sensing linkage holds its knee in rear line pressure, not in front pressure', () => {
    // Balance bar: front bore 20 mm, rear 25 mm, 60 % to the front; hand-derived λ = (0.4/0.6) · (20/25)² = 0.426667
    // (force balance on the bar, docs/design-file.md).
    const states = [
      { id: 'unladen', label: 'Unladen', kind: 'unladen', mass_kg: 1800, front_axle_kg: 1000, cg_height_m: 0.6 },
      { id: 'laden', label: 'Laden', kind: 'laden', mass_kg: 2400, front_axle_kg: 1000, cg_height_m: 0.6 },
    ];
    const plain = design({ type: 'load_sensing', ratio: 0.3, knee_bar_at_rear_axle_kg: [[800, 20], [1400, 40]] }, states);
    const r = readDesign({ ...plain, hydraulics: { ...plain.hydraulics, balance_bar: { rear_bore_mm: 25, setting_front_share: 0.6 } } });
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    const [lowest] = failedValves(r.design.hydraulics.rear_valve);
    const laden = stateModels(r.design)[1]!;
    const low = failedDistribution(laden, lowest!);
    // hand-derived: front 100 bar ⇒ rear master 42.667 bar ⇒ rear line 20 + 0.3 · (42.667 − 20) = 26.8 bar;
    // z = (125.664 · 100 + 50.265 · 26.8) / (2400 · 9.80665) = 0.591159
    const z = (125.66371 * 100 + 50.26548 * 26.8) / (2400 * 9.80665);
    expect(forcesAt(low, z).p / 1e5).toBeCloseTo(100, 3);
    expect(forcesAt(low, z).p2 / 1e5).toBeCloseTo(26.8, 3);
  });
});

