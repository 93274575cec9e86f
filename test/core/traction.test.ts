// Traction limits (core/traction.ts).
// Sources: traction-limited acceleration without load transfer (physicshelpforum.com/threads/dynamic.2565;
// wyzant.com/resources/answers/5249; Q&A sites, arithmetic checked), R. N. Jazar, Vehicle Dynamics: Theory
// and Application (2008), eqs. 2.118–2.120, p. 55, and the load-transfer forms checked with T. Bevan,
// The Theory of Machines, ch. 8, Example 6, through a mirror argument explained below.
import { describe, expect, it } from 'vitest';
import { axleLoadModel } from '../../core/axle-loads.ts';
import { G_N } from '../../core/constants.ts';
import { driveAxleLoadOnGradient, maxAccelerationG, tractionTable } from '../../core/traction.ts';

const ideal = { allWheelFrontShare: null, rollingResistance: 0 };
// A CG height the engine accepts but small enough to make load transfer vanish to 1e-9 (the h = 0 case).
const H_ZERO = 1e-12;

describe('maxAccelerationG without load transfer (E6, h = 0)', () => {
  // E6 (physicshelpforum.com/threads/dynamic.2565): 60 % on the front, μ = 0.80, g = 9.81:
  // a_FWD = 4.7088 m/s², a_RWD = 3.1392 m/s²; from rest over 50 m, FWD 78.1 km/h, RWD 63.8 km/h.
  const loads = axleLoadModel(1000, 600, H_ZERO, 2.5);
  const gSource = 9.81;
  it('front drive: 0.8 × 0.6 g', () => {
    const a = maxAccelerationG(loads, 'front', 0.8, ideal).x * gSource;
    expect(a).toBeCloseTo(4.7088, 4);
    expect(Math.sqrt(2 * a * 50) * 3.6).toBeCloseTo(78.1, 1);
  });
  it('rear drive: 0.8 × 0.4 g', () => {
    const a = maxAccelerationG(loads, 'rear', 0.8, ideal).x * gSource;
    expect(a).toBeCloseTo(3.1392, 4);
    expect(Math.sqrt(2 * a * 50) * 3.6).toBeCloseTo(63.8, 1);
  });
  it('rear drive, 48 % on the drive wheels, μ = 0.60, g = 9.8: 2.82 m/s², 0–105 km/h in 10.3 s (E6, wyzant 5249)', () => {
    const l = axleLoadModel(1000, 520, H_ZERO, 2.5);
    const a = maxAccelerationG(l, 'rear', 0.6, ideal).x * 9.8;
    expect(a).toBeCloseTo(2.82, 2);
    expect(105 / 3.6 / a).toBeCloseTo(10.3, 1);
  });
  it('all-wheel drive, ideal split, μ = 1: 0–100 km/h in 27.78/g ≈ 2.83 s (E6, Jazar eqs. 2.118–2.120)', () => {
    const a = maxAccelerationG(loads, 'all', 1, ideal).x * G_N;
    expect(100 / 3.6 / a).toBeCloseTo(2.83, 2);
  });
});

