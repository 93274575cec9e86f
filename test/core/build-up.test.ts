/**
 * Mass build-up, load states derived from it, ratings (core/build-up.ts, core/ratings.ts).
 * Sources:
 * - R. N. Jazar, Vehicle Dynamics: Theory and Application (2008), Example 40, p. 41: CG 1.1084 m
 *   behind the front axle from per-wheel loads; lecture slides "Forward Vehicle Dynamics", Example 1
 *   (built on Jazar ch. 2): 890 kg at 0.78 m on 2.35 m → 2916.5 N / 1449 N per wheel, g = 9.81;
 * - a medium-duty truck body-builder manual, appendix "Weight Distribution" (14 500 lb at 156 in on a
 *   214 in wheelbase → rear +10 570 lb, front +3 929.9 lb; an item ahead of the front axle adds more
 *   than its own weight to the front);
 * - moment balance about the front axle and the ground (statics) as fast-check properties;
 * - occupant masses: Regulation (EU) No 1230/2012 Art. 2 (75 kg driver, from memory); NSW (Australia)
 *   RMS "Brake assessment manual" v1.0 (2013), definition of MLTM (68 kg per unoccupied seat); UK MOT
 *   testing guide, class 5 test weight (140 lb per passenger seat,
 *   http://www.motinfo.gov.uk/htdocs/m4s03000802.htm); US 154 lb per sleeping position (49 CFR 571.110,
 *   from memory; practitioner reports, no published source read);
 * - hand-derived: the arithmetic written beside each figure.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  type BuildUp,
  buildUp,
  type BuildUpItem,
  demoDesign,
  evaluate,
  itemAxleLoads,
  MassSum,
  OCCUPANT_MASSES,
  occupantMass,
  readDesign,
  TO_SI,
} from '../../core/index.ts';

const N_PER_KG_E7 = 9.81; // the sources' g

describe('build-up against published examples', () => {
  it('E7 (Jazar Example 40): per-wheel loads 2000 N front, 1800 N rear on 2.34 m → CG 1.1084 m behind the front axle', () => {
    const b: BuildUp = {
      baseline: { front_axle_kg: (2 * 2000) / N_PER_KG_E7, rear_axle_kg: (2 * 1800) / N_PER_KG_E7, cg_height_m: 0.5, cg_height_source: 'assumed' },
    };
    const r = buildUp(b, 2.34);
    expect(r.baseline.cg_x_m).toBeCloseTo(1.1084, 4);
    expect(2.34 - r.baseline.cg_x_m).toBeCloseTo(1.2316, 4);
  });

  it('E7 (lecture slides Example 1): 890 kg at 0.78 m on 2.35 m → 2916.5 N front and 1449 N rear per wheel', () => {
    const a = itemAxleLoads(890, 0.78, 2.35);
    expect((a.front_kg * N_PER_KG_E7) / 2).toBeCloseTo(2916.5, 1);
    expect(Math.abs((a.rear_kg * N_PER_KG_E7) / 2 - 1449)).toBeLessThan(0.1);
  });

  it('E8: 14 500 lb payload centred 156 in behind the front axle, wheelbase 214 in → rear +10 570 lb, front +3 929.9 lb, whatever the base vehicle', () => {
    const L = 214 * TO_SI.in;
    const payload: BuildUpItem = { name: 'body and payload', mass_kg: 14500 * TO_SI.lb, x_m: 156 * TO_SI.in, cg_height_m: 1.5, group: 'payload' };
    fc.assert(
      fc.property(fc.double({ min: 1000, max: 8000, noNaN: true }), fc.double({ min: 1000, max: 8000, noNaN: true }), (f, rr) => {
        const r = buildUp({ baseline: { front_axle_kg: f, rear_axle_kg: rr, cg_height_m: 1, cg_height_source: 'assumed' }, added: [payload] }, L);
        expect(r.changes.converted.rear_axle_kg / TO_SI.lb).toBeCloseTo(10570.09, 1);
        expect(r.changes.converted.front_axle_kg / TO_SI.lb).toBeCloseTo(3929.9, 1);
      }),
      { numRuns: 50 },
    );
  });

  it('E8 rule: an item ahead of the front axle adds more than its own mass to the front and unloads the rear', () => {
    // hand-derived: 100 kg at x = −0.6 m on L = 3 m → rear = 100 × (−0.6)/3 = −20 kg, front = 120 kg.
    const r = buildUp(
      { baseline: { front_axle_kg: 1200, rear_axle_kg: 1000, cg_height_m: 0.7, cg_height_source: 'assumed' }, added: [{ name: 'winch', mass_kg: 100, x_m: -0.6, cg_height_m: 0.5 }] },
      3,
    );
    expect(r.changes.converted.front_axle_kg).toBeCloseTo(120, 9);
    expect(r.changes.converted.rear_axle_kg).toBeCloseTo(-20, 9);
    expect(r.changes.converted.front_axle_kg).toBeGreaterThan(100);
  });
});

describe('build-up moment balance (properties)', () => {
  const item = fc.record({
    name: fc.constant('item'),
    mass_kg: fc.double({ min: 1, max: 400, noNaN: true }),
    x_m: fc.double({ min: -1, max: 5, noNaN: true }),
    cg_height_m: fc.double({ min: 0.1, max: 2.5, noNaN: true }),
    y_m: fc.double({ min: -0.8, max: 0.8, noNaN: true }),
  });
  const setup = fc.record({
    L: fc.double({ min: 2.2, max: 4.5, noNaN: true }),
    f: fc.double({ min: 800, max: 2500, noNaN: true }),
    r: fc.double({ min: 800, max: 2500, noNaN: true }),
    h: fc.double({ min: 0.4, max: 1.2, noNaN: true }),
    removed: fc.array(item, { maxLength: 3 }),
    added: fc.array(item, { maxLength: 6 }),
  });

  it('axle masses sum to the mass; rear × L = Σ m x; mass × h = Σ m z; left + right = mass', () => {
    fc.assert(
      fc.property(setup, (s) => {
        const b: BuildUp = {
          baseline: { front_axle_kg: s.f, rear_axle_kg: s.r, cg_height_m: s.h, cg_height_source: 'assumed' },
          track_m: 1.7,
          removed: s.removed.map((i) => ({ ...i, mass_kg: Math.min(i.mass_kg, 100) })),
          added: s.added,
        };
        const t = buildUp(b, s.L).converted;
        // Independent sums, written out here.
        let m = s.f + s.r;
        let mx = s.r * s.L; // baseline moment about the front axle
        let mz = (s.f + s.r) * s.h;
        for (const i of b.removed!) (m -= i.mass_kg), (mx -= i.mass_kg * i.x_m), (mz -= i.mass_kg * i.cg_height_m);
        for (const i of b.added!) (m += i.mass_kg), (mx += i.mass_kg * i.x_m), (mz += i.mass_kg * i.cg_height_m);
        const tol = 1e-9 * Math.max(1, m);
        expect(Math.abs(t.mass_kg - m)).toBeLessThan(tol);
        expect(Math.abs(t.front_axle_kg + t.rear_axle_kg - t.mass_kg)).toBeLessThan(tol);
        expect(Math.abs(t.rear_axle_kg * s.L - mx)).toBeLessThan(1e-9 * Math.max(1, Math.abs(mx)) * 10);
        expect(Math.abs(t.cg_height_m * t.mass_kg - mz)).toBeLessThan(1e-9 * Math.max(1, mz) * 10);
        expect(Math.abs(t.lateral!.left_kg + t.lateral!.right_kg - t.mass_kg)).toBeLessThan(tol * 10);
      }),
      { numRuns: 200 },
    );
  });

  it('adding then removing the same item returns the baseline, in any order', () => {
    fc.assert(
      fc.property(setup, item, (s, it) => {
        const base = { front_axle_kg: s.f, rear_axle_kg: s.r, cg_height_m: s.h, cg_height_source: 'assumed' as const };
        const a = buildUp({ baseline: base, added: [it], removed: [it] }, s.L).converted;
        const b0 = buildUp({ baseline: base }, s.L).baseline;
        expect(a.mass_kg).toBeCloseTo(b0.mass_kg, 6);
        expect(a.front_axle_kg).toBeCloseTo(b0.front_axle_kg, 6);
        expect(a.cg_height_m).toBeCloseTo(b0.cg_height_m, 9);
        const fwd = buildUp({ baseline: base, added: s.added }, s.L).converted;
        const rev = buildUp({ baseline: base, added: [...s.added].reverse() }, s.L).converted;
        expect(rev.front_axle_kg).toBeCloseTo(fwd.front_axle_kg, 6);
        expect(rev.cg_height_m).toBeCloseTo(fwd.cg_height_m, 9);
      }),
      { numRuns: 100 },
    );
  });

  it('lateral moment balance with corner weights: (right − left) × track / 2 = mass × CG offset', () => {
    const wheel = fc.double({ min: 300, max: 1200, noNaN: true });
    fc.assert(
      fc.property(setup, wheel, wheel, wheel, wheel, (s, fl, fr, rl, rr) => {
        const track = 1.7;
        const b: BuildUp = {
          baseline: { front_axle_kg: fl + fr, rear_axle_kg: rl + rr, wheels_kg: { front_left: fl, front_right: fr, rear_left: rl, rear_right: rr }, cg_height_m: s.h, cg_height_source: 'assumed' },
          track_m: track,
          added: s.added,
        };
        const r = buildUp(b, s.L);
        const base = r.baseline.lateral!;
        // hand-derived: the baseline keeps the measured corner weights
        expect(base.wheels_kg.front_right).toBeCloseTo(fr, 9);
        expect(base.right_kg - base.left_kg).toBeCloseTo(fr + rr - fl - rl, 9);
        for (const t of [r.baseline, r.converted]) {
          const lat = t.lateral!;
          expect(((lat.right_kg - lat.left_kg) * track) / 2).toBeCloseTo(t.mass_kg * lat.cg_y_m, 6);
          const w = lat.wheels_kg;
          expect(w.front_left + w.front_right).toBeCloseTo(t.front_axle_kg, 6);
          expect(w.rear_left + w.rear_right).toBeCloseTo(t.rear_axle_kg, 6);
        }
      }),
      { numRuns: 100 },
    );
  });

  it('an item on the right wheel line (y = track / 2) loads only the right wheels (lever rule, hand-derived)', () => {
    const s = new MassSum(3, 1.6).add({ mass_kg: 90, x_m: 1.5, cg_height_m: 1, y_m: 0.8 });
    expect(s.wheels.front_left).toBeCloseTo(0, 12);
    expect(s.wheels.rear_left).toBeCloseTo(0, 12);
    expect(s.wheels.front_right).toBeCloseTo(45, 12);
    expect(s.wheels.rear_right).toBeCloseTo(45, 12);
  });
});

describe('occupant masses listed with their sources', () => {
  it('carries the values regimes use (EU, NSW, UK MOT and US figures)', () => {
    const byId = Object.fromEntries(OCCUPANT_MASSES.map((o) => [o.id, o]));
    expect(byId['eu-75']!.mass_kg).toBe(75); // EU MRO includes a 75 kg driver
    expect(byId['au-nsw-68']!.mass_kg).toBe(68); // NSW MLTM: 68 kg per unoccupied seat
    expect(byId['uk-mot-63.5']!.mass_kg).toBeCloseTo(140 * 0.45359237, 0); // 140 lb per passenger seat
    expect(byId['us-154-lb']!.mass_kg).toBeCloseTo(69.853, 3); // 154 lb × 0.45359237 kg/lb
    for (const o of OCCUPANT_MASSES) expect(o.source.length).toBeGreaterThan(10);
    expect(occupantMass('custom', 82)).toBe(82);
  });
});

/**
 * A hand-checked design: wheelbase 3.0 m; baseline front 1200, rear 800 kg (x0 = 3 × 800 / 2000 = 1.2 m),
 * CG 0.7 m; engine 200 kg removed at x −0.3 m, z 0.6; battery 300 kg added at x 1.5, z 0.4; 75 kg per
 * occupant (eu-75), driver and passenger at x 0.6, z 1.0; payload 400 kg at x 2.4, z 0.9.
 * Unladen: m = 2000 − 200 + 300 + 75 = 2175; Σmx = 2400 + 60 + 450 + 45 = 2955 → rear 985, front 1190;
 *          Σmz = 1400 − 120 + 120 + 75 = 1475 → h = 0.678161.
 * Laden:   m = 2175 + 75 + 400 = 2650; Σmx = 2955 + 45 + 960 = 3960 → rear 1320, front 1330;
 *          Σmz = 1475 + 75 + 360 = 1910 → h = 0.720755.
 */
