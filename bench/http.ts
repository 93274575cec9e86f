/**
 * HTTP benchmark of the workbench (issue 3): autocannon on loopback against the recompute endpoint
 * (POST /workbench/update with the demo form, as htmx sends it on every change): 64 connections, 10 s, twice:
 *   (a) the same form on every request: answered from the response cache (server/response-cache.ts);
 *   (b) a fresh design on every request (the front pad friction changes each time): parsed, evaluated, rendered.
 * For each: requests per second, p50/p99 latency, and the server's CPU time per request. The server runs in a
 * child process (this file with BENCH_HTTP_CHILD=1) so that its CPU time is measured apart from autocannon's;
 * the machine is shared, so CPU ms per request is the figure that other load disturbs least. Then update()
 * called in-process (no HTTP) for the same two cases, and the page weight: bytes transferred on a first load
 * (page and every asset, compressed as a browser asks for them) and on a repeat load (assets are immutable and
 * cached, so only the page travels). Targets: p99 ≤ 20 ms, ≥ 2000 req/s, first load ≤ 1.6 MB, repeat ≤ 50 KB.
 * Each case runs after a warm-up (not counted; BENCH_WARMUP s, default 3) so that it reports the steady state;
 * the first answer of the fresh server process (code compiled on the way) is timed on its own.
 * Options through the environment: BENCH_DURATION (s), BENCH_CONNECTIONS, BENCH_WARMUP (s).
 */
import { fork } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { request } from 'node:http';
import autocannon from 'autocannon';
import { demoDesign } from '../core/index.ts';
import { buildApp } from '../server/app.ts';
import { designToValues } from '../server/forms/design-form.ts';
import { answers, update } from '../server/routes/workbench.ts';

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

/** POST a form, resolve with the milliseconds until the whole answer arrived. */
function timedPost(url: string, body: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const t0 = performance.now();
    const req = request(url, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true' } }, (res) => {
      res.resume();
      res.on('end', () => resolve(performance.now() - t0));
    });
    req.on('error', reject);
    req.end(body);
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

interface ChildReport {
  cpu: NodeJS.CpuUsage;
  hits: number;
  misses: number;
}

/** The server in a child process: prints nothing, answers the parent's questions over IPC. */
async function serveChild(): Promise<void> {
  const app = buildApp();
  await app.listen({ host: '127.0.0.1', port: 0 });
  const send = (m: unknown) => process.send!(m);
  process.on('message', (m: string) => {
    if (m === 'report') send({ cpu: process.cpuUsage(), hits: answers.hits, misses: answers.misses } satisfies ChildReport);
    if (m === 'close') void app.close().then(() => process.exit(0));
  });
  send({ port: (app.server.address() as { port: number }).port });
}

function startChild(): Promise<{ port: number; ask: () => Promise<ChildReport>; close: () => void }> {
  const child = fork(fileURLToPath(import.meta.url), [], { execArgv: ['--import', 'tsx'], env: { ...process.env, BENCH_HTTP_CHILD: '1' } });
  let waiting: ((r: ChildReport) => void) | null = null;
  return new Promise((resolve, reject) => {
    child.once('error', reject);
    child.on('message', (m: { port?: number } & Partial<ChildReport>) => {
      if (m.port !== undefined) {
        resolve({
          port: m.port,
          ask: () => new Promise<ChildReport>((res) => ((waiting = res), child.send('report'))),
          close: () => child.send('close'),
        });
      } else if (waiting) {
        const w = waiting;
        waiting = null;
        w(m as ChildReport);
      }
    });
  });
}

const cpuMs = (a: NodeJS.CpuUsage, b: NodeJS.CpuUsage) => (b.user - a.user + b.system - a.system) / 1000;

/** CPU ms per call of f, in this process (no HTTP, no compression): median of 5 rounds of n calls. */
function cpuPerCall(f: (i: number) => unknown, n: number): number {
  let i = 0;
  for (let k = 0; k < 20; k++) f(i++);
  const rounds: number[] = [];
  for (let r = 0; r < 5; r++) {
    const a = process.cpuUsage();
    for (let k = 0; k < n; k++) f(i++);
    rounds.push(cpuMs(a, process.cpuUsage()) / n);
  }
  return rounds.sort((x, y) => x - y)[2]!;
}

