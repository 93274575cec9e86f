/**
 * First lock and braking efficiency.
 * Sources: design-file spec "Physics" (first lock = smallest z with f1 or f2 = k; "both" when the two
 * rates differ by less than 0.001; efficiency = z / k), 71/320/EEC Annex II Appendix point 3.1.1
 * (f = T / N), 71/320/EEC Annex II Appendix point 2;
 * T. Bevan, The Theory of Machines, ch. 8, Example 6;
 * hand derivations in the comments.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { axleLoadModel } from '../../core/axle-loads.ts';
import type { Distribution } from '../../core/distribution.ts';
import { stateModels } from '../../core/evaluate.ts';
import { firstLock } from '../../core/lock-order.ts';
import { arbitraryDesign } from './arbitrary-design.ts';
import { limiting, loads, proportioning } from './hand-cases.ts';

/** A fixed split: front share φ at every z (one linear piece). */
function fixedSplit(P: number, phi: number): Distribution {
  return { P, z: [0, 1], t1: [0, phi * P], t2: [0, (1 - phi) * P] };
}

describe('E1 single-axle limits (T. Bevan, The Theory of Machines, ch. 8, Example 6)', () => {
  // Source: L = 9.5 ft, h = 2.0 ft, CG 4.0 ft ahead of the rear axle (l_f = 5.5 ft from the front),
  // 30 mph = 44 ft/s, μ = 0.6, g = 32.2 ft/s² (the source's g, kept as a parameter).
  // Adaptation: "front brakes only" is a fixed split φ = 1, "rear only" φ = 0; the engine's first lock
  // at k = μ gives the braking rate z, the source's deceleration is a = z g, distance v² / (2a).
  const gSource = 32.2;
  const v = 44;
  const model = axleLoadModel(1000, (1000 * 4.0) / 9.5, 2.0, 9.5); // feet in, χ = h/L is dimensionless

  it('rear brakes only: a = 9.93084 ft/s², 97.5 ft', () => {
    const l = firstLock(model, fixedSplit(model.P, 0), 0.6);
    expect(l.first_axle).toBe('rear');
    expect(l.braking_rate * gSource).toBeCloseTo(9.93084, 4); // published/recomputed 9.93084 ft/s²
    expect(v ** 2 / (2 * l.braking_rate * gSource)).toBeCloseTo(97.5, 1); // published 97.5 ft
  });

  it('front brakes only: a = 9.31084 ft/s², 104 ft', () => {
    const l = firstLock(model, fixedSplit(model.P, 1), 0.6);
    expect(l.first_axle).toBe('front');
    expect(l.braking_rate * gSource).toBeCloseTo(9.31084, 4); // 9.31084 ft/s²
    expect(Math.round(v ** 2 / (2 * l.braking_rate * gSource))).toBe(104); // published 104 ft
  });

  it('all wheels at the limit: a = μ g, 50.1 ft (split set to the ideal share at z = μ)', () => {
    // The ideal front share at z = μ is ψ + χμ (Appendix point 3.1); with that fixed split both axles
    // reach μ together at z = μ.
    const phi = model.psi + model.chi * 0.6;
    const l = firstLock(model, fixedSplit(model.P, phi), 0.6);
    expect(l.first_axle).toBe('both');
    expect(l.braking_rate).toBeCloseTo(0.6, 12);
    expect(v ** 2 / (2 * l.braking_rate * gSource)).toBeCloseTo(50.1, 1); // published 50.1 ft
    expect(l.efficiency).toBeCloseTo(1, 12);
  });
});

