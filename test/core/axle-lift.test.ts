/**
 * CG height by axle lift (core/axle-lift.ts).
 * Sources:
 * - synthetic vehicles whose true CG height is known: the scale readings are generated here by rigid-
 *   body statics (rotate the body, take moments about the lower wheel's contact point), independently
 *   of the formula under test, because the published example below is known to be wrong;
 * - the known-wrong published example (R. N. Jazar, Vehicle Dynamics: Theory and Application
 *   (2008), Example 43): only the recomputation
 *   "its inputs give 1.876 m, not the printed 0.34 m" is checked, never used as the method's truth;
 * - GUM (JCGM 100:2008, from memory): a resolution step δ as a rectangular distribution, u = δ/√12;
 *   linear propagation u² = Σ (c_i u_i)².
 */
import { describe, expect, it } from 'vitest';
import { axleLift, type AxleLiftInput, type AxleLiftReading, chiSquaredQuantile, resolutionUncertainty } from '../../core/index.ts';

interface Vehicle {
  L: number; // wheelbase, m
  r: number; // wheel-centre height, m
  a: number; // CG behind the front axle, m
  h: number; // CG height above ground, m
  M: number; // mass, kg
}

/**
 * Axle masses with one axle raised by H (wheel-centre rise), by plain statics: body frame X rearward
 * along the wheel-centre line from the front wheel centre, Z perpendicular; pitch φ (rear up positive);
 * horizontal position of a point = X cos φ − Z sin φ; the rear reaction balances the moment of the
 * weight about the front contact point (vertically below the front wheel centre).
 */
function weigh(v: Vehicle, raised: 'front' | 'rear', H: number): { front: number; rear: number } {
  const sinPhi = (raised === 'rear' ? 1 : -1) * (H / v.L);
  const cosPhi = Math.sqrt(1 - sinPhi * sinPhi);
  const xRear = v.L * cosPhi;
  const xCg = v.a * cosPhi - (v.h - v.r) * sinPhi;
  const rear = (v.M * xCg) / xRear;
  return { front: v.M - rear, rear };
}

function level(v: Vehicle) {
  const w = weigh(v, 'rear', 0);
  return { front_axle_kg: w.front, rear_axle_kg: w.rear };
}

function lift(v: Vehicle, raised: 'front' | 'rear', H: number, readRaised = false): AxleLiftReading {
  const w = weigh(v, raised, H);
  const down = raised === 'rear' ? 'front' : 'rear';
  const read = readRaised ? raised : down;
  return read === 'front' ? { raised_axle: raised, lift_height_m: H, front_axle_kg: w.front } : { raised_axle: raised, lift_height_m: H, rear_axle_kg: w.rear };
}

const base = { scale_resolution_kg: 1, lift_height_uncertainty_m: 0.002, wheelbase_uncertainty_m: 0.003 };

/** Seeded PRNG (mulberry32, from memory) and a normal deviate by Box–Muller. */
function prng(seed: number) {
  let s = seed >>> 0;
  const next = () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = () => Math.sqrt(-2 * Math.log(1 - next())) * Math.cos(2 * Math.PI * next());
  return { next, normal };
}

