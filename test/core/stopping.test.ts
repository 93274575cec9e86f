// Stopping distances (core/stopping.ts).
// Sources: T. Bevan, The Theory of Machines, ch. 8, Example 6 (braking distance
// from 30 mph = 44 ft/s with rear brakes only 97.5 ft, front only 104 ft, all wheels at the limit 50.1 ft;
// g = 32.2 ft/s² there, 9.80665 m/s² here, a 0.08 % difference, inside the tolerance used), and hand
// derivations of the linear build-up ramp shown beside each check.
import { describe, expect, it } from 'vitest';
import { axleLoadModel } from '../../core/axle-loads.ts';
import type { Distribution } from '../../core/distribution.ts';
import { stopDistances, stoppingTable } from '../../core/stopping.ts';

const ft = 0.3048;
// E1 vehicle: L = 9.5 ft, h = 2.0 ft, CG 4.0 ft ahead of the rear axle → static front share 4/9.5.
const loads = axleLoadModel(1000, (1000 * 4) / 9.5, 2 * ft, 9.5 * ft);
const P = loads.P;
/** A fixed split: front share φ of the braking force at every braking rate. */
const fixedSplit = (phi: number): Distribution => ({ P, z: [0, 1], t1: [0, phi * P], t2: [0, (1 - phi) * P] });
const setup = { speedsKmh: [(44 * ft * 3.6)], reactionS: 0, buildUpS: 0, absFactor: 1 };

describe('stoppingTable against E1 (braking distance only)', () => {
  it('rear brakes only: the rear locks first, 97.5 ft', () => {
    const row = stoppingTable(loads, fixedSplit(0), [0.6], setup).find((r) => r.mode === 'no_abs')!;
    expect(row.first_axle).toBe('rear');
    expect(row.braking_m / ft).toBeCloseTo(97.5, 0);
    expect(Math.abs(row.braking_m / ft - 97.5)).toBeLessThan(0.3);
  });
  it('front brakes only: 104 ft', () => {
    const row = stoppingTable(loads, fixedSplit(1), [0.6], setup).find((r) => r.mode === 'no_abs')!;
    expect(row.first_axle).toBe('front');
    expect(Math.abs(row.braking_m / ft - 104)).toBeLessThan(0.5);
  });
  it('all wheels at the limit (ABS mode with factor 1): 50.1 ft', () => {
    const row = stoppingTable(loads, fixedSplit(0.5), [0.6], setup).find((r) => r.mode === 'abs')!;
    expect(row.braking_rate).toBe(0.6);
    expect(Math.abs(row.total_ft - 50.1)).toBeLessThan(0.1);
  });
  it('the ABS factor scales the deceleration: 0.9 × 0.6 g gives 50.1/0.9 ft', () => {
    const row = stoppingTable(loads, fixedSplit(0.5), [0.6], { ...setup, absFactor: 0.9 }).find((r) => r.mode === 'abs')!;
    expect(Math.abs(row.braking_m / ft - 50.1 / 0.9)).toBeLessThan(0.15);
  });
});

describe('stopDistances with reaction and a linear build-up (hand-derived)', () => {
  it('20 m/s, 5 m/s², reaction 1 s, build-up 1 s', () => {
    // reaction 20 m; ramp: v0 t_b − a t_b²/6 = 20 − 5/6 = 19.1667 m, speed left 20 − 5/2 = 17.5 m/s;
    // braking 17.5²/(2·5) = 30.625 m; total 69.7917 m = 228.97 ft.
    const d = stopDistances(20, 5, 1, 1);
    expect(d.reaction_m).toBeCloseTo(20, 10);
    expect(d.build_up_m).toBeCloseTo(19.16667, 4);
    expect(d.braking_m).toBeCloseTo(30.625, 10);
    expect(d.total_m).toBeCloseTo(69.79167, 4);
    expect(d.total_ft).toBeCloseTo(228.975, 2);
  });
  it('a ramp costs half its duration at the initial speed less a t_b²/24', () => {
    // total − v²/(2a) = v t_b/2 − a t_b²/24: expand (v − a t_b/2)²/(2a) + v t_b − a t_b²/6
    // = v²/(2a) − v t_b/2 + a t_b²/8 + v t_b − a t_b²/6. Here 25·0.8/2 − 6·0.64/24 = 10 − 0.16 = 9.84 m.
    const v = 25;
    const a = 6;
    const tb = 0.8;
    expect(stopDistances(v, a, 0, tb).total_m - (v * v) / (2 * a)).toBeCloseTo(9.84, 10);
  });
  it('a stop that ends during the ramp joins the other branch continuously at v0 = a t_b/2', () => {
    // At v0 = 2.5, a = 5, t_b = 1 the ramp ends exactly at rest: 2.5 − 5/6 = 1.6667 m either way.
    expect(stopDistances(2.5, 5, 0, 1).total_m).toBeCloseTo(1.666667, 6);
    expect(stopDistances(2.5 - 1e-9, 5, 0, 1).total_m).toBeCloseTo(1.666667, 6);
    // Slower than that: t_s = √(2 v0 t_b/a); v0 = 1, a = 5, t_b = 1 → t_s = 0.632456 s,
    // distance v0 t_s − a t_s³/(6 t_b) = 0.632456 − 0.210819 = 0.421637 m.
    expect(stopDistances(1, 5, 0, 1).total_m).toBeCloseTo(0.421637, 6);
  });
});
