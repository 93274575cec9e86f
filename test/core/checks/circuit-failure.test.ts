/**
 * Failed-circuit distributions and the pressure ↔ braking-rate reading (core/checks/circuit-failure.ts).
 * Hand-derived with the design-file physics: T = G·max(0, p − threshold), z = (T1 + T2)/P.
 */
import { describe, expect, it } from 'vitest';
import { brakingRateAtPressure, failedCircuitDistribution, pressureAtBrakingRate } from '../../../core/checks/circuit-failure.ts';
import { firstLock } from '../../../core/lock-order.ts';
import { stateModel } from '../../../core/state-model.ts';
import { gainOf, splitDesign } from './fixed-split.ts';

const d = splitDesign({ frontPistons: 3, rearPistons: 2 });
const s = stateModel(d, d.load_states[0]!);

describe('failed circuits', () => {
  it('front only: z = G1 p / P; rear only: z = G2 p / P; one diagonal: z = (G1 + G2) p / (2P)', () => {
    const p = 40e5;
    expect(brakingRateAtPressure(failedCircuitDistribution(s, 'front_circuit_only'), p)).toBeCloseTo((gainOf(3) * p) / s.loads.P, 12);
    expect(brakingRateAtPressure(failedCircuitDistribution(s, 'rear_circuit_only'), p)).toBeCloseTo((gainOf(2) * p) / s.loads.P, 12);
    expect(brakingRateAtPressure(failedCircuitDistribution(s, 'one_diagonal'), p)).toBeCloseTo((gainOf(5) * p) / (2 * s.loads.P), 12);
  });

  it('front only never locks the rear: rear_lock null, front lock at z = kψ/(1 − kχ) = 0.4/0.84 on k = 0.8', () => {
    const l = firstLock(s.loads, failedCircuitDistribution(s, 'front_circuit_only'), 0.8);
    expect(l.rear_lock_braking_rate).toBeNull();
    expect(l.braking_rate).toBeCloseTo(0.4 / 0.84, 12);
  });

  it('pressureAtBrakingRate inverts brakingRateAtPressure, and a threshold gives a dead band', () => {
    for (const z of [0.05, 0.3, 0.9]) expect(brakingRateAtPressure(s.dist, pressureAtBrakingRate(s.dist, z))).toBeCloseTo(z, 12);
    const t = splitDesign({ frontPistons: 3, rearPistons: 2 });
    t.axles.front.brake.threshold_pressure_bar = 2;
    t.axles.rear.brake.threshold_pressure_bar = 2;
    const st = stateModel(t, t.load_states[0]!);
    expect(brakingRateAtPressure(st.dist, 1.5e5)).toBe(0);
    // above 2 bar: z = (G1 + G2)(p − 2 bar)/P
    expect(brakingRateAtPressure(st.dist, 12e5)).toBeCloseTo((gainOf(5) * 10e5) / st.loads.P, 12);
  });
});

describe('a limiting valve with the front circuit failed', () => {
  it('the rear force stops at the knee: z never exceeds G2·knee/P, and the needed pedal force is reported as unreachable', async () => {
    const { runChecks } = await import('../../../core/checks/run-checks.ts');
    const { stateModels } = await import('../../../core/evaluate.ts');
    // 2 rear pistons, knee 10 bar: z_max = G2·10e5/P = gainOf(2)·1e6/(1000 g) ≈ 0.164 → 1.61 m/s² < 2.9 (M1 secondary)
    const d = splitDesign({ frontPistons: 3, rearPistons: 2 });
    d.hydraulics.rear_valve = { type: 'limiting', knee_bar: 10 };
    const zMax = (gainOf(2) * 10e5) / (1000 * 9.80665);
    const rear = failedCircuitDistribution(stateModel(d, d.load_states[0]!), 'rear_circuit_only');
    expect(brakingRateAtPressure(rear, 200e5)).toBeCloseTo(zMax, 12);
    expect(Number.isNaN(pressureAtBrakingRate(rear, zMax + 0.01))).toBe(true);
    const c = runChecks(d, stateModels(d), { rules: ['performance/secondary'] }).find((x) => x.scenario === 'rear_circuit_only')!;
    expect(c.passed).toBe(false);
    expect(c.worst_margin!).toBeCloseTo(zMax * 9.80665 - 2.9, 9);
    expect(c.details!.pedal_force_for_required_n).toBeNull();
    expect(c.note).toContain('not reachable with these brakes at any pedal force');
  });
});
