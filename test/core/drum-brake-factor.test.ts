/**
 * Drum brake factor against lining friction (core/drum-brake-factor.ts): simple rigid-shoe formulas,
 * from memory (leading shoe μH/(K − μ), trailing μH/(K + μ), K = 1), scaled to the nominal C* at μ 0.38.
 * Hand calculation for +15 % friction, μ 0.38 → 0.437:
 *   leading-trailing 2μK/(K² − μ²): 0.76/0.8556 = 0.88827 → 0.874/0.809031 = 1.08030; C* 2.2 → 2.2 · 1.21619 = 2.6756
 *   two-leading 2μ/(K − μ): 0.612903 → 0.776199 (per shoe); C* 2.2 → 2.2 · 1.26643 = 2.7862
 *   duo-servo C_L(2 + C_L): nominal 4.0 → C_L = −1 + √5 = 1.23607, H = 1.23607 / 0.612903 = 2.01675;
 *     at 0.437 C_L = 2.01675 · 0.776199 = 1.56540, C* = 1.56540 · 3.56540 = 5.5813
 */
import { describe, expect, it } from 'vitest';
import { brakeFactorAtFriction } from '../../core/drum-brake-factor.ts';

describe('drum brake factor as a function of lining friction', () => {
  it('each arrangement gives the nominal C* at the nominal friction', () => {
    for (const a of ['leading_trailing', 'two_leading', 'duo_servo'] as const) expect(brakeFactorAtFriction(a, 2.2, 0.38)).toBeCloseTo(2.2, 12);
  });
  it('+15 % friction: leading-trailing 2.6756, two-leading 2.7862, duo-servo (4.0) 5.5813', () => {
    expect(brakeFactorAtFriction('leading_trailing', 2.2, 0.437)).toBeCloseTo(2.6756, 3);
    expect(brakeFactorAtFriction('two_leading', 2.2, 0.437)).toBeCloseTo(2.7862, 3);
    expect(brakeFactorAtFriction('duo_servo', 4.0, 0.437)).toBeCloseTo(5.5813, 3);
  });
  it('every arrangement rises faster than in proportion to μ (self-energising shoes)', () => {
    for (const a of ['leading_trailing', 'two_leading', 'duo_servo'] as const) expect(brakeFactorAtFriction(a, 2.2, 0.437) / 2.2).toBeGreaterThan(1.15);
  });
});
