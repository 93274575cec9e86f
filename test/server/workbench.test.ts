// Route tests of the workbench through inject (no network).
// Sources: OWASP XSS Prevention Cheat Sheet rule #1 (escape & < > " ' in content and quoted attributes) and
// rule #3.1 (JSON data blocks with < escaped); htmx 2 docs "Response Handling" (4xx not swapped unless
// configured; we configure 422); NIST SP 811 appendix B.8 (1 in = 0.0254 m, 1 lb = 0.45359237 kg);
// RFC 9110 (413 Content Too Large, 415 Unsupported Media Type, 422 Unprocessable Content);
// RFC 4180 (CSV); the design contract design-file contract (docs/design-file.md).
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { CAUTION, demoDesign } from '../../core/index.ts';
import { buildApp } from '../../server/app.ts';
import { BODY_LIMIT } from '../../server/errors.ts';
import { sourceMounts, writePublic } from '../../server/static-assets.ts';
import { designToValues, type FormValues } from '../../form/design-form.ts';
import { HTMX_CONFIG } from '../../views/layout.ts';
import { formBody, openPage, postForm } from './form-post.ts';

let app: FastifyInstance;
let shape = '';
const EVIL = `<script>alert("x")</script> & 'q'`;
const EVIL_ESCAPED = '&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;q&#39;';

beforeAll(async () => {
  app = buildApp();
  await app.ready();
  shape = (await openPage(app)).shape;
});
afterAll(async () => {
  await app.close();
});

