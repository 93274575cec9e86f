/**
 * Exact band of a fixed front/rear split (core/sizing/split-band.ts) against hand derivations.
 * Relations used (fixed split, ψ = P1/P, χ = h/E; hand-derived from the axle loads under braking, N1 = P1 + zPh/E: common practice, no source):
 *   f1 = φz/(ψ + χz), f2 = (1 − φ)z/(1 − ψ − χz);  f1 ≥ f2 ⟺ φ ≥ ψ + χz.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { sizingCurveRules } from '../../../core/sizing/sizing-rules.ts';
import { splitBand } from '../../../core/sizing/split-band.ts';
import { compileRule, fixedSplitSegments, geometryOf, ruleMargin } from '../../../core/sizing/rule-margin.ts';
import { branchSet } from '../../../core/sizing/split-band.ts';
import type { CurveRule } from '../../../core/rules/rule-types.ts';
import { axleLoadModel } from '../../../core/index.ts';
import { fixedSplitDesign } from './fixtures.ts';

const PSI = 1100 / 2000; // ψ of the fixture
const CHI = 0.6 / 3; // χ of the fixture

describe('fixed-split band, lock-order rules', () => {
  it('FMVSS 135 lock sequence (front at or above rear for z 0.15–0.80): φ ≥ ψ + 0.8χ, up to 1', () => {
    // hand-derived: f1 ≥ f2 ⟺ φ ≥ ψ + χz for every z in [0.15, 0.80]; the largest bound is at z = 0.80.
    // Upper end: φ = 1 gives f2 = 0 ≤ f1. Lift-off (1 − ψ)/χ = 2.25 lies beyond 0.80.
    const d = fixedSplitDesign({ rules: ['fmvss135/lock-sequence'] });
    const band = splitBand(d, sizingCurveRules(d));
    expect(band.intervals).toHaveLength(1);
    expect(band.intervals[0]![0]).toBeCloseTo(PSI + 0.8 * CHI, 9);
    expect(band.intervals[0]![1]).toBe(1);
  });

  it('71/320 Appendix N1 main requirement (z 0.15–0.50): φ ≥ ψ + 0.5χ', () => {
    // hand-derived as above with the N1 range of 71/320/EEC Annex II Appendix point 3.1.1 (b): bound at z = 0.50.
    // An unladen state makes the rear-axle load ratio 900/562 = 1.60 > 1.5 with a maximum mass of 2 t, so the N1
    // requirement applies (light-N1 rule, 71/320/EEC Annex II Appendix 3.1.1, from memory); its own bound
    // ψ + 0.5χ = 638/1200 + 0.5·0.5/3 = 0.615 lies below the laden one.
    const base = fixedSplitDesign({ rules: ['eu-appendix/lock-order'] });
    const d = { ...base, load_states: [...base.load_states, { id: 'empty', label: 'Unladen', kind: 'unladen' as const, mass_kg: 1200, front_axle_kg: 638, cg_height_m: 0.5 }] };
    const band = splitBand(d, sizingCurveRules(d));
    const primary = band.per_rule[0]!.branches.find((b) => b.id === 'primary')!;
    expect(primary.intervals[0]![0]).toBeCloseTo(PSI + 0.5 * CHI, 9);
    expect(primary.intervals[0]![1]).toBe(1);
  });

  it('a range reaching rear-axle lift-off leaves no band', () => {
    // hand-derived: ψ = 0.55, χ = 2.4/3 = 0.8 → lift-off (1 − ψ)/χ = 0.5625 < 0.80, so the FMVSS range is cut.
    const d = fixedSplitDesign({ cgM: 2.4, rules: ['fmvss135/lock-sequence'] });
    expect(splitBand(d, sizingCurveRules(d)).intervals).toEqual([]);
  });
});

describe('fixed-split band, efficiency line', () => {
  it('71/320 Appendix 3.1.1 line k = 0.2 + (z − 0.1)/0.85 for z 0.10–0.61 gives closed-form edges', () => {
    // hand-derived: with L(z) = c + s z, c = 0.2 − 0.1/0.85, s = 1/0.85 (71/320/EEC Annex II Appendix point 3.1.1 (a), coefficient 0.85 held as partial [P]):
    //  front: f1 ≤ L ⟺ φ ≤ g(z) = L(z)(ψ + χz)/z = cψ/z + cχ + sψ + sχz, smallest at z* = √(cψ/(sχ))
    //         (inside [0.10, 0.61] here), where g = 2√(cψ·sχ) + cχ + sψ;
    //  rear:  f2 ≤ L ⟺ φ ≥ 1 − h(z), h(z) = L(z)(1 − ψ − χz)/z, decreasing in z (h' = −c(1 − ψ)/z² − sχ < 0),
    //         so the binding point is z = 0.61: φ ≥ 1 − L(0.61)(1 − ψ − 0.61χ)/0.61.
    const c = 0.2 - 0.1 / 0.85;
    const s = 1 / 0.85;
    const zStar = Math.sqrt((c * PSI) / (s * CHI));
    expect(zStar).toBeGreaterThan(0.1);
    expect(zStar).toBeLessThan(0.61);
    const upper = 2 * Math.sqrt(c * PSI * s * CHI) + c * CHI + s * PSI;
    const lower = 1 - ((c + s * 0.61) * (1 - PSI - 0.61 * CHI)) / 0.61;
    const d = fixedSplitDesign({ rules: ['eu-appendix/efficiency'] });
    const band = splitBand(d, sizingCurveRules(d));
    expect(band.intervals).toHaveLength(1);
    expect(band.intervals[0]![0]).toBeCloseTo(lower, 9);
    expect(band.intervals[0]![1]).toBeCloseTo(upper, 9);
  });

  it('the common band is the intersection: lock order from below, efficiency line from above', () => {
    // hand-derived from the two tests above: [max(ψ + 0.8χ, rear bound), front bound].
    const c = 0.2 - 0.1 / 0.85;
    const s = 1 / 0.85;
    const upper = 2 * Math.sqrt(c * PSI * s * CHI) + c * CHI + s * PSI;
    const d = fixedSplitDesign({ rules: ['fmvss135/lock-sequence', 'eu-appendix/efficiency'] });
    const band = splitBand(d, sizingCurveRules(d));
    expect(band.intervals[0]![0]).toBeCloseTo(PSI + 0.8 * CHI, 9);
    expect(band.intervals[0]![1]).toBeCloseTo(upper, 9);
  });
});

describe('exact band against a scan of the margins', () => {
  it('every edge is a pass/fail boundary of the exact margin (random vehicles, all categories)', () => {
    // Property: just inside an edge the rule passes, just outside it fails (margins by core/sizing/rule-margin.ts,
    // which follows core/checks/curve-check.ts); the any-of branches of M1/N1/other categories included.
    fc.assert(
      fc.property(
        fc.constantFrom('M1', 'N1', 'N2' as const),
        fc.double({ min: 0.35, max: 0.7, noNaN: true }),
        fc.double({ min: 0.1, max: 0.35, noNaN: true }),
        (category, psi, chi) => {
          const d = fixedSplitDesign({ category: category as 'M1', frontKg: 2000 * psi, cgM: 3 * chi, rules: ['eu-appendix'] });
          const rules = sizingCurveRules(d);
          const band = splitBand(d, rules);
          const s = d.load_states[0]!;
          const m = axleLoadModel(s.mass_kg, s.front_axle_kg, s.cg_height_m, 3);
          for (const pr of band.per_rule) {
            const r = rules.find((x) => x.compiled.rule.id === pr.rule)!;
            const ok = (phi: number) => ruleMargin(r.compiled, geometryOf(m), fixedSplitSegments(phi, m.P)) >= -1e-9;
            for (const [lo, hi] of pr.intervals) {
              expect(ok(Math.min(hi, lo + 1e-6))).toBe(true);
              if (lo > 1e-6) expect(ok(lo - 1e-6)).toBe(false);
              if (hi < 1 - 1e-6) expect(ok(hi + 1e-6)).toBe(false);
            }
          }
        },
      ),
      { numRuns: 60, seed: 5 },
    );
  });
});

describe('a clause whose alternatives bound φ from both sides', () => {
  it('gives two intervals: φ ≤ min U or φ ≥ max L (synthetic clause, not a regulation)', () => {
    // Clause on z 0.15–0.30: f1 ≤ z − 0.05 OR f1 ≥ z + 0.05. With f1 = φz/(ψ + χz):
    //   U(z) = (z − 0.05)(ψ + χz)/z = ψ + χz − 0.05ψ/z − 0.05χ, increasing (U' = χ + 0.05ψ/z² > 0): min at z = 0.15;
    //   L(z) = ψ + χz + 0.05ψ/z + 0.05χ, L' = χ − 0.05ψ/z² < 0 below z = √(0.05ψ/χ) ≈ 0.371: max at z = 0.15.
    // L > U everywhere, so φ fails on (min U, max L) = (U(0.15), L(0.15)).
    const rule: CurveRule = {
      kind: 'curve', id: 'test/two-sided', rule_set: 'test', title: 'synthetic', source: { document: 'test', paragraph: '-' }, status: 'verified',
      categories: ['N1'], load_states: 'all', abs_exempt: false,
      branches: [{ id: 'only', label: 'synthetic', status: 'verified', pieces: [{ z: [0.15, 0.3], all_of: [[
        { type: 'at_most', axle: 'front', line: { intercept: -0.05, slope: 1 } },
        { type: 'at_least', axle: 'front', line: { intercept: 0.05, slope: 1 } },
      ]] }] }],
    };
    const U = PSI + CHI * 0.15 - (0.05 * PSI) / 0.15 - 0.05 * CHI;
    const L = PSI + CHI * 0.15 + (0.05 * PSI) / 0.15 + 0.05 * CHI;
    const set = branchSet(compileRule(rule).branches[0]!, PSI, CHI);
    expect(set).toHaveLength(2);
    expect(set[0]![0]).toBe(0);
    expect(set[0]![1]).toBeCloseTo(U, 9);
    expect(set[1]![0]).toBeCloseTo(L, 9);
    expect(set[1]![1]).toBe(1);
  });
});
