// Regenerative braking (core/regen.ts).
// Sources: hand derivations in the comments (lock conditions T_i = k N_i with the axle loads of
// 71/320/EEC Annex II Appendix 3.1.3); the "both" tolerance of 0.001 in braking rate is the design-file
// spec's ("First lock").
import { describe, expect, it } from 'vitest';
import { axleLoadModel } from '../../core/axle-loads.ts';
import type { Distribution } from '../../core/distribution.ts';
import { forcesAt } from '../../core/distribution.ts';
import { firstLock } from '../../core/lock-order.ts';
import { lockOrderRange } from '../../core/lock-order-range.ts';
import { maxAllowedRegenForce, regenBaseSpeed, regenDistribution, regenForceAt, type RegenSetup } from '../../core/regen.ts';

// Vehicle: ψ = 0.5 (static front share), χ = h/E = 0.25. Friction brakes: a fixed front share φ = 0.7.
// Without regeneration the ideal crossing is at z* = (φ − ψ)/χ = 0.8, so the front locks first below it.
const loads = axleLoadModel(2000, 1000, 0.8, 3.2);
const P = loads.P;
const friction: Distribution = { P, z: [0, 1], t1: [0, 0.7 * P], t2: [0, 0.3 * P] };
const regenFirst = { type: 'regen_first' } as const;

describe('regen_first on the rear axle: the lock order flips at a hand-computed adhesion', () => {
  // Regeneration R = r P on the rear, r = 0.05; friction supplies (z − r) P above z = r:
  //   T1 = 0.7 (z − r) P,  T2 = 0.3 (z − r) P + r P;  N1 = (0.5 + 0.25 z) P,  N2 = (0.5 − 0.25 z) P.
  // Front lock: 0.7 (z − r) = k (0.5 + 0.25 z) → z_F = (0.5k + 0.035)/(0.7 − 0.25k)
  // Rear lock:  0.3 (z − r) + r = k (0.5 − 0.25 z) → z_R = (0.5k − 0.035)/(0.3 + 0.25k)
  // z_F = z_R ⇔ (0.5k + 0.035)(0.3 + 0.25k) = (0.5k − 0.035)(0.7 − 0.25k)
  //          ⇔ 0.25k² − 0.2k + 0.035 = 0 ⇔ k = 0.4 ± √0.02 → k₁ = 0.258579, k₂ = 0.541421.
  // Below k₁ (and above k₂) the rear axle locks first; at k₁ both lock at z = k₁ (the ideal line).
  const d = regenDistribution(friction, 0.05 * P, 0, regenFirst);
  const k1 = 0.4 - Math.sqrt(0.02);
  it('without regeneration the front locks first on every surface below 0.8', () => {
    for (const k of [0.2, 0.25, 0.3, 0.5, 0.7]) expect(firstLock(loads, friction, k).first_axle).toBe('front');
  });
  it('with 0.05 P of regeneration the rear locks first just below k₁ and the front just above', () => {
    expect(firstLock(loads, d, k1 - 0.005).first_axle).toBe('rear');
    expect(firstLock(loads, d, k1 + 0.005).first_axle).toBe('front');
    expect(firstLock(loads, d, 0.6).first_axle).toBe('rear'); // above k₂
  });
  it('at k₁ both axles reach the adhesion at z = k₁', () => {
    const l = firstLock(loads, d, k1);
    expect(l.front_lock_braking_rate!).toBeCloseTo(k1, 9);
    expect(l.rear_lock_braking_rate!).toBeCloseTo(k1, 9);
  });
  it('on k = 0.2 the rear locks during pure regeneration at z = k(1 − ψ)/(1 + kχ) = 0.1/1.05', () => {
    // With r = 0.1 the regeneration alone covers z up to 0.1; there T2 = z P = 0.2 (0.5 − 0.25 z) P.
    const l = firstLock(loads, regenDistribution(friction, 0.1 * P, 0, regenFirst), 0.2);
    expect(l.first_axle).toBe('rear');
    expect(l.braking_rate).toBeCloseTo(0.1 / 1.05, 12);
  });
});

describe('maxAllowedRegenForce (N1 range: the rear may not lock first up to z = 0.50)', () => {
  it('k = 0.3: the flip is at r = 0.0375/0.7; "both" within 0.001 moves the limit to r = 0.161/2.98667', () => {
    // k = 0.3: z_F = (0.15 + 0.7r)/0.625 = 0.24 + 1.12 r;  z_R = (0.15 − 0.7r)/0.375 = 0.4 − 1.866667 r.
    // Equal at r = 0.16/2.986667 = 0.0535714 (= 0.0375/0.7). The design-file spec counts a lock within
    // 0.001 as "both", which is allowed; z_F − z_R = 0.001 at r = 0.161/2.986667 = 0.0539063.
    const rule = lockOrderRange('N1');
    const R = maxAllowedRegenForce(loads, friction, 0.3, 0, regenFirst, rule)!;
    // Solved exactly on the linear piece: 1.12 + 1.866667 = 1.12 + 28/15.
    expect(Math.abs(R - (0.161 / (1.12 + 28 / 15)) * P)).toBeLessThan(1e-6);
    expect(R / P).toBeGreaterThan(0.0375 / 0.7);
    expect(firstLock(loads, regenDistribution(friction, R * 1.01, 0, regenFirst), 0.3).first_axle).toBe('rear');
  });
  it('regeneration on the front axle never upsets the order: no limit (null)', () => {
    const rule = lockOrderRange('N1');
    expect(maxAllowedRegenForce(loads, friction, 0.3, 1, regenFirst, rule)).toBeNull();
  });
  it('a surface outside the rule range (k = 0.9) puts no limit', () => {
    expect(maxAllowedRegenForce(loads, friction, 0.9, 0, regenFirst, lockOrderRange('N1'))).toBeNull();
  });
});

