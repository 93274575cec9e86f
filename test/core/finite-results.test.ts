/**
 * Every numeric result is finite or an explicit null (issue 12 point 9): for any schema-valid design,
 * realistic (arbitrary-design.ts) or pushed to the schema's lower limits, the lockstep-result/1 object
 * holds no Infinity or NaN (JSON would print them as null where a number is promised).
 * Source: an invariant of the result format (design-file contract), no outside value.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { DesignFile } from '../../core/design.ts';
import { evaluate } from '../../core/evaluate.ts';
import { readDesign } from '../../core/validate.ts';
import { arbitraryDesign } from './arbitrary-design.ts';
import { demoDesign } from '../../core/demo.ts';

const demoSample: DesignFile = demoDesign();

function nonFinite(value: unknown): string[] {
  const out: string[] = [];
  const walk = (o: unknown, path: string) => {
    if (typeof o === 'number') {
      if (!Number.isFinite(o)) out.push(`${path} = ${o}`);
    } else if (Array.isArray(o)) o.forEach((v, i) => walk(v, `${path}[${i}]`));
    else if (o && typeof o === 'object') for (const [k, v] of Object.entries(o)) walk(v, `${path}.${k}`);
  };
  walk(value, 'result');
  return out;
}

/** The design with its load states and brakes at the schema's lower limits (the smallest inputs allowed). */
function atLowerLimits(d: DesignFile, which: { mass: boolean; cg: boolean; front: boolean; brakes: boolean }): DesignFile {
  const c = structuredClone(d);
  c.load_states = c.load_states.map((s) => ({
    ...s,
    ...(which.mass ? { mass_kg: 50, front_axle_kg: Math.min(s.front_axle_kg, 49) } : {}),
    ...(which.front ? { front_axle_kg: 1 } : {}),
    ...(which.cg ? { cg_height_m: 0.05 } : {}),
  }));
  if (which.brakes) {
    for (const axle of ['front', 'rear'] as const) {
      const b = c.axles[axle].brake;
      c.axles[axle].tyre_radius_m = 0.1;
      if (b.type === 'disc') c.axles[axle].brake = { ...b, piston_diameters_mm: b.piston_diameters_mm.map(() => 10), effective_radius_m: 0.03, pad_friction: 0.05 };
      else c.axles[axle].brake = { ...b, wheel_cylinder_diameter_mm: 10, drum_radius_m: 0.05, brake_factor: 0.3 };
    }
  }
  return c;
}

describe('results are finite or null (fast-check)', () => {
  it('realistic and lower-limit designs give no Infinity or NaN anywhere in the result', () => {
    fc.assert(
      fc.property(arbitraryDesign, fc.record({ mass: fc.boolean(), cg: fc.boolean(), front: fc.boolean(), brakes: fc.boolean() }), (design, which) => {
        const r = readDesign(atLowerLimits(design, which));
        if (!r.ok) return; // a combination the schema refuses (e.g. a CG at or above the wheelbase) is not a design
        const result = evaluate(r.design);
        expect(nonFinite(result)).toEqual([]);
      }),
      { numRuns: 60 },
    );
  });
});

describe('inputs that make no physical sense are refused, naming the field', () => {
  const demo = () => structuredClone(demoSample);
  it('a CG height or front axle load of 5e-324 (results would overflow) is below the allowed range', () => {
    const d = demo();
    d.load_states[0]!.cg_height_m = 5e-324;
    d.load_states[0]!.front_axle_kg = 5e-324;
    const r = readDesign(d);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      const paths = r.errors.map((e) => e.path);
      expect(paths).toContain('load_states[0].cg_height_m');
      expect(paths).toContain('load_states[0].front_axle_kg');
    }
  });

  it('a fixed (opposed-piston) caliper with 3 pistons is refused on its piston list', () => {
    const d = demo();
    d.axles.front.brake = { type: 'disc', caliper: 'fixed', piston_diameters_mm: [38, 42, 38], effective_radius_m: 0.12, pad_friction: 0.4, threshold_pressure_bar: 0 };
    const r = readDesign(d);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.find((e) => e.path === 'axles.front.brake.piston_diameters_mm')?.message).toMatch(/even number/);
  });
});
