/**
 * evaluate(): the `lockstep-result/1` for a design.
 * Sources: design-file spec ("Result" keys; "a z beyond rear-axle lift (N2 <= 0) is reported with null
 * utilisations and a warning, not a crash"; `at` defaults to 0.1 … 1.0); 71/320/EEC Annex II Appendix
 * point 3.1.3 for the lift-off hand derivation.
 */
import { readdirSync, readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CAUTION } from '../../core/caution.ts';
import { demoDesign } from '../../core/demo.ts';
import type { DesignFile } from '../../core/design.ts';
import { evaluate } from '../../core/evaluate.ts';
import { readDesign } from '../../core/validate.ts';
import { arbitraryDesign } from './arbitrary-design.ts';

/** Paths of every NaN or ±Infinity anywhere in the value (every block, including ones other features add). */
function nonFinite(v: unknown, path: string, out: string[]): void {
  if (typeof v === 'number') {
    if (!Number.isFinite(v)) out.push(`${path} = ${v}`);
  } else if (Array.isArray(v)) {
    v.forEach((x, i) => nonFinite(x, `${path}[${i}]`, out));
  } else if (typeof v === 'object' && v !== null) {
    for (const [k, x] of Object.entries(v)) nonFinite(x, `${path}.${k}`, out);
  }
}

/** Nulls among the keys the spec defines, except where it allows them (critical rate; utilisations beyond lift-off). */
function unexpectedNulls(r: ReturnType<typeof evaluate>): string[] {
  const out: string[] = [];
  const need = (obj: object, keys: string[], path: string) => {
    for (const k of keys) {
      const v = (obj as Record<string, unknown>)[k];
      if (v === null || v === undefined) out.push(`${path}.${k} = ${v}`);
    }
  };
  r.load_states.forEach((s, i) => {
    const p = `load_states[${i}]`;
    need(s, ['id', 'front_axle_static_n', 'rear_axle_static_n', 'critical_braking_rates', 'lock', 'at'], p);
    if (s.critical_braking_rate !== null && typeof s.critical_braking_rate !== 'number') out.push(`${p}.critical_braking_rate`);
    s.lock.forEach((l, j) => need(l, ['adhesion', 'first_axle', 'braking_rate', 'efficiency'], `${p}.lock[${j}]`));
    s.at.forEach((a, j) => {
      need(a, ['braking_rate', 'front_axle_load_n', 'rear_axle_load_n', 'ideal_front_force_n', 'ideal_rear_force_n', 'front_force_n', 'rear_force_n', 'front_pressure_bar', 'rear_pressure_bar', 'pedal_force_n'], `${p}.at[${j}]`);
      // utilisations: null exactly when N2 <= 0 (design-file spec)
      const lifted = !(a.rear_axle_load_n > 0);
      if ((a.front_utilisation === null) !== lifted || (a.rear_utilisation === null) !== lifted) out.push(`${p}.at[${j}] utilisation null-ness`);
    });
    const c = s.curves;
    if (c) {
      c.braking_rate.forEach((z, j) => {
        const lifted = !(c.ideal_rear_per_weight[j]! > 0 || z === 0);
        if (!lifted && (c.front_utilisation[j] === null || c.rear_utilisation[j] === null)) out.push(`${p}.curves utilisation null at z = ${z}`);
      });
    }
  });
  return out;
}

