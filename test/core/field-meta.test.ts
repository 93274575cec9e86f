/**
 * The quantity table: every numeric field of the input files carries its quantity, its file unit and a label.
 * Source: the design-file convention that each key is stored in one declared unit (docs/design-file.md, key
 * reference; the unit names follow NIST SP 811 (2008), appendix B); the labels are the project's own words,
 * no published source.
 */
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import {
  AxleLiftFile,
  axleLiftFieldMeta,
  DesignFile,
  DISPLAY_UNITS,
  fieldMeta,
  numericLeaves,
  parsePath,
  quantityOfPath,
  TO_SI,
  withField,
} from '../../core/index.ts';

describe('every numeric field has a quantity, a file unit and a label', () => {
  for (const [name, schema] of [['design file', DesignFile], ['axle-lift file', AxleLiftFile]] as const) {
    it(`${name}: each numeric leaf is registered`, () => {
      const leaves = numericLeaves(schema);
      expect(leaves.length).toBeGreaterThan(name === 'design file' ? 120 : 10);
      expect(leaves.filter((l) => l.meta === null).map((l) => l.path)).toEqual([]);
      for (const l of leaves) {
        const m = l.meta!;
        expect(m.label.trim().length, l.path).toBeGreaterThan(2);
        expect(m.label, l.path).not.toMatch(/_/); // words for people, not a key
        expect(Object.hasOwn(TO_SI, m.unit), `${l.path}: ${m.unit}`).toBe(true);
        expect(Object.hasOwn(DISPLAY_UNITS, m.quantity), `${l.path}: ${m.quantity}`).toBe(true);
        // the file keeps the metric unit of its quantity: no field is stored in a US unit
        expect(m.unit, l.path).toBe(DISPLAY_UNITS[m.quantity].metric);
      }
    });

    it(`${name}: a field found in several forms (valve types, brake types) means the same in each`, () => {
      const byPath = new Map<string, string>();
      for (const l of numericLeaves(schema)) {
        const m = JSON.stringify([l.meta?.quantity, l.meta?.unit]);
        expect(byPath.get(l.path) ?? m, l.path).toBe(m);
        byPath.set(l.path, m);
      }
    });
  }

  it('the walk finds an unregistered number inside lists, pairs, unions and records', () => {
    const bare = z.strictObject({
      a: z.array(z.strictObject({ b: z.number() })),
      c: z.tuple([withField(z.number(), { quantity: 'mass', unit: 'kg', label: 'Mass' }), z.number()]),
      d: z.discriminatedUnion('t', [z.strictObject({ t: z.literal('x'), e: z.number().optional() })]),
      f: z.record(z.string(), z.number()),
    });
    expect(numericLeaves(bare).filter((l) => l.meta === null).map((l) => l.path)).toEqual(['a[].b', 'c[1]', 'd.e', 'f.<key>']);
  });
});

describe('looking a field up by its path', () => {
  it('finds units the key names and the ones it does not (pairs, corner weights)', () => {
    expect(fieldMeta('vehicle.wheelbase_m')).toEqual({ quantity: 'length', unit: 'm', label: 'Wheelbase' });
    expect(fieldMeta('load_states[3].front_axle_kg')?.unit).toBe('kg');
    expect(fieldMeta('axles.rear.brake.piston_diameters_mm[1]')?.quantity).toBe('short_length');
    expect(fieldMeta('hydraulics.rear_valve.knee_bar_at_rear_axle_kg[2][0]')?.quantity).toBe('mass');
    expect(fieldMeta('hydraulics.rear_valve.knee_bar_at_rear_axle_kg[2][1]')?.unit).toBe('bar');
    expect(fieldMeta('build_up.baseline.wheels_kg.rear_left')?.unit).toBe('kg');
    expect(fieldMeta('heat.hot_friction_factor_at_c[0][0]')?.unit).toBe('degC');
    expect(fieldMeta('heat.hot_friction_factor_at_c[0][1]')?.unit).toBe('1');
    expect(fieldMeta('hardware.front.expansion_per_bar_mm3')?.unit).toBe('mm3/bar');
    expect(fieldMeta('heat.cooling_coefficient_per_s')?.unit).toBe('1/s');
    expect(quantityOfPath(['hydraulics', 'balance_bar', 'setting_front_share'])).toBe('ratio');
    expect(axleLiftFieldMeta('lifts[4].lift_angle_deg')?.quantity).toBe('angle');
  });

  it('gives null for what is no number or not in the file', () => {
    expect(fieldMeta('vehicle.category')).toBeNull();
    expect(fieldMeta('provenance["vehicle.wheelbase_m"].source')).toBeNull();
    expect(fieldMeta('vehicle.no_such_key_m')).toBeNull();
    expect(fieldMeta('load_states.mass_kg')).toBeNull(); // a list needs an index
  });

  it('reads paths as written in the file', () => {
    expect(parsePath('provenance["axles.rear.brake.brake_factor"].source')).toEqual(['provenance', 'axles.rear.brake.brake_factor', 'source']);
    expect(parsePath('hydraulics.rear_valve.knee_bar_at_rear_axle_kg[2][1]')).toEqual(['hydraulics', 'rear_valve', 'knee_bar_at_rear_axle_kg', 2, 1]);
  });
});
