// Hostile input to the form routes, through inject (no network), and the request guard on a loopback port.
// Sources: OWASP "Prototype Pollution Prevention Cheat Sheet" (refuse __proto__, constructor, prototype as keys;
// null-prototype or checked objects); ECMAScript 2024 §20.1.3 (the members of Object.prototype, taken here at
// run time with Object.getOwnPropertyNames); Fetch Metadata Request Headers (W3C, §2.1 Sec-Fetch-Site: cross-site,
// same-origin, same-site, none) and RFC 6454 §7 (the Origin header); RFC 9110 §7.2 (Host), §15.5.20 (421
// Misdirected Request), §15.5.14 / §15.5.16 (413, 415); Node.js http docs (server.maxConnections: sockets over it
// are closed, headersTimeout, requestTimeout, keepAliveTimeout).
import { mkdtempSync, rmSync } from 'node:fs';
import { request } from 'node:http';
import { connect, type Socket } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { FastifyInstance } from 'fastify';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoDesign } from '../../core/index.ts';
import { DESIGN_FILE_MAX_BYTES } from '../../core/file-limits.ts';
import { MAX_INPUT_BYTES } from '../../cli/errors.ts';
import { buildApp } from '../../server/app.ts';
import { UPLOAD_LIMIT } from '../../server/errors.ts';
import { designToValues, readForm } from '../../form/design-form.ts';
import { MAX_FIELDS } from '../../form/field-names.ts';
import { MAX_CONNECTIONS, SERVER_LIMITS } from '../../server/plugins/request-guard.ts';
import { FORM_ROUTES, freshDemoBody, hostileRequest, PROTOTYPE_NAMES } from '../../scripts/hostile-form.ts';

const dir = mkdtempSync(path.join(tmpdir(), 'lockstep-hostile-'));
let app: FastifyInstance;
let savedDir: string | undefined;
const protoBefore = Object.getOwnPropertyNames(Object.prototype).sort();
beforeAll(async () => {
  savedDir = process.env.LOCKSTEP_DATA_DIR;
  process.env.LOCKSTEP_DATA_DIR = dir;
  app = buildApp();
  await app.ready();
});
afterAll(async () => {
  await app.close();
  if (savedDir === undefined) delete process.env.LOCKSTEP_DATA_DIR;
  else process.env.LOCKSTEP_DATA_DIR = savedDir;
  rmSync(dir, { recursive: true, force: true });
});

const FORM = { 'content-type': 'application/x-www-form-urlencoded' };
const post = (url: string, payload: string, headers: Record<string, string> = {}) => app.inject({ method: 'POST', url, headers: { ...FORM, ...headers }, payload });
const demoForm = (extra: Record<string, string> = {}) => new URLSearchParams({ _units: 'metric', ...designToValues(demoDesign(), 'metric'), ...extra }).toString();
let fresh = 0;
/** The demo, renamed so no cached answer is reused, still evaluates: 200 and "Results are current". */
async function demoStillEvaluates(): Promise<void> {
  const r = await post('/workbench/update', freshDemoBody(String(++fresh)), { 'hx-request': 'true' });
  expect(r.statusCode).toBe(200);
  expect(r.body).toContain('Results are current');
}
function prototypeUnchanged(): void {
  expect(Object.getOwnPropertyNames(Object.prototype).sort()).toEqual(protoBefore);
  const probe: Record<string, unknown> = {};
  for (const k of ['x', 'x_kg', 'polluted']) expect(probe[k], k).toBeUndefined();
}

