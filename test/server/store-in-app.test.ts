// Sources: the store and packet routes inside the whole app (buildApp: helmet, formbody, the app's error handler), as the
// page uses them: the workbench form posted to /designs/save and /packet.pdf (field names are design paths).
// Fastify testing guide: app.inject. Escaping: OWASP XSS Prevention rule #1.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoDesign } from '../../core/index.ts';
import { buildApp } from '../../server/app.ts';
import { designToValues } from '../../form/design-form.ts';
import { revisionId } from '../../store/revision-id.ts';

const dir = mkdtempSync(path.join(tmpdir(), 'lockstep-app-store-'));
let app: FastifyInstance;
let saved: string | undefined;
beforeAll(async () => {
  saved = process.env.LOCKSTEP_DATA_DIR;
  process.env.LOCKSTEP_DATA_DIR = dir;
  app = buildApp();
  await app.ready();
});
afterAll(async () => {
  await app.close();
  if (saved === undefined) delete process.env.LOCKSTEP_DATA_DIR;
  else process.env.LOCKSTEP_DATA_DIR = saved;
  rmSync(dir, { recursive: true, force: true });
});

const FORM = { 'content-type': 'application/x-www-form-urlencoded' };

describe('store and packet in the app', () => {
  it('the page carries the identification inputs and the save / packet controls', async () => {
    const r = await app.inject({ url: '/' });
    expect(r.statusCode).toBe(200);
    expect(r.body).toContain('name="identification.owner"');
    expect(r.body).toContain('hx-post="/designs/save"');
    expect(r.body).toContain('data-download="/packet.pdf"');
  });
  it('saves the form as a revision (same id as the design file) and adds the next save to the same design', async () => {
    const d = demoDesign();
    d.identification = { owner: '<b>Workshop</b> & Co' };
    const values = { ...designToValues(d, 'metric'), _units: 'metric', _message: 'first' };
    const r1 = await app.inject({ method: 'POST', url: '/designs/save', payload: new URLSearchParams(values).toString(), headers: { ...FORM, 'hx-request': 'true' } });
    expect(r1.statusCode).toBe(200);
    expect(r1.body).toContain(revisionId(d).slice(0, 12));
    const id = /name="_design_id" value="([0-9a-f]{10})"/.exec(r1.body)![1]!;
    d.load_states[0]!.mass_kg = 2750;
    const v2 = { ...designToValues(d, 'metric'), _units: 'metric', _design_id: id, _message: 'heavier' };
    const r2 = await app.inject({ method: 'POST', url: '/designs/save', payload: new URLSearchParams(v2).toString(), headers: { ...FORM, 'hx-request': 'true' } });
    expect(r2.body).toContain('(2 revisions)');
    const hist = await app.inject({ url: `/designs/${id}/history`, headers: { 'hx-request': 'true' } });
    expect(hist.body).toContain('heavier');
    expect(hist.body).not.toContain('<b>Workshop');
  });
  it('downloads the packet of the design on the page', async () => {
    const values = { ...designToValues(demoDesign(), 'metric'), _units: 'metric' };
    const r = await app.inject({ method: 'POST', url: '/packet.pdf?date=2026-12-01', payload: new URLSearchParams(values).toString(), headers: FORM });
    expect(r.statusCode).toBe(200);
    expect(r.headers['content-type']).toBe('application/pdf');
    expect(r.headers['x-lockstep-revision']).toBe(revisionId(demoDesign()));
  });
  it('answers an invalid form with 422 and the field named, as JSON for the download script', async () => {
    const values = { ...designToValues(demoDesign(), 'metric'), _units: 'metric', 'vehicle.wheelbase_m': '99' };
    const r = await app.inject({ method: 'POST', url: '/export/curves.csv', payload: new URLSearchParams(values).toString(), headers: FORM });
    expect(r.statusCode).toBe(422);
    expect(r.json()).toMatchObject({ code: 'STORE_ERR_DESIGN_INVALID' });
    expect(JSON.stringify(r.json())).toContain('vehicle.wheelbase_m');
  });
});