export async function run(): Promise<void> {
  const child = await startChild();
  const base = `http://127.0.0.1:${child.port}`;
  const app = buildApp(); // for the page weight only
  await app.listen({ host: '127.0.0.1', port: 0 });
  const pageBase = `http://127.0.0.1:${(app.server.address() as { port: number }).port}`;
  try {
    const html = await plainGet(`${base}/`);
    const shape = (/name="_shape" value="([^"]*)"/.exec(html)?.[1] ?? '').replace(/&amp;/g, '&');
    const values = { ...designToValues(demoDesign(), 'metric'), _units: 'metric', _shape: shape };
    const form = new URLSearchParams(values).toString();
    const PAD = /axles\.front\.brake\.pad_friction=[^&]*/;
    // a pad friction never sent before (0.3 + n·10⁻⁷, n counting up): neither cache can answer
    const fresh = (n: number) => form.replace(PAD, `axles.front.brake.pad_friction=${(0.3 + n * 1e-7).toFixed(7)}`);
    if (!PAD.test(form)) throw new Error('the demo form has no front pad friction field to vary');

    const cold = await timedPost(`${base}/workbench/update`, fresh(0));
    const second = await timedPost(`${base}/workbench/update`, fresh(-1));
    console.log(`first recompute answered by a fresh server process (after it served the page once) ${cold.toFixed(0)} ms; the next, another design, ${second.toFixed(0)} ms`);
    const duration = Number(process.env.BENCH_DURATION ?? 10);
    const connections = Number(process.env.BENCH_CONNECTIONS ?? 64);
    const headers = { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true', 'accept-encoding': 'br, gzip' };
    const warmup = Number(process.env.BENCH_WARMUP ?? 3);
    const measure = async (title: string, opts: Partial<Parameters<typeof autocannon>[0]>) => {
      // a warm-up run first, not counted: the first requests of a fresh process compile code on the way
      // (a cold first answer is reported separately above); the figures below are the steady state
      if (warmup > 0) await autocannon({ url: `${base}/workbench/update`, method: 'POST', connections, duration: warmup, headers, body: form, ...opts });
      const before = await child.ask();
      const result = await autocannon({ url: `${base}/workbench/update`, method: 'POST', connections, duration, headers, body: form, ...opts });
      const after = await child.ask();
      const bad = result.non2xx + result.errors + result.timeouts;
      const served = after.hits + after.misses - before.hits - before.misses;
      console.log(`${title}: ${connections} connections, ${duration} s after a ${warmup} s warm-up`);
      console.log(`  requests/s  mean ${result.requests.average.toFixed(0)}   (target >= 2000)`);
      console.log(`  latency     p50 ${result.latency.p50} ms   p99 ${result.latency.p99} ms   max ${result.latency.max} ms   (target p99 <= 20 ms)`);
      console.log(`  server CPU  ${(cpuMs(before.cpu, after.cpu) / Math.max(1, served)).toFixed(3)} ms per request (${served} answered; cache hits ${after.hits - before.hits}, misses ${after.misses - before.misses})`);
      console.log(
        `  responses   ${result.requests.total} total, ${bad} not 2xx or failed (non-2xx ${result.non2xx}, errors ${result.errors}, timeouts ${result.timeouts}), ${kb(result.throughput.average)}/s`,
      );
    };
    // (a) the same form again and again (a re-sent unchanged form)
    await measure('(a) recompute endpoint, the same form every time (response cache)', {});
    // (b) a new design on every request
    let n = 0;
    await measure('(b) recompute endpoint, a fresh design on every request (no cache can answer)', {
      requests: [{ setupRequest: (req: { body?: string }) => ({ ...req, body: fresh(++n) }) }],
    });

    // the same two cases in this process, without HTTP and compression: CPU ms per update() call
    const posted = Object.fromEntries(new URLSearchParams(form));
    const same = cpuPerCall(() => answers.answer(`update\n${JSON.stringify(Object.entries(posted))}`, () => update(posted)), 2000);
    let m = 10_000_000;
    const changed = cpuPerCall(() => update({ ...posted, 'axles.front.brake.pad_friction': (0.3 + ++m * 1e-9).toFixed(9) }), 100);
    console.log('in-process CPU per call (no HTTP, no compression):');
    console.log(`  (a) same form, cached answer   ${same.toFixed(3)} ms`);
    console.log(`  (b) fresh design, update()     ${changed.toFixed(3)} ms`);

    // page weight
    const page = await get(`${pageBase}/`);
    const assets = [...html.matchAll(/<(?:script|link)[^>]+(?:src|href)="(\/[^"]+)"/g)].map((m) => m[1]!);
    let first = page.bytes + page.headerBytes;
    const rows: string[] = [`  ${'/'.padEnd(52)} ${kb(page.bytes).padStart(11)} ${page.encoding}`];
    for (const a of assets) {
      const r = await get(`${pageBase}${a}`);
      first += r.bytes + r.headerBytes;
      rows.push(`  ${a.padEnd(52)} ${kb(r.bytes).padStart(11)} ${r.encoding}`);
    }
    const repeat = page.bytes + page.headerBytes; // assets: cache-control immutable, one year: no request
    console.log('page weight (bytes on the wire incl. response headers):');
    for (const r of rows) console.log(r);
    console.log(`  first load  ${kb(first)} (${(first / 1e6).toFixed(2)} MB; target <= 1.6 MB)`);
    console.log(`  repeat load ${kb(repeat)} (target <= 50 KB): the page only; every asset is cached as immutable`);
  } finally {
    child.close();
    await app.close();
  }
}

if (process.env.BENCH_HTTP_CHILD === '1') await serveChild();
else if (import.meta.url === `file://${process.argv[1]}`) await run();
