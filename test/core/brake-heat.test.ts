// Brake heat (core/brake-heat.ts).
// Sources: U. C. Jindal, Machine Design, Example 23-5, p. 621 (1100 kg from 65 km/h, four
// brakes sharing equally, 12 kg drums, c = 460 J/(kg K), rotating parts +10 %, no loss during the stop:
// 49 307.97 J per brake, 8.93 K); ½ m v² (kinetic energy, common practice, no source needed beyond
// mechanics); Type-I parameters of 71/320/EEC Annex II 1.3, verified;
// hand derivations for the cooling model.
import { describe, expect, it } from 'vitest';
import { G_N } from '../../core/constants.ts';
import type { Distribution } from '../../core/distribution.ts';
import {
  frontEnergyShare,
  type HeatSetup,
  rotorFadeRun,
  rotorTemperatureRise,
  stopEnergy,
  stopHeat,
  typeIParameters,
} from '../../core/brake-heat.ts';

describe('energy and temperature rise per stop', () => {
  it('E5: 49 307.97 J per brake and 8.93 K', () => {
    const perBrake = stopEnergy(1100, 65 / 3.6, 0, 0.1) / 4;
    expect(perBrake).toBeCloseTo(49307.97, 1);
    expect(rotorTemperatureRise(perBrake, 12, 460, 1)).toBeCloseTo(8.93, 2);
  });
  it('without rotating parts a stop releases ½ m v²', () => {
    // 3500 kg from 100 km/h: ½ · 3500 · 27.7778² = 1 350 308.6 J.
    expect(stopEnergy(3500, 100 / 3.6, 0)).toBeCloseTo(1350308.6, 0);
    // From v1 to v2: ½ m (v1² − v2²); 1000 kg, 20 → 10 m/s: 150 000 J.
    expect(stopEnergy(1000, 20, 10)).toBeCloseTo(150000, 8);
  });
  it('splits the energy by the installed distribution: front share 0.7 → 70 % front, two brakes per axle', () => {
    const P = 1000 * G_N;
    const d: Distribution = { P, z: [0, 1], t1: [0, 0.7 * P], t2: [0, 0.3 * P] };
    expect(frontEnergyShare(d, 0.5)).toBeCloseTo(0.7, 12);
    const s: HeatSetup = { c: 460, share: 1, b: 0, ambient: 20, rotating: 0, frontRotorKg: 10, rearRotorKg: 5 };
    const row = stopHeat('x', 1000, d, 20, 0, 0.5, s);
    // E = 200 000 J; front 140 000 J → 70 000 J per brake → 70 000/(10·460) = 15.2174 K;
    // rear 60 000 J → 30 000 J per brake → 30 000/(5·460) = 13.0435 K.
    expect(row.front_brake_energy_j).toBeCloseTo(70000, 6);
    expect(row.front_rotor_rise_k).toBeCloseTo(15.2174, 4);
    expect(row.rear_rotor_rise_k).toBeCloseTo(13.0435, 4);
  });
});

describe('Type-I-like repeated stops', () => {
  it('parameters per category (71/320/EEC Annex II 1.3)', () => {
    expect(typeIParameters('M1')).toEqual({ vCapKmh: 120, intervalS: 45, cycles: 15 });
    expect(typeIParameters('N1')).toEqual({ vCapKmh: 120, intervalS: 55, cycles: 15 });
    expect(typeIParameters('M2')).toEqual({ vCapKmh: 100, intervalS: 55, cycles: 15 });
    expect(typeIParameters('N3')).toEqual({ vCapKmh: 60, intervalS: 60, cycles: 20 });
  });
  const v1 = 120 / 3.6;
  const v2 = v1 / 2;
  // One braking, one rotor taking half of a 0.7 axle share, share into the rotor 0.9, 8 kg, c = 460:
  // energy ½·2000·(33.333² − 16.667²) = 833 333.3 J → rotor 0.9·0.35·833 333.3 = 262 500 J → 71.3315 K.
  const rise = 262500 / (8 * 460);
  it('without cooling every cycle adds the same rise: 15 cycles → 15 × 71.3315 K', () => {
    const s: HeatSetup = { c: 460, share: 0.9, b: 0, ambient: 20, rotating: 0, frontRotorKg: 8, rearRotorKg: 8 };
    const peaks = rotorFadeRun(2000, 0.7, 8, v1, v2, 3, 55, 15, s);
    expect(peaks[0]! - 20).toBeCloseTo(rise, 6);
    expect(peaks[14]! - 20).toBeCloseTo(15 * rise, 4);
  });
  it('with cooling the peaks follow the geometric series of a pulse train (within the braking-time smear)', () => {
    // Heat put in as a pulse at the end of each braking and cooling by e^(−bΔt) over each 55 s cycle:
    // peak_n = ΔT (1 − ρⁿ)/(1 − ρ), ρ = e^(−0.004·55) = 0.802519. The braking lasts 16.67/3 = 5.56 s,
    // during which early heat already cools, so the model lies a little below; allow 1.5 %.
    const s: HeatSetup = { c: 460, share: 0.9, b: 0.004, ambient: 20, rotating: 0, frontRotorKg: 8, rearRotorKg: 8 };
    const peaks = rotorFadeRun(2000, 0.7, 8, v1, v2, 3, 55, 15, s);
    const rho = Math.exp(-0.004 * 55);
    const series = (n: number) => (rise * (1 - rho ** n)) / (1 - rho);
    expect((peaks[14]! - 20) / series(15)).toBeGreaterThan(0.985);
    expect((peaks[14]! - 20) / series(15)).toBeLessThanOrEqual(1);
    expect((peaks[0]! - 20) / series(1)).toBeGreaterThan(0.985);
  });
});

describe('heat block validation', () => {
  it('a base-vehicle front axle load not below its mass is refused, naming the field', async () => {
    const { demoDesign, readDesign } = await import('../../core/index.ts');
    const d = demoDesign();
    d.heat = { ...d.heat!, base_vehicle_mass_kg: 1500, base_vehicle_front_axle_kg: 1500 };
    const r = readDesign(d);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.map((e) => e.path)).toContain('heat.base_vehicle_front_axle_kg');
  });
});
