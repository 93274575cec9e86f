// Route tests of the conversion inputs (mass build-up and ratings) through inject (no network).
// Sources: docs/build-up.md (the build_up / ratings blocks and from_build_up, the project's contract);
// NIST SP 811 appendix B.8 (1 lb = 0.45359237 kg, 1 in = 0.0254 m) for the US-unit entry;
// the moment balance of the build-up is hand-derived beside each check.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { demoDesign } from '../../core/index.ts';
import { buildApp } from '../../server/app.ts';
import { designToValues, type FormValues } from '../../form/design-form.ts';
import { messageId } from '../../views/fields.ts';
import { formBody, openPage, postForm, unescapeAttr } from './form-post.ts';

let app: FastifyInstance;
let shape = '';
let pageFieldNames: string[] = [];

beforeAll(async () => {
  app = buildApp();
  await app.ready();
  const page = await openPage(app);
  shape = page.shape;
  pageFieldNames = [...page.body.matchAll(/name="((?:build_up|ratings)\.[^"]+)"/g)].map((m) => unescapeAttr(m[1]!));
});
afterAll(async () => {
  await app.close();
});

const form = (values: FormValues, extra: FormValues = {}) => formBody(shape, values, extra);
const post = (url: string, body: string) => postForm(app, url, body);

const L = demoDesign().vehicle.wheelbase_m; // 3.665 m
/** Demo form plus a base vehicle and one added item placed over the rear axle; load state 1 from the build-up. */
function withBuildUp(units: 'metric' | 'us' = 'metric'): FormValues {
  const v = designToValues(demoDesign(), units);
  const kg = (x: number) => String(units === 'us' ? x / 0.45359237 : x);
  const m = (x: number) => String(units === 'us' ? x / 0.0254 : x);
  Object.assign(v, {
    'build_up.baseline.front_axle_kg': kg(1400),
    'build_up.baseline.rear_axle_kg': kg(1200),
    'build_up.baseline.cg_height_m': m(0.75),
    'build_up.baseline.cg_height_source': 'measured',
    'build_up.added[0].name': 'battery pack',
    'build_up.added[0].mass_kg': kg(200),
    'build_up.added[0].x_m': m(L),
    'build_up.added[0].cg_height_m': m(0.5),
    'build_up.added[0].group': 'battery',
    'load_states[0].from_build_up': 'unladen',
  });
  delete v['load_states[0].mass_kg'];
  delete v['load_states[0].front_axle_kg'];
  delete v['load_states[0].cg_height_m'];
  return v;
}

