/**
 * The inspection cases of issue 18, each against a hand computation on the fixed-split system of
 * fixed-split.ts: m = 1000 kg, ψ = 0.5, χ = h/E = 0.2, equal 40 mm sliding calipers, no valve, so the
 * front share φ = front pistons / all pistons; test surface k = 0.8 (the default).
 * First lock of a fixed split on k: front when φ z = k (ψ + χ z), z = kψ/(φ − kχ);
 * rear when (1 − φ) z = k (1 − ψ − χ z), z = k(1 − ψ)/(1 − φ + kχ).
 * Required deceleration from a distance limit s at v km/h with reaction term c·v: v²/(25.92 (s − c v))
 * (s = v²/(2d) with v in km/h: 2 · 3.6² = 25.92; common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import type { CheckResult } from '../../../core/checks/check-result.ts';
import { frictionFactorAt } from '../../../core/checks/hot-performance.ts';
import { lightlyLoadedState } from '../../../core/checks/lightly-loaded.ts';
import { runChecks } from '../../../core/checks/run-checks.ts';
import { G_N } from '../../../core/constants.ts';
import { DesignFile } from '../../../core/design.ts';
import { evaluate, stateModels } from '../../../core/evaluate.ts';
import { pitfalls } from '../../../core/pitfalls.ts';
import { RULE_SELECTORS } from '../../../core/rules/index.ts';
import { gainOf, pressureFor, splitDesign } from './fixed-split.ts';

const K = 0.8;
const frontLock = (phi: number, k = K) => (k * 0.5) / (phi - k * 0.2);
const rearLock = (phi: number, k = K) => (k * 0.5) / (1 - phi + k * 0.2);
const implied = (v: number, s: number, c: number) => (v * v) / (25.92 * (s - c * v));

function checksOf(d: DesignFile, rule: string): CheckResult[] {
  return runChecks(d, stateModels(d), { rules: [rule] }).filter((c) => c.rule === rule);
}

describe('residual braking (71/320/EEC Annex II 2.1.4: laden M1 1.7 m/s² as in 70/311 Annex II; unladen 1.5 m/s² and distances from memory)', () => {
  it('checks each failed circuit with the laden or unladen figure', () => {
    const d = splitDesign({ frontPistons: 3, rearPistons: 2 });
    const r = checksOf(d, 'performance/residual');
    expect(r.map((c) => `${c.load_state}/${c.scenario}`)).toEqual([
      'unladen/front_circuit_only',
      'unladen/rear_circuit_only',
      'laden/front_circuit_only',
      'laden/rear_circuit_only',
    ]);
    // M1 laden: s ≤ 0.1v + (100/30)·v²/150 at 80 km/h → 6400/(25.92·142.22) = 1.736 > 1.7
    const laden = Math.max(1.7, implied(80, 8 + ((100 / 30) * 6400) / 150, 0.1));
    // M1 unladen: (100/25)·v²/150 → 1.447 < 1.5, so 1.5
    const unladen = Math.max(1.5, implied(80, 8 + ((100 / 25) * 6400) / 150, 0.1));
    expect(laden).toBeCloseTo(1.7361, 4);
    expect(unladen).toBe(1.5);
    // Front brakes only: 700 N gives far more than the front lock, so a = g·kψ/(1 − kχ) (φ = 1); rear only: g·k(1 − ψ)/(1 + kχ).
    const aFront = frontLock(1) * G_N;
    const aRear = rearLock(0) * G_N;
    const by = (id: string, sc: string) => r.find((c) => c.load_state === id && c.scenario === sc)!;
    expect(by('laden', 'front_circuit_only').worst_margin!).toBeCloseTo(aFront - laden, 9);
    expect(by('laden', 'rear_circuit_only').worst_margin!).toBeCloseTo(aRear - laden, 9);
    expect(by('unladen', 'rear_circuit_only').worst_margin!).toBeCloseTo(aRear - unladen, 9);
    expect(by('laden', 'front_circuit_only').status).toBe('partial');
    expect(by('unladen', 'front_circuit_only').status).toBe('memory');
    expect(r.every((c) => c.passed === true && c.verify_note === 'verify against the current official text')).toBe(true);
  });

  it('fails when the pedal cannot reach the residual figure', () => {
    // Pedal ratio 1, booster 1: p = 700 N / A (A = π/4·0.025²) = 1.43 MPa; rear brakes only (1 piston): z = G2 p / P = 0.117,
    // below the rear lock
    const b = splitDesign({ frontPistons: 20, rearPistons: 1, boosterRatio: 1 });
    const d = { ...b, hydraulics: { ...b.hydraulics, pedal_ratio: 1 } };
    const c = checksOf(d, 'performance/residual').find((x) => x.load_state === 'laden' && x.scenario === 'rear_circuit_only')!;
    const z = (gainOf(1) * (700 / ((Math.PI / 4) * 0.025 ** 2))) / (1000 * G_N);
    expect(z).toBeLessThan(rearLock(1 / 21));
    expect(c.worst_margin!).toBeCloseTo(z * G_N - Math.max(1.7, implied(80, 8 + ((100 / 30) * 6400) / 150, 0.1)), 9);
    expect(c.passed).toBe(false);
  });
});

describe('FMVSS 135 failure stops (from memory: proportioning failed 110 m, antilock failed 85 m, from 100 km/h at ≤ 500 N)', () => {
  const valve = { type: 'proportioning', knee_bar: 20, ratio: 0.3 } as const;
  it('proportioning valve stuck open and stuck shut', () => {
    const base = splitDesign({ frontPistons: 3, rearPistons: 2, extra: { rules: ['fmvss135'] } });
    const d = { ...base, hydraulics: { ...base.hydraulics, rear_valve: valve } } as DesignFile;
    const r = checksOf(d, 'fmvss135/proportioning-failure').filter((c) => c.load_state === 'laden');
    const req = implied(100, 110, 0.1); // 0.10V + 0.0100V² = 110 m at 100 km/h: 10000/(25.92·100) = 3.858 m/s²
    expect(req).toBeCloseTo(3.858, 3);
    // stuck open: the full split φ = 0.6, rear locks first at z = 0.4/0.56
    const open = r.find((c) => c.scenario === 'valve_stuck_open')!;
    expect(open.worst_margin!).toBeCloseTo(rearLock(0.6) * G_N - req, 9);
    // stuck shut: front brakes only
    const shut = r.find((c) => c.scenario === 'valve_stuck_shut')!;
    expect(shut.worst_margin!).toBeCloseTo(frontLock(1) * G_N - req, 9);
    expect(shut.passed).toBe(true);
    expect(shut.status).toBe('memory');
  });

  it('no valve: not applicable; electronic distribution working: its failure leaves the hydraulic split', () => {
    const none = checksOf(splitDesign({ frontPistons: 3, rearPistons: 2 }), 'fmvss135/proportioning-failure');
    expect(none.filter((c) => c.load_state !== null).every((c) => !c.applies && c.passed === null)).toBe(true);
    const ebd = checksOf(splitDesign({ frontPistons: 3, rearPistons: 2, abs: true, extra: { systems: { abs: 'fitted', ebd: 'retained' } } }), 'fmvss135/proportioning-failure');
    const laden = ebd.find((c) => c.load_state === 'laden')!;
    expect(laden.scenario).toBe('ebd_failed');
    expect(laden.worst_margin!).toBeCloseTo(rearLock(0.6) * G_N - implied(100, 110, 0.1), 9);
  });

  it('antilock failed: the hydraulic split up to the first lock, only when antilock is fitted', () => {
    const req = implied(100, 85, 0.1); // 0.10V + 0.0075V² = 85 m: 10000/(25.92·75) = 5.144 m/s²
    const r = checksOf(splitDesign({ frontPistons: 3, rearPistons: 2, abs: true }), 'fmvss135/antilock-failure').filter((c) => c.load_state === 'laden');
    expect(r).toHaveLength(1);
    expect(r[0]!.scenario).toBe('antilock_failed');
    expect(r[0]!.advisory).toBe(false);
    expect(r[0]!.worst_margin!).toBeCloseTo(rearLock(0.6) * G_N - req, 9);
    const noAbs = checksOf(splitDesign({ frontPistons: 3, rearPistons: 2 }), 'fmvss135/antilock-failure');
    expect(noAbs.filter((c) => c.load_state !== null).every((c) => !c.applies)).toBe(true);
  });
});

describe('FMVSS 135 lightly loaded vehicle (from memory: unloaded vehicle + 180 kg driver and instruments)', () => {
  const ll = { unloaded_mass_kg: 900, unloaded_front_axle_kg: 450, unloaded_cg_height_m: 0.5, added_behind_front_axle_m: 0.5, added_height_m: 0.9 };
  it('derives the load state from the unloaded vehicle and the added mass', () => {
    const r = lightlyLoadedState(splitDesign({ frontPistons: 7, rearPistons: 3, extra: { lightly_loaded: ll } }));
    if (!('state' in r)) throw new Error('expected a state');
    // m = 900 + 180; front = 450 + 180·(1 − 0.5/2.5) = 594; h = (900·0.5 + 180·0.9)/1080 = 0.56667
    expect(r.state.mass_kg).toBe(1080);
    expect(r.state.front_axle_kg).toBeCloseTo(594, 9);
    expect(r.state.cg_height_m).toBeCloseTo(612 / 1080, 12);
    expect(r.state.kind).toBe('unladen');
  });

  it('the lock-sequence rule checks it beside the design states and says which states it used', () => {
    const d = splitDesign({ frontPistons: 7, rearPistons: 3, extra: { rules: ['fmvss135'], lightly_loaded: ll } });
    const r = checksOf(d, 'fmvss135/lock-sequence');
    expect(r.map((c) => c.load_state)).toEqual(['unladen', 'laden', 'lightly-loaded']);
    const c = r[2]!;
    // ψ = 594/1080 = 0.55, χ = 0.56667/2.5: the crossing z* = (φ − ψ)/χ = 0.15/0.22667 = 0.662 lies inside 0.15–0.80,
    // so the lightly loaded vehicle fails from there (the design states pass) and the worst margin is at z = 0.80
    const psi = 594 / 1080;
    const chi = 612 / 1080 / 2.5;
    const z = 0.8;
    expect(r[0]!.passed && r[1]!.passed).toBe(true);
    expect(c.passed).toBe(false);
    expect(c.failing_ranges[0]![0]).toBeCloseTo((0.7 - psi) / chi, 9);
    expect(c.worst_margin!).toBeCloseTo((0.7 * z) / (psi + chi * z) - (0.3 * z) / (1 - psi - chi * z), 9);
    expect(c.note).toMatch(/load states used: unladen "unladen", laden "laden", lightly loaded "lightly-loaded" \(derived\)/);
  });

  it('without the block: not checked, naming the missing input, never a pass', () => {
    const r = checksOf(splitDesign({ frontPistons: 7, rearPistons: 3, extra: { rules: ['fmvss135'] } }), 'fmvss135/cold-effectiveness');
    const nc = r.filter((c) => c.applies && c.passed === null);
    expect(nc).toHaveLength(1);
    expect(nc[0]!.missing_inputs).toEqual(['lightly_loaded']);
  });
});

describe('hot performance (R13 Annex 4 / R13-H Annex 3 1.5.3.1: ≥ 80 % of the prescribed and ≥ 60 % of the cold figure)', () => {
  const heat = { front_rotor_kg: 8, rear_rotor_kg: 6 };
  it('reads the friction factor table piecewise-linearly, flat beyond its ends', () => {
    const t = [[300, 1], [500, 0.8]] as const;
    expect(frictionFactorAt(t, 100)).toBe(1);
    expect(frictionFactorAt(t, 400)).toBeCloseTo(0.9, 12);
    expect(frictionFactorAt(t, 900)).toBe(0.8);
  });

  it('a pedal-limited hot stop with friction × 0.1 fails; the cold stop is lock-limited', () => {
    // booster 1: p = 500·4/A; cold: 5 pistons' gain × p far above the rear lock, so a_cold = g·0.4/0.56 (φ = 0.6)
    // hot: z = 0.1·5·G(1 piston)·p / P, pedal-limited; required = max(0.8·5.8, 0.6·a_cold)
    const d = splitDesign({ frontPistons: 3, rearPistons: 2, boosterRatio: 1, extra: { heat: { ...heat, hot_friction_factor_at_c: [[0, 0.1]] } } });
    const c = checksOf(d, 'performance/hot');
    expect(c).toHaveLength(1);
    const aCold = rearLock(0.6) * G_N;
    const aHot = (0.1 * 5 * gainOf(1) * pressureFor(500, 1)) / 1000;
    const need = Math.max(0.8 * 5.8, 0.6 * aCold);
    expect(c[0]!.details!.cold_deceleration_ms2 as number).toBeCloseTo(aCold, 9);
    expect(c[0]!.details!.hot_deceleration_ms2 as number).toBeCloseTo(aHot, 9);
    expect(c[0]!.worst_margin!).toBeCloseTo(aHot - need, 9);
    expect(c[0]!.passed).toBe(false);
    expect(c[0]!.note).toMatch(/estimate, a Type-I test must confirm it/);
  });

  it('takes the rotor temperature at the end of the Type-I sequence of the brake-heat model', () => {
    const d = splitDesign({ frontPistons: 3, rearPistons: 2, extra: { heat } });
    const c = checksOf(d, 'performance/hot')[0]!;
    const heatResult = evaluate(d).heat!;
    expect(c.details!.front_rotor_end_c).toBe(heatResult.type_i.vehicle.front_final_peak_c);
    expect(c.details!.friction_factor_source).toBe('default_from_memory');
  });

  it('without rotor masses: not checked, naming them', () => {
    const c = checksOf(splitDesign({ frontPistons: 3, rearPistons: 2 }), 'performance/hot');
    expect(c[0]!.passed).toBeNull();
    expect(c[0]!.applies).toBe(true);
    expect(c[0]!.missing_inputs).toEqual(['heat.front_rotor_kg', 'heat.rear_rotor_kg']);
  });
});

describe('R13-H regeneration categories (from memory: A not part of service braking, B part of it)', () => {
  // 100 N·m × 10 / 0.3 m = 3333.3 N on the rear axle, regeneration first: up to z = 3333.3/9806.65 = 0.34
  // only the rear brakes, so f2 > f1 = 0 for z from 0.15: the front-first rule fails on every branch.
  const regen = (extra: object) => ({ max_motor_torque_nm: 100, gear_ratio: 10, max_power_kw: 200, blending: { type: 'regen_first' }, ...extra });
  const design = (extra: object, abs = false) => {
    const d = splitDesign({ frontPistons: 7, rearPistons: 3, abs, extra: { rules: ['un-r13h'], regen: regen(extra) } as Partial<DesignFile> });
    return { ...d, vehicle: { ...d.vehicle, drive: 'rear' } } as DesignFile;
  };
  it('category B: the curve rules with the largest regenerative force', () => {
    const c = checksOf(design({ category: 'B' }), 'un-r13h/regen-distribution');
    expect(c.map((x) => x.load_state)).toEqual(['unladen', 'laden']);
    expect(c[0]!.details!.regen_force_n as number).toBeCloseTo((100 * 10) / 0.3, 9);
    expect(c.every((x) => x.passed === false && x.scenario === 'regeneration_on')).toBe(true);
    expect(c[0]!.note).toMatch(/not checked here/);
  });
  it('category A: not applicable; category not stated: not checked; antilock not said to control the axle: not checked', () => {
    expect(checksOf(design({ category: 'A' }), 'un-r13h/regen-distribution')[0]!.applies).toBe(false);
    const missing = checksOf(design({}), 'un-r13h/regen-distribution')[0]!;
    expect([missing.applies, missing.passed, missing.missing_inputs]).toEqual([true, null, ['regen.category']]);
    const abs = checksOf(design({ category: 'B' }, true), 'un-r13h/regen-distribution')[0]!;
    expect(abs.missing_inputs).toEqual(['regen.abs_controls_regen_axle']);
    expect(checksOf(design({ category: 'B', abs_controls_regen_axle: true }, true), 'un-r13h/regen-distribution')[0]!.applies).toBe(false);
  });
  it('failure warning: as stated, not checked when not stated', () => {
    expect(checksOf(design({ category: 'B', failure_warning: true }), 'un-r13h/regen-failure-warning')[0]!.passed).toBe(true);
    expect(checksOf(design({ category: 'B', failure_warning: false }), 'un-r13h/regen-failure-warning')[0]!.passed).toBe(false);
    expect(checksOf(design({ category: 'B' }), 'un-r13h/regen-failure-warning')[0]!.missing_inputs).toEqual(['regen.failure_warning']);
  });
});

describe('towing (from memory: combination 12 %, solo Type-0 figure for the combination, stricter reading)', () => {
  // Laden state m = 1000 kg, front 500 kg, h = 0.5 m, E = 2.5 m; nose 50 kg on a hitch 1.0 m behind the rear axle at 0.5 m:
  // m' = 1050 kg, front' = 500 − 50·1.0/2.5 = 480 kg, h' = 0.5 m.
  const towing = (braked: boolean) => ({ trailer_mass_kg: 500, trailer_braked: braked, nose_load_kg: 50, hitch_behind_rear_axle_m: 1.0, hitch_height_m: 0.5 });
  it('unbraked trailer: its free mass is stopped by the vehicle and pushes at the hitch', () => {
    const d = splitDesign({ frontPistons: 3, rearPistons: 2, extra: { towing: towing(false) } });
    const c = checksOf(d, 'performance/towing-service');
    expect(c).toHaveLength(1);
    expect(c[0]!.load_state).toBe('towing');
    // m_f = 450 kg; χ_eq = (1050·0.5 + 450·0.5)/(1500·2.5) = 0.2. In z = T/P': rear locks when
    // 0.4·1050 z = 0.8(570 − 0.2·1050 z) → z = 456/588; front at 384/462 (later). Combination z_c = z·1050/1500.
    const zc = (456 / 588) * (1050 / 1500);
    expect(c[0]!.details!.deceleration_ms2 as number).toBeCloseTo(zc * G_N, 9);
    expect(c[0]!.details!.first_lock_axle).toBe('rear');
    expect(c[0]!.details!.towing_front_axle_kg as number).toBeCloseTo(480, 9);
    expect(c[0]!.worst_margin!).toBeCloseTo(zc * G_N - 5.8, 9);
    expect(c[0]!.passed).toBe(false);
  });
  it('braked trailer: only the nose load counts', () => {
    const c = checksOf(splitDesign({ frontPistons: 3, rearPistons: 2, extra: { towing: towing(true) } }), 'performance/towing-service')[0]!;
    expect(c.worst_margin!).toBeCloseTo((456 / 588) * G_N - 5.8, 9);
    expect(c.passed).toBe(true);
  });
  it('the parking brake holds the whole combination on 12 %', () => {
    const c = checksOf(splitDesign({ frontPistons: 3, rearPistons: 2, extra: { towing: towing(false) } }), 'performance/parking-combination');
    const th = Math.atan(0.12);
    const s = Math.sin(th);
    const co = Math.cos(th);
    // hold (1000 + 500)·g·sin θ; rear axle facing uphill: 570 cos θ + 0.2·1050 sin θ + 450 sin θ·0.5/2.5 (kg·g)
    const up = (1500 * s) / (570 * co + 210 * s + 90 * s);
    const down = (1500 * s) / (570 * co - 210 * s - 90 * s);
    expect(c.find((x) => x.scenario === 'facing_uphill')!.details!.adhesion_needed as number).toBeCloseTo(up, 9);
    expect(c.find((x) => x.scenario === 'facing_downhill')!.worst_margin!).toBeCloseTo(K - down, 9);
  });
  it('no trailer: not applicable', () => {
    expect(checksOf(splitDesign({ frontPistons: 3, rearPistons: 2 }), 'performance/parking-combination').every((c) => !c.applies)).toBe(true);
  });
});

describe('ABS, ESC and EBD status', () => {
  it('R13-H antilock (M1) and stability control (from memory)', () => {
    expect(checksOf(splitDesign({ frontPistons: 3, rearPistons: 2 }), 'un-r13h/antilock-fitted')[0]!.passed).toBe(false);
    expect(checksOf(splitDesign({ frontPistons: 3, rearPistons: 2, abs: true }), 'un-r13h/antilock-fitted')[0]!.passed).toBe(true);
    const esc = checksOf(splitDesign({ frontPistons: 3, rearPistons: 2 }), 'un-r13h/stability-control-fitted')[0]!;
    expect(esc.missing_inputs).toEqual(['systems.esc']);
    expect(checksOf(splitDesign({ frontPistons: 3, rearPistons: 2, extra: { systems: { esc: 'removed' } } }), 'un-r13h/stability-control-fitted')[0]!.passed).toBe(false);
  });
  it('a status that contradicts vehicle.abs is an error on the field', () => {
    const r = DesignFile.safeParse(splitDesign({ frontPistons: 3, rearPistons: 2, abs: true, extra: { systems: { abs: 'removed' } } }));
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join('.'))).toContain('systems.abs');
  });
  it('pitfalls when the conversion removes what the base vehicle had or keeps it on changed brakes', () => {
    const d = splitDesign({
      frontPistons: 3,
      rearPistons: 2,
      abs: true,
      extra: { systems: { abs: 'retained', esc: 'removed', ebd: 'removed' }, base_vehicle: { stability_control: true, rear_brake_type: 'drum' } },
    });
    const p = pitfalls(d).filter((x) => x.path.startsWith('systems.'));
    // the stability-control loss is reported once (by the base-vehicle pitfall, now naming systems.esc)
    expect(p.map((x) => `${x.code} ${x.path}`)).toEqual([
      'PITFALL_STABILITY_CONTROL_LOST systems.esc',
      'PITFALL_SYSTEM_RETAINED_CHANGED systems.abs',
      'PITFALL_SYSTEM_REMOVED systems.ebd',
    ]);
    expect(p[1]!.message).toMatch(/rear brakes changed from drum to disc/);
  });
});

describe('--rules selection', () => {
  it('every new rule is selectable on its own', () => {
    for (const id of ['performance/residual', 'performance/hot', 'performance/towing-service', 'performance/parking-combination', 'un-r13h/hot', 'un-r13h/regen-distribution', 'un-r13h/regen-failure-warning', 'un-r13h/antilock-fitted', 'un-r13h/stability-control-fitted', 'un-r13h/parking-combination', 'fmvss135/proportioning-failure', 'fmvss135/antilock-failure']) {
      expect(RULE_SELECTORS).toContain(id);
      const d = splitDesign({ frontPistons: 3, rearPistons: 2 });
      const r = runChecks(d, stateModels(d), { rules: [id] });
      expect(new Set(r.map((c) => c.rule))).toEqual(new Set([id]));
    }
  });
});
