/**
 * Real roots of small polynomials on an interval (core/checks/polynomial.ts). Expected roots are
 * the factors the polynomials are built from (hand-derived: (z − a)(z − b)… expanded).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { polyEval, polyMul, polyRootsIn } from '../../../core/checks/polynomial.ts';

describe('polyRootsIn', () => {
  it('finds the roots of (z − 0.2)(z − 0.5)(z − 0.9) inside [0, 1] and only those inside [0.3, 1]', () => {
    const p = polyMul(polyMul([-0.2, 1], [-0.5, 1]), [-0.9, 1]);
    const r = polyRootsIn(p, 0, 1);
    expect(r.length).toBe(3);
    [0.2, 0.5, 0.9].forEach((x, i) => expect(r[i]!).toBeCloseTo(x, 12));
    expect(polyRootsIn(p, 0.3, 1).length).toBe(2);
  });

  it('finds a double (touching) root: (z − 0.4)² (z + 3)', () => {
    const p = polyMul(polyMul([-0.4, 1], [-0.4, 1]), [3, 1]);
    const r = polyRootsIn(p, 0, 1);
    expect(r.length).toBe(1);
    expect(r[0]!).toBeCloseTo(0.4, 6);
  });

  it('gives nothing for a constant and for z² + 1', () => {
    expect(polyRootsIn([2], 0, 1)).toEqual([]);
    expect(polyRootsIn([1, 0, 1], -5, 5)).toEqual([]);
  });

  it('property: every simple root of a product of four linear factors in [0, 1] is found', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0.01, max: 0.99, noNaN: true }), { minLength: 1, maxLength: 4 }), (roots) => {
        const distinct = roots.filter((x, i) => roots.every((y, j) => j >= i || Math.abs(x - y) > 1e-3));
        const p = distinct.reduce((acc, x) => polyMul(acc, [-x, 1]), [1] as number[]);
        const found = polyRootsIn(p, 0, 1);
        for (const x of distinct) expect(found.some((f) => Math.abs(f - x) < 1e-7)).toBe(true);
        for (const f of found) expect(Math.abs(polyEval(p, f))).toBeLessThan(1e-9);
      }),
      { numRuns: 200 },
    );
  });
});