describe('hostile field names (issue 16, points 1 to 3)', () => {
  it('property: random names and values to every form route never give a 5xx, leave Object.prototype alone, and the demo still evaluates', async () => {
    await fc.assert(
      fc.asyncProperty(hostileRequest, async (req) => {
        const r = await app.inject({ method: 'POST', url: req.url, headers: req.headers, payload: req.payload });
        expect(r.statusCode, `${req.url} ${req.payload.slice(-200)}`).toBeLessThan(500);
        expect(r.statusCode).toBeGreaterThanOrEqual(200);
        prototypeUnchanged();
      }),
      { numRuns: 120, seed: 16 },
    );
    await demoStillEvaluates();
  });

  it('every Object.prototype member name, alone or inside a path, is refused on every form route with 400 APP_ERR_FIELD_NAME', async () => {
    const names = [...PROTOTYPE_NAMES.flatMap((n) => [n, `vehicle.${n}`, `load_states[0].${n}`, `lift.${n}`]), '__proto__.x', 'constructor.prototype.x'];
    for (const url of FORM_ROUTES) {
      for (const n of names) {
        const r = await post(url, `${encodeURIComponent(n)}=1`);
        expect(r.statusCode, `${url} ${n}`).toBe(400);
        expect(r.json().code, `${url} ${n}`).toBe('APP_ERR_FIELD_NAME');
      }
    }
    prototypeUnchanged();
  });

  it('vehicle.__proto__.x_kg and lift.__proto__.x are refused and poison nothing: the demo still evaluates', async () => {
    for (const [url, body] of [['/workbench/update', 'vehicle.__proto__.x_kg=1'], ['/workbench/cg-lift', 'lift.__proto__.x=1']] as const) {
      const r = await post(url, body, { 'hx-request': 'true' });
      expect(r.statusCode).toBe(400);
      expect(r.body).toContain('APP_ERR_FIELD_NAME');
    }
    prototypeUnchanged();
    await demoStillEvaluates();
  });

  it('list positions beyond the schema limit are refused before any list is built (at most 8 load states: 0 to 7)', async () => {
    // design-file schema: load_states holds 1 to 8 entries (docs/design-file.md); the axle-lift tool at most 64 rows
    for (const [url, body] of [
      ['/workbench/update', 'load_states[100000000].mass_kg='],
      ['/workbench/update', 'load_states[8].mass_kg=1'],
      ['/workbench/cg-lift', 'lift.lifts[100000000].lift_height_m=1'],
      ['/workbench/update', 'load_states[-1].mass_kg=1'],
      ['/workbench/update', 'load_states[01].mass_kg=1'],
    ] as const) {
      const r = await post(url, body);
      expect(r.statusCode, body).toBe(400);
      expect(r.json().code).toBe('APP_ERR_FIELD_NAME');
    }
    const r = await post('/workbench/update', 'load_states[8].mass_kg=1');
    expect(r.json().message).toContain('at most 8 entries (positions 0 to 7)');
    // the last allowed position is read (and reported by the schema as an incomplete load state, not refused)
    const ok = await post('/workbench/update', demoForm({ 'load_states[7].mass_kg': '2000' }));
    expect(ok.statusCode).toBe(422);
  });

  it('load_states.length=1 is refused with a coded message instead of silently dropping a load state', async () => {
    const r = await post('/workbench/design.json', demoForm({ 'load_states.length': '1' }));
    expect(r.statusCode).toBe(400);
    expect(r.json()).toMatchObject({ code: 'APP_ERR_FIELD_NAME' });
    expect(r.json().message).toContain('is a list');
    const plain = await post('/workbench/design.json', demoForm());
    expect(plain.json().load_states).toHaveLength(demoDesign().load_states.length);
  });

  it('a form with more fields than any page sends (over 5000) is refused with 400 APP_ERR_TOO_MANY_FIELDS', async () => {
    const body = Array.from({ length: MAX_FIELDS + 1 }, (_, i) => `notes${i}=x`).join('&');
    const r = await post('/workbench/update', body);
    expect(r.statusCode).toBe(400);
    expect(r.json().code).toBe('APP_ERR_TOO_MANY_FIELDS');
  });

  it('a sizing proposal for a part the design does not have (a balance bar) is a 422 APP_ERR_SIZING_NOT_APPLICABLE', async () => {
    expect(demoDesign().hydraulics).not.toHaveProperty('balance_bar');
    const r = await post('/workbench/update', demoForm({ _op: 'size:apply:hydraulics.balance_bar.setting_front_share=0.6' }));
    expect(r.statusCode).toBe(422);
    expect(r.json().code).toBe('APP_ERR_SIZING_NOT_APPLICABLE');
  });

  it('a valid file with a whitespace-only label is accepted by the form too (the form reads text as the file does)', async () => {
    const d = demoDesign();
    d.load_states[0]!.label = '   ';
    const up = await post('/workbench/update', new URLSearchParams({ _units: 'metric', _upload: JSON.stringify(d) }).toString(), { 'hx-request': 'true' });
    expect(up.statusCode).toBe(200);
    const values = designToValues(d, 'metric');
    const back = readForm(values, 'metric');
    expect(back.ok).toBe(true);
    if (back.ok) expect(back.design.load_states[0]!.label).toBe('   ');
    const again = await post('/workbench/update', demoForm({ 'load_states[0].label': '   ' }));
    expect(again.statusCode).toBe(200);
  });
});

