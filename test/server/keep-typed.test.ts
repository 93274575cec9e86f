// Nothing typed is lost on the workbench form (form/keep-typed.ts, issue 15 point 4): fields of a type
// switched away are carried in `_stash` and come back; new build-up rows are drafts until filled.
// Expectations are hand-derived from the demo design's values (core demoDesign) and the list rules below.
import { describe, expect, it } from 'vitest';
import { demoDesign } from '../../core/index.ts';
import { applyListOp, designToValues, type FormValues, readForm } from '../../form/design-form.ts';
import { keepSwitchedOut, withoutDraftRows } from '../../form/keep-typed.ts';
import { update } from '../../server/routes/workbench.ts';

const demo = (): FormValues => designToValues(demoDesign(), 'metric');
const inputsOf = (html: string): FormValues => {
  const out: FormValues = {};
  for (const m of html.matchAll(/<input[^>]*name="([^"]+)"[^>]*value="([^"]*)"/g)) out[m[1]!] = m[2]!.replace(/&quot;/g, '"').replace(/&amp;/g, '&').replace(/&#39;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>');
  for (const m of html.matchAll(/<select[^>]*name="([^"]+)"[^>]*>[\s\S]*?<option value="([^"]*)" selected/g)) out[m[1]!] = m[2]!;
  return out;
};
const structural = (v: FormValues, change: FormValues): FormValues => {
  const shape = new URLSearchParams({ _units: 'metric', 'axles.front.brake.type': v['axles.front.brake.type'] ?? '', 'hydraulics.rear_valve.type': v['hydraulics.rear_valve.type'] ?? '' }).toString();
  return { ...v, ...change, _units: 'metric', _shape: shape };
};

describe('a type switch and back', () => {
  it('the load-sensing table typed, switched to proportioning and back: the typed rows return', () => {
    const v = demo();
    v['hydraulics.rear_valve.knee_bar_at_rear_axle_kg[1][1]'] = '44.5';
    const away = update(structural(v, { 'hydraulics.rear_valve.type': 'proportioning' }));
    const shown = inputsOf(away.body.html);
    expect(shown['hydraulics.rear_valve.knee_bar_at_rear_axle_kg[1][1]']).toBeUndefined();
    expect(JSON.parse(shown._stash!)['hydraulics.rear_valve.knee_bar_at_rear_axle_kg[1][1]']).toBe('44.5');
    const back = update(structural({ ...shown, 'hydraulics.rear_valve.type': 'proportioning' }, { 'hydraulics.rear_valve.type': 'load_sensing' }));
    const again = inputsOf(back.body.html);
    expect(again['hydraulics.rear_valve.knee_bar_at_rear_axle_kg[1][1]']).toBe('44.5');
    expect(again['hydraulics.rear_valve.knee_bar_at_rear_axle_kg[0][0]']).toBe(v['hydraulics.rear_valve.knee_bar_at_rear_axle_kg[0][0]']);
  });

  it('keepSwitchedOut: a list operation forgets stashed fields of that list (their indices moved)', () => {
    const values = { a: '1', 'load_states[0].mass_kg': '2720', _stash: JSON.stringify({ 'load_states[1].mass_kg': '3500', 'x.y': '2' }) };
    const out = keepSwitchedOut(values, (v) => v, { dropUnder: 'load_states' });
    expect(out['load_states[1].mass_kg']).toBeUndefined();
    expect(out['x.y']).toBe('2'); // put back: the identity normalise keeps it
  });

  it('keepSwitchedOut: a hostile _stash (prototype keys, non-strings, not JSON) is ignored', () => {
    for (const stash of ['{"__proto__":{"x":"1"},"n":5}', 'not json', '[1,2]']) {
      const out = keepSwitchedOut({ a: '1', _stash: stash }, (v) => v);
      expect(out).toEqual({ a: '1' });
      expect(({} as Record<string, unknown>).x).toBeUndefined();
    }
  });
});

describe('new build-up rows are drafts', () => {
  it('"+ seat" adds an empty seat that is not the driver seat, and raises no message until filled', () => {
    let v = demo();
    v = applyListOp(v, { op: 'add', list: 'build_up.seats', index: null });
    v['build_up.seats[0].name'] = 'driver';
    v['build_up.seats[0].x_m'] = '1.2';
    v['build_up.seats[0].cg_height_m'] = '0.9';
    v['build_up.seats[0].driver'] = 'true';
    v = applyListOp(v, { op: 'add', list: 'build_up.seats', index: null });
    expect(v['build_up.seats[1].driver']).toBe('false'); // the driver tick is not copied
    expect(v['build_up.seats[1].name']).toBe('');
    // the empty second seat is a draft: the design is read without it, so nothing is reported on it
    const drafted = withoutDraftRows(v);
    expect(Object.keys(drafted).some((k) => k.startsWith('build_up.seats[1]'))).toBe(false);
    const r = readForm(drafted, 'metric');
    const onSeat1 = r.ok ? [] : r.errors.filter((e) => e.path.startsWith('build_up.seats[1]'));
    expect(onSeat1).toEqual([]);
    // once something is typed in it, it counts (and is checked)
    v['build_up.seats[1].name'] = 'rear bench';
    expect(Object.keys(withoutDraftRows(v)).some((k) => k.startsWith('build_up.seats[1]'))).toBe(true);
  });

  it('"+ item" starts an empty row in the group of the last one; only trailing empty rows are drafts', () => {
    let v = demo();
    v = applyListOp(v, { op: 'add', list: 'build_up.added', index: null });
    Object.assign(v, { 'build_up.added[0].name': 'pack', 'build_up.added[0].mass_kg': '300', 'build_up.added[0].group': 'drive' });
    v = applyListOp(v, { op: 'add', list: 'build_up.added', index: null });
    v = applyListOp(v, { op: 'add', list: 'build_up.added', index: null });
    expect(v['build_up.added[2].group']).toBe('drive');
    expect(v['build_up.added[2].mass_kg']).toBe('');
    const d = withoutDraftRows(v);
    expect(d['build_up.added[0].name']).toBe('pack');
    expect(d['build_up.added[1].name']).toBeUndefined();
    expect(d['build_up.added[2].name']).toBeUndefined();
    v['build_up.added[2].name'] = 'water tank'; // a filled row after an empty one: both stay (paths keep their meaning)
    expect(withoutDraftRows(v)['build_up.added[1].name']).toBe('');
  });
});