function conversionDesign(): Record<string, unknown> {
  const d = demoDesign() as unknown as Record<string, unknown>;
  (d.vehicle as Record<string, unknown>).wheelbase_m = 3.0;
  d.build_up = {
    baseline: { front_axle_kg: 1200, rear_axle_kg: 800, cg_height_m: 0.7, cg_height_source: 'maker', cg_height_uncertainty_m: 0.04 },
    removed: [{ name: 'engine', mass_kg: 200, x_m: -0.3, cg_height_m: 0.6, group: 'drivetrain removed' }],
    added: [{ name: 'battery', mass_kg: 300, x_m: 1.5, cg_height_m: 0.4, group: 'battery' }],
    occupant: { basis: 'eu-75' },
    seats: [
      { name: 'driver', x_m: 0.6, cg_height_m: 1.0, driver: true },
      { name: 'passenger', x_m: 0.6, cg_height_m: 1.0 },
    ],
    payload: { mass_kg: 400, x_m: 2.4, cg_height_m: 0.9 },
  };
  d.load_states = [
    { id: 'unladen', label: 'Unladen', kind: 'unladen', from_build_up: 'unladen' },
    { id: 'laden', label: 'Laden', kind: 'laden', from_build_up: 'laden' },
  ];
  return d;
}

describe('load states derived from the build-up', () => {
  it('fills unladen and laden from the build-up (hand-derived figures above)', () => {
    const r = readDesign(conversionDesign());
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    const [u, l] = r.design.load_states;
    expect(u!.mass_kg).toBeCloseTo(2175, 9);
    expect(u!.front_axle_kg).toBeCloseTo(1190, 9);
    expect(u!.cg_height_m).toBeCloseTo(1475 / 2175, 12);
    expect(l!.mass_kg).toBeCloseTo(2650, 9);
    expect(l!.front_axle_kg).toBeCloseTo(1330, 9);
    expect(l!.cg_height_m).toBeCloseTo(1910 / 2650, 12);
    // The baseline's CG uncertainty carried with its weight m0 / m: 0.04 × 2000 / 2175.
    expect(u!.cg_height_uncertainty_m).toBeCloseTo((0.04 * 2000) / 2175, 12);
    expect(u!.derived_from).toBe('build_up');
  });

  it('group subtotals and before/after changes', () => {
    const r = readDesign(conversionDesign());
    if (!r.ok) throw new Error('invalid');
    const b = buildUp(r.design.build_up!, 3);
    const g = Object.fromEntries(b.groups.map((x) => [x.group, x]));
    // engine: −200 kg at −0.3 m → rear −200 × (−0.3)/3 = +20, front −220
    expect(g['drivetrain removed']!.front_axle_kg).toBeCloseTo(-220, 9);
    expect(g['drivetrain removed']!.rear_axle_kg).toBeCloseTo(20, 9);
    // two occupants at 0.6 m: rear 2 × 75 × 0.2 = 30, front 120
    expect(g.occupants!.rear_axle_kg).toBeCloseTo(30, 9);
    expect(g.occupants!.items).toBe(2);
    expect(b.changes.laden.mass_kg).toBeCloseTo(650, 9);
    expect(b.changes.laden.rear_axle_kg).toBeCloseTo(1320 - 800, 9);
  });

  it('evaluate echoes mass, front axle, CG height and derived_from for every state; a measured CG height overrides', () => {
    const d = conversionDesign();
    (d.load_states as Record<string, unknown>[])[1] = {
      id: 'laden', label: 'Laden', kind: 'laden', from_build_up: 'laden',
      cg_height_m: 0.75, cg_height_uncertainty_m: 0.011, cg_height_derived_from: 'measured', overrides: ['cg_height_m'],
    };
    const r = readDesign(d);
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    const e = evaluate(r.design);
    const [u, l] = e.load_states;
    expect(u).toMatchObject({ mass_kg: 2175, derived_from: 'build_up', cg_height_derived_from: 'build_up', from_build_up: 'unladen' });
    expect(l).toMatchObject({ cg_height_m: 0.75, cg_height_uncertainty_m: 0.011, derived_from: 'build_up', cg_height_derived_from: 'measured' });
    expect(l!.mass_kg).toBeCloseTo(2650, 9);
    const demo = readDesign(demoDesign());
    if (!demo.ok) throw new Error('demo invalid');
    const plain = evaluate(demo.design);
    expect(plain.load_states[0]).toMatchObject({ derived_from: 'entered', cg_height_uncertainty_m: null, from_build_up: null });
  });

  it('a figure written without overrides is replaced, with a warning naming the field', () => {
    const d = conversionDesign();
    (d.load_states as Record<string, unknown>[])[0]!.mass_kg = 2100;
    const r = readDesign(d);
    if (!r.ok) throw new Error('invalid');
    expect(r.design.load_states[0]!.mass_kg).toBeCloseTo(2175, 9);
    expect(r.warnings.find((w) => w.code === 'WARN_BUILD_UP_REPLACED')?.path).toBe('load_states[0].mass_kg');
  });

  it('from_build_up without a build_up block is an error on that field; a design without build-up is unchanged', () => {
    const d = demoDesign() as unknown as Record<string, unknown>;
    (d.load_states as Record<string, unknown>[])[0] = { id: 'u', label: 'U', kind: 'unladen', from_build_up: 'unladen' };
    const r = readDesign(d);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.map((e) => e.path)).toEqual(['load_states[0].from_build_up']);
    const plain = readDesign(demoDesign());
    expect(plain.ok && plain.design.load_states).toEqual(demoDesign().load_states);
  });

  it('a build-up that removes more than the vehicle weighs is an error on from_build_up', () => {
    const d = conversionDesign();
    (d.build_up as Record<string, unknown>).removed = [{ name: 'everything', mass_kg: 2600, x_m: 1.0, cg_height_m: 0.5 }];
    const r = readDesign(d);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors[0]!.path).toBe('load_states[0].from_build_up');
    expect(r.errors[0]!.message).toMatch(/is not a vehicle/);
    expect(r.errors.some((e) => e.path === 'load_states[0].mass_kg')).toBe(false);
  });

  it('bad build-up input names the field and the range', () => {
    const d = conversionDesign();
    ((d.build_up as Record<string, unknown>).added as Record<string, unknown>[])[0]!.mass_kg = -5;
    (d.build_up as Record<string, unknown>).occupant = { basis: 'custom' };
    const r = readDesign(d);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const paths = r.errors.map((e) => e.path);
    expect(paths).toContain('build_up.added[0].mass_kg');
    expect(r.errors.find((e) => e.path === 'build_up.added[0].mass_kg')!.message).toMatch(/above 0 and at most 60000 kg/);
    // the states' missing figures are not reported on top of the build-up's own errors
    expect(paths.some((p) => p.startsWith('load_states'))).toBe(false);
  });
});

