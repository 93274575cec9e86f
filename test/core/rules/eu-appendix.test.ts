/**
 * Rule set eu-appendix: 71/320/EEC Annex II Appendix point 3.1.1 (each line with its status [V]/[P]/[M] as the
 * rule set holds it). Every expected value is derived by hand from the closed forms of a fixed split
 * (from the axle loads under braking, common practice, no source): f1 = φz/(ψ + χz), f2 = (1 − φ)z/(1 − ψ − χz), with
 * ψ = 0.5, χ = 0.2 (test/core/checks/fixed-split.ts). A dense scan is used only as a cross-check.
 */
import { describe, expect, it } from 'vitest';
import { checkCurveRule } from '../../../core/checks/curve-check.ts';
import { euAppendix } from '../../../core/rules/eu-appendix.ts';
import type { Category, CurveRule } from '../../../core/rules/rule-types.ts';
import type { Distribution } from '../../../core/distribution.ts';
import { CHI, crossBack, f1, f2, fixedSplit, loads, P, PSI, scanMin } from '../checks/fixed-split.ts';

function rule(id: string, category: Category): CurveRule {
  const r = euAppendix.rules.find((x) => x.id === id && x.categories.includes(category));
  if (!r || r.kind !== 'curve') throw new Error(`no ${id} for ${category}`);
  return r;
}

const efficiency = rule('eu-appendix/efficiency', 'M1');
const lockM1 = rule('eu-appendix/lock-order', 'M1');
const lockN1 = rule('eu-appendix/lock-order', 'N1');
const lockOther = rule('eu-appendix/lock-order', 'N2');
/** Efficiency line, point 3.1.1: z ≥ 0.10 + 0.85(k − 0.20) ⇔ k ≤ 0.20 + (z − 0.10)/0.85. */
const L = (z: number) => 0.2 + (z - 0.1) / 0.85;

describe('eu-appendix/efficiency (71/320 Annex II Appendix point 3.1.1, coefficient 0.85 [P])', () => {
  it('passes φ = 0.6: worst margin at z = 0.10, front, 0.20 − 0.06/0.52', () => {
    // L − f1 grows from z = 0.10 (d/dz = 1/0.85 − 0.3/(0.5+0.2z)² > 0); L − f2 at 0.10 = 0.2 − 0.04/0.48 = 0.1167
    const v = checkCurveRule(efficiency, loads, fixedSplit(0.6));
    expect(v.passed).toBe(true);
    expect(v.status).toBe('partial');
    expect(v.worst_margin!).toBeCloseTo(0.2 - 0.06 / 0.52, 10);
    expect(v.worst_at_braking_rate!).toBeCloseTo(0.1, 10);
    expect(v.failing_ranges).toEqual([]);
  });

  it('fails φ = 0.9 from the root of f1 = L to z = 0.61, worst at the interior minimum', () => {
    // 0.9z = (0.5 + 0.2z)(0.2 − 0.1/0.85 + z/0.85) → quadratic A z² + B z + C = 0
    const a0 = 0.2 - 0.1 / 0.85;
    const a1 = 1 / 0.85;
    const A = 0.2 * a1;
    const B = 0.5 * a1 + 0.2 * a0 - 0.9;
    const C = 0.5 * a0;
    const zIn = (-B - Math.sqrt(B * B - 4 * A * C)) / (2 * A); // ≈ 0.1598; the other root ≈ 1.095 lies beyond 0.61
    // min of L − f1: 1/0.85 = 0.9·0.5/(0.5 + 0.2z)² → 0.5 + 0.2z = √(0.45·0.85)
    const zMin = (Math.sqrt(0.45 * 0.85) - 0.5) / 0.2; // ≈ 0.5924
    const v = checkCurveRule(efficiency, loads, fixedSplit(0.9));
    expect(v.passed).toBe(false);
    expect(v.failing_ranges.length).toBe(1);
    expect(v.failing_ranges[0]![0]).toBeCloseTo(zIn, 9);
    expect(v.failing_ranges[0]![1]).toBeCloseTo(0.61, 12);
    expect(v.worst_at_braking_rate!).toBeCloseTo(zMin, 8);
    expect(v.worst_margin!).toBeCloseTo(L(zMin) - f1(0.9, zMin), 10);
    // cross-check by scan (not the method)
    const scan = scanMin((z) => Math.min(L(z) - f1(0.9, z), L(z) - f2(0.9, z)), 0.1, 0.61);
    expect(v.worst_margin!).toBeLessThanOrEqual(scan.min + 1e-12);
    expect(v.worst_margin!).toBeCloseTo(scan.min, 6);
  });
});