const form = (values: FormValues, extra: FormValues = {}) => formBody(shape, values, extra);
const demoValues = (): FormValues => designToValues(demoDesign(), 'metric');
const update = (body: string) => postForm(app, '/workbench/update', body);
/** Every <script> in a body is either external (src) or a JSON data block: no inline code (CSP). */
function inlineScripts(body: string): string[] {
  return [...body.matchAll(/<script\b([^>]*)>/g)].map((m) => m[1]!).filter((a) => !/\bsrc="/.test(a) && !/type="application\/json"/.test(a));
}

describe('GET /', () => {
  it('serves the page on the demo with every section, the caution and no inline script', async () => {
    const r = await app.inject({ method: 'GET', url: '/' });
    expect(r.statusCode).toBe(200);
    expect(r.headers['content-type']).toBe('text/html; charset=utf-8');
    for (const id of ['design-form', 'design-inputs', 'status', 'results', 'results-note', 'chart-a', 'chart-b', 'chart-c', 'verdict-0', 'verdict-1', 'panel-vehicle', 'panel-load-states', 'panel-brakes', 'panel-hydraulics', 'panel-surfaces', 'panel-table']) {
      expect(r.body, id).toContain(`id="${id}"`);
    }
    expect(r.body).toContain(CAUTION);
    expect(r.body).toContain('What you are looking at');
    expect(inlineScripts(r.body)).toEqual([]);
    expect(r.body).toMatch(/<div class="chart" data-chart="chart-a-data"/);
  });
  it('gives every element its own id (labels, aria references and swaps depend on it)', async () => {
    const page = await app.inject({ method: 'GET', url: '/' });
    const ids = [...page.body.matchAll(/\sid="([^"]+)"/g)].map((m) => m[1]!);
    expect(ids.filter((id, i) => ids.indexOf(id) !== i)).toEqual([]);
    const upd = await update(form(demoValues()));
    const updIds = [...upd.body.matchAll(/\sid="([^"]+)"/g)].map((m) => m[1]!);
    expect(updIds.filter((id, i) => updIds.indexOf(id) !== i)).toEqual([]);
  });

  it('sends a CSP without unsafe-eval and without inline script, and configures htmx to match', async () => {
    const r = await app.inject({ method: 'GET', url: '/' });
    const csp = String(r.headers['content-security-policy']);
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toContain('unsafe-eval');
    expect(/script-src[^;]*unsafe-inline/.test(csp)).toBe(false);
    expect(csp).toContain("frame-ancestors 'none'");
    expect(HTMX_CONFIG.allowEval).toBe(false);
    expect(HTMX_CONFIG.includeIndicatorStyles).toBe(false);
    expect(r.body).toContain('name="htmx-config"');
  });
  it('shows US customary units on request: 3.665 m = 144.29 in (3.665 / 0.0254 = 144.2913…, shown to 0.01 in)', async () => {
    const r = await app.inject({ method: 'GET', url: '/?units=us' });
    expect(r.body).toMatch(/name="vehicle.wheelbase_m" value="144.29"/);
  });
});

describe('static assets', () => {
  // the build step's output (scripts/precompress.ts), written here to a temporary folder so the tests do not
  // depend on whether `npm run build` ran; brotli quality 4 instead of the build's 11 only to keep the test quick
  let built: FastifyInstance;
  let publicDir = '';
  beforeAll(async () => {
    publicDir = join(mkdtempSync(join(tmpdir(), 'lockstep-public-')), 'public');
    await writePublic(sourceMounts(), publicDir, 4);
    built = buildApp({ publicDir });
    await built.ready();
  });
  afterAll(async () => {
    await built.close();
    rmSync(dirname(publicDir), { recursive: true, force: true });
  });

  it('serves htmx and plotly from node_modules under versioned URLs, cached for a year, compressed', async () => {
    const app = built;
    const page = (await app.inject({ method: 'GET', url: '/' })).body;
    const htmx = /src="(\/vendor\/htmx-2\.0\.11\/htmx\.min\.js)"/.exec(page)![1]!;
    const plotly = /src="(\/vendor\/plotly-[\d.]+\/plotly\.min\.js)"/.exec(page)![1]!;
    for (const url of [htmx, plotly]) {
      const r = await app.inject({ method: 'GET', url, headers: { 'accept-encoding': 'br, gzip' } });
      expect(r.statusCode, url).toBe(200);
      expect(r.headers['content-type']).toMatch(/javascript/);
      expect(String(r.headers['cache-control'])).toMatch(/max-age=31536000/);
      expect(String(r.headers['cache-control'])).toMatch(/immutable/);
      expect(r.headers['content-encoding']).toBe('br');
    }
    const css = /href="(\/static\/[0-9a-f]{10}\/css\/workbench\.css)"/.exec(page)![1]!;
    const c = await app.inject({ method: 'GET', url: css });
    expect(c.statusCode).toBe(200);
    expect(c.headers['content-type']).toMatch(/text\/css/);
  });
  it('serves nothing else from node_modules', async () => {
    for (const a of [app, built]) {
      const r = await a.inject({ method: 'GET', url: '/vendor/htmx-2.0.11/htmx.js' });
      expect(r.statusCode).toBe(404);
    }
  });
  it('answers brotli from the precompressed file, the same bytes once decompressed, and plain bytes otherwise', async () => {
    // RFC 9110 §8.4 (Content-Encoding) and §12.5.5 (Vary): the body varies with Accept-Encoding
    const url = `${built.assets.app}/js/workbench.js`;
    const source = readFileSync(join(process.cwd(), 'static/js/workbench.js'));
    const br = await built.inject({ method: 'GET', url, headers: { 'accept-encoding': 'gzip, deflate, br' } });
    expect(br.statusCode).toBe(200);
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.headers['content-type']).toMatch(/javascript/);
    expect(String(br.headers.vary)).toMatch(/accept-encoding/i);
    expect(String(br.headers['cache-control'])).toBe('public, max-age=31536000, immutable');
    // byte for byte the file the build wrote (not compressed again for this request) ...
    const brFile = readFileSync(join(publicDir, ...url.split('/').filter(Boolean)) + '.br');
    expect(br.rawPayload.equals(brFile)).toBe(true);
    // ... which decompresses to the source file
    expect(brotliDecompressSync(br.rawPayload).equals(source)).toBe(true);
    const gz = await built.inject({ method: 'GET', url, headers: { 'accept-encoding': 'gzip' } });
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(gz.rawPayload).equals(source)).toBe(true);
    const plain = await built.inject({ method: 'GET', url, headers: { 'accept-encoding': 'identity' } });
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.rawPayload.equals(source)).toBe(true);
  });
  it('without a current build, sends the source files uncompressed, still cached for a year', async () => {
    // `app` has no build folder for the current URLs unless `npm run build` ran after the last edit of static/;
    // this one points at a folder that does not exist
    const none = buildApp({ publicDir: join(dirname(publicDir), 'missing') });
    try {
      const source = readFileSync(join(process.cwd(), 'static/js/workbench.js'));
      const r = await none.inject({ method: 'GET', url: `${none.assets.app}/js/workbench.js`, headers: { 'accept-encoding': 'br, gzip' } });
      expect(r.statusCode).toBe(200);
      expect(r.headers['content-encoding']).toBeUndefined();
      expect(r.rawPayload.equals(source)).toBe(true);
      expect(String(r.headers['cache-control'])).toBe('public, max-age=31536000, immutable');
      const h = await none.inject({ method: 'GET', url: none.assets.htmx, headers: { 'accept-encoding': 'br' } });
      expect(h.statusCode).toBe(200);
      expect(h.headers['content-encoding']).toBeUndefined();
    } finally {
      await none.close();
    }
  });
  it('takes each mount from the build only when the build holds it (static/ edited since: the rest stays precompressed)', async () => {
    const partDir = join(dirname(publicDir), 'part');
    await writePublic(sourceMounts().filter((m) => m.prefix.startsWith('/vendor/htmx-')), partDir, 4);
    const part = buildApp({ publicDir: partDir });
    try {
      const enc = async (url: string) => (await part.inject({ method: 'GET', url, headers: { 'accept-encoding': 'br' } })).headers['content-encoding'];
      expect(await enc(part.assets.htmx)).toBe('br');
      expect(await enc(`${part.assets.app}/js/workbench.js`)).toBeUndefined();
      expect(await enc(part.assets.plotly)).toBeUndefined();
    } finally {
      await part.close();
    }
  });
  it('serves no path outside the listed files', async () => {
    for (const a of [app, built]) {
      const prefix = a.assets.app;
      for (const url of [
        `${prefix}/../package.json`,
        `${prefix}/..%2f..%2fpackage.json`,
        `${prefix}/%2e%2e/%2e%2e/package.json`,
        `${prefix}/js/workbench.js.br`,
        `${prefix}/`,
        `${a.assets.htmx}/../package.json`,
        '/static/0000000000/js/workbench.js',
      ]) {
        const r = await a.inject({ method: 'GET', url });
        expect(r.statusCode, url).toBe(404);
        expect(r.body, url).not.toContain('"name": "lockstep"');
      }
    }
  });
});