describe('ratings margins and warnings', () => {
  it('an axle over its rating although the total is within; front share below the minimum', () => {
    const d = conversionDesign();
    // Laden (hand-derived above): 2650 kg, front 1330, rear 1320, front share 50.19 %.
    d.ratings = { max_mass_kg: 3000, max_front_axle_kg: 1400, max_rear_axle_kg: 1300, min_front_axle_share_pct: 52 };
    const r = readDesign(d);
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    const e = evaluate(r.design);
    const laden = e.load_states[1]!;
    expect(laden.ratings!.mass_margin_kg).toBeCloseTo(350, 9);
    expect(laden.ratings!.rear_axle_margin_kg).toBeCloseTo(-20, 9);
    expect(laden.ratings!.front_axle_margin_kg).toBeCloseTo(70, 9);
    expect(laden.ratings!.front_axle_share_pct).toBeCloseTo((100 * 1330) / 2650, 9);
    const over = laden.warnings.find((w) => w.code === 'WARN_AXLE_OVER_RATING');
    expect(over?.message).toMatch(/rear axle 1320 kg is 20 kg over its rating 1300 kg although the total 2650 kg is within/);
    expect(laden.warnings.map((w) => w.code)).toContain('WARN_FRONT_SHARE_LOW');
    // Unladen: 2175 kg, front 1190 (54.7 %), rear 985: within every rating.
    const unladen = e.load_states[0]!;
    expect(unladen.warnings.filter((w) => w.code.includes('RATING') || w.code === 'WARN_FRONT_SHARE_LOW')).toEqual([]);
  });

  it('an empty ratings block is refused with a message', () => {
    const d = conversionDesign();
    d.ratings = {};
    const r = readDesign(d);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors[0]!.path).toBe('ratings');
  });
});
