// The inspection-case inputs in the workbench (views/panels/cases-inputs.ts; docs/design-file.md, "Optional blocks
// for the inspection cases"), through inject (no network): every new key has a field, a design round-trips
// through the form unchanged, and the derived load states' checks are shown.
import { readFileSync } from 'node:fs';
import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoDesign } from '../../core/index.ts';
import { buildApp } from '../../server/app.ts';
import { designToValues, type FormValues } from '../../form/design-form.ts';
import { postForm } from './form-post.ts';

let app: FastifyInstance;
beforeAll(async () => {
  app = buildApp();
  await app.ready();
});
afterAll(async () => {
  await app.close();
});

const example = JSON.parse(readFileSync(new URL('../../docs/examples/towing-camper-fmvss.json', import.meta.url), 'utf8')) as Record<string, unknown>;
const post = (url: string, values: FormValues) => postForm(app, url, new URLSearchParams(values).toString());

describe('inspection-case inputs', () => {
  it('the page has a field for every new key', async () => {
    const page = await app.inject({ method: 'GET', url: '/' });
    for (const name of [
      'systems.abs', 'systems.esc', 'systems.ebd', 'regen.category', 'regen.abs_controls_regen_axle', 'regen.failure_warning',
      'lightly_loaded.unloaded_mass_kg', 'lightly_loaded.unloaded_front_axle_kg', 'lightly_loaded.unloaded_cg_height_m', 'lightly_loaded.added_mass_kg',
      'lightly_loaded.added_behind_front_axle_m', 'lightly_loaded.added_height_m', 'towing.trailer_mass_kg', 'towing.trailer_braked',
      'towing.nose_load_kg', 'towing.hitch_behind_rear_axle_m', 'towing.hitch_height_m', 'towing.load_state',
    ]) expect(page.body).toContain(`name="${name}"`);
    expect(page.body).toContain('value="add:heat.hot_friction_factor_at_c"');
  });

  it('the example design goes through the form unchanged', async () => {
    const r = await post('/workbench/design.json', designToValues(example, 'metric'));
    expect(r.statusCode).toBe(200);
    const d = JSON.parse(r.body) as Record<string, unknown>;
    for (const k of ['lightly_loaded', 'towing', 'systems', 'regen', 'heat']) expect(d[k]).toEqual(example[k]);
  });

  it('the results list the checks of the derived load states and what is not checked', async () => {
    const r = await post('/workbench/update', designToValues(example, 'metric'));
    expect(r.statusCode).toBe(200);
    expect(r.body).toContain('Derived load state: towing the trailer');
    expect(r.body).toContain('Derived load state: lightly loaded vehicle');
    expect(r.body).toContain('performance/towing-service');
    const noLl = { ...example };
    delete noLl.lightly_loaded;
    const nc = await post('/workbench/update', designToValues(noLl, 'metric'));
    expect(nc.body).toContain('not checked');
  });

  it('a hot-friction row can be added to an empty table and removed again', async () => {
    const added = await post('/workbench/update', { ...designToValues(demoDesign(), 'metric'), _op: 'add:heat.hot_friction_factor_at_c' });
    expect(added.body).toContain('name="heat.hot_friction_factor_at_c[0][0]"');
    expect(added.body).toContain('name="heat.hot_friction_factor_at_c[0][1]"');
    const values = { ...designToValues(demoDesign(), 'metric'), 'heat.hot_friction_factor_at_c[0][0]': '400', 'heat.hot_friction_factor_at_c[0][1]': '0.9' };
    const d = JSON.parse((await post('/workbench/design.json', values)).body) as { heat: { hot_friction_factor_at_c?: number[][] } };
    expect(d.heat.hot_friction_factor_at_c).toEqual([[400, 0.9]]);
    const removed = await post('/workbench/update', { ...values, _op: 'remove:heat.hot_friction_factor_at_c[0]' });
    expect(removed.body).not.toContain('name="heat.hot_friction_factor_at_c[0][0]"');
  });
});
