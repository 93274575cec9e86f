/**
 * Benchmark dispatcher: `npm run bench` runs every benchmark, `npm run bench -- engine` only the one
 * named. Each benchmark is a module in this folder exporting `run(): Promise<void> | void` that prints
 * its own figures; add a line to `benchmarks` to register a new one. Benchmarks only print: timing is
 * never asserted in tests (the machine is shared).
 */
import { cpus, loadavg } from 'node:os';

type Benchmark = { summary: string; load: () => Promise<{ run: () => void | Promise<void> }> };

const benchmarks: Record<string, Benchmark> = {
  engine: { summary: 'engine evaluation of the demo design against a closed-form floor (issue 2)', load: () => import('./engine.ts') },
  evaluate: { summary: 'full evaluate() of the demo design with curves, and its costliest blocks (issue 3)', load: () => import('./evaluate.ts') },
  sizing: { summary: 'exact split band vs brute-force scan; Monte Carlo samples/s (issue 5)', load: () => import('./sizing.ts') },
  http: { summary: 'recompute, page and static asset under autocannon against a bare node:http server; memory; page weight (issue 17)', load: () => import('./http.ts') },
  packet: { summary: 'the demo\'s evidence packet, design to PDF bytes, on one core: evaluate, content, PDF (issue 14)', load: () => import('./packet.ts') },
  cli: { summary: 'lockstep start-up, one evaluation and 100 designs in one run against `node -e 0` (issue 17)', load: () => import('./cli.ts') },
};

async function main(argv: string[]): Promise<number> {
  if (argv.includes('--help') || argv.includes('-h')) {
    console.log(`usage: npm run bench [-- name ...]\n\n${Object.entries(benchmarks).map(([n, b]) => `  ${n.padEnd(12)} ${b.summary}`).join('\n')}`);
    return 0;
  }
  const names = argv.length > 0 ? argv : Object.keys(benchmarks);
  const load = loadavg().map((x) => x.toFixed(2)).join(' ');
  console.log(`machine: ${cpus().length} cores (${cpus()[0]?.model ?? 'unknown'}), load average ${load} (1, 5, 15 min), Node ${process.version}`);
  const unknown = names.filter((n) => !(n in benchmarks));
  if (unknown.length > 0) {
    console.error(`unknown benchmark ${unknown.map((n) => `"${n}"`).join(', ')}; known: ${Object.keys(benchmarks).join(', ')}`);
    return 2;
  }
  for (const name of names) {
    console.log(`== ${name}: ${benchmarks[name]!.summary}`);
    const mod = await benchmarks[name]!.load();
    await mod.run();
  }
  console.log(`load average at the end ${loadavg().map((x) => x.toFixed(2)).join(' ')}`);
  return 0;
}

process.exitCode = await main(process.argv.slice(2));