describe('eu-appendix/efficiency, range end z = 0.61 where the line reaches k = 0.80', () => {
  it('f2(0.61) exactly 0.80 passes with margin 0; a little more rear braking fails just below 0.61', () => {
    // (1 − φ)·0.61/(0.5 − 0.2·0.61) = 0.8 → 1 − φ = 0.8·0.378/0.61; f2 rises faster than the line there
    // (f2' = (1 − φ)·0.5/0.378² = 1.73 > 1/0.85), so f2 < L below 0.61
    const phi = 1 - (0.8 * 0.378) / 0.61;
    const edge = checkCurveRule(efficiency, loads, fixedSplit(phi));
    expect(edge.passed).toBe(true);
    expect(edge.worst_margin!).toBeCloseTo(0, 12);
    expect(edge.worst_at_braking_rate!).toBeCloseTo(0.61, 12);
    const over = checkCurveRule(efficiency, loads, fixedSplit(phi - 0.01));
    expect(over.passed).toBe(false);
    expect(over.failing_ranges[0]![1]).toBeCloseTo(0.61, 12);
    // margin at 0.61: 0.8 − (1 − φ + 0.01)·0.61/0.378
    expect(over.worst_margin!).toBeCloseTo(0.8 - ((1 - phi + 0.01) * 0.61) / 0.378, 10);
  });
});

describe('eu-appendix/lock-order, M1 (point 3.1.1, M1 requirement, diagram 1A [V])', () => {
  it('passes φ = 0.7 (z* = 1.0 > 0.80) on the main branch, worst at z = 0.15', () => {
    // f1 − f2 has its maximum inside [0.15, 0.80] (slope + at 0.15, − at 0.80), so the minimum is an end:
    // at 0.15: 0.105/0.53 − 0.045/0.47 = 0.10237; at 0.80: 0.56/0.66 − 0.24/0.34 = 0.14260
    const v = checkCurveRule(lockM1, loads, fixedSplit(0.7));
    expect(v.passed).toBe(true);
    expect(v.branch).toBe('primary');
    expect(v.status).toBe('verified');
    expect(v.worst_margin!).toBeCloseTo(0.105 / 0.53 - 0.045 / 0.47, 12);
    expect(v.worst_at_braking_rate!).toBeCloseTo(0.15, 12);
  });

  it('fails φ = 0.6 for z from z* = (0.6 − 0.5)/0.2 = 0.5 to 0.80 on every branch', () => {
    const v = checkCurveRule(lockM1, loads, fixedSplit(0.6));
    expect(v.passed).toBe(false);
    expect(v.branch).toBeNull();
    expect(v.failing_ranges.length).toBe(1);
    expect(v.failing_ranges[0]![0]).toBeCloseTo((0.6 - PSI) / CHI, 10);
    expect(v.failing_ranges[0]![1]).toBeCloseTo(0.8, 12);
    // worst at 0.80: 0.48/0.66 − 0.32/0.34
    expect(v.worst_margin!).toBeCloseTo(0.48 / 0.66 - 0.32 / 0.34, 10);
    expect(v.branches.map((b) => b.passed)).toEqual([false, false]);
  });

  it('accepts a crossing inside 0.30–0.45 while f2 ≤ z + 0.05 (inversion allowance)', () => {
    // crossBack(): rear above front on (0.35, (0.5 − √0.1124)/0.4 ≈ 0.41185); there f2 ≤ 0.172/0.42 = 0.4095 < z + 0.05
    const zBack = (0.5 - Math.sqrt(0.1124)) / 0.4;
    const v = checkCurveRule(lockM1, loads, crossBack());
    expect(v.passed).toBe(true);
    expect(v.branch).toBe('inversion-allowance');
    const primary = v.branches[0]!;
    expect(primary.passed).toBe(false);
    expect(primary.failing_ranges[0]![0]).toBeCloseTo(0.35, 10);
    expect(primary.failing_ranges[0]![1]).toBeCloseTo(zBack, 10);
    // allowance branch: lowest at the piece end z = 0.30 where only f1 − f2 = 0.171/0.56 − 0.129/0.44 applies
    expect(v.worst_margin!).toBeCloseTo(0.171 / 0.56 - 0.129 / 0.44, 10);
    expect(v.worst_at_braking_rate!).toBeCloseTo(0.3, 10);
  });

  it('inversion edge: f2 peaking exactly at z + 0.05 (z = 0.35) passes; 0.001 P more rear force fails there', () => {
    // pieces: φ = 0.56 up to 0.30 (T1 = 0.168 P, T2 = 0.132 P: f1 = f2 = 0.30 there), then to z = 0.35 with
    // T2 = 0.172 P = 0.40·N2(0.35)/P·P (f2 = z + 0.05), then the rear force held (T1 = zP − T2)
    const edge: Distribution = { P, z: [0, 0.3, 0.35, 1], t1: [0, 0.168 * P, 0.178 * P, (1 - 0.172) * P], t2: [0, 0.132 * P, 0.172 * P, 0.172 * P] };
    const ok = checkCurveRule(lockM1, loads, edge);
    expect(ok.passed).toBe(true);
    expect(ok.branch).toBe('inversion-allowance');
    expect(ok.worst_margin!).toBeCloseTo(0, 10);
    // T2(0.35) = 0.173 P: f2 = 0.173/0.43 = 0.40233, 0.00233 above z + 0.05 at its peak z = 0.35
    const over: Distribution = { P, z: [0, 0.3, 0.35, 1], t1: [0, 0.168 * P, 0.177 * P, (1 - 0.173) * P], t2: [0, 0.132 * P, 0.173 * P, 0.173 * P] };
    const bad = checkCurveRule(lockM1, loads, over);
    expect(bad.passed).toBe(false);
    const allowance = bad.branches[1]!;
    expect(allowance.worst_margin!).toBeCloseTo(0.4 - 0.173 / 0.43, 10);
    expect(allowance.worst_at_braking_rate!).toBeCloseTo(0.35, 10);
    expect(allowance.failing_ranges.length).toBe(1);
    expect(allowance.failing_ranges[0]![0]).toBeLessThan(0.35);
    expect(allowance.failing_ranges[0]![1]).toBeGreaterThan(0.35);
  });

  it('range end: a crossing exactly at z* = 0.30 fails the main branch from 0.30 and the allowance from 0.45', () => {
    // φ = ψ + 0.30χ = 0.56
    const v = checkCurveRule(lockM1, loads, fixedSplit(0.56));
    expect(v.passed).toBe(false);
    expect(v.branches[0]!.failing_ranges[0]![0]).toBeCloseTo(0.3, 10);
    expect(v.branches[1]!.failing_ranges.length).toBe(1);
    expect(v.branches[1]!.failing_ranges[0]![0]).toBeCloseTo(0.45, 10);
    expect(v.branches[1]!.failing_ranges[0]![1]).toBeCloseTo(0.8, 10);
  });
});

