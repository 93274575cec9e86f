/**
 * Engine benchmark. Times the evaluation of the demo design (every load state, full plotting curves,
 * the lock table over every surface, the default `at` list) and, in the same run, a bare closed-form
 * loop over the same braking-rate grid as the floor: a fixed front share φ, N1 = P1 + χ P z,
 * N2 = P2 − χ P z, f1 = φ z P / N1, f2 = (1 − φ) z P / N2 for every load state. Prints the median per
 * call of both and their ratio, and, for information, the full evaluate() with every later result block.
 * Targets (issue 2): at most 50 µs per two-state evaluation and within 20× of the floor.
 */
import { performance } from 'node:perf_hooks';
import { curveGrid } from '../core/curves.ts';
import { demoDesign } from '../core/demo.ts';
import { evaluate, evaluateState, stateModels } from '../core/evaluate.ts';
import { readDesign } from '../core/validate.ts';

/** Median time per call in µs: `rounds` samples, each timing `inner` calls. */
function medianMicros(fn: () => unknown, rounds: number, inner: number): number {
  const samples: number[] = [];
  let sink = 0;
  for (let r = 0; r < rounds; r++) {
    const t0 = performance.now();
    for (let i = 0; i < inner; i++) sink += fn() === undefined ? 0 : 1;
    samples.push(((performance.now() - t0) * 1000) / inner);
  }
  if (sink < 0) console.log(sink); // keeps the calls observable
  samples.sort((a, b) => a - b);
  return samples[samples.length >> 1]!;
}

export function run(): void {
  const reading = readDesign(demoDesign());
  if (!reading.ok) throw new Error('the demo design does not validate');
  const design = reading.design;
  const states = design.load_states.length;

  // The engine of issue 2: every load state with its curves, lock table and default `at` list.
  const engine = () => stateModels(design).map((s) => evaluateState(design, s, { curves: true }));
  // evaluate() as the CLI calls it: the same plus every block later features add to the result.
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

  // Warm up the JIT, then measure (median of 31 rounds).
  for (let i = 0; i < 3000; i++) {
    engine();
    floorFresh();
    floorBare();
  }
  for (let i = 0; i < 300; i++) full();
  const tEngine = medianMicros(engine, 31, 400);
  const tFull = medianMicros(full, 15, 20);
  const tFresh = medianMicros(floorFresh, 31, 4000);
  const tBare = medianMicros(floorBare, 31, 20000);
  const per2 = (t: number) => (t * 2) / states;
  console.log(`demo design: ${states} load states, ${grid.length}-point grid plus event points, ${(design.adhesion_coefficients ?? []).length} surfaces, ${10} braking rates in \`at\``);
  console.log(`engine (stateModels + evaluateState with curves, every state): median ${tEngine.toFixed(2)} µs per call = ${per2(tEngine).toFixed(2)} µs per two-state evaluation (target ≤ 50 µs)`);
  console.log(`closed-form floor (a), fresh f1/f2 arrays:  median ${tFresh.toFixed(3)} µs  -> ratio ${(tEngine / tFresh).toFixed(1)}× (target ≤ 20×)`);
  console.log(`closed-form floor (b), arithmetic only:     median ${tBare.toFixed(3)} µs  -> ratio ${(tEngine / tBare).toFixed(1)}×`);
  console.log(`full evaluate(design, { curves: true }) incl. later result blocks: median ${tFull.toFixed(1)} µs per call`);
  console.log(`verdict: ${per2(tEngine) <= 50 ? 'time target met' : 'time target MISSED'}; ${tEngine / tFresh <= 20 ? 'ratio target met (floor a)' : 'ratio target MISSED (floor a)'}`);
}
