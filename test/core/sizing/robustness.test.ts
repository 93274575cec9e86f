/**
 * Robustness analysis (core/sizing/robustness.ts): seeded Monte Carlo, worst-case corners and the
 * sensitivity ranking, checked on a case computable by hand.
 *
 * Hand case: one load state, disc brakes without thresholds or valve (fixed split φ = G1/(G1 + G2),
 * G ∝ piston area when everything else is equal: φ = d1²/(d1² + d2²)), rule FMVSS 135 lock sequence
 * only (front at or above rear for z 0.15–0.80). From the fixed-split relation f1 ≥ f2 ⟺ φ ≥ ψ + χz
 * (hand-derived from the axle loads under braking, common practice, no source) the vehicle passes iff φ ≥ ψ + 0.8 h/E, i.e. iff h ≤ h_crit = (φ − ψ)E/0.8.
 * With only the CG height uncertain, normal with standard deviation σ around h0:
 *   P(fail) = P(h > h_crit) = 1 − Φ((h_crit − h0)/σ);
 * uniform on [h0 − t, h0 + t]: P(fail) = (h0 + t − h_crit)/(2t).
 */
import { describe, expect, it } from 'vitest';
import type { DesignFile } from '../../../core/index.ts';
import { mulberry32 } from '../../../core/sizing/prng.ts';
import { monteCarlo, robustnessModel, sampleMargins, sensitivity, worstCorner } from '../../../core/sizing/robustness.ts';
import { sizingCurveRules } from '../../../core/sizing/sizing-rules.ts';
import { demoDesign } from '../../../core/demo.ts';
import { designMargins } from '../../../core/sizing/design-margins.ts';
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
  d.tolerances = { pad_friction_front_pct: 0, pad_friction_rear_pct: 0, cg_height_m: tol, front_axle_kg: 0, tyre_radius_pct: 0, threshold_front_bar: 0, threshold_rear_bar: 0, distribution };
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

/**
 * The valve knee and the threshold pressures (issue 12 point 8), hand-derived on the fixed-split vehicle above
 * (2000 kg, 1100 kg front: ψ = 0.55; wheelbase E = 3 m; discs with sliding calipers, μ 0.4, r_eff 0.12 m,
 * tyre radius R 0.3 m), rule FMVSS 135 lock sequence: margin = min over z in [0.15, 0.80] of f1 − f2, with
 * f1 = T1/(P1 + χPz), f2 = T2/(P2 − χPz), χ = h/E (design-file spec, adhesion utilisation).
 * Axle gain (design-file spec, physics): G = 2 brakes · 2 pad faces · μ · A · r_eff / R, A = π d²/4.
 * Forces below are per unit vehicle weight P = m g (t_i = T_i/P).
 */
const G_STD = 9.80665; // standard gravity, m/s² (ISO 80000-3)
const P_N = 2000 * G_STD;
const gain = (dMm: number) => (2 * 2 * 0.4 * (Math.PI / 4) * (dMm * 1e-3) ** 2 * 0.12) / 0.3;
const G1 = gain(54);
const G2 = gain(34);
const noTolerances = { pad_friction_front_pct: 0, pad_friction_rear_pct: 0, cg_height_m: 0, front_axle_kg: 0, tyre_radius_pct: 0, valve_knee_pct: 0, valve_ratio_pct: 0, threshold_front_bar: 0, threshold_rear_bar: 0 } as const;