describe('conversion inputs', () => {
  it('renders the build-up and ratings inputs with their units, empty on the demo', async () => {
    const r = await app.inject({ method: 'GET', url: '/' });
    expect(r.body).toContain('id="panel-conversion-inputs"');
    expect(r.body).toContain('id="panel-conversion"');
    expect(pageFieldNames).toContain('build_up.baseline.front_axle_kg');
    expect(pageFieldNames).toContain('ratings.max_mass_kg');
    expect(r.body).toMatch(/Front axle as weighed <span class="unit">\(kg\)<\/span>/);
    expect(r.body).toMatch(/CG height of the base vehicle <span class="unit">\(m\)<\/span>/);
    expect(r.body).toContain('name="load_states[0].from_build_up"');
    const us = await app.inject({ method: 'GET', url: '/?units=us' });
    expect(us.body).toMatch(/Front axle as weighed <span class="unit">\(lb\)<\/span>/);
    expect(us.body).toMatch(/Track width <span class="unit">\(in\)<\/span>/);
  });

  it('an empty build-up and empty ratings leave the design unchanged', async () => {
    const v = designToValues(demoDesign(), 'metric');
    for (const n of pageFieldNames) v[n] = n.endsWith('.driver') ? 'false' : '';
    const r = await post('/workbench/design.json', form(v));
    expect(r.statusCode).toBe(200);
    const d = JSON.parse(r.body) as Record<string, unknown>;
    expect('build_up' in d).toBe(false);
    expect('ratings' in d).toBe(false);
  });

  it('a base vehicle and one added item give the build_up block and the derived unladen state', async () => {
    const r = await post('/workbench/design.json', form(withBuildUp()));
    expect(r.statusCode).toBe(200);
    const d = JSON.parse(r.body) as ReturnType<typeof demoDesign>;
    expect(d.build_up?.added?.[0]).toMatchObject({ name: 'battery pack', mass_kg: 200, group: 'battery' });
    const s = d.load_states[0]!;
    // hand-derived: 1400 + 1200 + 200 = 2800 kg; the item sits over the rear axle (x = L) so the front keeps
    // 1400 kg; CG height (2600 x 0.75 + 200 x 0.5) / 2800 = 2050 / 2800 = 0.732142857 m
    expect(s.mass_kg).toBeCloseTo(2800, 9);
    expect(s.front_axle_kg).toBeCloseTo(1400, 9);
    expect(s.cg_height_m).toBeCloseTo(2050 / 2800, 9);
    expect(s.derived_from).toBe('build_up');

    const u = await post('/workbench/update', form(withBuildUp()));
    expect(u.statusCode).toBe(200);
    expect(u.body).toContain('Unladen (from build-up)');
    expect(u.body).toContain('battery pack');
    expect(u.body).toMatch(/2800 kg|<td>2800</); // the unladen mass of the hand derivation above, in the results
  });

  it('reads the build-up in US units (lb, in)', async () => {
    const r = await post('/workbench/design.json', form(withBuildUp('us'), { _units: 'us', _shape: '' }));
    expect(r.statusCode).toBe(200);
    const d = JSON.parse(r.body) as ReturnType<typeof demoDesign>;
    // NIST SP 811 B.8: the pounds and inches typed are exactly the kg and m of the metric case
    expect(d.build_up?.baseline.front_axle_kg).toBeCloseTo(1400, 6);
    expect(d.build_up?.added?.[0]?.x_m).toBeCloseTo(L, 9);
    expect(d.load_states[0]!.mass_kg).toBeCloseTo(2800, 6);
  });

  it('corner weights typed on the page give the base vehicle\'s left/right split, in kg or lb', async () => {
    const v = withBuildUp();
    Object.assign(v, {
      'build_up.track_m': '1.7',
      'build_up.baseline.wheels_kg.front_left': '680',
      'build_up.baseline.wheels_kg.front_right': '720',
      'build_up.baseline.wheels_kg.rear_left': '590',
      'build_up.baseline.wheels_kg.rear_right': '610',
    });
    const r = await post('/workbench/design.json', form(v));
    expect(r.statusCode).toBe(200);
    const d = JSON.parse(r.body) as ReturnType<typeof demoDesign>;
    expect(d.build_up?.baseline.wheels_kg).toEqual({ front_left: 680, front_right: 720, rear_left: 590, rear_right: 610 });
    const u = await post('/workbench/update', form(v));
    expect(u.statusCode).toBe(200);
    // hand-derived (docs/build-up.md, the item over the rear axle centreline loads both sides equally):
    // base left 680 + 590 = 1270 kg, right 720 + 610 = 1330 kg; the 200 kg item adds 100 each: 1370 / 1430
    expect(u.body).toContain('1270 / 1330');
    expect(u.body).toContain('1370 / 1430');
    // lb typed in US units is the same mass (NIST SP 811 B.8: 1 lb = 0.45359237 kg)
    const us = withBuildUp('us');
    Object.assign(us, { 'build_up.track_m': String(1.7 / 0.0254), 'build_up.baseline.wheels_kg.front_left': String(680 / 0.45359237) });
    for (const k of ['front_right', 'rear_left', 'rear_right'] as const) us[`build_up.baseline.wheels_kg.${k}`] = String({ front_right: 720, rear_left: 590, rear_right: 610 }[k] / 0.45359237);
    const ru = await post('/workbench/design.json', form(us, { _units: 'us', _shape: '' }));
    expect((JSON.parse(ru.body) as ReturnType<typeof demoDesign>).build_up?.baseline.wheels_kg?.front_left).toBeCloseTo(680, 6);
    // one corner left out: the others need it (the schema asks for all four), named on its field with kg
    delete v['build_up.baseline.wheels_kg.rear_right'];
    const bad = await post('/workbench/update', form(v));
    expect(bad.statusCode).toBe(422);
    expect(bad.body).toMatch(new RegExp(`id="${messageId('build_up.baseline.wheels_kg.rear_right')}"[^>]*>[^<]*required`));
  });

  it('adds a first item to an empty list and removes the last one', async () => {
    const add = await post('/workbench/update', form(designToValues(demoDesign(), 'metric'), { _op: 'add:build_up.removed' }));
    expect(add.body).toContain('name="build_up.removed[0].mass_kg"');
    expect(add.body).toMatch(/name="build_up\.removed\[0\]\.group"[^>]*value="removed"/);
    const v = withBuildUp();
    const rm = await post('/workbench/update', form(v, { _op: 'remove:build_up.added[0]' }));
    expect(rm.body).not.toContain('name="build_up.added[0]');
    expect(rm.statusCode).toBe(200);
    expect(rm.body).not.toContain('battery pack');
  });

  it('marks a bad value on its field with the allowed range', async () => {
    const v = withBuildUp();
    v['build_up.added[0].x_m'] = '25'; // docs/build-up.md: x_m from -10 to 20 m
    v['build_up.baseline.front_axle_kg'] = 'heavy';
    const r = await post('/workbench/update', form(v));
    expect(r.statusCode).toBe(422);
    const slot = (name: string) => new RegExp(`<p class="msg" id="${messageId(name)}"[^>]*>([^<]+)</p>`).exec(r.body)?.[1] ?? '';
    expect(slot('build_up.added[0].x_m')).toMatch(/20/);
    expect(slot('build_up.baseline.front_axle_kg')).not.toBe('');
  });

  it('from_build_up without a build-up is an error on that field', async () => {
    const v = designToValues(demoDesign(), 'metric');
    v['load_states[1].from_build_up'] = 'laden';
    const r = await post('/workbench/update', form(v));
    expect(r.statusCode).toBe(422);
    expect(r.body).toMatch(new RegExp(`id="${messageId('load_states[1].from_build_up')}"[^>]*>[^<]*build_up`));
  });

  it('ratings entered give the margins per load state', async () => {
    const v = designToValues(demoDesign(), 'metric');
    v['ratings.max_front_axle_kg'] = '1500';
    const r = await post('/workbench/design.json', form(v));
    expect(JSON.parse(r.body).ratings).toEqual({ max_front_axle_kg: 1500 });
    const u = await post('/workbench/update', form(v));
    // demo laden front axle 1610 kg against a 1500 kg rating: margin 1500 - 1610 = -110 kg (hand-derived)
    expect(u.body).toContain('−110 (over)');
  });
});
