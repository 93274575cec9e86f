// The source of each input on the workbench (issue 14, point 2): a source chosen on the page is recorded for
// the value the field holds then; a value typed over later no longer carries it. The project's own rule
// (core/provenance.ts), checked here through the form model the page posts.
import { describe, expect, it } from 'vitest';
import { demoDesign, inputSource } from '../../core/index.ts';
import { designToValues, formProvenance, NOTE_FIELD, readForm, SOURCE_FIELD } from '../../form/design-form.ts';
import { fieldNameProblem } from '../../form/field-names.ts';

const W = 'vehicle.wheelbase_m';

describe('source selects of the workbench', () => {
  it('shows the demo\'s recorded sources beside their inputs', () => {
    const v = designToValues(demoDesign(), 'metric');
    expect(v[`${SOURCE_FIELD}load_states[0].front_axle_kg`]).toBe('measured');
    expect(v[`${NOTE_FIELD}load_states[0].front_axle_kg`]).toBe('weighbridge, driver on board');
  });
  it('records a source chosen now for the value the field holds', () => {
    const v = designToValues(demoDesign(), 'metric');
    v[`${SOURCE_FIELD}${W}`] = 'measured';
    v[`${NOTE_FIELD}${W}`] = 'tape between the hub centres';
    const r = readForm(v, 'metric');
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.design.provenance?.[W]).toEqual({ source: 'measured', value: 3.665, note: 'tape between the hub centres' });
  });
  it('a value typed over keeps its old entry, which then reads "changed"; "not stated" drops it', () => {
    const v = designToValues(demoDesign(), 'metric');
    v['load_states[0].front_axle_kg'] = '1500';
    const r = readForm(v, 'metric');
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(inputSource(r.design.provenance, 'load_states[0].front_axle_kg', 1500).state).toBe('changed');
    expect(formProvenance(v, 'metric').sources.get('load_states[0].front_axle_kg')?.state).toBe('changed');
    v[`${SOURCE_FIELD}load_states[0].front_axle_kg`] = '';
    const r2 = readForm(v, 'metric');
    expect(r2.ok && r2.design.provenance?.['load_states[0].front_axle_kg']).toBe(undefined);
  });
  it('refuses a source that is not one, and a select named for no input', () => {
    const v = designToValues(demoDesign(), 'metric');
    v[`${SOURCE_FIELD}${W}`] = 'guessed';
    const r = readForm(v, 'metric');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.map((e) => e.path)).toContain(W);
    expect(fieldNameProblem(`${SOURCE_FIELD}${W}`)).toBeNull();
    expect(fieldNameProblem(`${SOURCE_FIELD}__proto__.x`)).not.toBeNull();
    expect(fieldNameProblem(`${SOURCE_FIELD}_provenance`)).not.toBeNull();
  });
});

describe('test results typed on the page', () => {
  it('a road test row added by the list button and filled in becomes test_results.road', async () => {
    const { applyListOp, parseListOp } = await import('../../form/design-form.ts');
    let v = designToValues(demoDesign(), 'metric');
    v = applyListOp(v, parseListOp('add:test_results.road')!);
    Object.assign(v, { 'test_results.road[0].load_state': 'laden', 'test_results.road[0].test': 'service', 'test_results.road[0].mfdd_ms2': '5.6' });
    const r = readForm(v, 'metric');
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.design.test_results?.road).toEqual([{ load_state: 'laden', test: 'service', mfdd_ms2: 5.6 }]);
  });
});
