/**
 * The installed distribution and the line pressure for a braking rate.
 * Sources: design-file spec "Physics" (T1 = G1 max(0, p1 − threshold1), T2 = G2 max(0, p2 − threshold2),
 * p solves T1 + T2 = z P exactly on the piecewise-linear characteristic); 71/320/EEC Annex II Appendix
 * point 2 (z, P, T1, T2); hand derivations in the comments.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { forcesAt, forcesAlong } from '../../core/distribution.ts';
import { stateModels } from '../../core/evaluate.ts';
import { installedDistribution } from '../../core/installed-distribution.ts';
import { arbitraryDesign } from './arbitrary-design.ts';
import { loads, proportioning } from './hand-cases.ts';

const P = loads.P;
const per100bar = P / 1e7;

describe('pressure solved on the characteristic (hand-derived)', () => {
  // G1 = 0.6P and G2 = 0.4P per 100 bar; thresholds 1 bar front, 5 bar rear; no valve. With x in bar:
  // 1 ≤ x ≤ 5: z = 0.006(x − 1) (front alone, up to z = 0.024); x ≥ 5: z = 0.01x − 0.026.
  const d = installedDistribution({ P, G1: 0.6 * per100bar, G2: 0.4 * per100bar, threshold1: 1e5, threshold2: 5e5, valve: { knee: Infinity, ratio: 1 } });

  it('z = 0.5 → x = 52.6 bar, T1 = 0.3096 P, T2 = 0.1904 P', () => {
    const f = forcesAt(d, 0.5);
    expect(f.p).toBeCloseTo(52.6e5, 4);
    expect(f.p2).toBeCloseTo(52.6e5, 4);
    expect(f.front / P).toBeCloseTo(0.3096, 12);
    expect(f.rear / P).toBeCloseTo(0.1904, 12);
  });

  it('z = 0.01 (front alone) → x = 1 + 0.01/0.006 = 2.6667 bar, T2 = 0', () => {
    const f = forcesAt(d, 0.01);
    expect(f.p).toBeCloseTo((1 + 0.01 / 0.006) * 1e5, 4);
    expect(f.rear).toBe(0);
    expect(f.front / P).toBeCloseTo(0.01, 12);
  });

  it('the rear starts at z = 0.024, x = 5 bar (a breakpoint of the characteristic)', () => {
    expect(d.z.some((z) => Math.abs(z - 0.024) < 1e-12)).toBe(true);
    expect(forcesAt(d, 0.024).p).toBeCloseTo(5e5, 4);
  });

  it('proportioning 30 bar / 0.25 (hand-cases.ts): z = 0.5 → x = (0.5 − 0.09)/0.007 = 58.571 bar, rear 37.143 bar', () => {
    const f = forcesAt(proportioning, 0.5);
    const x = (0.5 - 0.09) / 0.007;
    expect(f.p).toBeCloseTo(x * 1e5, 4);
    expect(f.p2).toBeCloseTo((30 + 0.25 * (x - 30)) * 1e5, 4);
  });
});

describe('properties over random valid designs (fast-check)', () => {
  it('T1 + T2 = z P to 1e-9 relative, forces and pressures non-negative and non-decreasing', () => {
    fc.assert(
      fc.property(arbitraryDesign, fc.array(fc.double({ min: 1e-6, max: 1.5, noNaN: true }), { minLength: 2, maxLength: 20 }), (design, zs) => {
        zs.sort((a, b) => a - b);
        for (const s of stateModels(design)) {
          let prev = { front: 0, rear: 0, p: 0, p2: 0 };
          for (const z of zs) {
            const f = forcesAt(s.dist, z);
            expect(Math.abs(f.front + f.rear - z * s.loads.P)).toBeLessThanOrEqual(1e-9 * z * s.loads.P);
            expect(f.front).toBeGreaterThanOrEqual(prev.front - 1e-9 * s.loads.P);
            expect(f.p).toBeGreaterThanOrEqual(prev.p - 1e-3);
            // a travel-sensing valve lowers its knee as the rear unloads: with a steep table the rear line
            // pressure (and force) may fall as z rises (p2 = r·p + (1 − r)·K(z)), so only the static law is monotone
            if (!s.sensing) {
              expect(f.rear).toBeGreaterThanOrEqual(prev.rear - 1e-9 * s.loads.P);
              expect(f.p2).toBeGreaterThanOrEqual(prev.p2 - 1e-3);
            }
            // the pressure really produces the forces: T1 = G1 max(0, p − threshold1), same for the rear
            expect(f.front).toBeCloseTo(s.G1 * Math.max(0, f.p - s.threshold1), 6);
            expect(f.rear).toBeCloseTo(s.G2 * Math.max(0, f.p2 - s.threshold2), 6);
            prev = f;
          }
          // forcesAlong walks the same pieces: identical values
          const along = forcesAlong(s.dist, zs);
          zs.forEach((z, i) => {
            const f = forcesAt(s.dist, z);
            expect(along.front[i]).toBe(f.front);
            expect(along.rear[i]).toBe(f.rear);
            expect(along.p[i]).toBe(f.p);
            expect(along.p2[i]).toBe(f.p2);
          });
        }
      }),
      { numRuns: 300 },
    );
  });
});
