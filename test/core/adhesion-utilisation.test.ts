/**
 * Adhesion utilisation f_i = T_i / N_i.
 * Sources: 71/320/EEC Annex II Appendix point 2 (f_i) and point 3.1.3 (N1, N2);
 * design-file spec (null utilisation beyond rear-axle lift-off).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { utilisation } from '../../core/adhesion-utilisation.ts';
import { stateModels } from '../../core/evaluate.ts';
import { arbitraryDesign } from './arbitrary-design.ts';
import { limiting, loads } from './hand-cases.ts';

describe('adhesion utilisation', () => {
  it('hand-derived (limiting case, z = 0.3 below the knee): f1 = 0.18/0.575, f2 = 0.12/0.425', () => {
    // T1 = 0.6 · 0.3 P = 0.18 P, N1 = (0.5 + 0.075) P; T2 = 0.12 P, N2 = 0.425 P
    const u = utilisation(loads, limiting, 0.3);
    expect(u.front).toBeCloseTo(0.18 / 0.575, 12);
    expect(u.rear).toBeCloseTo(0.12 / 0.425, 12);
  });

  it('null for both axles at and beyond rear-axle lift-off (z = 2 here)', () => {
    expect(utilisation(loads, limiting, 2)).toEqual({ front: null, rear: null });
    expect(utilisation(loads, limiting, 2.5)).toEqual({ front: null, rear: null });
    expect(utilisation(loads, limiting, 1.99).rear).not.toBeNull();
  });

  it('f1 and f2 are non-decreasing in z below lift-off (random valid designs, fast-check)', () => {
    fc.assert(
      fc.property(arbitraryDesign, (design) => {
        for (const s of stateModels(design)) {
          // a travel-sensing valve lowers its knee as the rear unloads, so f2 may fall with a steep table: not monotone by design
          if (s.sensing) continue;
          const zMax = Math.min(1.5, s.loads.zLift * 0.999);
          let prev = { front: 0, rear: 0 };
          const drops: string[] = [];
          for (let i = 1; i <= 200; i++) {
            const z = (zMax * i) / 200;
            const u = utilisation(s.loads, s.dist, z);
            if (u.front === null || u.rear === null) drops.push(`null below lift-off at z = ${z}`);
            else {
              if (u.front < prev.front - 1e-12) drops.push(`f1 falls at z = ${z}`);
              if (u.rear < prev.rear - 1e-12) drops.push(`f2 falls at z = ${z}`);
              prev = { front: u.front, rear: u.rear };
            }
          }
          expect(drops).toEqual([]);
        }
      }),
      { numRuns: 200 },
    );
  });
});