describe('axleLift on a synthetic vehicle with known CG height', () => {
  // An invented van-like body: the readings come from weigh(), not from the formula.
  const van: Vehicle = { L: 3.5, r: 0.35, a: 1.6, h: 0.92, M: 2800 };

  it('recovers h to 1e-6 m from one rear lift (front axle on the scales)', () => {
    const r = axleLift({ ...base, wheelbase_m: van.L, wheel_centre_height_m: van.r, level: level(van), lifts: [lift(van, 'rear', 0.6)] });
    expect(Math.abs(r.cg_height_m - van.h)).toBeLessThan(1e-6);
    expect(r.cg_to_front_axle_m).toBeCloseTo(van.a, 9);
    expect(r.mass_kg).toBeCloseTo(van.M, 9);
  });

  it('recovers h to 1e-6 m from one front lift (rear axle on the scales)', () => {
    const r = axleLift({ ...base, wheelbase_m: van.L, wheel_centre_height_m: van.r, level: level(van), lifts: [lift(van, 'front', 0.55)] });
    expect(Math.abs(r.cg_height_m - van.h)).toBeLessThan(1e-6);
    // The axle that stays down gains load when the CG is above the wheel centres.
    expect(r.lifts[0]!.reading_change_kg).toBeGreaterThan(0);
  });

  it('gives the same h when the reading is of the raised axle (sign of ΔW flips)', () => {
    for (const raised of ['front', 'rear'] as const) {
      const r = axleLift({ ...base, wheelbase_m: van.L, wheel_centre_height_m: van.r, level: level(van), lifts: [lift(van, raised, 0.5, true)] });
      expect(Math.abs(r.cg_height_m - van.h)).toBeLessThan(1e-6);
      expect(r.lifts[0]!.reading_change_kg).toBeLessThan(0);
    }
  });

  it('recovers h to 1e-6 m from several lifts at both ends, and from a lift given as an angle', () => {
    const lifts = [lift(van, 'rear', 0.3), lift(van, 'rear', 0.5), lift(van, 'rear', 0.7), lift(van, 'front', 0.4), lift(van, 'front', 0.65)];
    const r = axleLift({ ...base, wheelbase_m: van.L, wheel_centre_height_m: van.r, level: level(van), lifts });
    expect(Math.abs(r.cg_height_m - van.h)).toBeLessThan(1e-6);
    for (const l of r.lifts) expect(Math.abs(l.cg_height_m - van.h)).toBeLessThan(1e-6);
    expect(r.fit_degrees_of_freedom).toBe(4);
    expect(r.warnings.map((w) => w.code)).not.toContain('WARN_LIFTS_DISAGREE');
    expect(r.warnings.map((w) => w.code)).not.toContain('WARN_LIFT_ONE_END');

    const H = 0.6;
    const deg = (Math.asin(H / van.L) * 180) / Math.PI;
    const w = weigh(van, 'rear', H);
    const ra = axleLift({
      ...base,
      lift_angle_uncertainty_deg: 0.1,
      wheelbase_m: van.L,
      wheel_centre_height_m: van.r,
      level: level(van),
      lifts: [{ raised_axle: 'rear', lift_angle_deg: deg, front_axle_kg: w.front }],
    });
    expect(Math.abs(ra.cg_height_m - van.h)).toBeLessThan(1e-6);
  });

  it('a CG ahead of mid-wheelbase and a low CG are recovered too', () => {
    for (const v of [
      { L: 2.6, r: 0.3, a: 0.9, h: 0.52, M: 1300 },
      { L: 4.3, r: 0.38, a: 2.6, h: 1.15, M: 3500 },
    ]) {
      const r = axleLift({ ...base, wheelbase_m: v.L, wheel_centre_height_m: v.r, level: level(v), lifts: [lift(v, 'rear', 0.5), lift(v, 'front', 0.5)] });
      expect(Math.abs(r.cg_height_m - v.h)).toBeLessThan(1e-6);
    }
  });
});