describe('request guard (issue 16, point 4)', () => {
  it('answers only its own host names; ALLOWED_HOSTS (allowedHosts) adds names', async () => {
    const evil = await app.inject({ method: 'GET', url: '/api/designs', headers: { host: 'evil.example' } });
    expect(evil.statusCode).toBe(421);
    expect(evil.json().code).toBe('APP_ERR_HOST_NOT_ALLOWED');
    for (const host of ['localhost:80', '127.0.0.1:3000', '[::1]:3000']) {
      expect((await app.inject({ method: 'GET', url: '/api/designs', headers: { host } })).statusCode, host).toBe(200);
    }
    const other = buildApp({ allowedHosts: ['workshop.example', 'bench.example:8080'] });
    try {
      expect((await other.inject({ url: '/api/designs', headers: { host: 'workshop.example:3000' } })).statusCode).toBe(200);
      expect((await other.inject({ url: '/api/designs', headers: { host: 'bench.example:8080' } })).statusCode).toBe(200);
      expect((await other.inject({ url: '/api/designs', headers: { host: 'bench.example:8081' } })).statusCode).toBe(421);
    } finally {
      await other.close();
    }
  });

  it('refuses a cross-site save, rename or delete (Origin or Sec-Fetch-Site) and carries out none of it; same-origin passes', async () => {
    const before = (await app.inject({ url: '/api/designs' })).json().designs.length;
    for (const headers of <Array<Record<string, string>>>[
      { origin: 'http://evil.example', 'sec-fetch-site': 'cross-site' },
      { origin: 'http://evil.example' },
      { 'sec-fetch-site': 'same-site' },
      { origin: 'null' },
    ]) {
      for (const url of ['/designs/save', '/designs/x/rename', '/designs/x/delete']) {
        const r = await post(url, demoForm(), headers);
        expect(r.statusCode, `${url} ${JSON.stringify(headers)}`).toBe(403);
        expect(r.json().code).toBe('APP_ERR_CROSS_SITE');
      }
    }
    const del = await app.inject({ method: 'DELETE', url: '/api/designs/x?confirm=x', headers: { origin: 'http://evil.example' } });
    expect(del.statusCode).toBe(403);
    expect((await app.inject({ url: '/api/designs' })).json().designs.length).toBe(before);
    const own = await post('/designs/save', demoForm(), { origin: 'http://localhost:80', 'sec-fetch-site': 'same-origin' });
    expect(own.statusCode).toBe(200);
    expect((await app.inject({ url: '/api/designs' })).json().designs.length).toBe(before + 1);
  });

  it('listening: the bound port is part of the own address', async () => {
    const live = buildApp();
    await live.listen({ host: '127.0.0.1', port: 0 });
    try {
      const port = (live.server.address() as { port: number }).port;
      const get = (host: string) =>
        new Promise<number>((resolve, reject) => {
          request({ host: '127.0.0.1', port, path: '/api/designs', headers: { host } }, (res) => {
            res.resume();
            resolve(res.statusCode ?? 0);
          })
            .on('error', reject)
            .end();
        });
      expect(await get(`127.0.0.1:${port}`)).toBe(200);
      expect(await get(`localhost:${port}`)).toBe(200);
      expect(await get(`127.0.0.1:${port + 1}`)).toBe(421);
      expect(await get('evil.example')).toBe(421);
    } finally {
      await live.close();
    }
  });
});

