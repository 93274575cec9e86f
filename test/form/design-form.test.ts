// Sources: NIST SP 811 (2008) appendix B.8 for the factors (1 in = 0.0254 m exactly, 1 lb = 0.45359237 kg,
// 1 psi = 6894.757 Pa); hand-derived conversions shown beside each check. Design contract:
// design-file contract (docs/design-file.md) (field paths and units).
import { describe, expect, it } from 'vitest';
import { demoDesign } from '../../core/index.ts';
import {
  applyListOp,
  convertValues,
  designToValues,
  kindOfField,
  parseFieldPath,
  parseListOp,
  readForm,
  unitOfField,
  valuesToInput,
} from '../../form/design-form.ts';

describe('field names are design paths', () => {
  it('parseFieldPath reads dots and indices', () => {
    expect(parseFieldPath('load_states[1].mass_kg')).toEqual(['load_states', 1, 'mass_kg']);
    expect(parseFieldPath('hydraulics.rear_valve.knee_bar_at_rear_axle_kg[0][1]')).toEqual(['hydraulics', 'rear_valve', 'knee_bar_at_rear_axle_kg', 0, 1]);
  });
  it('kindOfField follows the suffix and the schema', () => {
    expect(kindOfField('vehicle.wheelbase_m')).toBe('number');
    expect(kindOfField('axles.front.brake.pad_friction')).toBe('number'); // z.number() without suffix
    expect(kindOfField('vehicle.abs')).toBe('boolean');
    expect(kindOfField('vehicle.category')).toBe('text');
    expect(kindOfField('axles.rear.brake.brake_factor')).toBe('number'); // found in the drum branch of the union
    expect(kindOfField('hydraulics.rear_valve.knee_bar_at_rear_axle_kg[0][1]')).toBe('number');
  });
  it('unitOfField uses overrides for the load-sensing table', () => {
    expect(unitOfField('hydraulics.rear_valve.knee_bar_at_rear_axle_kg[2][0]')?.quantity).toBe('mass');
    expect(unitOfField('hydraulics.rear_valve.knee_bar_at_rear_axle_kg[2][1]')?.quantity).toBe('pressure');
    expect(unitOfField('axles.front.brake.piston_diameters_mm[0]')?.quantity).toBe('short_length');
    expect(unitOfField('hydraulics.pedal_ratio')).toBeNull();
  });
});

describe('design <-> form values', () => {
  it('the demo survives a round trip in metric unchanged', () => {
    const d = demoDesign();
    const r = readForm(designToValues(d, 'metric'), 'metric');
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.design).toEqual(d);
  });
  it('US display: 3.665 m wheelbase shows as 144.29 in (3.665 / 0.0254 = 144.2913…, shown to 0.01 in)', () => {
    const v = designToValues(demoDesign(), 'us');
    expect(v['vehicle.wheelbase_m']).toBe('144.29');
    // 2720 kg / 0.45359237 = 5996.5745 lb (hand-derived), shown to 0.1 lb
    expect(v['load_states[0].mass_kg']).toBe('5996.6');
  });
  it('a typed unit wins over the display unit: "58 in" = 1.4732 m, "1450 lb" = 657.709 kg, "90 psi" = 6.20528 bar, "2.2 t" = 2200 kg', () => {
    const v = designToValues(demoDesign(), 'metric');
    v['vehicle.wheelbase_m'] = '58 in';
    v['load_states[0].front_axle_kg'] = '1450 lb';
    v['hydraulics.booster_runout_bar'] = '90 psi';
    v['load_states[0].mass_kg'] = '2.2 t';
    const { input, errors } = valuesToInput(v, 'metric');
    expect(errors).toEqual([]);
    const i = input as { vehicle: { wheelbase_m: number }; load_states: Array<{ mass_kg: number; front_axle_kg: number }>; hydraulics: { booster_runout_bar: number } };
    expect(i.vehicle.wheelbase_m).toBeCloseTo(1.4732, 10); // 58 × 0.0254
    expect(i.load_states[0]!.front_axle_kg).toBeCloseTo(657.708937, 5); // 1450 × 0.45359237
    expect(i.hydraulics.booster_runout_bar).toBeCloseTo(6.205282, 5); // 90 × 6894.757 / 1e5
    expect(i.load_states[0]!.mass_kg).toBe(2200);
  });
  it('booleans: hidden "false" then checkbox "true", last value is what the form sends', () => {
    const v = designToValues(demoDesign(), 'metric');
    v['vehicle.abs'] = 'true';
    expect((valuesToInput(v, 'metric').input as { vehicle: { abs: boolean } }).vehicle.abs).toBe(true);
    v['vehicle.abs'] = 'false';
    expect((valuesToInput(v, 'metric').input as { vehicle: { abs: boolean } }).vehicle.abs).toBe(false);
  });
  it('errors carry the field name: unreadable text, out of range, cross-field', () => {
    const v = designToValues(demoDesign(), 'metric');
    v['vehicle.wheelbase_m'] = 'abc';
    v['load_states[1].front_axle_kg'] = '3600'; // above the laden mass 3500 kg
    v['axles.front.brake.pad_friction'] = '5';
    const r = readForm(v, 'metric');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const paths = r.errors.map((e) => e.path);
    expect(paths).toContain('vehicle.wheelbase_m');
    expect(paths).toContain('axles.front.brake.pad_friction');
    expect(r.errors.find((e) => e.path === 'vehicle.wheelbase_m')!.message).toMatch(/not a number/);
    expect(r.errors.find((e) => e.path === 'axles.front.brake.pad_friction')!.message).toMatch(/1\.2/);
  });
  it('an empty entry of a list is reported on its own field', () => {
    const v = designToValues(demoDesign(), 'metric');
    v['axles.front.brake.piston_diameters_mm[1]'] = '';
    const r = readForm(v, 'metric');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.map((e) => e.path)).toContain('axles.front.brake.piston_diameters_mm[1]');
  });
  it('convertValues metric -> us -> metric keeps the numbers (6 significant digits)', () => {
    const m = designToValues(demoDesign(), 'metric');
    const back = convertValues(convertValues(m, 'metric', 'us'), 'us', 'metric');
    expect(Number(back['vehicle.wheelbase_m'])).toBeCloseTo(3.665, 4);
    expect(Number(back['load_states[1].mass_kg'])).toBeCloseTo(3500, 1);
    const bad = { ...m, 'vehicle.wheelbase_m': 'long' };
    expect(convertValues(bad, 'metric', 'us')['vehicle.wheelbase_m']).toBe('long');
  });
});