describe('eu-appendix/lock-order, N1 (point 3.1.1, N1 requirement and footnote (2), diagram 1C [V])', () => {
  it('range end: z* exactly 0.50 (φ = 0.6) passes with margin 0 at z = 0.50', () => {
    const v = checkCurveRule(lockN1, loads, fixedSplit(0.6));
    expect(v.passed).toBe(true);
    expect(v.branch).toBe('primary');
    expect(v.worst_margin!).toBeCloseTo(0, 12);
    expect(v.worst_at_braking_rate!).toBeCloseTo(0.5, 10);
  });

  it('fails the main branch but passes the corridor for φ = 0.54 (z* = 0.20); worst margin z + 0.08 − f2 at 0.50 = 0.005', () => {
    // f2(0.5) = 0.46·0.5/0.4 = 0.575; limit 0.58 on both sides of z = 0.5 (z + 0.08 = 2z − 0.42 = 0.58)
    const v = checkCurveRule(lockN1, loads, fixedSplit(0.54));
    expect(v.passed).toBe(true);
    expect(v.branch).toBe('corridor');
    expect(v.branches[0]!.failing_ranges[0]![0]).toBeCloseTo(0.2, 10);
    expect(v.worst_margin!).toBeCloseTo(0.58 - 0.575, 10);
    expect(v.worst_at_braking_rate!).toBeCloseTo(0.5, 8);
  });

  it('fails the corridor for φ = 0.52 between the roots of f2 = z + 0.08 and f2 = 2z − 0.42', () => {
    // 0.48z = (z + 0.08)(0.5 − 0.2z) → 0.2z² − 0.004z − 0.04 = 0 → z = (0.004 + √(0.000016 + 0.032))/0.4
    const zA = (0.004 + Math.sqrt(0.000016 + 0.032)) / 0.4;
    // 0.48z = (2z − 0.42)(0.5 − 0.2z) → 0.4z² − 0.604z + 0.21 = 0 → z = (0.604 − √(0.604² − 0.336))/0.8
    const zB = (0.604 - Math.sqrt(0.604 ** 2 - 0.336)) / 0.8;
    const v = checkCurveRule(lockN1, loads, fixedSplit(0.52));
    expect(v.passed).toBe(false);
    const corridor = v.branches[1]!;
    expect(corridor.failing_ranges.length).toBe(1);
    expect(corridor.failing_ranges[0]![0]).toBeCloseTo(zA, 9);
    expect(corridor.failing_ranges[0]![1]).toBeCloseTo(zB, 9);
    // worst at z = 0.5: 0.58 − 0.24/0.4 = −0.02
    expect(corridor.worst_margin!).toBeCloseTo(-0.02, 10);
  });

  it('corridor edge: f2(0.5) exactly 0.58 (φ = 0.536) passes with margin 0; φ = 0.535 fails', () => {
    // (1 − φ)·0.5/0.4 = 0.58 → φ = 0.536
    const edge = checkCurveRule(lockN1, loads, fixedSplit(0.536));
    expect(edge.passed).toBe(true);
    expect(edge.branch).toBe('corridor');
    expect(edge.worst_margin!).toBeCloseTo(0, 10);
    const over = checkCurveRule(lockN1, loads, fixedSplit(0.535));
    expect(over.passed).toBe(false);
    // f2(0.5) = 0.465·1.25 = 0.58125: 0.00125 above the corridor
    expect(over.branches[1]!.worst_margin!).toBeCloseTo(-0.00125, 10);
  });

  it('corridor lower edge: the front curve below z − 0.08 at z = 0.15 fails the corridor', () => {
    // φ = 0.26: f1(0.15) = 0.039/0.53 = 0.0736 ≥ 0.07 passes; φ = 0.24: 0.036/0.53 = 0.0679 < 0.07
    const ok = checkCurveRule(lockN1, loads, fixedSplit(0.26)).branches[1]!;
    const low = checkCurveRule(lockN1, loads, fixedSplit(0.24)).branches[1]!;
    expect(low.failing_ranges[0]![0]).toBeCloseTo(0.15, 12);
    expect(low.worst_margin!).toBeLessThan(ok.worst_margin!);
    // at z = 0.15 the front-lower clause gives f1 − 0.07
    expect(low.worst_margin!).toBeLessThanOrEqual(0.036 / 0.53 - 0.07 + 1e-12);
  });
});