describe('valve knee and threshold pressures move the corners as computed by hand', () => {
  it('limiting valve, knee ±10 % only: margin at z = 0.15 with the rear force held at G2·K', () => {
    // Limiting valve, knee K0 = 10 bar = 1e6 Pa. The rear line reaches K at z_K = (G1 + G2) K / P
    // (= 0.104 at K0, 0.115 at 1.1 K0: below 0.15 in every corner), so over the whole range 0.15–0.80 the rear
    // force is held at t2 = r = G2 K / P and the front takes the rest, t1 = z − r:
    //   f1 − f2 = (z − r)/(ψ + χz) − r/(1 − ψ − χz),
    //   d/dz = (ψ + χr)/(ψ + χz)² − χr/(1 − ψ − χz)²  > 0 here (first term ≥ 0.557/0.71² ≈ 1.1, second
    //   ≤ 0.2·0.04/0.29² ≈ 0.1), so the smallest margin sits at z = 0.15:
    //   m(K) = (0.15 − r)/(ψ + 0.15χ) − r/(1 − ψ − 0.15χ), r = G2 K / P.
    // A higher knee gives the rear more force and the smaller margin: the worst corner is knee +10 %.
    const d = fixedSplitDesign({ rules: ['fmvss135/lock-sequence'], frontPistonMm: 54, rearPistonMm: 34 });
    d.hydraulics.rear_valve = { type: 'limiting', knee_bar: 10 };
    d.tolerances = { ...noTolerances, valve_knee_pct: 10 };
    const psi = 0.55;
    const chi = 0.6 / 3;
    const K0 = 1e6;
    expect(((G1 + G2) * 1.1 * K0) / P_N).toBeLessThan(0.15);
    const margin = (K: number) => {
      const r = (G2 * K) / P_N;
      return (0.15 - r) / (psi + 0.15 * chi) - r / (1 - psi - 0.15 * chi);
    };
    const m = robustnessModel(d, sizingCurveRules(d));
    const wc = worstCorner(m);
    expect(wc.worst.valve_knee_pct).toBe(10);
    expect(wc.worst.smallest_margin!).toBeCloseTo(margin(1.1 * K0), 9);
    expect(wc.corners).toBe(2 * 4); // knee − and + (the only shared input that moves) × the state's 4 CG/axle corners
    const s = sensitivity(m);
    expect(s.nominal!).toBeCloseTo(margin(K0), 9);
    const knee = s.ranking[0]!;
    expect(knee.input).toBe('valve_knee');
    expect(knee.label).toBe('rear valve knee pressure');
    expect(knee.margin_at_minus!).toBeCloseTo(margin(0.9 * K0), 9);
    expect(knee.margin_at_plus!).toBeCloseTo(margin(1.1 * K0), 9);
    expect(knee.effect).toBeCloseTo(margin(K0) - margin(1.1 * K0), 9); // r is linear in K: both sides move alike
    for (const r of s.ranking.slice(1)) expect(r.effect).toBe(0);
    // a limiting valve has no ratio to vary
    expect(s.ranking.some((r) => r.input === 'valve_ratio')).toBe(false);
  });

  it('front threshold 1 bar ±0.5 bar only: the front loses G1·t, the margin at z = 0.15 follows', () => {
    // No valve, rear threshold 0, front threshold t (below the line pressure at z = 0.15, about 14 bar).
    // zP = G1 (p − t) + G2 p gives p = (zP + G1 t)/(G1 + G2), so with φ = G1/(G1 + G2) and τ = G1 t / P:
    //   t1 = φz − (1 − φ)τ,  t2 = (1 − φ)(z + τ).
    // With h = 0.3 m (χ = 0.1) and τ = 0, f1 − f2 = z(φ − ψ − χz)/((ψ + χz)(1 − ψ − χz)) rises with z over
    // 0.15–0.80 (numerator rising as φ − ψ = 0.166 > 2χz... up to z = 0.83, denominator falling as ψ + χz moves
    // away from 1/2); the threshold term −(1 − φ)τ/((ψ + χz)(1 − ψ − χz)) is small (τ ≤ 0.011), and the test
    // checks on a grid that the sum still rises, so the smallest margin sits at z = 0.15:
    //   m(t) = (0.15φ − (1 − φ)τ)/(ψ + 0.15χ) − (1 − φ)(0.15 + τ)/(1 − ψ − 0.15χ).
    // A higher front threshold takes force from the front: the worst corner is +0.5 bar (t = 1.5 bar).
    const d = fixedSplitDesign({ rules: ['fmvss135/lock-sequence'], frontPistonMm: 54, rearPistonMm: 34, cgM: 0.3 });
    if (d.axles.front.brake.type !== 'disc') throw new Error('fixture changed');
    d.axles.front.brake.threshold_pressure_bar = 1;
    d.tolerances = { ...noTolerances, threshold_front_bar: 0.5 };
    const psi = 0.55;
    const chi = 0.3 / 3;
    const phi = G1 / (G1 + G2);
    const fDiff = (z: number, tBar: number) => {
      const tau = (G1 * tBar * 1e5) / P_N;
      return (phi * z - (1 - phi) * tau) / (psi + chi * z) - ((1 - phi) * (z + tau)) / (1 - psi - chi * z);
    };
    for (const t of [0.5, 1, 1.5]) for (let z = 0.15; z < 0.8; z += 0.01) expect(fDiff(z + 0.01, t)).toBeGreaterThan(fDiff(z, t));
    expect((0.15 * P_N + G1 * 1.5e5) / (G1 + G2)).toBeGreaterThan(1.5e5); // the front brake is applied at z = 0.15
    const m = robustnessModel(d, sizingCurveRules(d));
    const wc = worstCorner(m);
    expect(wc.worst.threshold_front_bar).toBe(0.5);
    expect(wc.worst.smallest_margin!).toBeCloseTo(fDiff(0.15, 1.5), 9);
    const s = sensitivity(m);
    expect(s.nominal!).toBeCloseTo(fDiff(0.15, 1), 9);
    const th = s.ranking[0]!;
    expect(th.input).toBe('threshold_front');
    expect(th.tolerance).toBe('±0.5 bar');
    expect(th.margin_at_minus!).toBeCloseTo(fDiff(0.15, 0.5), 9);
    expect(th.margin_at_plus!).toBeCloseTo(fDiff(0.15, 1.5), 9);
    for (const r of s.ranking.slice(1)) expect(r.effect).toBe(0);
  });

  it('a threshold tolerance never pushes a threshold below zero', () => {
    // nominal front threshold 0: the − corner stays at 0 bar, so its margin equals the nominal one
    const d = fixedSplitDesign({ rules: ['fmvss135/lock-sequence'], frontPistonMm: 54, rearPistonMm: 34, cgM: 0.3 });
    d.tolerances = { ...noTolerances, threshold_front_bar: 0.5 };
    const s = sensitivity(robustnessModel(d, sizingCurveRules(d)));
    const th = s.ranking.find((r) => r.input === 'threshold_front')!;
    expect(th.margin_at_minus).toBe(s.nominal);
    expect(th.margin_at_plus!).toBeLessThan(s.nominal!);
  });
});