describe('list operations', () => {
  it('dup copies a load state with a fresh id, remove renumbers', () => {
    const v = designToValues(demoDesign(), 'metric');
    const op = parseListOp('dup:load_states[0]')!;
    const d = applyListOp(v, op);
    expect(d['load_states[1].id']).toBe('unladen-2');
    expect(d['load_states[1].label']).toBe('Unladen, driver only (copy)');
    expect(d['load_states[2].id']).toBe('laden');
    const r = applyListOp(d, parseListOp('remove:load_states[0]')!);
    expect(r['load_states[0].id']).toBe('unladen-2');
    expect(r['load_states[2].id']).toBeUndefined();
    expect(readForm(r, 'metric').ok).toBe(true);
  });
  it('add appends a copy of the last entry of a number list; the last entry cannot be removed', () => {
    const v = designToValues(demoDesign(), 'metric');
    const a = applyListOp(v, parseListOp('add:axles.rear.brake.piston_diameters_mm')!);
    expect(a['axles.rear.brake.piston_diameters_mm[1]']).toBe('48');
    const one = applyListOp(v, parseListOp('remove:axles.rear.brake.piston_diameters_mm[0]')!);
    expect(one['axles.rear.brake.piston_diameters_mm[0]']).toBe('48');
  });
  it('parseListOp refuses anything else', () => {
    expect(parseListOp('remove:load_states')).toBeNull();
    expect(parseListOp('drop:load_states[0]')).toBeNull();
  });
});

describe('messages in the user units', () => {
  it('a range error in US units also names the range in inches (0.5 m = 19.69 in, 10 m = 393.7 in)', () => {
    const v = designToValues(demoDesign(), 'us');
    v['vehicle.wheelbase_m'] = '8'; // 8 in = 0.2032 m, below 0.5 m
    const r = readForm(v, 'us');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.find((e) => e.path === 'vehicle.wheelbase_m')!.message).toMatch(/\(19\.69 to 393\.7 in\)/);
  });
});

describe('unit switching never alters a design', () => {
  it('metric -> US -> metric gives back the exact numbers; an untouched US form reads back exactly', () => {
    const d = demoDesign();
    const us = convertValues(designToValues(d, 'metric'), 'metric', 'us');
    expect(us['vehicle.wheelbase_m']).toBe('144.29'); // shown rounded to 0.01 in: 3.665 / 0.0254 = 144.2913…
    const a = readForm(us, 'us');
    expect(a.ok && a.design).toEqual(d);
    const back = convertValues(us, 'us', 'metric');
    expect(back['vehicle.wheelbase_m']).toBe('3.665');
    const b = readForm(back, 'metric');
    expect(b.ok && b.design).toEqual(d);
  });
  it('a retyped value is read from the text, not the remembered number', () => {
    const us = designToValues(demoDesign(), 'us');
    us['vehicle.wheelbase_m'] = '144'; // 144 × 0.0254 = 3.6576 m
    const r = readForm(us, 'us');
    expect(r.ok && r.design.vehicle.wheelbase_m).toBeCloseTo(3.6576, 10);
  });
  it('every example design in docs/examples survives the form in both unit systems', async () => {
    const { readdirSync, readFileSync } = await import('node:fs');
    const { readDesign } = await import('../../core/index.ts');
    const dir = new URL('../../docs/examples/', import.meta.url);
    let checked = 0;
    for (const f of readdirSync(dir).filter((n) => n.endsWith('.json'))) {
      const r = readDesign(JSON.parse(readFileSync(new URL(f, dir), 'utf8')));
      if (!r.ok) continue; // not a design file (other example formats live here too)
      for (const u of ['metric', 'us'] as const) {
        const back = readForm(designToValues(r.design, u), u);
        expect(back.ok && back.design, `${f} ${u}`).toEqual(r.design);
      }
      checked++;
    }
    expect(checked).toBeGreaterThan(0);
  });
});
