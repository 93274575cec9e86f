/**
 * The ideal distribution.
 * Sources: 71/320/EEC Annex II Appendix point 3.1 (the ideal line f1 = f2 = z, symbols of point 2),
 * 71/320/EEC Annex II Appendix point 2;
 * T. Bevan, The Theory of Machines, ch. 8, Example 6.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { axleLoadModel, frontAxleLoad, rearAxleLoad } from '../../core/axle-loads.ts';
import { idealForces, idealFrontShare } from '../../core/ideal-distribution.ts';

const num = (min: number, max: number) => fc.double({ min, max, noNaN: true });

describe('ideal distribution', () => {
  it('on the ideal distribution f1 = f2 = z below lift-off (Appendix point 3.1)', () => {
    fc.assert(
      fc.property(num(500, 40000), num(0.3, 0.7), num(0.3, 1.5), num(2, 6), num(0.001, 1.5), (m, share, h, E, zRaw) => {
        const model = axleLoadModel(m, m * share, h, E);
        const z = Math.min(zRaw, 0.999 * model.zLift);
        const t = idealForces(model, z);
        expect(t.front / frontAxleLoad(model, z)).toBeCloseTo(z, 12);
        expect(t.rear / rearAxleLoad(model, z)).toBeCloseTo(z, 12);
        // T1 + T2 = z P on the ideal as on any distribution (Appendix point 3.1.3 with N1 + N2 = P)
        expect(Math.abs(t.front + t.rear - z * model.P)).toBeLessThan(1e-9 * model.P);
        // its front share is ψ + χ z (hand-derived: T1 / (zP) = N1 / P)
        expect(t.front / (z * model.P)).toBeCloseTo(idealFrontShare(model, z), 12);
      }),
    );
  });

  it('E1 (Bevan, ch. 8 Ex. 6): ideal front/rear ratio at z = μ = 0.6 is 1.21', () => {
    // Source inputs: L = 9.5 ft, h = 2.0 ft, CG 4.0 ft ahead of the rear axle (static front share 4/9.5).
    // Adaptation: feet converted to metres only for uniformity (χ = h/L is dimensionless); the
    // published ratio N_f/N_r = (l_r + μh)/(l_f − μh) is the ratio of ideal forces at z = μ.
    const ft = 0.3048; // NIST SP 811 B.8, exact
    const model = axleLoadModel(1000, (1000 * 4.0) / 9.5, 2.0 * ft, 9.5 * ft);
    const t = idealForces(model, 0.6);
    expect(t.front / t.rear).toBeCloseTo(1.21, 2); // published 1.21
    // hand-derived: (4.0 + 0.6 × 2.0)/(5.5 − 0.6 × 2.0) = 5.2/4.3
    expect(t.front / t.rear).toBeCloseTo(5.2 / 4.3, 12);
  });
});