describe('zero tolerances', () => {
  it('give zero spread: every sample, the worst corner and each one-at-a-time change equal the nominal margin', () => {
    // the demo (load-sensing valve, thresholds, two load states): every input applies, none may move
    const d = demoDesign();
    d.tolerances = { ...noTolerances };
    const m = robustnessModel(d, sizingCurveRules(d));
    const s = sensitivity(m);
    expect(s.nominal).not.toBeNull();
    const samples = sampleMargins(m, 500, 5);
    for (const v of samples) expect(v).toBe(s.nominal);
    const mc = monteCarlo(m, 500, 5);
    expect(mc.probability_of_failure).toBe(s.nominal! < 0 ? 1 : 0);
    expect(mc.p05_margin).toBe(mc.median_margin);
    const wc = worstCorner(m);
    expect(wc.corners).toBe(4 ** d.load_states.length);
    expect(wc.worst.smallest_margin).toBe(s.nominal);
    expect(s.ranking.map((r) => r.input)).toEqual(expect.arrayContaining(['valve_knee', 'valve_ratio', 'threshold_front', 'threshold_rear']));
    for (const r of s.ranking) expect(r.effect).toBe(0);
  });
});

describe('a travel-sensing load-sensing valve', () => {
  it("the perturbed vehicles are judged on the engine's dynamic distribution (knee following the braking rear load)", () => {
    // The robustness analysis builds the distribution of a travel-sensing valve in its own buffers; each
    // one-at-a-time case must give the smallest margin the curve checks give (core/checks/curve-check.ts on the
    // engine's distribution, core/installed-distribution.ts, itself checked by hand in its own tests) for the
    // design with that input changed in the file. The demo's valve senses travel (the default).
    const d = demoDesign();
    expect(d.hydraulics.rear_valve.type).toBe('load_sensing');
    d.tolerances = { ...noTolerances, valve_knee_pct: 10, valve_ratio_pct: 5, front_axle_kg: 40, cg_height_m: 0.08, threshold_rear_bar: 0.5 };
    const rules = sizingCurveRules(d);
    const s = sensitivity(robustnessModel(d, rules));
    const engine = (f: (x: DesignFile) => void) => {
      const c = structuredClone(d);
      f(c);
      return designMargins(c, rules).smallest_margin!;
    };
    expect(s.nominal!).toBeCloseTo(engine(() => {}), 9);
    const at = (input: string) => s.ranking.find((r) => r.input === input)!;
    const valve = (x: DesignFile) => x.hydraulics.rear_valve as Extract<DesignFile['hydraulics']['rear_valve'], { type: 'load_sensing' }>;
    expect(at('valve_knee').margin_at_plus!).toBeCloseTo(engine((x) => (valve(x).knee_bar_at_rear_axle_kg = valve(x).knee_bar_at_rear_axle_kg.map(([kg, b]) => [kg, 1.1 * b]))), 9);
    expect(at('valve_knee').margin_at_minus!).toBeCloseTo(engine((x) => (valve(x).knee_bar_at_rear_axle_kg = valve(x).knee_bar_at_rear_axle_kg.map(([kg, b]) => [kg, 0.9 * b]))), 9);
    expect(at('valve_ratio').margin_at_minus!).toBeCloseTo(engine((x) => (valve(x).ratio *= 0.95)), 9);
    expect(at('front_axle_load').margin_at_plus!).toBeCloseTo(engine((x) => x.load_states.forEach((st) => (st.front_axle_kg += 40))), 9);
    expect(at('cg_height').margin_at_plus!).toBeCloseTo(engine((x) => x.load_states.forEach((st) => (st.cg_height_m += 0.08))), 9);
    expect(at('threshold_rear').margin_at_plus!).toBeCloseTo(engine((x) => (x.axles.rear.brake.threshold_pressure_bar += 0.5)), 9);
    // and the static reading differs: the travel-sensing knee is not the static one here
    const st = structuredClone(d);
    (st.hydraulics.rear_valve as { senses?: string }).senses = 'static';
    expect(Math.abs(sensitivity(robustnessModel(st, rules)).nominal! - s.nominal!)).toBeGreaterThan(0.01);
  });
});
