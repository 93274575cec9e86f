// HTTP routes of the design store, the packet and the exports (app.inject, Fastify testing guide).
// Escaping follows OWASP XSS Prevention rule #1 (& < > " ' escaped in content and quoted attributes).
// CSV: RFC 4180. Expected diffs are hand-derived from the edits made in each test to the invented demo design.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import formbody from '@fastify/formbody';
import Fastify, { type FastifyInstance } from 'fastify';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { demoDesign, type DesignFile } from '../../core/index.ts';
import { designToValues } from '../../form/design-form.ts';
import { packetRoutes } from '../../server/routes/packet.ts';
import { storeRoutes } from '../../server/routes/store.ts';
import { revisionId } from '../../store/revision-id.ts';
import { errorReplies } from '../../server/error-reply.ts';

let dir: string;
let app: FastifyInstance;
const EVIL = '<img src=x onerror="alert(1)"> & \'q\'';

beforeEach(async () => {
  dir = mkdtempSync(path.join(tmpdir(), 'lockstep-routes-'));
  app = Fastify();
  errorReplies(app, { app: '/static', htmx: '/vendor/htmx.min.js', plotly: '/vendor/plotly.min.js' }); // the app's one error answer (server/app.ts)
  await app.register(formbody);
  await app.register(storeRoutes, { dataDir: dir, now: () => new Date('2026-12-01T10:00:00Z') });
  await app.register(packetRoutes, { dataDir: dir, now: () => new Date('2026-12-01T10:00:00Z') });
  await app.ready();
});
afterEach(async () => {
  await app.close();
  rmSync(dir, { recursive: true, force: true });
});

const clone = (d: DesignFile): DesignFile => JSON.parse(JSON.stringify(d)) as DesignFile;

async function saveNew(design: DesignFile, message?: string) {
  const r = await app.inject({ method: 'POST', url: '/api/designs', payload: { design, message } });
  expect(r.statusCode).toBe(201);
  return r.json() as { design: { id: string }; revision_id: string };
}

describe('store API', () => {
  it('saves, lists, adds a revision, shows history and a field-level diff', async () => {
    const a = demoDesign();
    const s1 = await saveNew(a, 'base vehicle');
    expect(s1.revision_id).toBe(revisionId(a));
    const b = clone(a);
    b.load_states[0]!.cg_height_m = 0.74;
    const r2 = await app.inject({ method: 'POST', url: `/api/designs/${s1.design.id}/revisions`, payload: { design: b, message: 'battery lower' } });
    expect(r2.statusCode).toBe(201);
    const rev2 = (r2.json() as { revision_id: string }).revision_id;
    const list = (await app.inject({ url: '/api/designs' })).json() as { designs: { id: string; revision_count: number }[] };
    expect(list.designs).toEqual([expect.objectContaining({ id: s1.design.id, revision_count: 2 })]);
    const hist = (await app.inject({ url: `/api/designs/${s1.design.id}/history` })).json() as { history: { message: string }[] };
    expect(hist.history.map((h) => h.message)).toEqual(['base vehicle', 'battery lower']);
    const diff = (await app.inject({ url: `/api/diff?a=${s1.revision_id}&b=${rev2}` })).json() as { entries: { text: string }[] };
    expect(diff.entries.map((e) => e.text)).toEqual(['load_states[0].cg_height_m: 0.78 → 0.74 m']);
    const open = (await app.inject({ url: `/api/designs/${s1.design.id}` })).json() as { design_file: DesignFile };
    expect(open.design_file).toEqual(b);
  });
  it('renames, duplicates, and deletes only with the design id as confirmation', async () => {
    const s = await saveNew(demoDesign());
    const id = s.design.id;
    expect((await app.inject({ method: 'POST', url: `/api/designs/${id}/rename`, payload: { name: 'Option B' } })).json()).toMatchObject({ name: 'Option B' });
    const dup = await app.inject({ method: 'POST', url: `/api/designs/${id}/duplicate`, payload: {} });
    expect(dup.statusCode).toBe(201);
    const refused = await app.inject({ method: 'DELETE', url: `/api/designs/${id}` });
    expect(refused.statusCode).toBe(409);
    expect(refused.json()).toMatchObject({ code: 'STORE_ERR_DELETE_NOT_CONFIRMED' });
    const ok = await app.inject({ method: 'DELETE', url: `/api/designs/${id}?confirm=${id}` });
    expect(ok.statusCode).toBe(200);
    expect((await app.inject({ url: `/api/designs/${id}` })).statusCode).toBe(404);
  });
  it('refuses an invalid design with 422, naming the field', async () => {
    const d = demoDesign() as unknown as Record<string, unknown>;
    (d.vehicle as Record<string, unknown>).wheelbase_m = 40;
    const r = await app.inject({ method: 'POST', url: '/api/designs', payload: { design: d } });
    expect(r.statusCode).toBe(422);
    expect(r.json()).toMatchObject({ code: 'STORE_ERR_DESIGN_INVALID' });
    expect(JSON.stringify(r.json())).toContain('vehicle.wheelbase_m');
  });
  it('compares two revisions: overlaid curves as a plotly spec and verdicts side by side', async () => {
    const a = demoDesign();
    const s1 = await saveNew(a);
    const b = clone(a);
    if (b.axles.rear.brake.type !== 'disc') throw new Error('demo rear brake is a disc');
    b.axles.rear.brake.piston_diameters_mm = [54];
    const s2 = await saveNew(b);
    const c = (await app.inject({ url: `/api/compare?a=${s1.revision_id}&b=${s2.revision_id}` })).json() as {
      chart: { data: { name: string; line: { dash: string } }[] };
      states: { quantity: string; changed: boolean }[];
      checks: unknown[];
      diff: { text: string }[];
    };
    // 2 designs × 2 load states × 2 axles, plus the ideal line
    expect(c.chart.data).toHaveLength(9);
    expect(c.chart.data.filter((t) => t.line.dash === 'dash')).toHaveLength(4);
    expect(c.diff.map((e) => e.text)).toEqual(['axles.rear.brake.piston_diameters_mm[0]: 48 → 54 mm']);
    // a bigger rear caliper changes the installed front share at low pressure in every load state
    expect(c.states.filter((r) => r.quantity === 'installed front share at low pressure').every((r) => r.changed)).toBe(true);
    expect(c.checks.length).toBeGreaterThan(0);
  });
});

