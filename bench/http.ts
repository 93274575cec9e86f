/**
 * HTTP benchmark of the workbench (issues 3 and 17): autocannon on loopback, 64 connections, 10 s per case, after a
 * warm-up: first a bare node:http server answering two bytes (the floor, same load generator, same run), then
 *   (a) POST /workbench/update with the same form every time: answered from the response cache;
 *   (b) POST /workbench/update with a fresh design on every request (the front pad friction changes): parsed,
 *       evaluated, rendered, compressed;                                  target >= 0.04 × bare, <= 1 ms CPU each
 *   (c) GET / (the page, as a browser asks for it);                      target >= 0.04 × bare
 *   (d) GET of plotly (1.4 MB compressed, the largest static asset);     target >= 0.25 × bare
 * For each: requests per second and their ratio to the bare server, p50/p99 latency, the server's CPU time per
 * request and its resident memory (targets: <= 200 MB idle, <= 300 MB under load). The server runs in a child
 * process (this file with BENCH_HTTP_CHILD=1) so that its CPU time and memory are measured apart from autocannon's;
 * the machine is shared, so the ratios and the CPU ms per request are the figures other load disturbs least. Then
 * update() in-process (no HTTP) for (a) and (b), and the page weight: bytes on a first load (page and every asset,
 * compressed as a browser asks for them) and on a repeat load (assets are immutable and cached, so only the page
 * travels); targets first load <= 1.6 MB, repeat <= 50 KB.
 * Options through the environment: BENCH_DURATION (s), BENCH_CONNECTIONS, BENCH_WARMUP (s).
 */