describe('errors', () => {
  it('unknown routes get a 404 page for browsers and coded JSON otherwise', async () => {
    const h = await app.inject({ method: 'GET', url: '/no/such/page', headers: { accept: 'text/html' } });
    expect(h.statusCode).toBe(404);
    expect(h.headers['content-type']).toBe('text/html; charset=utf-8');
    expect(h.body).toContain('APP_ERR_NOT_FOUND');
    const j = await app.inject({ method: 'GET', url: '/no/such/page' });
    expect(j.statusCode).toBe(404);
    expect(j.json()).toMatchObject({ code: 'APP_ERR_NOT_FOUND' });
  });
  it('escapes the URL in the 404 page', async () => {
    const h = await app.inject({ method: 'GET', url: '/%3Cscript%3Ex', headers: { accept: 'text/html' } });
    expect(h.body).not.toContain('<script>x');
  });
  it('refuses a body over the limit with 413 APP_ERR_BODY_TOO_LARGE', async () => {
    const r = await app.inject({ method: 'POST', url: '/workbench/update', headers: { 'content-type': 'application/x-www-form-urlencoded' }, payload: `name=${'x'.repeat(BODY_LIMIT + 1)}` });
    expect(r.statusCode).toBe(413);
    expect(r.json()).toMatchObject({ code: 'APP_ERR_BODY_TOO_LARGE' });
  });
  it('refuses a content type it does not read with 415 APP_ERR_UNSUPPORTED_MEDIA_TYPE', async () => {
    const r = await app.inject({ method: 'POST', url: '/workbench/update', headers: { 'content-type': 'text/csv' }, payload: 'a,b' });
    expect(r.statusCode).toBe(415);
    expect(r.json()).toMatchObject({ code: 'APP_ERR_UNSUPPORTED_MEDIA_TYPE' });
  });
  it('refuses an unknown list operation with 400 APP_ERR_UNKNOWN_OPERATION as a status fragment', async () => {
    const r = await update(form(demoValues(), { _op: 'explode:load_states[0]' }));
    expect(r.statusCode).toBe(400);
    expect(r.body).toContain('APP_ERR_UNKNOWN_OPERATION');
    expect(r.body).toContain('id="status"');
  });
});