describe('evaluate', () => {
  it('no NaN or Infinity anywhere, nulls only where the spec allows them (random valid designs, fast-check)', () => {
    fc.assert(
      fc.property(arbitraryDesign, fc.boolean(), (design, withCurves) => {
        const r = evaluate(design, { curves: withCurves, at: [0, 0.05, 0.5, 1, 1.5] });
        const bad: string[] = [];
        nonFinite(r, 'result', bad);
        expect(bad).toEqual([]);
        expect(unexpectedNulls(r)).toEqual([]);
        // and the JSON text round-trips (no value JSON cannot hold)
        expect(JSON.parse(JSON.stringify(r))).toEqual(r);
      }),
      { numRuns: 100 },
    );
  });

  it('deferLimits computes the same result, key for key, when its parts are read (random valid designs and the examples)', () => {
    // the deferred parts are the same functions called later: the JSON text must be identical (no source needed)
    const same = (design: DesignFile) => {
      const eager = JSON.stringify(evaluate(design, { curves: true }));
      const lazy = evaluate(design, { curves: true, deferLimits: true });
      expect(Object.getOwnPropertyDescriptor(lazy, 'regen')?.get).toBeTypeOf('function'); // not computed yet
      expect(JSON.stringify(lazy)).toBe(eager);
      expect(Object.getOwnPropertyDescriptor(lazy, 'regen')?.get).toBeUndefined(); // kept after the first read
    };
    for (const f of readdirSync('docs/examples')) {
      const r = readDesign(JSON.parse(readFileSync(`docs/examples/${f}`, 'utf8')));
      if (r.ok) same(r.design);
    }
    same(demoDesign());
    fc.assert(fc.property(arbitraryDesign, same), { numRuns: 30 });
  });

  it('the demo result holds every key of the spec example, with the default `at` list 0.1 … 1.0', () => {
    const r = evaluate(demoDesign());
    expect(r.format).toBe('lockstep-result/1');
    expect(Array.isArray(r.checks)).toBe(true);
    expect(r.caution).toBe(CAUTION);
    expect(r.load_states.map((s) => s.id)).toEqual(['unladen', 'laden']);
    for (const s of r.load_states) {
      for (const k of ['id', 'front_axle_static_n', 'rear_axle_static_n', 'critical_braking_rate', 'critical_braking_rates', 'lock', 'at']) expect(s).toHaveProperty(k);
      for (const l of s.lock) for (const k of ['adhesion', 'first_axle', 'braking_rate', 'efficiency']) expect(l).toHaveProperty(k);
      expect(s.at.map((a) => a.braking_rate)).toEqual([0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0]);
      for (const a of s.at) {
        for (const k of ['braking_rate', 'front_axle_load_n', 'rear_axle_load_n', 'ideal_front_force_n', 'ideal_rear_force_n', 'front_force_n', 'rear_force_n', 'front_utilisation', 'rear_utilisation', 'front_pressure_bar', 'rear_pressure_bar', 'pedal_force_n']) {
          expect(a).toHaveProperty(k);
        }
      }
    }
    // static loads: P1 = 1420 kg × g_n, P2 = (2720 − 1420) kg × g_n (g_n = 9.80665, NIST SP 811 B.8)
    expect(r.load_states[0]!.front_axle_static_n).toBeCloseTo(1420 * 9.80665, 9);
    expect(r.load_states[0]!.rear_axle_static_n).toBeCloseTo(1300 * 9.80665, 9);
  });

  it('beyond rear-axle lift-off: null utilisations and a warning, not a crash', () => {
    // hand-derived: E = 2.2 m, h = 1.0 m (χ = 1/2.2), front 62 % → z_lift = 0.38 · 2.2 = 0.836
    const d: DesignFile = {
      ...demoDesign(),
      vehicle: { ...demoDesign().vehicle, wheelbase_m: 2.2 },
      load_states: [{ id: 'tall', label: 'Tall load', kind: 'laden', mass_kg: 2000, front_axle_kg: 1240, cg_height_m: 1.0 }],
    };
    const reading = readDesign(d);
    expect(reading.ok).toBe(true);
    const r = evaluate(d).load_states[0]!;
    expect(r.rear_lift_off_braking_rate).toBeCloseTo(0.836, 12);
    const beyond = r.at.filter((a) => a.braking_rate >= 0.836);
    expect(beyond.map((a) => a.braking_rate)).toEqual([0.9, 1.0]);
    for (const a of beyond) {
      expect(a.front_utilisation).toBeNull();
      expect(a.rear_utilisation).toBeNull();
    }
    expect(r.at.find((a) => a.braking_rate === 0.8)!.rear_utilisation).not.toBeNull();
    expect(r.warnings.map((w) => w.code)).toContain('WARN_AT_BEYOND_LIFT_OFF');
    // crossings only below lift-off (design-file spec)
    for (const z of r.critical_braking_rates) expect(z).toBeLessThan(0.836);
    const c = evaluate(d, { curves: true }).load_states[0]!.curves!;
    expect(c.events.some((e) => e.kind === 'lift_off' && Math.abs(e.braking_rate - 0.836) < 1e-12)).toBe(true);
  });
});
