/**
 * Robustness analysis (core/sizing/robustness.ts): seeded Monte Carlo, worst-case corners and the
 * sensitivity ranking, checked on a case computable by hand.
 *
 * Hand case: one load state, disc brakes without thresholds or valve (fixed split φ = G1/(G1 + G2),
 * G ∝ piston area when everything else is equal: φ = d1²/(d1² + d2²)), rule FMVSS 135 lock sequence
 * only (front at or above rear for z 0.15–0.80). From the fixed-split relation f1 ≥ f2 ⟺ φ ≥ ψ + χz
 * (reference sheet section 1) the vehicle passes iff φ ≥ ψ + 0.8 h/E, i.e. iff h ≤ h_crit = (φ − ψ)E/0.8.
 * With only the CG height uncertain, normal with standard deviation σ around h0:
 *   P(fail) = P(h > h_crit) = 1 − Φ((h_crit − h0)/σ);
 * uniform on [h0 − t, h0 + t]: P(fail) = (h0 + t − h_crit)/(2t).
 */
import { describe, expect, it } from 'vitest';
import type { DesignFile } from '../../../core/index.ts';
import { mulberry32 } from '../../../core/sizing/prng.ts';
import { monteCarlo, robustnessModel, sampleMargins, sensitivity, worstCorner } from '../../../core/sizing/robustness.ts';
import { sizingCurveRules } from '../../../core/sizing/sizing-rules.ts';
import { fixedSplitDesign } from './fixtures.ts';

/** Standard normal CDF via erf, Abramowitz & Stegun 7.1.26 (|error| ≤ 1.5e-7; coefficients from memory). */
function normalCdf(x: number): number {
  const z = Math.abs(x) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * z);
  const poly = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429))));
  const erf = 1 - poly * Math.exp(-z * z);
  return x >= 0 ? 0.5 * (1 + erf) : 0.5 * (1 - erf);
}

const H0 = 0.6;
const PSI = 1100 / 2000;
const E = 3;
const PHI = (54 * 54) / (54 * 54 + 34 * 34);
const H_CRIT = ((PHI - PSI) * E) / 0.8;

function onlyCg(tol: number, distribution: 'normal' | 'uniform'): DesignFile {
  const d = fixedSplitDesign({ rules: ['fmvss135/lock-sequence'], frontPistonMm: 54, rearPistonMm: 34 });
  d.tolerances = { pad_friction_front_pct: 0, pad_friction_rear_pct: 0, cg_height_m: tol, front_axle_kg: 0, tyre_radius_pct: 0, distribution };
  return d;
}

describe('seeded Monte Carlo', () => {
  it('is reproducible with a seed and changes with another seed', () => {
    const d = onlyCg(0.04, 'normal');
    const m = robustnessModel(d, sizingCurveRules(d));
    const a = sampleMargins(m, 3000, 42);
    const b = sampleMargins(m, 3000, 42);
    const c = sampleMargins(m, 3000, 43);
    expect(Array.from(a)).toEqual(Array.from(b));
    expect(Array.from(a)).not.toEqual(Array.from(c));
  });

  it('the generator draws standard normals (mean 0, variance 1 within sampling error)', () => {
    // Box–Muller gives exact N(0, 1) from uniform draws; with n = 200 000 the mean's standard error is 0.0022
    // and the variance's about 0.0032 (√(2/n)); 5 standard errors allowed.
    const g = mulberry32(7);
    let s = 0;
    let s2 = 0;
    const n = 200000;
    for (let i = 0; i < n; i++) {
      const x = g.normal();
      s += x;
      s2 += x * x;
    }
    expect(Math.abs(s / n)).toBeLessThan(5 * Math.sqrt(1 / n));
    expect(Math.abs(s2 / n - 1)).toBeLessThan(5 * Math.sqrt(2 / n));
  });

  it('normal CG height only: probability equals the normal tail beyond the critical CG height', () => {
    const tol = 0.04; // ± limit = 2σ
    const sigma = tol / 2;
    const expected = 1 - normalCdf((H_CRIT - H0) / sigma);
    expect(expected).toBeGreaterThan(0.05); // a case with failures to count
    const d = onlyCg(tol, 'normal');
    const mc = monteCarlo(robustnessModel(d, sizingCurveRules(d)), 100000, 3);
    const se = Math.sqrt((expected * (1 - expected)) / 100000);
    expect(Math.abs(mc.probability_of_failure - expected)).toBeLessThan(4 * se);
    expect(mc.histogram.counts.reduce((a, b) => a + b, 0)).toBe(100000);
  });

  it('uniform CG height only: probability equals the share of the range above the critical height', () => {
    const tol = 0.04;
    const expected = (H0 + tol - H_CRIT) / (2 * tol);
    expect(expected).toBeGreaterThan(0);
    expect(expected).toBeLessThan(1);
    const d = onlyCg(tol, 'uniform');
    const mc = monteCarlo(robustnessModel(d, sizingCurveRules(d)), 50000, 9);
    const se = Math.sqrt((expected * (1 - expected)) / 50000);
    expect(Math.abs(mc.probability_of_failure - expected)).toBeLessThan(4 * se);
  });
});

describe('corners and sensitivity', () => {
  it('only the CG height uncertain: the high corner fails, the low one passes, CG height ranks first', () => {
    // hand-derived: h0 − t < h_crit < h0 + t for t = 0.04 (h_crit − h0 is about 0.022), so half of the corners fail.
    expect(H_CRIT - H0).toBeGreaterThan(0);
    expect(H_CRIT - H0).toBeLessThan(0.04);
    const d = onlyCg(0.04, 'normal');
    const m = robustnessModel(d, sizingCurveRules(d));
    const wc = worstCorner(m);
    expect(wc.worst.cg_height_change_m).toEqual([0.04]);
    expect(wc.worst.smallest_margin!).toBeLessThan(0);
    expect(wc.failing_corners / wc.corners).toBe(0.5);
    const s = sensitivity(m);
    expect(s.ranking[0]!.input).toBe('cg_height');
    for (const r of s.ranking.slice(1)) expect(r.effect).toBe(0);
  });

  it("a load state's CG-height standard uncertainty is used as ± 2u when the tolerances leave CG height out", () => {
    const d = onlyCg(0.04, 'normal');
    d.tolerances = { ...d.tolerances, cg_height_m: undefined };
    d.load_states[0] = { ...d.load_states[0]!, cg_height_uncertainty_m: 0.03 };
    expect(robustnessModel(d, sizingCurveRules(d)).states[0]!.hTol).toBeCloseTo(0.06, 12);
  });
});
