/**
 * Fuzz harness of the form routes: `npm run fuzz` (10 000 requests), `npm run fuzz -- 2000 [seed]`.
 *
 * Starts the server itself (`server/main.ts`, HOST=127.0.0.1, a free port, a temporary data folder: loopback only,
 * nothing else is contacted), sends the hostile requests of scripts/hostile-form.ts (8 at a time, at most
 * 100 000 requests and 10 minutes), then checks the demo still evaluates, prints the histogram of statuses and
 * codes, and stops the server. Exit code 1 on any 5xx, a failed connection or a demo that no longer evaluates.
 * See docs/threat-model.md.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { freshDemoBody, type HostileRequest, hostileRequest } from './hostile-form.ts';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const MAX_COUNT = 100_000;
const TIME_LIMIT_MS = 10 * 60_000;
const PARALLEL = 8;

const count = Math.min(MAX_COUNT, Math.max(1, Number(process.argv[2] ?? 10_000) || 10_000));
const seed = Number(process.argv[3] ?? 16) || 16;

interface Answer {
  status: number;
  code: string;
}

function send(port: number, req: HostileRequest): Promise<Answer> {
  return new Promise((resolve) => {
    const headers = { host: `127.0.0.1:${port}`, ...req.headers, 'content-length': String(Buffer.byteLength(req.payload)) };
    const r = request({ host: '127.0.0.1', port, method: 'POST', path: req.url, headers, timeout: 60_000 }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        const body = Buffer.concat(chunks).toString('utf8');
        const code = /\b(APP_ERR_[A-Z_]+|STORE_ERR_[A-Z_]+)\b/.exec(body)?.[1] ?? '-';
        resolve({ status: res.statusCode ?? 0, code });
      });
    });
    r.on('timeout', () => r.destroy(new Error('timeout')));
    r.on('error', (e) => resolve({ status: 0, code: `connection: ${e.message}` }));
    r.end(req.payload);
  });
}

async function startServer(dataDir: string): Promise<{ port: number; stop: () => void }> {
  const child = spawn(process.execPath, ['--import', 'tsx', join(ROOT, 'server/main.ts')], {
    cwd: ROOT,
    env: { ...process.env, HOST: '127.0.0.1', PORT: '0', LOCKSTEP_DATA_DIR: dataDir, ALLOWED_HOSTS: '' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const port = await new Promise<number>((resolve, reject) => {
    let out = '';
    child.stdout.on('data', (c: Buffer) => {
      out += c.toString();
      const m = /http:\/\/127\.0\.0\.1:(\d+)\//.exec(out);
      if (m) resolve(Number(m[1]));
    });
    child.on('exit', (code) => reject(new Error(`the server ended (exit ${code}) before it listened`)));
  });
  return { port, stop: () => child.kill('SIGTERM') };
}

const dataDir = mkdtempSync(join(tmpdir(), 'lockstep-fuzz-'));
const server = await startServer(dataDir);
const statuses = new Map<number, number>();
const codes = new Map<string, number>();
const bad: string[] = [];
const started = Date.now();
let sent = 0;
try {
  const batch = 500;
  for (let b = 0; sent < count && Date.now() - started < TIME_LIMIT_MS; b++) {
    const reqs = fc.sample(hostileRequest, { numRuns: Math.min(batch, count - sent), seed: seed + b });
    let next = 0;
    const worker = async () => {
      while (next < reqs.length) {
        const req = reqs[next++]!;
        const a = await send(server.port, req);
        statuses.set(a.status, (statuses.get(a.status) ?? 0) + 1);
        codes.set(a.code, (codes.get(a.code) ?? 0) + 1);
        if ((a.status >= 500 || a.status === 0) && bad.length < 10) bad.push(`${a.status} ${a.code} ${req.url} ${req.payload.slice(-160)}`);
      }
    };
    await Promise.all(Array.from({ length: PARALLEL }, worker));
    sent += reqs.length;
  }
  const demo = await send(server.port, { url: '/workbench/update', headers: { 'content-type': 'application/x-www-form-urlencoded' }, payload: freshDemoBody(String(Date.now())) });
  const seconds = (Date.now() - started) / 1000;
  console.log(`fuzz: ${sent} requests in ${seconds.toFixed(1)} s (${(sent / seconds).toFixed(0)}/s), seed ${seed}, server on 127.0.0.1:${server.port}`);
  console.log('status  count');
  for (const [s, n] of [...statuses].sort((x, y) => x[0] - y[0])) console.log(`${String(s).padEnd(7)} ${n}`);
  console.log('code (from the answer)  count');
  for (const [c, n] of [...codes].sort((x, y) => y[1] - x[1]).slice(0, 15)) console.log(`  ${c.padEnd(32)} ${n}`);
  console.log(`demo afterwards: ${demo.status === 200 ? 'evaluates (200)' : `FAILED (${demo.status} ${demo.code})`}`);
  for (const line of bad) console.log(`  bad: ${line}`);
  if (bad.length > 0 || demo.status !== 200) process.exitCode = 1;
} finally {
  server.stop();
  rmSync(dataDir, { recursive: true, force: true });
}