describe('HTML fragments', () => {
  it('escape user text in the designs list, history and save result', async () => {
    const d = demoDesign();
    d.name = EVIL;
    const s = await saveNew(d, EVIL);
    for (const url of ['/designs', `/designs/${s.design.id}/history`]) {
      const r = await app.inject({ url, headers: { 'hx-request': 'true' } });
      expect(r.statusCode).toBe(200);
      expect(r.headers['content-type']).toContain('text/html');
      expect(r.body).not.toContain('<img src=x');
      expect(r.body).toContain('&lt;img src=x onerror=&quot;alert(1)&quot;&gt; &amp; &#39;q&#39;');
    }
  });
  it('save the workbench form (field names are design paths) and report the revision', async () => {
    const d = demoDesign();
    d.identification = { owner: EVIL };
    const values = { ...designToValues(d, 'metric'), _units: 'metric', _message: 'from the page' };
    const r = await app.inject({ method: 'POST', url: '/designs/save', payload: new URLSearchParams(values).toString(), headers: { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true' } });
    expect(r.statusCode).toBe(200);
    expect(r.body).toContain(revisionId(d).slice(0, 12));
    expect(r.body).toMatch(/id="store-design-id" name="_design_id" value="[0-9a-f]{10}" hx-swap-oob="true"/);
  });
  it('rename, duplicate and delete (with the confirmation field) from the list', async () => {
    const s = await saveNew(demoDesign());
    const id = s.design.id;
    const form = { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true' };
    const renamed = await app.inject({ method: 'POST', url: `/designs/${id}/rename`, payload: `name=${encodeURIComponent(EVIL)}`, headers: form });
    expect(renamed.statusCode).toBe(200);
    expect(renamed.body).toContain('&lt;img src=x');
    const dup = await app.inject({ method: 'POST', url: `/designs/${id}/duplicate`, payload: '', headers: form });
    expect(dup.body.match(/<tr id="design-/g)).toHaveLength(2);
    const refused = await app.inject({ method: 'POST', url: `/designs/${id}/delete`, payload: 'confirm=', headers: form });
    expect(refused.statusCode).toBe(409);
    expect(refused.body).toContain('STORE_ERR_DELETE_NOT_CONFIRMED');
    const deleted = await app.inject({ method: 'POST', url: `/designs/${id}/delete`, payload: `confirm=${id}`, headers: form });
    expect(deleted.body.match(/<tr id="design-/g)).toHaveLength(1);
  });
  it('show a diff and a before/after comparison fragment', async () => {
    const a = demoDesign();
    const s1 = await saveNew(a);
    const b = clone(a);
    b.name = EVIL;
    const s2 = await saveNew(b);
    const diff = await app.inject({ url: `/diff?a=${s1.revision_id}&b=${s2.revision_id}`, headers: { 'hx-request': 'true' } });
    expect(diff.body).toContain('name: &quot;Demo');
    expect(diff.body).not.toContain('<img');
    const cmp = await app.inject({ url: `/compare?a=${s1.revision_id}&b=${s2.revision_id}`, headers: { 'hx-request': 'true' } });
    expect(cmp.statusCode).toBe(200);
    expect(cmp.body).toContain('data-chart="compare-chart-data"');
    expect(cmp.body).not.toContain('<img');
  });
});

describe('packet and exports', () => {
  it('serve the packet PDF of a saved revision (by prefix) and of the posted design', async () => {
    const d = demoDesign();
    const s = await saveNew(d);
    const r = await app.inject({ url: `/revisions/${s.revision_id.slice(0, 10)}/packet.pdf?date=2026-12-01` });
    expect(r.statusCode).toBe(200);
    expect(r.headers['content-type']).toBe('application/pdf');
    expect(r.headers['x-lockstep-revision']).toBe(s.revision_id);
    expect(r.rawPayload.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const posted = await app.inject({ method: 'POST', url: '/packet.pdf?date=2026-12-01', payload: { design: d } });
    expect(posted.statusCode).toBe(200);
    // the design on the page is no saved revision: its packet is a draft (issue 14), the same design saved is not
    expect(posted.rawPayload.equals(r.rawPayload)).toBe(false);
    const again = await app.inject({ url: `/revisions/${s.revision_id}/packet.pdf?date=2026-12-01` });
    expect(again.rawPayload.equals(r.rawPayload)).toBe(true);
  });
  it('serve the print view with user text escaped and the caution', async () => {
    const d = demoDesign();
    d.identification = { owner: EVIL };
    const s = await saveNew(d);
    const r = await app.inject({ url: `/revisions/${s.revision_id}/packet.html` });
    expect(r.body).toContain('&lt;img src=x');
    expect(r.body).not.toContain('<img');
    expect(r.body).toContain('Engineering estimate only.');
  });
  it('export the design JSON, the curves CSV and the checks CSV', async () => {
    const d = demoDesign();
    const s = await saveNew(d);
    const json = await app.inject({ url: `/revisions/${s.revision_id}/export/design.json` });
    expect(JSON.parse(json.body)).toEqual(d);
    expect(json.headers['content-disposition']).toMatch(/^attachment; filename="Demo-long-wheelbase[^"]*-[0-9a-f]{8}\.json"$/);
    const curves = await app.inject({ url: `/revisions/${s.revision_id}/export/curves.csv` });
    const lines = curves.body.trimEnd().split('\r\n');
    expect(lines[0]).toBe('load_state,braking_rate,front_utilisation,rear_utilisation,front_force_per_weight,rear_force_per_weight,ideal_front_per_weight,ideal_rear_per_weight,front_pressure_bar,rear_pressure_bar,pedal_force_n');
    expect(lines[1]!.startsWith('unladen,0,')).toBe(true);
    const checks = await app.inject({ url: `/revisions/${s.revision_id}/export/checks.csv` });
    expect(checks.body.split('\r\n')[0]).toBe('rule,load_state,passed,worst_margin,worst_at_braking_rate,failing_ranges,source,status,note');
  });
  it('answer an unknown revision with a coded 404', async () => {
    const r = await app.inject({ url: '/revisions/0123456789abcdef/packet.pdf' });
    expect(r.statusCode).toBe(404);
    expect(r.json()).toMatchObject({ code: 'STORE_ERR_REVISION_NOT_FOUND' });
  });
});
