// The yes/no facts of the optional base_vehicle and conversion blocks (core/hardware-schema.ts, docs/hardware.md)
// as three-way selects in the workbench (views/fields.ts triStateField), through inject (no network).
// Sources: practitioner reports, no published source (helper springs, air assistance, lift or lowering stop a
// load-sensing valve reading the load; the demo has a load-sensing rear valve, so "suspension modified: yes"
// must raise PITFALL_LOAD_SENSING_SUSPENSION); docs/hardware.md ("each pitfall check uses what is given": a
// fact not stated is absent from the design, not false).
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

const demo = () => designToValues(demoDesign(), 'metric');
const post = (url: string, values: FormValues) => postForm(app, url, new URLSearchParams(values).toString());

describe('three-way yes/no facts in the hardware panel', () => {
  it('the page offers not stated / yes / no for the facts, "not stated" chosen for the demo', async () => {
    const page = await app.inject({ method: 'GET', url: '/' });
    const select = /<select id="f-conversion-suspension_modified"[^>]*>(.*?)<\/select>/s.exec(page.body)?.[1] ?? '';
    expect(select).toContain('<option value="" selected>not stated</option>');
    expect(select).toContain('<option value="true">yes</option>');
    expect(select).toContain('<option value="false">no</option>');
    for (const name of ['base_vehicle.abs', 'base_vehicle.stability_control', 'base_vehicle.booster', 'conversion.engine_removed', 'conversion.master_cylinder_from_drum_system']) {
      expect(page.body).toContain(`name="${name}"`);
    }
  });

  it('"yes" for suspension modified raises its pitfall; "no" and "not stated" do not', async () => {
    const yes = await post('/workbench/update', { ...demo(), 'conversion.suspension_modified': 'true' });
    expect(yes.statusCode).toBe(200);
    expect(yes.body).toContain('PITFALL_LOAD_SENSING_SUSPENSION');
    const no = await post('/workbench/update', { ...demo(), 'conversion.suspension_modified': 'false' });
    expect(no.statusCode).toBe(200);
    expect(no.body).not.toContain('PITFALL_LOAD_SENSING_SUSPENSION');
    const unstated = await post('/workbench/update', { ...demo(), 'conversion.suspension_modified': '' });
    expect(unstated.body).not.toContain('PITFALL_LOAD_SENSING_SUSPENSION');
  });

  it('"not stated" leaves the key out of the design; "no" writes false', async () => {
    const unstated = await post('/workbench/design.json', { ...demo(), 'conversion.suspension_modified': '', 'base_vehicle.abs': '' });
    expect(unstated.statusCode).toBe(200);
    const d = JSON.parse(unstated.body) as { conversion?: object; base_vehicle?: object };
    expect(d.conversion).toBeUndefined(); // a block nobody filled in stays absent
    expect(d.base_vehicle).toBeUndefined();
    const no = JSON.parse((await post('/workbench/design.json', { ...demo(), 'conversion.suspension_modified': 'false', 'base_vehicle.abs': '' })).body) as { conversion?: Record<string, unknown>; base_vehicle?: object };
    expect(no.conversion).toEqual({ suspension_modified: false });
    expect(no.base_vehicle).toBeUndefined();
  });

  it('base vehicle with ABS on a design without ABS: the pitfall appears once "yes" is chosen', async () => {
    const values = { ...demo(), 'vehicle.abs': 'false' };
    expect((await post('/workbench/update', { ...values, 'base_vehicle.abs': '' })).body).not.toContain('PITFALL_ABS_LOST');
    expect((await post('/workbench/update', { ...values, 'base_vehicle.abs': 'true' })).body).toContain('PITFALL_ABS_LOST');
  });

  it('text that is not a yes/no word is marked on the field, kept as typed', async () => {
    const res = await post('/workbench/update', { ...demo(), 'conversion.engine_removed': 'maybe' });
    expect(res.statusCode).toBe(422);
    expect(res.body).toMatch(/id="m-conversion-engine_removed"[^>]*>&quot;maybe&quot; is not a yes\/no value: choose yes, no or not stated/);
  });
});