describe('axleLift uncertainty (GUM, linear)', () => {
  const van: Vehicle = { L: 3.5, r: 0.35, a: 1.6, h: 0.92, M: 2800 };

  it('a resolution step counts as a rectangular distribution: u = δ/√12', () => {
    // GUM 4.3.7 / F.2.2.1 (from memory): half-width δ/2, u = (δ/2)/√3 = δ/√12.
    expect(resolutionUncertainty(5)).toBeCloseTo(5 / Math.sqrt(12), 12);
    expect(resolutionUncertainty(5)).toBeCloseTo(1.4433756729740645, 12);
  });

  it('one lift: sensitivity to the reading is L/(W tan θ) and u² is the sum of the squared contributions', () => {
    const H = 0.6;
    const r = axleLift({ ...base, wheelbase_m: van.L, wheel_centre_height_m: van.r, level: level(van), lifts: [lift(van, 'rear', H)] });
    const tan = H / Math.sqrt(van.L ** 2 - H ** 2);
    const reading = r.budget.entries.find((e) => e.path === 'lifts[0].front_axle_kg')!;
    // hand-derived: h = r + L (y − Wf)/(W tan θ) → ∂h/∂y = L/(W tan θ)
    expect(reading.sensitivity).toBeCloseTo(van.L / (van.M * tan), 6);
    expect(reading.standard_uncertainty).toBeCloseTo(1 / Math.sqrt(12), 12);
    // ∂h/∂r = 1 exactly.
    expect(r.budget.entries.find((e) => e.path === 'wheel_centre_height_m')!.sensitivity).toBeCloseTo(1, 6);
    const sumSq = r.budget.entries.reduce((a, e) => a + e.contribution_m ** 2, 0);
    expect(Math.sqrt(sumSq)).toBeCloseTo(r.standard_uncertainty_m, 12);
    expect(r.budget.by_source.reduce((a, b) => a + b.variance_share, 0)).toBeCloseTo(1, 9);
  });

  it('names the largest contributor: a poorly known lift angle dominates', () => {
    const H = 0.6;
    const deg = (Math.asin(H / van.L) * 180) / Math.PI;
    const r = axleLift({
      ...base,
      lift_angle_uncertainty_deg: 0.5,
      wheelbase_m: van.L,
      wheel_centre_height_m: van.r,
      level: level(van),
      lifts: [{ raised_axle: 'rear', lift_angle_deg: deg, front_axle_kg: weigh(van, 'rear', H).front }],
    });
    expect(r.budget.largest_source).toBe('lift_angle');
    expect(r.budget.largest_input).toBe('lift 1 (rear raised): angle');
  });

  it('several noisy lifts: the fit lands within its stated standard uncertainty in about 68 % of 400 seeded trials', () => {
    // Noise drawn to match the stated uncertainties: lift heights and wheelbase normal with the stated
    // standard deviations, readings rounded to the scale step (rectangular). If the propagation is
    // right, |ĥ − h| ≤ u holds with probability ≈ 0.683 and ≤ 2u with ≈ 0.954 (normal, first order).
    // Binomial s.d. for 400 trials at p = 0.683 is 2.3 points: 60–78 % is about −3.6 to +4.2 s.d.
    const rnd = prng(20261201);
    const uH = 0.003;
    const uL = 0.005;
    const uR = 0.002;
    const res = 5;
    const trials = 400;
    let within1 = 0;
    let within2 = 0;
    for (let t = 0; t < trials; t++) {
      const v: Vehicle = { L: 3.2 + 0.8 * rnd.next(), r: 0.34 + 0.04 * rnd.next(), a: 1.3 + 0.6 * rnd.next(), h: 0.6 + 0.5 * rnd.next(), M: 2200 + 1300 * rnd.next() };
      const round = (kg: number) => Math.round(kg / res) * res;
      const lv = level(v);
      const heights: Array<['front' | 'rear', number]> = [['rear', 0.35], ['rear', 0.5], ['rear', 0.65], ['front', 0.35], ['front', 0.5], ['front', 0.65]];
      const lifts: AxleLiftReading[] = heights.map(([raised, H]) => {
        const w = weigh(v, raised, H);
        const Hm = H + uH * rnd.normal();
        return raised === 'rear' ? { raised_axle: raised, lift_height_m: Hm, front_axle_kg: round(w.front) } : { raised_axle: raised, lift_height_m: Hm, rear_axle_kg: round(w.rear) };
      });
      const inp: AxleLiftInput = {
        wheelbase_m: v.L + uL * rnd.normal(),
        wheel_centre_height_m: v.r + uR * rnd.normal(),
        wheel_centre_height_uncertainty_m: uR,
        level: { front_axle_kg: round(lv.front_axle_kg), rear_axle_kg: round(lv.rear_axle_kg) },
        lifts,
        scale_resolution_kg: res,
        lift_height_uncertainty_m: uH,
        wheelbase_uncertainty_m: uL,
      };
      const r = axleLift(inp);
      const err = Math.abs(r.cg_height_m - v.h);
      if (err <= r.standard_uncertainty_m) within1++;
      if (err <= 2 * r.standard_uncertainty_m) within2++;
    }
    expect(within1 / trials).toBeGreaterThanOrEqual(0.6);
    expect(within1 / trials).toBeLessThanOrEqual(0.78);
    expect(within2 / trials).toBeGreaterThanOrEqual(0.9);
  });
});