describe('eu-appendix/lock-order, other categories (point 3.1.1, diagram 1B; 0.74/0.38 relation [M])', () => {
  it('passes the main branch over 0.15–0.30 for z* = 0.40 (φ = 0.58); margin 0 would sit at 0.40, outside', () => {
    // worst at 0.30: 0.174/0.56 − 0.126/0.44
    const v = checkCurveRule(lockOther, loads, fixedSplit(0.58));
    expect(v.passed).toBe(true);
    expect(v.branch).toBe('primary');
    expect(v.status).toBe('verified');
    expect(v.worst_margin!).toBeCloseTo(0.174 / 0.56 - 0.126 / 0.44, 10);
  });

  it('passes through the corridor for φ = 0.54 (z* = 0.20), status memory, checked against a scan', () => {
    const v = checkCurveRule(lockOther, loads, fixedSplit(0.54));
    expect(v.passed).toBe(true);
    expect(v.branch).toBe('corridor');
    expect(v.status).toBe('memory');
    const rel = (z: number) => 0.38 + (z - 0.3) / 0.74;
    const band = (z: number) => Math.min(z + 0.08 - f1(0.54, z), f1(0.54, z) - z + 0.08, z + 0.08 - f2(0.54, z), f2(0.54, z) - z + 0.08);
    const scan = Math.min(scanMin(band, 0.15, 0.3).min, scanMin((z) => rel(z) - f2(0.54, z), 0.3, 0.61).min);
    expect(v.worst_margin!).toBeCloseTo(scan, 7);
  });

  it('fails both branches for φ = 0.40 (rear above front from z = 0; f2 above the band at z = 0.30)', () => {
    // f2(0.30) = 0.6·0.3/0.44 = 0.409 > 0.38
    const v = checkCurveRule(lockOther, loads, fixedSplit(0.4));
    expect(v.passed).toBe(false);
    expect(v.status).toBe('memory'); // the least certain branch decides a failing verdict
    expect(v.failing_ranges[0]).toEqual([0.15, 0.3]);
  });
});
