/**
 * Every pedal-to-pressure path goes through one pedal model that knows the balance bar
 * (core/pedal-force.ts hydraulicPedalModel). Design: docs/examples/balance-bar-booster-failed.json
 * (invented, issue 12 point 2).
 *
 * Source: hand calculation, written out (bar s = 0.6 = front share of the pushrod force):
 *   front bore 22.2 mm: A_f = π/4 · 0.0222² = 3.8708e-4 m²; rear bore 19.05 mm: A_r = 2.8502e-4 m²
 *   pushrod force at 500 N pedal, ratio 3.5, no assist: F = 1750 N
 *   front line p1 = s·F/A_f = 1050 / 3.8708e-4 = 27.126 bar; rear master (1 − s)·F/A_r = 700 / 2.8502e-4 = 24.560 bar
 *   with the booster (ratio 2): twice those, 54.252 and 49.120 bar.
 *   Front gain (fixed 4-piston 38/42: clamp area = one side's pistons = π/4 (0.038² + 0.042²) = 2.5196e-3 m²):
 *     G1 = 2 brakes · 2 faces · 0.4 · 2.5196e-3 · 0.1365 / 0.31 = 1.77512e-3 N/Pa
 *   Rear drum gain: G2 = 2 · 2.2 · 2.8502e-4 · 0.115 / 0.31 = 4.6522e-4 N/Pa
 *   Booster failed, laden (1900 kg): T1 = G1 (27.126 − 0.5) bar = 4726.5 N; T2 = G2 (24.560 − 6.1) bar = 858.8 N
 *     a = (4726.5 + 858.8) / 1900 = 2.9396 m/s²; M1 secondary figure 2.9 m/s² (UN R13 Annex 4 para 2.2):
 *     margin +0.040 m/s². The raw front bore without the bar gives 1/s = 1.667 times the pressures, 5.03 m/s².
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { checkDeceleration } from '../../core/checks/performance-check.ts';
import type { DesignFile } from '../../core/design.ts';
import { evaluate, stateModels } from '../../core/evaluate.ts';
import { pedalTravel } from '../../core/fluid-volume.ts';
import { hydraulicPedalModel, pedalForce, pressureForPedalForce } from '../../core/pedal-force.ts';
import { testerPrediction } from '../../core/roller-tester.ts';
import { selectRules } from '../../core/rules/index.ts';
import type { DecelerationRule } from '../../core/rules/rule-types.ts';
import { readDesign } from '../../core/validate.ts';
import { valveFailureModes } from '../../core/valve-failure.ts';

function load(file: string): DesignFile {
  const r = readDesign(JSON.parse(readFileSync(new URL(`../../docs/examples/${file}`, import.meta.url), 'utf8')));
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}

const design = load('balance-bar-booster-failed.json');
const rule = (id: string) => selectRules([id], 'M1')[0]!.rule as DecelerationRule;
const A_F = (Math.PI / 4) * 0.0222 ** 2;
const P1_UNASSISTED = (0.6 * 500 * 3.5) / A_F; // 27.126 bar
const G1 = (4 * 0.4 * (Math.PI / 4) * (0.038 ** 2 + 0.042 ** 2) * 0.1365) / 0.31;
const G2 = (2 * 2.2 * (Math.PI / 4) * 0.01905 ** 2 * 0.115) / 0.31;
const G = 9.80665;

describe('one pedal model with the balance bar', () => {
  it('the pressures of the hand calculation', () => {
    expect(P1_UNASSISTED / 1e5).toBeCloseTo(27.126, 3);
    expect(pressureForPedalForce(hydraulicPedalModel(design.hydraulics, { assisted: false }), 500)).toBeCloseTo(P1_UNASSISTED, 3);
    expect(pressureForPedalForce(hydraulicPedalModel(design.hydraulics), 500)).toBeCloseTo(2 * P1_UNASSISTED, 3);
  });

  it('booster failed (R13 figure): laden 2.94 m/s², margin +0.04 against 2.9', () => {
    const laden = stateModels(design)[1]!;
    const o = checkDeceleration(design, laden, rule('performance/booster-failure'), null);
    const hand = (G1 * (P1_UNASSISTED - 0.5e5) + G2 * ((0.4 * 1750) / ((Math.PI / 4) * 0.01905 ** 2) - 6.1e5)) / 1900;
    expect(hand).toBeCloseTo(2.9396, 3);
    expect(o.details.deceleration_ms2 as number).toBeCloseTo(hand, 6);
    expect(o.margin_ms2).toBeCloseTo(hand - 2.9, 6);
    expect(o.passed).toBe(true);
    // the same in the lockstep-result/1 checks
    const c = evaluate(design).checks.find((x) => x.rule === 'performance/booster-failure' && x.load_state === 'laden')!;
    expect(c.worst_margin!).toBeCloseTo(0.0396, 3);
  });

  it('booster failed (FMVSS case) uses the same pressure: braking rate at the pedal limit', () => {
    const laden = stateModels(design)[1]!;
    const o = checkDeceleration(design, laden, { ...rule('performance/booster-failure'), figures: { speed_kmh: 100, max_pedal_force_n: 500, max_distance_m: 168 } }, null);
    expect((o.details.braking_rate_at_pedal_limit as number) * G).toBeCloseTo(2.9396, 3);
  });

  it('secondary (rear circuit failed: front brakes only) at 500 N with the booster: p1 = 54.252 bar', () => {
    // hand: T1 = G1 (54.252 − 0.5) bar = 9541.7 N; z = 9541.7 / (1900 · 9.80665) = 0.51211
    const laden = stateModels(design)[1]!;
    const o = checkDeceleration(design, laden, rule('performance/secondary'), 'front_circuit_only');
    const z = (G1 * (2 * P1_UNASSISTED - 0.5e5)) / (1900 * G);
    expect(z).toBeCloseTo(0.5121, 3);
    expect(o.details.braking_rate_at_pedal_limit as number).toBeCloseTo(z, 6);
  });

  it('service: the pedal force for a pressure is p · (A_f / s) / (3.5 · 2)', () => {
    const s = stateModels(design)[0]!;
    const o = checkDeceleration(design, s, rule('performance/service'), null);
    const zReq = (o.details.required_deceleration_ms2 as number) / G;
    // hand: p for zReq from T1 + T2 = z P with both lines above their thresholds (λ = (0.4/0.6)(22.2/19.05)² = 0.90541)
    const lambda = (0.4 / 0.6) * (22.2 / 19.05) ** 2;
    const p = (zReq * 1450 * G + G1 * 0.5e5 + G2 * 6.1e5) / (G1 + G2 * lambda);
    expect(o.details.pedal_force_for_required_n as number).toBeCloseTo((p * A_F) / 0.6 / 7, 3);
  });

  it('valve failed: the pressure at the secondary pedal-force limit (500 N, M1) is 54.252 bar', () => {
    const d: DesignFile = { ...design, hydraulics: { ...design.hydraulics, rear_valve: { type: 'proportioning', knee_bar: 30, ratio: 0.3 } } };
    const modes = valveFailureModes(d, stateModels(d), [0.8]);
    expect(modes.length).toBeGreaterThan(0);
    for (const m of modes) expect(m.master_pressure_at_limit_bar).toBeCloseTo((2 * P1_UNASSISTED) / 1e5, 3);
  });

  it('pedal travel: each point\'s pedal force is its master pressure · (A_f / s) / 7', () => {
    const r = pedalTravel(design, stateModels(design));
    const points = r.states.flatMap((st) => st.cases.flatMap((c) => (c.point ? [c.point] : [])));
    expect(points.length).toBeGreaterThan(0);
    for (const pt of points) expect(pt.pedal_force_n).toBeCloseTo((pt.master_pressure_bar * 1e5 * A_F) / 0.6 / 7, 6);
  });

  it('roller tester: the pedal force at the front slip pressure is that pressure · (A_f / s) / 7', () => {
    const s = stateModels(design)[0]!;
    const t = testerPrediction(s, { rollerAdhesion: 0.6, testMassKg: 1450, requiredPct: 50, pedalLimitN: 500, stateKind: 'unladen' });
    const front = t.axles.find((a) => a.axle === 'front')!;
    // hand: slip when G1 (p − 0.5 bar) = 0.6 · 870 · 9.80665 N
    const p = 0.5e5 + (0.6 * 870 * G) / G1;
    expect(front.slip_pressure_bar!).toBeCloseTo(p / 1e5, 6);
    expect(front.slip_pedal_force_n!).toBeCloseTo((p * A_F) / 0.6 / 7, 6);
    expect(pedalForce(s.pedal, p)).toBeCloseTo(front.slip_pedal_force_n!, 9);
  });

  it('parking: the parking brake is a mechanical control in the design file (no hydraulic path to the pedal model)', () => {
    // the parking_brake block states a lever mechanism or a declared holding force; nothing in it passes a pedal
    // force through the master cylinders, so the balance bar does not enter (core/checks/performance-check.ts).
    const d: DesignFile = { ...design, parking_brake: { axle: 'rear', control: 'hand', holding_force_n: 6000 } };
    const withBar = evaluate(d).checks.filter((c) => c.rule === 'performance/parking');
    const noBar = evaluate({ ...d, hydraulics: { ...d.hydraulics, balance_bar: undefined } }).checks.filter((c) => c.rule === 'performance/parking');
    expect(withBar.map((c) => c.worst_margin)).toEqual(noBar.map((c) => c.worst_margin));
  });
});
