/**
 * The response cache of the workbench (server/response-cache.ts) and its use by POST /workbench/update:
 * the same posted form is answered from the cache, byte for byte the same; a form that differs in one field,
 * in its unit system or in the order of nothing but its values never gets another form's answer; the cache
 * stays within its bound. Expected answers are the ones the uncached update() renders (hand-checked property:
 * the recompute is a pure function of the posted form, DEVELOPERS.md "The workbench").
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoDesign } from '../../core/index.ts';
import { buildApp } from '../../server/app.ts';
import { designToValues } from '../../form/design-form.ts';
import { type Answer, chooseEncoding, ResponseCache } from '../../server/response-cache.ts';
import { answers, update } from '../../server/routes/workbench.ts';
import { raw } from '../../views/html.ts';

type App = ReturnType<typeof buildApp>;
let app: App;
beforeAll(async () => {
  app = buildApp();
  await app.ready();
});
afterAll(async () => {
  await app.close();
});

const post = (values: Record<string, string>, encoding = 'identity') =>
  app.inject({
    method: 'POST',
    url: '/workbench/update',
    headers: { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true', 'accept-encoding': encoding },
    payload: new URLSearchParams(values).toString(),
  });

const text = (a: Answer) => (a.entry ? a.entry.utf8.toString('utf8') : a.body.html);

describe('ResponseCache', () => {
  it('keeps at most its capacity, dropping the least recently used', () => {
    const c = new ResponseCache(3);
    let made = 0;
    const ask = (s: string) => c.answer(s, () => ({ status: 200, body: raw(`<p>${s}${++made}</p>`) }));
    for (const s of ['a', 'b', 'c']) ask(s);
    expect(text(ask('a'))).toBe('<p>a1</p>'); // hit: a is now the most recent
    ask('d'); // evicts b, the least recently used
    expect(c.size).toBe(3);
    expect(text(ask('b'))).toBe('<p>b5</p>'); // made again
    expect(text(ask('a'))).toBe('<p>a1</p>');
  });

  it('keeps at most its byte bound, dropping the least recently used, and counts what it keeps', () => {
    // each entry: a one-character form text (2 bytes as counted) and a 100-byte answer
    const c = new ResponseCache(100, 350);
    const ask = (s: string) => c.answer(s, () => ({ status: 200, body: raw(s.repeat(100)) }));
    for (const s of ['a', 'b', 'c']) ask(s);
    expect(c.size).toBe(3);
    expect(c.bytes).toBe(306);
    ask('d'); // 408 bytes would be over 350: a, the least recently used, goes
    expect(c.size).toBe(3);
    expect(c.bytes).toBe(306);
    let made = 0;
    c.answer('a', () => ((made++), { status: 200, body: raw('a'.repeat(100)) }));
    expect(made).toBe(1); // a was evicted: made again
    c.clear();
    expect(c.bytes).toBe(0);
  });

  it('never caches the empty source (uploads and oversized forms)', () => {
    const c = new ResponseCache(3);
    let made = 0;
    c.answer('', () => ({ status: 200, body: raw(`${++made}`) }));
    c.answer('', () => ({ status: 200, body: raw(`${++made}`) }));
    expect(made).toBe(2);
    expect(c.size).toBe(0);
  });

  it('chooses gzip, else brotli, and respects q=0', () => {
    expect(chooseEncoding('gzip, deflate, br')).toBe('gzip'); // the faster of the two (server/response-cache.ts)
    expect(chooseEncoding('br')).toBe('br');
    expect(chooseEncoding('br, gzip;q=0')).toBe('br');
    expect(chooseEncoding('br;q=0, gzip')).toBe('gzip');
    expect(chooseEncoding('identity')).toBeNull();
    expect(chooseEncoding(undefined)).toBeNull();
  });
});

describe('POST /workbench/update with the response cache', () => {
  it('answers a repeated form from the cache with the same bytes the uncached update() renders', async () => {
    const v = designToValues(demoDesign(), 'metric');
    const expected = update({ ...v });
    const hits = answers.hits;
    const first = await post(v);
    const second = await post(v);
    expect(answers.hits).toBe(hits + 1);
    expect(first.statusCode).toBe(expected.status);
    expect(first.body).toBe(expected.body.html);
    expect(second.body).toBe(expected.body.html);
  });

  it('a form that differs in one value, or in its units, gets its own answer', async () => {
    const v = designToValues(demoDesign(), 'metric');
    await post(v);
    const w = { ...v, 'vehicle.wheelbase_m': 'x' }; // invalid: 422 with a field message
    const r = await post(w);
    expect(r.statusCode).toBe(422);
    expect(r.body).toBe(update({ ...w }).body.html);
    const name = { ...v, name: 'Cache probe & <b>' };
    const n = await post(name);
    expect(n.body).toContain('Cache probe &amp; &lt;b&gt;');
    const us = designToValues(demoDesign(), 'us');
    const u = await post({ ...us, _units: 'us' });
    expect(u.body).toBe(update({ ...us, _units: 'us' }).body.html);
    expect(u.body).not.toBe((await post(v)).body);
  });

  it('compressed answers decode to the same HTML (brotli and gzip kept per entry)', async () => {
    const v = designToValues(demoDesign(), 'metric');
    const plain = await post(v);
    for (const enc of ['br', 'gzip']) {
      for (let i = 0; i < 2; i++) {
        const r = await post(v, enc === 'br' ? 'br' : 'gzip, br');
        expect(r.headers['content-encoding']).toBe(enc);
        const { brotliDecompressSync, gunzipSync } = await import('node:zlib');
        const buf = r.rawPayload;
        expect((enc === 'br' ? brotliDecompressSync(buf) : gunzipSync(buf)).toString('utf8')).toBe(plain.body);
      }
    }
  });
});