describe('axleLift warnings', () => {
  const van: Vehicle = { L: 3.5, r: 0.35, a: 1.6, h: 0.92, M: 2800 };
  const codes = (inp: AxleLiftInput) => axleLift(inp).warnings.map((w) => w.code);

  it('flags a lift angle below 10° and recommends lifting the other end', () => {
    // 0.3 m on 3.5 m is 4.9°.
    const c = codes({ ...base, wheelbase_m: van.L, wheel_centre_height_m: van.r, level: level(van), lifts: [lift(van, 'rear', 0.3)] });
    expect(c).toContain('WARN_LIFT_ANGLE_SMALL');
    expect(c).toContain('WARN_LIFT_ONE_END');
    expect(c).toContain('WARN_FEW_LIFTS');
    // 0.7 m on 3.5 m is 11.5°: no angle warning.
    expect(codes({ ...base, wheelbase_m: van.L, wheel_centre_height_m: van.r, level: level(van), lifts: [lift(van, 'rear', 0.7)] })).not.toContain('WARN_LIFT_ANGLE_SMALL');
  });

  it('flags lifts that disagree beyond their uncertainty (front lifts as if h were 6 cm higher)', () => {
    const high = { ...van, h: van.h + 0.06 };
    const lifts = [lift(van, 'rear', 0.5), lift(van, 'rear', 0.7), lift(high, 'front', 0.5), lift(high, 'front', 0.7)];
    const r = axleLift({ ...base, wheelbase_m: van.L, wheel_centre_height_m: van.r, level: level(van), lifts });
    expect(r.warnings.map((w) => w.code)).toContain('WARN_LIFTS_DISAGREE');
    expect(r.fit_chi_squared!).toBeGreaterThan(chiSquaredQuantile(0.99, r.fit_degrees_of_freedom));
  });

  it('flags a result below the wheel centre (readings of the wrong axle)', () => {
    // A reading of the raised axle entered as if it were of the axle that stays down.
    const w = weigh(van, 'rear', 0.6);
    const r = axleLift({ ...base, wheelbase_m: van.L, wheel_centre_height_m: van.r, level: level(van), lifts: [{ raised_axle: 'front', lift_height_m: 0.6, front_axle_kg: w.front }] });
    expect(r.warnings.map((w) => w.code)).toContain('WARN_CG_BELOW_WHEEL_CENTRE');
  });

  it('χ² 99 % quantile by Wilson–Hilferty is within 1 % of the tabulated values (from memory: 6.635, 9.210, 15.086)', () => {
    expect(chiSquaredQuantile(0.99, 1)).toBeCloseTo(6.635, -1);
    expect(Math.abs(chiSquaredQuantile(0.99, 2) / 9.21 - 1)).toBeLessThan(0.01);
    expect(Math.abs(chiSquaredQuantile(0.99, 5) / 15.086 - 1)).toBeLessThan(0.01);
  });
});

describe('the known-wrong published example (Jazar, Vehicle Dynamics, Example 43)', () => {
  it('its inputs give 1.876 m, not the printed 0.34 m', () => {
    // Published inputs: m = 2000 kg, front reaction 2Fz1 = 18000 N with the rear raised by φ = 30°,
    // a1 = 1.10 m, l = 2.30 m, R = 0.30 m, g = 9.81 m/s² as the book uses. The level front axle mass
    // follows from a1: m (l − a1)/l. This is a recomputation of the book's own numbers, not a truth
    // for the method (the synthetic vehicles above are).
    const g = 9.81;
    const m = 2000;
    const l = 2.3;
    const a1 = 1.1;
    const r = axleLift({
      wheelbase_m: l,
      wheel_centre_height_m: 0.3,
      level: { front_axle_kg: (m * (l - a1)) / l, rear_axle_kg: (m * a1) / l },
      lifts: [{ raised_axle: 'rear', lift_angle_deg: 30, front_axle_kg: 18000 / g }],
      scale_resolution_kg: 0,
      lift_height_uncertainty_m: 0,
      wheelbase_uncertainty_m: 0,
    });
    expect(r.cg_height_m).toBeCloseTo(1.876, 3);
    expect(Math.abs(r.cg_height_m - 0.34)).toBeGreaterThan(1);
  });
});
