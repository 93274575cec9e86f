/**
 * Axle loads under braking.
 * Sources: 71/320/EEC Annex II Appendix, point 2 (symbols P, P1, P2, h, E, χ = h/E, z) and point 3.1.3
 * (N1 = P1 + z h P / E, N2 = P2 − z h P / E), 71/320/EEC Annex II Appendix
 * point 3.1.3; R. Limpert, "Motorcycle
 * Braking Dynamics", 2008, section 2.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { axleLoadModel, frontAxleLoad, rearAxleLoad } from '../../core/axle-loads.ts';
import { G_N } from '../../core/constants.ts';
import { fromSI, TO_SI } from '../../core/units.ts';

const num = (min: number, max: number) => fc.double({ min, max, noNaN: true });

describe('axle loads (71/320/EEC Annex II Appendix points 2 and 3.1.3)', () => {
  it('N1 + N2 = P at every braking rate (Appendix point 3.1.3: the transfer z h P / E moves load, it adds none)', () => {
    fc.assert(
      fc.property(num(50, 60000), num(0.05, 0.95), num(0.1, 2), num(1, 8), num(0, 2), (m, share, h, E, z) => {
        const model = axleLoadModel(m, m * share, h, E);
        const sum = frontAxleLoad(model, z) + rearAxleLoad(model, z);
        expect(Math.abs(sum - model.P)).toBeLessThanOrEqual(1e-9 * model.P);
      }),
    );
  });

  it('static loads: P = m g_n with g_n = 9.80665 m/s² (NIST SP 811 appendix B.8), P2 = P − P1', () => {
    const model = axleLoadModel(2000, 1100, 0.6, 3);
    expect(model.P).toBe(2000 * 9.80665);
    expect(model.P1).toBe(1100 * 9.80665);
    expect(model.P2).toBeCloseTo(900 * 9.80665, 9);
    expect(model.chi).toBeCloseTo(0.2, 15); // χ = h / E, Appendix point 2
  });

  it('rear-axle lift-off where N2 = 0: z = P2 / (χ P) (Appendix point 3.1.3 solved for N2 = 0, hand-derived)', () => {
    // hand-derived: m = 2000 kg, front 1100 kg → P2 / P = 0.45; χ = 0.6 / 3 = 0.2 → z_lift = 0.45 / 0.2 = 2.25
    const model = axleLoadModel(2000, 1100, 0.6, 3);
    expect(model.zLift).toBeCloseTo(2.25, 12);
    expect(Math.abs(rearAxleLoad(model, model.zLift))).toBeLessThan(1e-9 * model.P);
  });

  it('E2 (Limpert 2008, section 2): W = 700 lb, χ = 0.5, a = 0.7 g → front normal force rises by 245 lb', () => {
    // Adaptation: the source's weight W in lb equals the mass in lb times g_n, so the engine gets the
    // mass 700 lb in kg and the increase is read back in lbf (1 lbf = 1 lb × g_n, NIST SP 811 B.8).
    // χ = h / E = 0.5 with h = 1 m, E = 2 m; the static share Ψ does not enter the increase (taken 0.4).
    // The source's g cancels (a is in g), so no g parameter is needed here.
    const massKg = 700 * TO_SI.lb;
    const model = axleLoadModel(massKg, 0.4 * massKg, 1, 2);
    const increase = fromSI(frontAxleLoad(model, 0.7) - model.P1, 'lbf');
    expect(increase).toBeCloseTo(245, 9); // published 245 lb (exact)
    // and the rear loses the same (N1 + N2 = P)
    expect(fromSI(model.P2 - rearAxleLoad(model, 0.7), 'lbf')).toBeCloseTo(245, 9);
    // F_zF = (1 − Ψ_rear + χ a) W with Ψ_rear = 0.6: (0.4 + 0.35) × 700 = 525 lb
    expect(fromSI(frontAxleLoad(model, 0.7), 'lbf')).toBeCloseTo(525, 9);
    expect(G_N).toBe(9.80665);
  });
});
