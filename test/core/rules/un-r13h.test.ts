/**
 * Rule set un-r13h: UN R13-H 02 series, Annex 5 (distribution) and Annex 3 (performance) for M1
 * and N1. The sheet (section 3) says Annex 5 carries over the 71/320 Appendix logic [M/P]: the same
 * hand-derived fixed splits as the eu-appendix tests give the same verdicts, with the statuses of
 * the sheet (lock order "partial", efficiency coefficient "memory", Annex 3 figures "memory", 5.6).
 */
import { describe, expect, it } from 'vitest';
import { checkCurveRule } from '../../../core/checks/curve-check.ts';
import { runChecks } from '../../../core/checks/run-checks.ts';
import { stateModels } from '../../../core/evaluate.ts';
import { unR13h } from '../../../core/rules/un-r13h.ts';
import type { CurveRule } from '../../../core/rules/rule-types.ts';
import { fixedSplit, gainOf, loads, pressureFor, splitDesign } from '../checks/fixed-split.ts';

function curve(id: string, cat: 'M1' | 'N1'): CurveRule {
  const r = unR13h.rules.find((x) => x.id === id && x.categories.includes(cat));
  if (!r || r.kind !== 'curve') throw new Error(id);
  return r;
}

describe('un-r13h/lock-order (R13-H Annex 5 point 3.1.1, as 71/320; status partial)', () => {
  it('M1: φ = 0.7 passes, φ = 0.6 fails from z = 0.50 (z* = (0.6 − 0.5)/0.2)', () => {
    const ok = checkCurveRule(curve('un-r13h/lock-order', 'M1'), loads, fixedSplit(0.7));
    expect(ok.passed).toBe(true);
    expect(ok.status).toBe('partial');
    const bad = checkCurveRule(curve('un-r13h/lock-order', 'M1'), loads, fixedSplit(0.6));
    expect(bad.passed).toBe(false);
    expect(bad.failing_ranges[0]![0]).toBeCloseTo(0.5, 10);
  });

  it('N1: corridor accepted for φ = 0.54, refused for φ = 0.52 (same arithmetic as the 71/320 N1 tests)', () => {
    expect(checkCurveRule(curve('un-r13h/lock-order', 'N1'), loads, fixedSplit(0.54)).branch).toBe('corridor');
    expect(checkCurveRule(curve('un-r13h/lock-order', 'N1'), loads, fixedSplit(0.52)).passed).toBe(false);
  });
});

describe('un-r13h/efficiency (R13-H Annex 5 3.1.1, coefficient from memory)', () => {
  it('passes φ = 0.6 and fails φ = 0.9, status memory', () => {
    const r = curve('un-r13h/efficiency', 'M1');
    const ok = checkCurveRule(r, loads, fixedSplit(0.6));
    expect(ok.passed).toBe(true);
    expect(ok.status).toBe('memory');
    expect(ok.worst_margin!).toBeCloseTo(0.2 - 0.06 / 0.52, 10);
    expect(checkCurveRule(r, loads, fixedSplit(0.9)).passed).toBe(false);
  });
});

describe('un-r13h scope and performance (R13-H Annex 3, from memory [M])', () => {
  it('has no requirement for N2: reported as not applicable, never as a pass or fail', () => {
    const d = splitDesign({ frontPistons: 7, rearPistons: 3, category: 'N2', extra: { rules: ['un-r13h'] } });
    const checks = runChecks(d, stateModels(d));
    expect(checks.length).toBeGreaterThan(0);
    for (const c of checks) {
      expect(c.applies).toBe(false);
      expect(c.passed).toBeNull();
    }
  });

  it('service: 6.43 m/s² needed; a fixed split locking at z = 0.714 on k = 0.8 passes, a weak pedal fails', () => {
    // rear lock of φ = 0.6 on k = 0.8: z = k(1 − ψ)/((1 − φ) + kχ) = 0.4/0.56 = 0.714286 → 7.005 m/s² ≥ 6.43
    const d = splitDesign({ frontPistons: 3, rearPistons: 2, category: 'M1', extra: { rules: ['un-r13h/service'] } });
    const ok = runChecks(d, stateModels(d)).filter((c) => c.rule === 'un-r13h/service');
    expect(ok.every((c) => c.passed)).toBe(true);
    // required: the higher of 6.43 and the decel the distance limit implies, 100²/(25.92·(0.1·100 + 0.006·100² − 0.1·100)) = 6.43004
    const required = Math.max(6.43, 100 ** 2 / (25.92 * 0.006 * 100 ** 2));
    expect(ok[0]!.worst_margin!).toBeCloseTo((0.4 / 0.56) * 9.80665 - required, 9);
    expect(ok[0]!.verify_note).toBe('verify against the current official text');
    // booster ratio 1, 3000 kg: z at 500 N = (G1 + G2)·p/P with p = 500·4/A_mc (pressureFor) and
    // G1 + G2 = 5 pistons' gain (gainOf): 4.02e-3 N/Pa × 4.07e6 Pa / (3000·9.80665 N) = 0.557 → 5.46 m/s²
    const weak = splitDesign({ frontPistons: 3, rearPistons: 2, category: 'M1', boosterRatio: 1, mass_kg: 3000, extra: { rules: ['un-r13h/service'] } });
    const zPedal = (gainOf(5) * pressureFor(500, 1)) / (3000 * 9.80665);
    const w = runChecks(weak, stateModels(weak));
    expect(w.every((c) => c.passed === false)).toBe(true);
    expect(w[0]!.worst_margin!).toBeCloseTo(zPedal * 9.80665 - required, 9);
    expect(w[0]!.details!.limited_by).toBe('pedal');
  });
});
