/**
 * HTTP benchmark of the workbench (issue 3): autocannon on loopback against the recompute endpoint
 * (POST /workbench/update with the demo form, as htmx sends it on every change): 64 connections, 10 s;
 * requests per second and p50/p99 latency. Then the page weight: bytes transferred on a first load (page and
 * every asset, compressed as a browser asks for them) and on a repeat load (assets are immutable and cached, so
 * only the page travels). Targets: p99 ≤ 20 ms, ≥ 2000 req/s, first load ≤ 1.6 MB, repeat load ≤ 50 KB.
 * Options through the environment: BENCH_DURATION (s), BENCH_CONNECTIONS.
 */
import { request } from 'node:http';
import autocannon from 'autocannon';
import { demoDesign } from '../core/index.ts';
import { buildApp } from '../server/app.ts';
import { designToValues } from '../server/forms/design-form.ts';

interface Fetched {
  status: number;
  bytes: number;
  headerBytes: number;
  body: string;
  encoding: string;
}

/** GET with the encodings a browser accepts; counts the bytes on the wire (compressed body + header block). */
function get(url: string): Promise<Fetched> {
  return new Promise((resolve, reject) => {
    const req = request(url, { headers: { 'accept-encoding': 'br, gzip, deflate', accept: 'text/html,*/*' } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        const buf = Buffer.concat(chunks);
        const headerBytes = res.rawHeaders.reduce((n, h) => n + Buffer.byteLength(h) + 2, 0) + 20;
        resolve({ status: res.statusCode ?? 0, bytes: buf.length, headerBytes, body: res.headers['content-encoding'] ? '' : buf.toString('utf8'), encoding: String(res.headers['content-encoding'] ?? 'identity') });
      });
    });
    req.on('error', reject);
    req.end();
  });
}

function plainGet(url: string): Promise<string> {
  return new Promise((resolve, reject) => {
    request(url, (res) => {
      let s = '';
      res.setEncoding('utf8');
      res.on('data', (c: string) => (s += c));
      res.on('end', () => resolve(s));
    }).on('error', reject).end();
  });
}

const kb = (n: number) => `${(n / 1024).toFixed(1)} KiB`;

export async function run(): Promise<void> {
  const app = buildApp();
  await app.listen({ host: '127.0.0.1', port: 0 });
  const base = `http://127.0.0.1:${(app.server.address() as { port: number }).port}`;
  try {
    const html = await plainGet(`${base}/`);
    const shape = (/name="_shape" value="([^"]*)"/.exec(html)?.[1] ?? '').replace(/&amp;/g, '&');
    const form = new URLSearchParams({ ...designToValues(demoDesign(), 'metric'), _units: 'metric', _shape: shape }).toString();

    const duration = Number(process.env.BENCH_DURATION ?? 10);
    const connections = Number(process.env.BENCH_CONNECTIONS ?? 64);
    const headers = { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true', 'accept-encoding': 'br, gzip' };
    const report = (title: string, result: Awaited<ReturnType<typeof autocannon>>) => {
      const bad = result.non2xx + result.errors + result.timeouts;
      console.log(`${title}: ${connections} connections, ${duration} s`);
      console.log(`  requests/s  mean ${result.requests.average.toFixed(0)}   (target >= 2000)`);
      console.log(`  latency     p50 ${result.latency.p50} ms   p99 ${result.latency.p99} ms   max ${result.latency.max} ms   (target p99 <= 20 ms)`);
      console.log(`  responses   ${result.requests.total} total, ${bad} not 2xx or failed, ${kb(result.throughput.average)}/s`);
    };
    // 1. a new design on every request (the front pad friction steps through 2000 values): every request is
    //    parsed, evaluated and rendered; nothing comes from the results cache
    let n = 0;
    const varied = await autocannon({
      url: `${base}/workbench/update`,
      method: 'POST',
      connections,
      duration,
      headers,
      requests: [{ setupRequest: (req: { body?: string }) => ({ ...req, body: form.replace(/axles\.front\.brake\.pad_friction=[^&]*/, `axles.front.brake.pad_friction=${(0.3 + (n++ % 2000) / 10000).toFixed(4)}`) }) }],
      body: form,
    });
    report('recompute endpoint, a changed design on every request (no cache)', varied);
    // 2. the same form again and again (a re-sent unchanged form: the rendered results come from the cache)
    const same = await autocannon({ url: `${base}/workbench/update`, method: 'POST', connections, duration, headers, body: form });
    report('recompute endpoint, the same form every time (results cache)', same);

    // page weight
    const page = await get(`${base}/`);
    const assets = [...html.matchAll(/<(?:script|link)[^>]+(?:src|href)="(\/[^"]+)"/g)].map((m) => m[1]!);
    let first = page.bytes + page.headerBytes;
    const rows: string[] = [`  ${'/'.padEnd(52)} ${kb(page.bytes).padStart(11)} ${page.encoding}`];
    for (const a of assets) {
      const r = await get(`${base}${a}`);
      first += r.bytes + r.headerBytes;
      rows.push(`  ${a.padEnd(52)} ${kb(r.bytes).padStart(11)} ${r.encoding}`);
    }
    const repeat = page.bytes + page.headerBytes; // assets: cache-control immutable, one year: no request
    console.log('page weight (bytes on the wire incl. response headers):');
    for (const r of rows) console.log(r);
    console.log(`  first load  ${kb(first)} (${(first / 1e6).toFixed(2)} MB; target <= 1.6 MB)`);
    console.log(`  repeat load ${kb(repeat)} (target <= 50 KB): the page only; every asset is cached as immutable`);
  } finally {
    await app.close();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await run();