import { fork, spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { request } from 'node:http';
import autocannon from 'autocannon';
import { demoDesign } from '../core/index.ts';
import { buildApp } from '../server/app.ts';
import { designToValues } from '../form/design-form.ts';
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

/** GET with br/gzip accepted, resolve with the milliseconds until the whole answer arrived. */
function timedGet(url: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const t0 = performance.now();
    request(url, { headers: { 'accept-encoding': 'br, gzip' } }, (res) => {
      res.resume();
      res.on('end', () => resolve(performance.now() - t0));
    })
      .on('error', reject)
      .end();
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
const mb = (n: number) => `${(n / 1e6).toFixed(0)} MB`;

/** A bare node:http server in a child process answering every request with two bytes: the floor of the ratios. */
function startBare(): Promise<{ url: string; close: () => void }> {
  const code = "const s=require('node:http').createServer((q,r)=>r.end('ok'));s.listen(0,'127.0.0.1',()=>process.send(s.address().port));process.on('message',()=>process.exit(0))";
  const child = spawn(process.execPath, ['-e', code], { stdio: ['ignore', 'ignore', 'inherit', 'ipc'] });
  return new Promise((resolve, reject) => {
    child.once('error', reject);
    child.once('message', (port) => resolve({ url: `http://127.0.0.1:${String(port)}/`, close: () => child.send('close') }));
  });
}

interface ChildReport {
  cpu: NodeJS.CpuUsage;
  hits: number;
  misses: number;
  /** Resident memory now and the largest seen since the last report (sampled every 100 ms), bytes. */
  rss: number;
  maxRss: number;
  /** V8 heap in use and memory outside it (Buffers), bytes; the recompute cache's entries and bytes. */
  heapUsed: number;
  external: number;
  cacheEntries: number;
  cacheBytes: number;
}

/** The server in a child process: prints nothing, answers the parent's questions over IPC. */
async function serveChild(): Promise<void> {
  const app = buildApp();
  await app.listen({ host: '127.0.0.1', port: 0 });
  const send = (m: unknown) => process.send!(m);
  let maxRss = process.memoryUsage.rss();
  setInterval(() => (maxRss = Math.max(maxRss, process.memoryUsage.rss())), 100).unref();
  process.on('message', (m: string) => {
    if (m === 'report') {
      const rss = process.memoryUsage.rss();
      const mem = process.memoryUsage();
      send({
        cpu: process.cpuUsage(),
        hits: answers.hits,
        misses: answers.misses,
        rss,
        maxRss: Math.max(maxRss, rss),
        heapUsed: mem.heapUsed,
        external: mem.external,
        cacheEntries: answers.size,
        cacheBytes: answers.bytes,
      } satisfies ChildReport);
      maxRss = rss;
    }
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
    const plotlyFirst = /<script[^>]+src="(\/vendor\/plotly[^"]+)"/.exec(html)?.[1];
    if (plotlyFirst) console.log(`first GET of plotly by a fresh server process (the brotli file the build step wrote; from the sources, uncompressed, without a current build) ${(await timedGet(`${base}${plotlyFirst}`)).toFixed(0)} ms`);
    const second = await timedPost(`${base}/workbench/update`, fresh(-1));
    console.log(`first recompute answered by a fresh server process (after it served the page once) ${cold.toFixed(0)} ms; the next, another design, ${second.toFixed(0)} ms`);
    const duration = Number(process.env.BENCH_DURATION ?? 10);
    const connections = Number(process.env.BENCH_CONNECTIONS ?? 64);
    const headers = { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true', 'accept-encoding': 'br, gzip' };
    const getHeaders = { accept: 'text/html,*/*', 'accept-encoding': 'br, gzip' };
    const warmup = Number(process.env.BENCH_WARMUP ?? 3);
    const idle = await child.ask();
    type Opts = Partial<Parameters<typeof autocannon>[0]>;
    const load = async (opts: Opts) => {
      // a warm-up run first, not counted: the first requests of a fresh process compile code on the way
      // (a cold first answer is reported separately above); the figures below are the steady state
      if (warmup > 0) await autocannon({ connections, duration: warmup, ...opts } as Parameters<typeof autocannon>[0]);
      return autocannon({ connections, duration, ...opts } as Parameters<typeof autocannon>[0]);
    };
    // the floor: a bare node:http server answering two bytes, same load generator, same run
    const bareServer = await startBare();
    const bare = await load({ url: bareServer.url });
    bareServer.close();
    const bareRps = bare.requests.average;
    console.log(`bare node:http server answering "ok": ${connections} connections, ${duration} s: ${bareRps.toFixed(0)} requests/s, p50 ${bare.latency.p50} ms, p99 ${bare.latency.p99} ms`);
    let maxRss = idle.maxRss;
    const measure = async (title: string, opts: Opts, target: { ratio?: number; cpuMs?: number }, viaAnswers = true) => {
      const before = await child.ask();
      const result = await load(opts);
      const after = await child.ask();
      maxRss = Math.max(maxRss, after.maxRss);
      const bad = result.non2xx + result.errors + result.timeouts;
      const counted = viaAnswers ? after.hits + after.misses - before.hits - before.misses : 0;
      const served = counted > 0 ? counted : result.requests.total;
      const cpu = cpuMs(before.cpu, after.cpu) / Math.max(1, served);
      const ratio = result.requests.average / bareRps;
      console.log(`${title}: ${connections} connections, ${duration} s after a ${warmup} s warm-up`);
      const goal = target.ratio === undefined ? '(no target: bounded by the bytes per answer)' : `(target >= ${target.ratio} × bare: ${ratio >= target.ratio ? 'met' : 'MISSED'})`;
      console.log(`  requests/s  mean ${result.requests.average.toFixed(0)} = ${ratio.toFixed(3)} × bare   ${goal}`);
      console.log(`  latency     p50 ${result.latency.p50} ms   p99 ${result.latency.p99} ms   max ${result.latency.max} ms`);
      console.log(
        `  server CPU  ${cpu.toFixed(3)} ms per request${target.cpuMs ? ` (target <= ${target.cpuMs} ms: ${cpu <= target.cpuMs ? 'met' : 'MISSED'})` : ''}` +
          (counted > 0 ? ` (${served} answered; cache hits ${after.hits - before.hits}, misses ${after.misses - before.misses})` : ''),
      );
      console.log(
        `  responses   ${result.requests.total} total, ${bad} not 2xx or failed (non-2xx ${result.non2xx}, errors ${result.errors}, timeouts ${result.timeouts}), ${kb(result.throughput.average)}/s`,
      );
      console.log(
        `  server RSS  ${mb(after.rss)} after, largest ${mb(after.maxRss)} during; heap in use ${mb(after.heapUsed)}, outside the heap ${mb(after.external)}; ` +
          `recompute cache ${after.cacheEntries} of ${answers.capacity} entries, ${mb(after.cacheBytes)} of ${mb(answers.maxBytes)}`,
      );
    };
    const post = { url: `${base}/workbench/update`, method: 'POST' as const, headers, body: form };
    // (a) the same form again and again (a re-sent unchanged form)
    await measure('(a) recompute endpoint, the same form every time (response cache)', post, { ratio: 0.04 });
    // (b) a new design on every request
    let n = 0;
    await measure('(b) recompute endpoint, a fresh design on every request (no cache can answer)', { ...post, requests: [{ setupRequest: (req: { body?: string }) => ({ ...req, body: fresh(++n) }) }] }, { ratio: 0.04, cpuMs: 1 });
    // (c) the page itself, as a browser asks for it
    await measure('(c) GET / (the workbench page, brotli or gzip)', { url: `${base}/`, headers: getHeaders }, { ratio: 0.04 }, false);
    // (d) a static asset (htmx, 16 KB as brotli), and (e) plotly, the largest (1.2 MB as brotli: the bytes bound it)
    const script = (name: string) => {
      const url = new RegExp(`<script[^>]+src="(/vendor/${name}[^"]+)"`).exec(html)?.[1];
      if (!url) throw new Error(`the page names no ${name} script`);
      return `${base}${url}`;
    };
    await measure('(d) GET htmx.min.js (a static asset, precompressed brotli)', { url: script('htmx'), headers: getHeaders }, { ratio: 0.25 }, false);
    await measure('(e) GET plotly.min.js (the largest static asset, precompressed brotli)', { url: script('plotly'), headers: getHeaders }, {}, false);
    const end = await child.ask();
    console.log(`server resident memory: idle ${mb(idle.rss)} (target <= 200 MB: ${idle.rss <= 200e6 ? 'met' : 'MISSED'}), largest under load ${mb(maxRss)} (target <= 300 MB: ${maxRss <= 300e6 ? 'met' : 'MISSED'}), after the load ${mb(end.rss)}`);

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