describe('fixed_proportion blending (hand-derived)', () => {
  // q = 0.5 of the friction force added on the rear, capped at R = 0.04 P.
  // Friction rate z_f gives total z = 1.5 z_f until 0.5 z_f P = 0.04 P (z_f = 0.08, z = 0.12); then z = z_f + 0.04.
  const d = regenDistribution(friction, 0.04 * P, 0, { type: 'fixed_proportion', proportion: 0.5 });
  it('below the cap: z = 0.06 → z_f = 0.04, T1 = 0.028 P, T2 = 0.012 P + 0.02 P', () => {
    const f = forcesAt(d, 0.06);
    expect(f.front / P).toBeCloseTo(0.028, 12);
    expect(f.rear / P).toBeCloseTo(0.032, 12);
  });
  it('above the cap: z = 0.3 → z_f = 0.26, T1 = 0.182 P, T2 = 0.078 P + 0.04 P', () => {
    const f = forcesAt(d, 0.3);
    expect(f.front / P).toBeCloseTo(0.182, 12);
    expect(f.rear / P).toBeCloseTo(0.118, 12);
  });
});

describe('regenForceAt: constant torque, constant power, fade-out (hand-derived)', () => {
  // 300 N m × 9.5 / 0.345 m = 8260.87 N; 90 kW → base speed 90000/8260.87 = 10.8947 m/s (39.22 km/h).
  const s: RegenSetup = {
    maxForce: (300 * 9.5) / 0.345,
    maxPower: 90e3,
    fadeStart: 15 / 3.6,
    cutoff: 5 / 3.6,
    blending: regenFirst,
    frontShare: 0,
    radius: 0.345,
    gearRatio: 9.5,
    speeds: [],
  };
  it('base speed', () => expect(regenBaseSpeed(s) * 3.6).toBeCloseTo(39.221, 3));
  it('30 km/h: constant torque, 8260.87 N', () => expect(regenForceAt(s, 30 / 3.6)).toBeCloseTo(8260.87, 2));
  it('100 km/h: constant power, 90000/27.7778 = 3240 N', () => expect(regenForceAt(s, 100 / 3.6)).toBeCloseTo(3240, 6));
  it('10 km/h: half-way through the fade, 4130.43 N', () => expect(regenForceAt(s, 10 / 3.6)).toBeCloseTo(4130.43, 2));
  it('4 km/h: below the cut-off, none', () => expect(regenForceAt(s, 4 / 3.6)).toBe(0));
});

describe('regenAnalysis on a design file (schema and wiring)', () => {
  it('a cut-off above the fade start is refused, naming the field', async () => {
    const { readDesign, demoDesign } = await import('../../core/index.ts');
    const d = demoDesign();
    d.regen = { ...d.regen!, fade_start_kmh: 10, cutoff_kmh: 20 };
    const r = readDesign(d);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.some((e) => e.path === 'regen.cutoff_kmh')).toBe(true);
  });
  it('a front-drive design puts all regeneration on the front: no surface limit, no flag', async () => {
    const { demoDesign, evaluate } = await import('../../core/index.ts');
    const d = demoDesign();
    d.vehicle.drive = 'front';
    const g = evaluate(d).regen!;
    expect(g.front_share).toBe(1);
    expect(g.flags.filter((f) => f.kind === 'surface_lock')).toEqual([]);
    for (const st of g.load_states) for (const l of st.limits) if (l.in_rule_range) expect(l.max_force_n).toBeNull();
  });
});

describe('regenDistribution keeps T1 + T2 = z P (property, fast-check)', () => {
  // Definition of a distribution (core/distribution.ts, design-file spec "Physics"): the axle forces add up
  // to z P at every braking rate; adding regeneration must not break it, and R = 0 changes nothing.
  it('for random hydraulic distributions, forces and blendings', async () => {
    const fc = await import('fast-check');
    const { installedDistribution } = await import('../../core/installed-distribution.ts');
    fc.assert(
      fc.property(
        fc.record({
          G1: fc.double({ min: 1e-4, max: 5e-3, noNaN: true }),
          G2: fc.double({ min: 1e-4, max: 5e-3, noNaN: true }),
          th1: fc.double({ min: 0, max: 3e5, noNaN: true }),
          th2: fc.double({ min: 0, max: 5e5, noNaN: true }),
          knee: fc.double({ min: 1e5, max: 8e6, noNaN: true }),
          ratio: fc.double({ min: 0.1, max: 1, noNaN: true }),
          r: fc.double({ min: 0, max: 0.4, noNaN: true }),
          share: fc.double({ min: 0, max: 1, noNaN: true }),
          q: fc.double({ min: 0.05, max: 2, noNaN: true }),
          fixed: fc.boolean(),
          z: fc.double({ min: 0.001, max: 1.2, noNaN: true }),
        }),
        (x) => {
          const fr = installedDistribution({ P, G1: x.G1, G2: x.G2, threshold1: x.th1, threshold2: x.th2, valve: { knee: x.knee, ratio: x.ratio } });
          const blend = x.fixed ? ({ type: 'fixed_proportion', proportion: x.q } as const) : regenFirst;
          const d = regenDistribution(fr, x.r * P, x.share, blend);
          const f = forcesAt(d, x.z);
          expect(Math.abs(f.front + f.rear - x.z * P)).toBeLessThan(1e-6 * P);
          expect(f.front).toBeGreaterThanOrEqual(-1e-9 * P);
          expect(f.rear).toBeGreaterThanOrEqual(-1e-9 * P);
          expect(regenDistribution(fr, 0, x.share, blend)).toBe(fr);
        },
      ),
      { numRuns: 300 },
    );
  });
});
