/**
 * Plotting curves.
 * Sources: issue 2 ("a z grid from 0 to 1 in steps of at most 0.01, plus the exact event points (valve
 * knee, critical rate, lift-off)"); 71/320/EEC Annex II Appendix point 2 (f_i = T_i/N_i); the values
 * must be those of forcesAt/utilisation at the same z (the curves only sample the engine).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { frontAxleLoad, rearAxleLoad } from '../../core/axle-loads.ts';
import { crossings } from '../../core/crossings.ts';
import { curves } from '../../core/curves.ts';
import { demoDesign } from '../../core/demo.ts';
import { forcesAt } from '../../core/distribution.ts';
import { stateModels } from '../../core/evaluate.ts';
import { pedalForce } from '../../core/pedal-force.ts';
import { arbitraryDesign } from './arbitrary-design.ts';

describe('curves', () => {
  it('grid 0 … 1 in steps ≤ 0.01, ascending, holding every event point below 1', () => {
    for (const s of stateModels(demoDesign())) {
      const cr = crossings(s.loads, s.dist);
      const c = curves(s, cr.rates, cr.critical);
      const zs = c.braking_rate;
      expect(zs[0]).toBe(0);
      expect(zs[zs.length - 1]).toBe(1);
      for (let i = 1; i < zs.length; i++) {
        expect(zs[i]!).toBeGreaterThan(zs[i - 1]!);
        expect(zs[i]! - zs[i - 1]!).toBeLessThanOrEqual(0.01 + 1e-12);
      }
      for (const e of c.events) if (e.braking_rate <= 1) expect(zs).toContain(e.braking_rate);
      // the valve knee of the demo (load-sensing) is a breakpoint event
      expect(c.events.some((e) => e.kind === 'breakpoint')).toBe(true);
    }
  });

  it('every sampled value equals the engine at the same z (random valid designs, fast-check)', () => {
    fc.assert(
      fc.property(arbitraryDesign, (design) => {
        for (const s of stateModels(design)) {
          const cr = crossings(s.loads, s.dist);
          const c = curves(s, cr.rates, cr.critical);
          const bad: string[] = [];
          c.braking_rate.forEach((z, i) => {
            const f = forcesAt(s.dist, z);
            const n1 = frontAxleLoad(s.loads, z);
            const n2 = rearAxleLoad(s.loads, z);
            const P = s.loads.P;
            const exp = {
              front_force_per_weight: f.front / P,
              rear_force_per_weight: f.rear / P,
              ideal_front_per_weight: (z * n1) / P,
              ideal_rear_per_weight: (z * n2) / P,
              front_pressure_bar: f.p / 1e5,
              rear_pressure_bar: f.p2 / 1e5,
              pedal_force_n: pedalForce(s.pedal, f.p),
              front_utilisation: n2 > 0 ? (z > 0 ? f.front / n1 : 0) : null,
              rear_utilisation: n2 > 0 ? (z > 0 ? f.rear / n2 : 0) : null,
            };
            for (const [k, v] of Object.entries(exp)) {
              if ((c as unknown as Record<string, unknown[]>)[k]![i] !== v) bad.push(`${k}[${i}] at z = ${z}`);
            }
          });
          expect(bad).toEqual([]);
        }
      }),
      { numRuns: 200 },
    );
  });
});