describe('connection limits (issue 16, point 5)', () => {
  it('sets the timeouts and the connection cap on the server', () => {
    expect(app.server.maxConnections).toBe(MAX_CONNECTIONS);
    expect(app.server.headersTimeout).toBe(SERVER_LIMITS.http.headersTimeout);
    expect(app.server.requestTimeout).toBe(SERVER_LIMITS.requestTimeout);
    expect(app.server.keepAliveTimeout).toBe(SERVER_LIMITS.keepAliveTimeout);
    expect(app.server.maxRequestsPerSocket).toBe(SERVER_LIMITS.maxRequestsPerSocket);
    expect(app.server.timeout).toBe(SERVER_LIMITS.connectionTimeout);
  });

  it('a connection over the cap is closed at once, and the server answers again when the held ones go', async () => {
    const live = buildApp();
    await live.listen({ host: '127.0.0.1', port: 0 });
    const port = (live.server.address() as { port: number }).port;
    const open = (): Promise<Socket> =>
      new Promise((resolve, reject) => {
        const s = connect(port, '127.0.0.1', () => resolve(s));
        s.on('error', reject);
      });
    const held: Socket[] = [];
    try {
      for (let i = 0; i < MAX_CONNECTIONS; i++) held.push(await open());
      // the server counts a connection once it accepted it: wait until all held ones are counted
      const count = () => new Promise<number>((resolve) => live.server.getConnections((_e, n) => resolve(n)));
      while ((await count()) < MAX_CONNECTIONS) await new Promise((r) => setTimeout(r, 20));
      const extra = await open();
      const closed = await new Promise<boolean>((resolve) => {
        extra.on('close', () => resolve(true));
        extra.write('GET /api/designs HTTP/1.1\r\nHost: 127.0.0.1\r\n\r\n');
      });
      expect(closed).toBe(true);
    } finally {
      for (const s of held) s.destroy();
    }
    const count = () => new Promise<number>((resolve) => live.server.getConnections((_e, n) => resolve(n)));
    while ((await count()) > 0) await new Promise((r) => setTimeout(r, 20));
    const r = await fetch(`http://127.0.0.1:${port}/api/designs`);
    expect(r.status).toBe(200);
    await live.close();
  });
});

describe('codes and limits of the store, packet and upload (issue 16, point 7)', () => {
  it('store and packet routes answer 413 / 415 with APP_ERR_* codes; text/plain to the workbench is a 415', async () => {
    const big = 'x'.repeat(3 * UPLOAD_LIMIT + 64 * 1024 + 1);
    for (const url of ['/designs/save', '/api/designs', '/packet.html', '/packet.pdf', '/workbench/update']) {
      const large = await post(url, `name=${big}`);
      expect(large.statusCode, url).toBe(413);
      expect(large.json().code, url).toBe('APP_ERR_BODY_TOO_LARGE');
      const plain = await app.inject({ method: 'POST', url, headers: { 'content-type': 'text/plain' }, payload: 'name=x' });
      expect(plain.statusCode, url).toBe(415);
      expect(plain.json().code, url).toBe('APP_ERR_UNSUPPORTED_MEDIA_TYPE');
    }
  });

  it('one design-file limit: the page, the upload check and the command line use the same number', async () => {
    expect(UPLOAD_LIMIT).toBe(DESIGN_FILE_MAX_BYTES);
    expect(MAX_INPUT_BYTES).toBe(DESIGN_FILE_MAX_BYTES);
    const page = await app.inject({ url: '/' });
    expect(page.body).toContain(`data-max-bytes="${DESIGN_FILE_MAX_BYTES}"`);
    // a valid file just under the limit, padded with line breaks (3 bytes each once percent-encoded), is read
    const demo = JSON.stringify(demoDesign());
    const under = demo + '\n'.repeat(DESIGN_FILE_MAX_BYTES - demo.length - 1);
    const ok = await post('/workbench/update', new URLSearchParams({ _units: 'metric', _upload: under }).toString(), { 'hx-request': 'true' });
    expect(ok.statusCode).toBe(200);
    const over = await post('/workbench/update', new URLSearchParams({ _units: 'metric', _upload: `${under}\n\n` }).toString(), { 'hx-request': 'true' });
    expect(over.statusCode).toBe(413);
    expect(over.body).toContain('APP_ERR_UPLOAD_TOO_LARGE');
  });
});
