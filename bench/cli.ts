/**
 * Command-line benchmark (issue 17): the real `lockstep` process (bin/lockstep.mjs, the built JavaScript in
 * dist/), against `node -e 0` measured in the same run:
 *   start-up (`lockstep --help`)                     target <= 150 ms wall
 *   `lockstep evaluate demo.json --json`             target <= 200 ms wall and <= 4 × `node -e 0`
 *   `lockstep evaluate` over 100 designs, one run    target <= 3 s wall
 * Each figure is the median of BENCH_CLI_RUNS runs (default 7), wall time and the child's CPU time (user +
 * system, less disturbed by other load on a shared machine), and for comparison the evaluation through tsx
 * (LOCKSTEP_FROM_SOURCE=1, how the command ran before the build step). Without dist/ it says so.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { demoDesign } from '../core/index.ts';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const bin = join(root, 'bin', 'lockstep.mjs');

interface Run {
  wallMs: number;
  cpuMs: number;
}

/** Wall and CPU time of one child process (CPU from /usr/bin/time when present, else not shown). */
function once(args: string[], env: NodeJS.ProcessEnv = process.env): Run {
  const t0 = performance.now();
  const r = spawnSync('/usr/bin/time', ['-f', '%U %S', process.execPath, ...args], { cwd: root, env, encoding: 'utf8', stdio: ['ignore', 'ignore', 'pipe'] });
  const wallMs = performance.now() - t0;
  const [u, s] = (r.stderr.trim().split('\n').pop() ?? '').split(' ').map(Number);
  if (r.status !== 0 && r.status !== 1) throw new Error(`${args.join(' ')} ended with ${r.status}: ${r.stderr.slice(0, 400)}`);
  return { wallMs, cpuMs: ((u ?? NaN) + (s ?? NaN)) * 1000 };
}

function median(args: string[], runs: number, env?: NodeJS.ProcessEnv): Run {
  once(args, env); // warms the file cache
  const rs = Array.from({ length: runs }, () => once(args, env));
  const mid = (xs: number[]) => xs.sort((a, b) => a - b)[xs.length >> 1]!;
  return { wallMs: mid(rs.map((r) => r.wallMs)), cpuMs: mid(rs.map((r) => r.cpuMs)) };
}

export function run(): void {
  if (!existsSync(join(root, 'dist', 'cli', 'main.js'))) console.log('dist/ is missing: run `npm run build` first (the figures below are for tsx)');
  const runs = Number(process.env.BENCH_CLI_RUNS ?? 7);
  const dir = mkdtempSync(join(tmpdir(), 'lockstep-bench-cli-'));
  try {
    const demo = join(dir, 'demo.json');
    writeFileSync(demo, JSON.stringify(demoDesign(), null, 2));
    const many = join(dir, 'many');
    spawnSync('mkdir', [many]);
    for (let i = 0; i < 100; i++) {
      const d = demoDesign();
      d.load_states[0]!.cg_height_m += i * 1e-4; // 100 different designs
      writeFileSync(join(many, `design-${String(i).padStart(3, '0')}.json`), JSON.stringify(d));
    }
    const bare = median(['-e', '0'], runs);
    const help = median([bin, '--help'], runs);
    const one = median([bin, 'evaluate', demo, '--json'], runs);
    const fromSource = median([bin, 'evaluate', demo, '--json'], runs, { ...process.env, LOCKSTEP_FROM_SOURCE: '1' });
    const hundred = median([bin, 'evaluate', many, '--json'], Math.max(3, runs >> 1));
    const f = (r: Run) => `${r.wallMs.toFixed(0).padStart(5)} ms wall, ${r.cpuMs.toFixed(0).padStart(5)} ms CPU`;
    const ratio = (r: Run) => `${(r.wallMs / bare.wallMs).toFixed(2)} × wall, ${(r.cpuMs / bare.cpuMs).toFixed(2)} × CPU of node -e 0`;
    const verdict = (ok: boolean) => (ok ? 'met' : 'MISSED');
    console.log(`median of ${runs} runs each (the machine is shared: read the ratios)`);
    console.log(`  node -e 0                          ${f(bare)}`);
    console.log(`  lockstep --help (start-up)         ${f(help)}   ${ratio(help)}   (target <= 150 ms: ${verdict(help.wallMs <= 150)})`);
    console.log(`  lockstep evaluate demo --json      ${f(one)}   ${ratio(one)}   (targets <= 200 ms: ${verdict(one.wallMs <= 200)}; <= 4 × node -e 0: ${verdict(one.wallMs <= 4 * bare.wallMs)})`);
    console.log(`  the same through tsx (before)      ${f(fromSource)}   ${ratio(fromSource)}   (LOCKSTEP_FROM_SOURCE=1: the sources, no build)`);
    console.log(`  lockstep evaluate 100 designs      ${f(hundred)}   ${(hundred.wallMs / 100).toFixed(1)} ms per design   (target <= 3 s: ${verdict(hundred.wallMs <= 3000)})`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
