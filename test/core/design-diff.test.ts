// Sources: the field paths and units follow docs/design-file.md (keys carry their unit: _kg, _m, _mm, _bar);
// expected entries are hand-derived from the edits each test makes to the demo design.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { demoDesign, designDiff, type DesignFile } from '../../core/index.ts';

const clone = (d: DesignFile): DesignFile => JSON.parse(JSON.stringify(d)) as DesignFile;

describe('designDiff', () => {
  it('is empty for equal designs', () => {
    expect(designDiff(demoDesign(), demoDesign())).toEqual([]);
  });
  it('names a changed array element with its unit from the key', () => {
    const a = demoDesign();
    const b = clone(a);
    if (b.axles.rear.brake.type !== 'disc') throw new Error('demo rear brake is a disc');
    b.axles.rear.brake.piston_diameters_mm[0] = 42;
    const d = designDiff(a, b);
    expect(d.map((e) => e.text)).toEqual(['axles.rear.brake.piston_diameters_mm[0]: 48 → 42 mm']);
    expect(d[0]).toMatchObject({ kind: 'changed', before: 48, after: 42, unit: 'mm' });
  });
  it('lists exactly the changed fields, with added and removed keys', () => {
    const a = demoDesign();
    const b = clone(a);
    b.load_states[1]!.mass_kg = 3400; // changed, kg
    b.hydraulics.booster_runout_bar = undefined; // removed, bar
    delete b.hydraulics.booster_runout_bar;
    b.notes = undefined;
    delete b.notes; // removed, text
    b.identification = { owner: 'Workshop <A>' }; // added
    const paths = designDiff(a, b).map((e) => `${e.kind} ${e.path}`);
    expect(paths.sort()).toEqual(
      ['changed load_states[1].mass_kg', 'removed hydraulics.booster_runout_bar', 'removed notes', 'added identification.owner'].sort(),
    );
    const runout = designDiff(a, b).find((e) => e.path === 'hydraulics.booster_runout_bar')!;
    expect(runout.text).toBe('hydraulics.booster_runout_bar: 90 bar → (none)');
  });
  it('gives each member of the load-sensing table its own unit (rear axle load kg, knee bar)', () => {
    const a = demoDesign();
    const b = clone(a);
    const v = b.hydraulics.rear_valve;
    if (v.type !== 'load_sensing') throw new Error('demo valve is load sensing');
    v.knee_bar_at_rear_axle_kg[1] = [1950, 50];
    expect(designDiff(a, b).map((e) => e.text)).toEqual([
      'hydraulics.rear_valve.knee_bar_at_rear_axle_kg[1][0]: 1900 → 1950 kg',
      'hydraulics.rear_valve.knee_bar_at_rear_axle_kg[1][1]: 48 → 50 bar',
    ]);
  });
  it('quotes provenance keys, which are field paths themselves, and gives them no unit', () => {
    const a = demoDesign();
    const b = clone(a);
    b.provenance!['axles.rear.brake.pad_friction'] = { source: 'measured', value: 0.4 }; // the same value as the demo's entry
    const d = designDiff(a, b);
    expect(d.map((e) => e.path)).toEqual([
      'provenance["axles.rear.brake.pad_friction"].note',
      'provenance["axles.rear.brake.pad_friction"].source',
    ]);
    expect(d[1]!.text).toBe('provenance["axles.rear.brake.pad_friction"].source: "maker" → "measured"');
  });
  it('does not report float noise as a change (canonical numbers)', () => {
    const a = demoDesign();
    const b = clone(a);
    b.vehicle.wheelbase_m = 3.665 * 3 / 3 + 1e-16;
    expect(designDiff(a, b)).toEqual([]);
  });
  it('reports one entry per changed number for random edits of one field (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1 }), fc.double({ min: 100, max: 5000, noNaN: true }), (i, m) => {
        const a = demoDesign();
        const b = clone(a);
        b.load_states[i]!.mass_kg = m;
        const d = designDiff(a, b);
        const changed = Math.abs(m - a.load_states[i]!.mass_kg) > 1e-9 * m;
        expect(d.length).toBe(changed ? 1 : 0);
        if (changed) expect(d[0]!.path).toBe(`load_states[${i}].mass_kg`);
      }),
    );
  });
});