describe('hand-derived first locks (see hand-cases.ts: ψ = 0.5, χ = 0.25, φ = 0.6)', () => {
  it('limiting valve, knee 50 bar (z = 0.5), k = 0.5: rear first at z = 10/21', () => {
    // Below the knee f2 = 0.4z/(0.5 − 0.25z) = 0.5 → 0.4z = 0.25 − 0.125z → z = 0.25/0.525 = 10/21 ≈ 0.47619 (< 0.5 ✓)
    // Front: below the knee 0.6z = 0.5(0.5 + 0.25z) → z = 0.25/0.475 = 0.526 > 0.5, so above the knee
    //   T1/P = z − 0.2: z − 0.2 = 0.25 + 0.125z → z = 0.45/0.875 = 0.5142857
    const l = firstLock(loads, limiting, 0.5);
    expect(l.first_axle).toBe('rear');
    expect(l.braking_rate).toBeCloseTo(10 / 21, 12);
    expect(l.efficiency).toBeCloseTo(20 / 21, 12); // z / k
    expect(l.front_lock_braking_rate).toBeCloseTo(0.45 / 0.875, 12);
  });

  it('limiting valve, k = 0.8: front first at z = 0.75', () => {
    // Rear below the knee: 0.4z = 0.8(0.5 − 0.25z) → z = 0.4/0.6 = 0.667 > 0.5, not on that piece;
    //   above: f2 = 0.2/(0.5 − 0.25z) = 0.8 → z = 1.0
    // Front above the knee: z − 0.2 = 0.8(0.5 + 0.25z) = 0.4 + 0.2z → z = 0.6/0.8 = 0.75
    const l = firstLock(loads, limiting, 0.8);
    expect(l.first_axle).toBe('front');
    expect(l.braking_rate).toBeCloseTo(0.75, 12);
    expect(l.efficiency).toBeCloseTo(0.9375, 12);
    expect(l.rear_lock_braking_rate).toBeCloseTo(1.0, 12);
  });

  it('proportioning valve 30 bar / 0.25, k = 0.8: front first at z = 3.34/4.6', () => {
    // Above the knee (z > 0.3): T1/P = (6/7)(z − 0.09), T2/P = (z + 0.54)/7.
    // Front: (6/7)(z − 0.09) = 0.8(0.5 + 0.25z) → (6/7 − 0.2) z = 0.4 + 0.54/7 → z = 3.34/4.6 ≈ 0.726087
    // Rear: (z + 0.54)/7 = 0.8(0.5 − 0.25z) → z + 0.54 = 2.8 − 1.4z → z = 2.26/2.4 ≈ 0.941667
    const l = firstLock(loads, proportioning, 0.8);
    expect(l.first_axle).toBe('front');
    expect(l.braking_rate).toBeCloseTo(3.34 / 4.6, 12);
    expect(l.rear_lock_braking_rate).toBeCloseTo(2.26 / 2.4, 12);
    expect(l.efficiency).toBeCloseTo(3.34 / 4.6 / 0.8, 12);
  });

  it('"both" only when the two rates differ by less than 0.001 (design-file spec)', () => {
    // Fixed split φ on the hand-case vehicle: f1 = φ z/(0.5 + 0.25z), f2 = (1 − φ) z/(0.5 − 0.25z).
    // With φ = 0.5 + 0.25 k both reach k at z = k exactly (the ideal share at z = k).
    const k = 0.6;
    const exact = firstLock(loads, fixedSplit(loads.P, 0.5 + 0.25 * k), k);
    expect(exact.first_axle).toBe('both');
    // Front at z1 = 0.5k/(φ − 0.25k), rear at z2 = 0.5k/(1 − φ + 0.25k) (hand-derived from the lines above).
    const rates = (phi: number) => [(0.5 * k) / (phi - 0.25 * k), (0.5 * k) / (1 - phi + 0.25 * k)] as const;
    for (const phi of [0.6505, 0.6495, 0.652, 0.648]) {
      const [z1, z2] = rates(phi);
      const l = firstLock(loads, fixedSplit(loads.P, phi), k);
      expect(l.braking_rate).toBeCloseTo(Math.min(z1, z2), 12);
      expect(l.first_axle).toBe(Math.abs(z1 - z2) < 0.001 ? 'both' : z1 < z2 ? 'front' : 'rear');
    }
  });
});

describe('properties over random valid designs (fast-check)', () => {
  it('first-lock braking rate ≤ k and efficiency never above 1 (Appendix points 2 and 3.1.3: z = (f1N1 + f2N2)/P ≤ k)', () => {
    fc.assert(
      fc.property(arbitraryDesign, fc.double({ min: 0.05, max: 1.5, noNaN: true }), (design, k) => {
        for (const s of stateModels(design)) {
          const l = firstLock(s.loads, s.dist, k);
          expect(l.braking_rate).toBeLessThanOrEqual(k * (1 + 1e-12));
          expect(l.efficiency).toBeLessThanOrEqual(1 + 1e-12);
          expect(l.braking_rate).toBeGreaterThan(0);
        }
      }),
      { numRuns: 300 },
    );
  });
});
