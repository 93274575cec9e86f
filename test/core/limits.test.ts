// The limits in the evaluation result (core/limits.ts via core/evaluate.ts).
// Sources: design-file spec ("Result": numbers are finite; null only where no answer exists) and the
// brief's rule that every figure is labelled an estimate; the random designs are generated, not invented data.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { demoDesign, evaluate, readDesign } from '../../core/index.ts';

function finiteEverywhere(v: unknown, path = ''): string[] {
  if (typeof v === 'number') return Number.isFinite(v) ? [] : [path];
  if (Array.isArray(v)) return v.flatMap((x, i) => finiteEverywhere(x, `${path}[${i}]`));
  if (v && typeof v === 'object') return Object.entries(v).flatMap(([k, x]) => finiteEverywhere(x, `${path}.${k}`));
  return [];
}

describe('limits in evaluate()', () => {
  it('every per-state and design-level limit block is there and marked as an estimate', () => {
    const r = evaluate(demoDesign());
    for (const s of r.load_states) {
      expect(s.traction.length).toBe(3 * r.adhesion_coefficients.length);
      expect(s.stopping.estimate && s.tester.estimate).toBe(true);
    }
    expect(r.regen?.estimate && r.heat?.estimate).toBe(true);
  });
  it('no NaN or Infinity in the limits for random load states and limit blocks (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.record({
          mass: fc.double({ min: 600, max: 8000, noNaN: true }),
          front: fc.double({ min: 0.2, max: 0.8, noNaN: true }),
          h: fc.double({ min: 0.3, max: 1.4, noNaN: true }),
          drive: fc.constantFrom('front', 'rear', 'all'),
          torque: fc.double({ min: 10, max: 3000, noNaN: true }),
          ratio: fc.double({ min: 1, max: 20, noNaN: true }),
          power: fc.double({ min: 5, max: 300, noNaN: true }),
          fixed: fc.boolean(),
          q: fc.double({ min: 0.05, max: 2, noNaN: true }),
          split: fc.option(fc.double({ min: 0, max: 1, noNaN: true })),
          fr: fc.double({ min: 0, max: 0.1, noNaN: true }),
          rotor: fc.double({ min: 1, max: 40, noNaN: true }),
          cool: fc.double({ min: 0, max: 0.05, noNaN: true }),
          roller: fc.double({ min: 0.3, max: 1.2, noNaN: true }),
        }),
        (x) => {
          const d = demoDesign();
          d.vehicle.drive = x.drive;
          d.load_states = [{ id: 's', label: 'random', kind: 'laden', mass_kg: x.mass, front_axle_kg: x.mass * x.front, cg_height_m: x.h }];
          d.traction = { rolling_resistance: x.fr, ...(x.split === null ? {} : { all_wheel_front_share: x.split }) };
          d.regen = {
            max_motor_torque_nm: x.torque,
            gear_ratio: x.ratio,
            max_power_kw: x.power,
            blending: x.fixed ? { type: 'fixed_proportion', proportion: x.q } : { type: 'regen_first' },
          };
          d.heat = { front_rotor_kg: x.rotor, rear_rotor_kg: x.rotor / 2, cooling_coefficient_per_s: x.cool, base_vehicle_mass_kg: x.mass * 0.8 };
          d.tester = { roller_adhesion: x.roller };
          const read = readDesign(d);
          expect(read.ok).toBe(true);
          if (!read.ok) return;
          const r = evaluate(read.design);
          const s = r.load_states[0]!;
          expect(finiteEverywhere({ t: s.traction, s: s.stopping, te: s.tester, g: r.regen, h: r.heat })).toEqual([]);
        },
      ),
      { numRuns: 40 },
    );
  });
});
