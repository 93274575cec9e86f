/**
 * Brake gain per axle.
 * Sources: design-file spec "Physics" (disc G = 2·2·μ·A_clamp·r_eff/R, A_clamp = Σ piston areas for a
 * sliding caliper, half of it for a fixed one; drum G = 2·C*·A_wc·r_drum/R);
 * T. H. Wentzell, Machine Design, Example 16.4, p. 361, as
 * recomputed in the FOSSEE companion); NIST SP 811 appendix B.8 for the inch and pound-force.
 */
import { describe, expect, it } from 'vitest';
import { brakeGain, clampArea, pistonArea } from '../../core/brake-gain.ts';
import { fromSI, TO_SI } from '../../core/units.ts';

describe('brake gain', () => {
  it('sliding and fixed calipers: the fixed caliper clamps with half the summed piston area', () => {
    // hand-derived: 4 pistons of 40 mm: Σ A = 4 · π/4 · 0.04² = π · 0.0016 = 5.0265e-3 m²
    const base = { type: 'disc' as const, piston_diameters_mm: [40, 40, 40, 40], effective_radius_m: 0.12, pad_friction: 0.4, threshold_pressure_bar: 0 };
    const sliding = { ...base, caliper: 'sliding' as const };
    const fixed = { ...base, caliper: 'fixed' as const };
    expect(clampArea(sliding)).toBeCloseTo(Math.PI * 0.0016, 15);
    expect(clampArea(fixed)).toBeCloseTo(Math.PI * 0.0008, 15);
    // G = 2·2·0.4·A·0.12/0.3 = 0.64 A
    expect(brakeGain(sliding, 0.3)).toBeCloseTo(0.64 * Math.PI * 0.0016, 15);
    expect(brakeGain(fixed, 0.3)).toBeCloseTo(0.64 * Math.PI * 0.0008, 15);
  });

  it('drum: G = 2·C*·A_wc·r/R (hand-derived: C* = 2, 22.2 mm, r = 0.127 m, R = 0.34 m)', () => {
    const g = brakeGain({ type: 'drum', wheel_cylinder_diameter_mm: 22.2, drum_radius_m: 0.127, brake_factor: 2, threshold_pressure_bar: 3 }, 0.34);
    const area = (Math.PI / 4) * 0.0222 ** 2; // 3.8708e-4 m²
    expect(g).toBeCloseTo((2 * 2 * area * 0.127) / 0.34, 15);
    expect(pistonArea(0.0222)).toBeCloseTo(area, 18);
  });

  describe('E4 (Wentzell, Machine Design, Ex. 16.4): 40 000 lb, 88 ft/s to rest in 400 ft, 10 braked wheels', () => {
    // Source: tyre radius 18 in, mean friction radius 10 in, lining friction 0.4, g = 32.2 ft/s².
    // a = V²/(2D) = 9.68 ft/s²; total torque (W a/g) r = 216 447.2 lbf·in; normal force per wheel for
    // one friction interface 5411.18 lbf (per pad of a two-pad disc half of that).
    // Adaptation: the 10 wheels are 5 axles of 2 brakes sharing equally. The engine gives the line
    // pressure per axle as (axle force)/G; the clamp (normal) force is pressure × piston area. A drum with
    // brake factor C* = μ = 0.4 has one friction interface whose normal force is the actuating force;
    // a sliding one-piston disc has two pads, each pressed with p·A.
    const gSource = 32.2;
    const W = 40000; // lb
    const a = 88 ** 2 / (2 * 400);
    const totalForceLbf = (W * a) / gSource;
    const perAxleN = toN(totalForceLbf / 5);
    const R = 18 * TO_SI.in;
    const r = 10 * TO_SI.in;
    function toN(lbf: number) {
      return lbf * TO_SI.lbf;
    }

    it('deceleration 9.68 ft/s² and total brake torque 216 447.2 lbf·in', () => {
      expect(a).toBeCloseTo(9.68, 10);
      // torque at the tyres = force × tyre radius, back in lbf·in
      expect(fromSI(perAxleN * 5, 'lbf') * 18).toBeCloseTo(216447.2, 1);
    });

    it('one friction interface (drum, C* = μ = 0.4): 5411.18 lbf normal force per wheel', () => {
      const dia = 25.4; // mm, any bore: the normal force does not depend on it
      const brake = { type: 'drum' as const, wheel_cylinder_diameter_mm: dia, drum_radius_m: r, brake_factor: 0.4, threshold_pressure_bar: 0 };
      const p = perAxleN / brakeGain(brake, R);
      expect(fromSI(p * pistonArea(dia * 1e-3), 'lbf')).toBeCloseTo(5411.18, 2);
    });

    it('two-pad disc (μ = 0.4 each side): half of it, 2705.59 lbf per pad', () => {
      const brake = { type: 'disc' as const, caliper: 'sliding' as const, piston_diameters_mm: [54], effective_radius_m: r, pad_friction: 0.4, threshold_pressure_bar: 0 };
      const p = perAxleN / brakeGain(brake, R);
      expect(fromSI(p * clampArea(brake), 'lbf')).toBeCloseTo(5411.18 / 2, 2);
    });
  });
});