describe('maxAccelerationG with load transfer (E6 forms; E1 numbers by mirror)', () => {
  // E1: L = 9.5 ft, h = 2.0 ft, CG 4.0 ft ahead of the rear axle, μ = 0.6, g = 32.2 ft/s²:
  //   rear brakes only  a = μ g l_f/(L + μ h) = 9.93084 ft/s²;  front brakes only  a = μ g l_r/(L − μ h) = 9.31084 ft/s².
  // Mirror: braking moves load forward, accelerating moves it backward. Turn the vehicle round (CG 4.0 ft
  // behind the front axle, static front share 5.5/9.5): the forces of E1's braking vehicle become those of
  // this vehicle accelerating. E1's rear axle (the one that unloads) is now the front, so
  //   front drive a = μ g (l_r/L)/(1 + μ h/L) = 0.6·32.2·5.5/10.7 = 9.93084 ft/s² (E6 FWD form),
  //   rear drive  a = μ g (l_f/L)/(1 − μ h/L) = 0.6·32.2·4.0/8.3 = 9.31084 ft/s² (E6 RWD form).
  const ft = 0.3048;
  const loads = axleLoadModel(1000, (1000 * 5.5) / 9.5, 2.0 * ft, 9.5 * ft);
  it('front drive equals E1 rear-brakes-only: 9.93084 ft/s²', () => {
    expect(maxAccelerationG(loads, 'front', 0.6, ideal).x * 32.2).toBeCloseTo(9.93084, 4);
  });
  it('rear drive equals E1 front-brakes-only: 9.31084 ft/s²', () => {
    expect(maxAccelerationG(loads, 'rear', 0.6, ideal).x * 32.2).toBeCloseTo(9.31084, 4);
  });
  it('all-wheel drive, ideal split: a = μ g (E6)', () => {
    expect(maxAccelerationG(loads, 'all', 0.6, ideal).x).toBeCloseTo(0.6, 12);
  });
  it('all-wheel with a fixed split of 1 or 0 is front or rear drive (limits of the E6 forms)', () => {
    const f = maxAccelerationG(loads, 'all', 0.6, { allWheelFrontShare: 1, rollingResistance: 0 });
    const r = maxAccelerationG(loads, 'all', 0.6, { allWheelFrontShare: 0, rollingResistance: 0 });
    expect(f.x * 32.2).toBeCloseTo(9.93084, 4);
    expect(r.x * 32.2).toBeCloseTo(9.31084, 4);
  });
  it('all-wheel, fixed split 0.4 front: the axle that saturates first sets the limit (hand-derived)', () => {
    // ψ = 5.5/9.5 = 0.578947, χ = 2/9.5 = 0.210526, μ = 0.6, s = 0.4:
    //   front bound x = μψ/(s + μχ) = 0.347368/0.526316 = 0.660000
    //   rear bound  x = μ(1 − ψ)/(1 − s − μχ) = 0.252632/0.473684 = 0.533333 → rear axle limits.
    const r = maxAccelerationG(loads, 'all', 0.6, { allWheelFrontShare: 0.4, rollingResistance: 0 });
    expect(r.x).toBeCloseTo(0.533333, 5);
    expect(r.limitedBy).toBe('rear_axle');
  });
});

describe('gradient and rolling resistance (hand-derived)', () => {
  it('rolling resistance lowers the front-drive limit to (μψ − f_r)/(1 + μχ)', () => {
    // ψ = 0.6, χ = 0.5/2.5 = 0.2, μ = 0.5, f_r = 0.015: (0.3 − 0.015)/(1.1) = 0.259091
    const loads = axleLoadModel(1000, 600, 0.5, 2.5);
    const r = maxAccelerationG(loads, 'front', 0.5, { allWheelFrontShare: null, rollingResistance: 0.015 });
    expect(r.x).toBeCloseTo(0.259091, 6);
  });
  it('steepest start gradient of a rear-drive van and the rear axle load on it', () => {
    // m = 2000 kg, front 1000 kg, h = 0.8 m, E = 3.2 m → ψ = 0.5, χ = 0.25; μ = 0.3:
    //   tanθ = μ(1−ψ)/(1 − μχ) = 0.15/0.925 = 0.162162 → 16.2162 %;
    //   cosθ = 1/√(1 + 0.162162²) = 0.987124, sinθ = 0.160074;
    //   N2 = P((1−ψ) cosθ + χ sinθ) = 19613.3 × (0.493562 + 0.040019) = 10465.3 N;
    //   check: μ N2 = 3139.6 N = P sinθ = 19613.3 × 0.160074 = 3139.6 N.
    const loads = axleLoadModel(2000, 1000, 0.8, 3.2);
    const row = tractionTable(loads, 'rear', [0.3], ideal).find((t) => t.drive === 'rear')!;
    expect(row.max_gradient_pct).toBeCloseTo(16.2162, 3);
    expect(row.drive_axle_load_on_gradient_n).toBeCloseTo(10465.3, 0);
    expect(0.3 * driveAxleLoadOnGradient(loads, 'rear', 0.162162162)).toBeCloseTo(loads.P * 0.160074, 0);
  });
  it('lists the design drive first, then the two others, each surface once', () => {
    const loads = axleLoadModel(2000, 1000, 0.8, 3.2);
    const t = tractionTable(loads, 'rear', [0.3, 0.8], ideal);
    expect(t.map((r) => r.drive)).toEqual(['rear', 'rear', 'front', 'front', 'all', 'all']);
    expect(t.filter((r) => r.is_design_drive).length).toBe(2);
  });
});