describe('POST /workbench/update', () => {
  it('a valid design: 200, status current, results out of band, field messages emptied, inputs left alone', async () => {
    const r = await update(form(demoValues()));
    expect(r.statusCode).toBe(200);
    expect(r.headers['content-type']).toBe('text/html; charset=utf-8');
    expect(r.body.startsWith('<div id="status"')).toBe(true);
    expect(r.body).toContain('Results are current');
    expect(r.body).toMatch(/<div id="results" hx-swap-oob="true">/);
    expect(r.body).toMatch(/<p class="msg" id="m-vehicle-wheelbase_m" hx-swap-oob="true"><\/p>/);
    expect(r.body).not.toContain('id="design-inputs"');
    expect(inlineScripts(r.body)).toEqual([]);
  });
  it('invalid values: 422, the field is marked with what is allowed, results marked not current, typed text kept', async () => {
    const v = demoValues();
    v['vehicle.wheelbase_m'] = '0.2'; // schema: 0.5 … 10 m
    v['load_states[1].front_axle_kg'] = '3600'; // must be below the laden mass 3500 kg
    v['axles.front.brake.pad_friction'] = 'lots';
    const r = await update(form(v));
    expect(r.statusCode).toBe(422);
    expect(r.body).toMatch(/id="m-vehicle-wheelbase_m"[^>]*hx-swap-oob="true">[^<]*0\.5[^<]*10[^<]*<\/p>/);
    expect(r.body).toMatch(/id="m-axles-front-brake-pad_friction"[^>]*>[^<]*not a number/);
    expect(r.body).toContain('href="#f-vehicle-wheelbase_m"');
    expect(r.body).toMatch(/<div id="results-note" class="stale-note on" hx-swap-oob="true"><span class="when-results"><strong>Not current\.<\/strong>/);
    expect(r.body).not.toMatch(/<div id="results" hx-swap-oob/);
    expect(r.body).not.toContain('id="design-inputs"'); // the inputs (and what was typed) stay in the page
    // htmx swaps 422 because the page configures it (htmx 2 default: no swap for 4xx)
    expect(HTMX_CONFIG.responseHandling.find((h) => h.code === '422')).toMatchObject({ swap: true });
  });
  it('the cross-field rule lands on the front axle load of the laden state', async () => {
    const v = demoValues();
    v['vehicle.wheelbase_m'] = '3.665';
    v['load_states[1].front_axle_kg'] = '3600';
    const r = await update(form(v));
    expect(r.statusCode).toBe(422);
    expect(r.body).toMatch(/id="m-load_states-1-front_axle_kg"[^>]*>[^<]*3600[^<]*3500/);
  });
  it('a typed unit is converted: "58 in" wheelbase is read as 1.4732 m (58 × 0.0254)', async () => {
    const v = demoValues();
    v['vehicle.wheelbase_m'] = '58 in';
    v['load_states[0].cg_height_m'] = '0.5';
    v['load_states[1].cg_height_m'] = '0.6';
    const r = await update(form(v));
    expect(r.statusCode).toBe(200);
    const j = await app.inject({ method: 'POST', url: '/workbench/design.json', headers: { 'content-type': 'application/x-www-form-urlencoded' }, payload: form(v) });
    expect(j.json().vehicle.wheelbase_m).toBeCloseTo(1.4732, 9);
  });
  it('switching units re-renders the inputs converted: 2720 kg -> 5996.6 lb (2720 / 0.45359237 = 5996.57…, shown to 0.1 lb)', async () => {
    const r = await update(form(demoValues(), { _units: 'us' }));
    expect(r.statusCode).toBe(200);
    expect(r.body).toContain('<div id="design-inputs" hx-swap-oob="true">');
    expect(r.body).toMatch(/name="load_states\[0\]\.mass_kg" value="5996.6"/);
    expect(r.body).toMatch(/name="vehicle.wheelbase_m" value="144.29"/);
  });
  it('switching the rear brake to drum shows the drum fields and drops the disc ones', async () => {
    const r = await update(form(demoValues(), { 'axles.rear.brake.type': 'drum' }));
    expect(r.statusCode).toBe(200);
    expect(r.body).toContain('name="axles.rear.brake.wheel_cylinder_diameter_mm"');
    expect(r.body).toContain('name="axles.rear.brake.brake_factor"');
    expect(r.body).not.toContain('name="axles.rear.brake.piston_diameters_mm[0]"');
  });
  it('switching the valve to proportioning shows knee and ratio; load-sensing shows its table', async () => {
    const r = await update(form(demoValues(), { 'hydraulics.rear_valve.type': 'proportioning' }));
    expect(r.statusCode).toBe(200);
    expect(r.body).toContain('name="hydraulics.rear_valve.knee_bar"');
    expect(r.body).not.toContain('name="hydraulics.rear_valve.knee_bar_at_rear_axle_kg');
    // the table typed for the load-sensing valve is kept (carried in _stash) for a switch back
    expect(r.body).toMatch(/name="_stash" value="[^"]*knee_bar_at_rear_axle_kg\[1\]\[1\]/);
    const t = await update(form(demoValues()));
    expect(t.statusCode).toBe(200);
    const page = await app.inject({ method: 'GET', url: '/' });
    expect(page.body).toContain('name="hydraulics.rear_valve.knee_bar_at_rear_axle_kg[1][1]"');
  });
  it('a balance bar typed on the page becomes hydraulics.balance_bar; with a diagonal split it is marked on the split', async () => {
    const page = await app.inject({ method: 'GET', url: '/' });
    expect(page.body).toMatch(/name="hydraulics\.balance_bar\.rear_bore_mm"[^>]*value=""/); // empty on the demo
    const bar = { 'hydraulics.balance_bar.rear_bore_mm': '22.2', 'hydraulics.balance_bar.setting_front_share': '0.55', 'hydraulics.balance_bar.driver_adjustable': 'false' };
    const file = await app.inject({ method: 'POST', url: '/workbench/design.json', headers: { 'content-type': 'application/x-www-form-urlencoded' }, payload: form(demoValues(), bar) });
    expect(file.statusCode).toBe(200);
    expect(JSON.parse(file.body).hydraulics.balance_bar).toEqual({ rear_bore_mm: 22.2, setting_front_share: 0.55, driver_adjustable: false });
    expect((await update(form(demoValues(), bar))).statusCode).toBe(200);
    // docs/design-file.md: a balance bar needs the front / rear split
    const diagonal = await update(form(demoValues(), { ...bar, 'hydraulics.circuit_split': 'diagonal' }));
    expect(diagonal.statusCode).toBe(422);
    expect(diagonal.body).toMatch(/id="m-hydraulics-circuit_split"[^>]*>[^<]*balance bar/);
    // one of the two numbers alone: the other is asked for on its own field
    const half = await update(form(demoValues(), { 'hydraulics.balance_bar.rear_bore_mm': '22.2' }));
    expect(half.statusCode).toBe(422);
    expect(half.body).toMatch(/id="m-hydraulics-balance_bar-setting_front_share"[^>]*>[^<]*required/);
  });
  it('add, duplicate and remove load states', async () => {
    const d = await update(form(demoValues(), { _op: 'dup:load_states[0]' }));
    expect(d.statusCode).toBe(200);
    expect(d.body).toMatch(/name="load_states\[1\]\.id"[^>]*value="unladen-2"/);
    expect(d.body).toMatch(/name="load_states\[2\]\.id"[^>]*value="laden"/);
    expect(d.body).toContain('id="verdict-2"');
    const rm = await update(form(demoValues(), { _op: 'remove:load_states[0]' }));
    expect(rm.body).toMatch(/name="load_states\[0\]\.id"[^>]*value="laden"/);
    expect(rm.body).not.toContain('name="load_states[1].id"');
  });
});

describe('user text is escaped in every fragment', () => {
  const evil = (): FormValues => {
    const v = demoValues();
    v.name = EVIL;
    v['load_states[0].label'] = EVIL;
    v['load_states[1].label'] = `${EVIL} laden`;
    return v;
  };
  function noRawEvil(body: string) {
    expect(body).not.toContain('<script>alert');
    expect(body).not.toContain(`"x")`);
    expect(inlineScripts(body)).toEqual([]);
  }
  it('status + results + field messages (plain update)', async () => {
    const r = await update(form(evil()));
    expect(r.statusCode).toBe(200);
    noRawEvil(r.body);
    expect(r.body).toContain(`Results for <strong>${EVIL_ESCAPED}</strong>`);
    expect(r.body).toContain(EVIL_ESCAPED); // verdict headings
    // in chart data the label travels as JSON with < written \u003c (and is entity-escaped for plotly labels)
    expect(r.body).toContain('\\u0026lt;script\\u0026gt;');
  });
  it('re-rendered inputs (structural change) keep the text as an escaped attribute value', async () => {
    const r = await update(form(evil(), { _op: 'dup:load_states[0]' }));
    noRawEvil(r.body);
    expect(r.body).toContain(`name="name" maxlength="200" aria-describedby="m-name" class="w-l" value="${EVIL_ESCAPED}"`);
    expect(r.body).toContain(`value="${EVIL_ESCAPED} (copy)"`);
  });
  it('invalid fragment (422) with the evil text typed into a number field', async () => {
    const v = evil();
    v['vehicle.wheelbase_m'] = EVIL;
    const r = await update(form(v));
    expect(r.statusCode).toBe(422);
    noRawEvil(r.body);
    expect(r.body).toContain('&lt;script&gt;');
  });
  it('upload fragment with an evil name and labels', async () => {
    const d = demoDesign();
    d.name = EVIL;
    d.load_states[0]!.label = EVIL;
    const r = await update(form({}, { _upload: JSON.stringify(d) }));
    expect(r.statusCode).toBe(200);
    noRawEvil(r.body);
    expect(r.body).toContain(EVIL_ESCAPED);
  });
  it('CSV quotes text and defuses spreadsheet formulas', async () => {
    const v = demoValues();
    v['load_states[0].label'] = '=HYPERLINK("x") & "q"';
    const r = await app.inject({ method: 'POST', url: '/workbench/table.csv', headers: { 'content-type': 'application/x-www-form-urlencoded' }, payload: form(v) });
    expect(r.statusCode).toBe(200);
    expect(r.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(r.headers['content-disposition']).toMatch(/attachment; filename=".*-table\.csv"/);
    const lines = r.body.trimEnd().split('\r\n');
    expect(lines).toHaveLength(1 + 2 * 10); // header + z = 0.1 … 1.0 for two load states
    expect(lines[1]).toContain(`"'=HYPERLINK(""x"") & ""q"""`);
    expect(lines[0]).toContain('"Pedal force (N)"');
  });
});

describe('upload', () => {
  it('malformed JSON: 422 APP_ERR_UPLOAD_NOT_JSON, and nothing of the design is replaced', async () => {
    const r = await update(form({}, { _upload: '{"format": "lockstep-design/1", ' }));
    expect(r.statusCode).toBe(422);
    expect(r.body).toContain('APP_ERR_UPLOAD_NOT_JSON');
    expect(r.body).toContain('unchanged');
    expect(r.body).not.toContain('id="design-inputs"');
    expect(r.body).not.toContain('id="results"');
    expect(r.body).not.toContain('hx-swap-oob');
  });
  it('a JSON file that is not a valid design: 422 APP_ERR_UPLOAD_INVALID with every problem by field', async () => {
    const d = demoDesign() as unknown as Record<string, unknown>;
    (d.vehicle as Record<string, unknown>).wheelbase_m = 40;
    const r = await update(form({}, { _upload: JSON.stringify(d) }));
    expect(r.statusCode).toBe(422);
    expect(r.body).toContain('APP_ERR_UPLOAD_INVALID');
    expect(r.body).toContain('vehicle.wheelbase_m');
    expect(r.body).not.toContain('hx-swap-oob');
  });
  it('a valid file replaces the inputs and the results', async () => {
    const d = demoDesign();
    d.name = 'Uploaded test design';
    const r = await update(form({}, { _upload: JSON.stringify(d) }));
    expect(r.statusCode).toBe(200);
    expect(r.body).toContain('<div id="design-inputs" hx-swap-oob="true">');
    expect(r.body).toContain('value="Uploaded test design"');
    expect(r.body).not.toContain('What you are looking at'); // the intro belongs to the demo only
    expect(r.body).toMatch(/<div id="results" hx-swap-oob="true">/);
  });
});

describe('downloads', () => {
  it('design.json is the current design as lockstep-design/1, provenance kept', async () => {
    const r = await app.inject({ method: 'POST', url: '/workbench/design.json', headers: { 'content-type': 'application/x-www-form-urlencoded' }, payload: form(demoValues()) });
    expect(r.statusCode).toBe(200);
    expect(r.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(r.headers['content-disposition']).toMatch(/^attachment; filename="demo-long-wheelbase-panel-van/);
    expect(r.json()).toEqual(demoDesign());
  });
  it('an invalid design is not downloaded: 422 with the field list', async () => {
    const v = demoValues();
    v['hydraulics.pedal_ratio'] = '0';
    const r = await app.inject({ method: 'POST', url: '/workbench/design.json', headers: { 'content-type': 'application/x-www-form-urlencoded' }, payload: form(v) });
    expect(r.statusCode).toBe(422);
    expect(r.json()).toMatchObject({ code: 'APP_ERR_FORM_INVALID' });
    expect(r.json().details[0]).toMatch(/^hydraulics\.pedal_ratio: /);
  });
});

describe('field message slots', () => {
  it('every out-of-band message in an update has its slot in the page (no orphan swaps)', async () => {
    const page = (await app.inject({ method: 'GET', url: '/' })).body;
    const r = await update(form(demoValues()));
    const oobIds = [...r.body.matchAll(/<p class="msg" id="([^"]+)"[^>]*hx-swap-oob="true"/g)].map((m) => m[1]!);
    expect(oobIds.length).toBeGreaterThan(20);
    for (const id of oobIds) expect(page, id).toContain(`id="${id}"`);
  });
});

describe('deferred result panels', () => {
  it('render a placeholder with the recompute and their results from POST /workbench/panel/:id', async () => {
    const { panels } = await import('../../views/panels/index.ts');
    const { html } = await import('../../views/html.ts');
    const probe = {
      id: 'probe-deferred',
      title: 'Probe',
      deferred: true,
      results: (ctx: { design: { name: string }; result: { load_states: unknown[] } }) => html`<p id="probe-out">${ctx.design.name}: ${ctx.result.load_states.length} states</p>`,
    };
    panels.push(probe as unknown as (typeof panels)[number]);
    try {
      const v = demoValues();
      v.name = EVIL;
      const r = await update(form(v));
      expect(r.statusCode).toBe(200);
      expect(r.body).toContain('id="deferred-probe-deferred" hx-post="/workbench/panel/probe-deferred" hx-trigger="intersect once" hx-include="#design-form"');
      expect(r.body).not.toContain('id="probe-out"');
      const p = await app.inject({ method: 'POST', url: '/workbench/panel/probe-deferred', headers: { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true' }, payload: form(v) });
      expect(p.statusCode).toBe(200);
      expect(p.body).toContain(`<p id="probe-out">${EVIL_ESCAPED}: 2 states</p>`);
      v['vehicle.wheelbase_m'] = 'x';
      const bad = await app.inject({ method: 'POST', url: '/workbench/panel/probe-deferred', headers: { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true' }, payload: form(v) });
      expect(bad.statusCode).toBe(422);
      expect(bad.body).toContain('Not current');
      const none = await app.inject({ method: 'POST', url: '/workbench/panel/verdict', headers: { 'content-type': 'application/x-www-form-urlencoded' }, payload: form(demoValues()) });
      expect(none.statusCode).toBe(404); // only deferred panels are served this way
    } finally {
      panels.splice(panels.indexOf(probe as unknown as (typeof panels)[number]), 1);
    }
  });
});
