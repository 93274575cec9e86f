/**
 * Sizing-assistant benchmark (issue 5), on the demo design:
 *  (a) the exact fixed-split band (core/sizing/split-band.ts) against a brute-force scan in the same
 *      run: φ in steps of 1e-4, z in steps of 1e-3 over each rule piece (ends included), a φ passing a
 *      rule when some branch holds at every scanned z. Prints both times, their ratio and the largest
 *      difference between the band edges (per rule and load state, and of the common band).
 *      Targets: at least 100× faster, edges within 1e-4.
 *  (b) Monte Carlo throughput of the robustness analysis (core/sizing/robustness.ts) on one core:
 *      samples per second for 1e5 samples. Target: 1e5 samples in at most 1 s.
 * The machine is shared: the load average is printed with the figures.
 */
import { loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { axleLoadModel } from '../core/axle-loads.ts';
import { demoDesign } from '../core/demo.ts';
import { readDesign } from '../core/validate.ts';
import { robustnessModel, sampleMargins } from '../core/sizing/robustness.ts';
import type { CompiledRule } from '../core/sizing/rule-margin.ts';
import { sizingCurveRules } from '../core/sizing/sizing-rules.ts';
import { type IntervalSet, intersect, splitBand } from '../core/sizing/split-band.ts';
import { sizeDesign } from '../core/sizing/sizing.ts';

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1]!;
}

/** Does φ pass the rule at every scanned z (fixed split, normalised forces)? */
function scanPasses(r: CompiledRule, psi: number, chi: number, phi: number): boolean {
  const zLift = (1 - psi) / chi;
  for (const b of r.branches) {
    let ok = true;
    for (const p of b.pieces) {
      if (p.z1 > zLift * (1 - 1e-9)) {
        ok = false;
        break;
      }
      const n = Math.round((p.z1 - p.z0) / 1e-3);
      for (let k = 0; k <= n && ok; k++) {
        const z = k === n ? p.z1 : p.z0 + k * 1e-3;
        const f1 = (phi * z) / (psi + chi * z);
        const f2 = ((1 - phi) * z) / (1 - psi - chi * z);
        for (const c of p.clauses) {
          let best = -Infinity;
          for (const f of c) best = Math.max(best, f.alpha + f.beta * z + f.g1 * f1 + f.g2 * f2);
          if (best < -1e-9) {
            ok = false;
            break;
          }
        }
      }
      if (!ok) break;
    }
    if (ok) return true;
  }
  return false;
}

/** The passing φ of a scan as intervals: runs of passing grid points. */
function scanSet(r: CompiledRule, psi: number, chi: number): IntervalSet {
  const out: IntervalSet = [];
  let start: number | null = null;
  let last = 0;
  for (let k = 0; k <= 10000; k++) {
    const phi = k / 10000;
    const ok = scanPasses(r, psi, chi, phi);
    if (ok && start === null) start = phi;
    if (!ok && start !== null) {
      out.push([start, last]);
      start = null;
    }
    if (ok) last = phi;
  }
  if (start !== null) out.push([start, last]);
  return out;
}

function edgeDifference(a: IntervalSet, b: IntervalSet): number {
  if (a.length !== b.length) return Infinity;
  let d = 0;
  for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs(a[i]![0] - b[i]![0]), Math.abs(a[i]![1] - b[i]![1]));
  return d;
}

export function run(): void {
  const reading = readDesign(demoDesign());
  if (!reading.ok) throw new Error('the demo design does not validate');
  const design = reading.design;
  const rules = sizingCurveRules(design);
  console.log(`load average ${loadavg().map((x) => x.toFixed(2)).join(' ')} (2 cores shared)`);

  // (a) exact band vs scan
  for (let i = 0; i < 300; i++) splitBand(design, rules); // warm-up (JIT)
  const exactTimes: number[] = [];
  let exact = splitBand(design, rules);
  for (let i = 0; i < 30; i++) {
    const t0 = performance.now();
    for (let k = 0; k < 10; k++) exact = splitBand(design, rules);
    exactTimes.push((performance.now() - t0) / 10);
  }
  const t0 = performance.now();
  let scanBand: IntervalSet = [[0, 1]];
  const scanPer: IntervalSet[] = [];
  for (const r of rules) {
    for (const i of r.states) {
      const s = design.load_states[i]!;
      const m = axleLoadModel(s.mass_kg, s.front_axle_kg, s.cg_height_m, design.vehicle.wheelbase_m);
      const set = scanSet(r.compiled, m.psi, m.chi);
      scanPer.push(set);
      scanBand = intersect(scanBand, set);
    }
  }
  const scanMs = performance.now() - t0;
  const exactMs = median(exactTimes);
  let worstEdge = edgeDifference(exact.intervals, scanBand);
  exact.per_rule.forEach((p, k) => (worstEdge = Math.max(worstEdge, edgeDifference(p.intervals, scanPer[k]!))));
  console.log(`(a) exact band: ${exactMs.toFixed(3)} ms (median of 30 rounds of 10); brute-force scan (φ step 1e-4, z step 1e-3): ${scanMs.toFixed(0)} ms`);
  console.log(`    ratio ${(scanMs / exactMs).toFixed(0)}× (target ≥ 100×); largest edge difference ${worstEdge.toExponential(2)} (target ≤ 1e-4; the scan's own grid is 1e-4)`);
  console.log(`    band ${exact.intervals.map(([a, b]) => `[${a.toFixed(6)}, ${b.toFixed(6)}]`).join(' ')}; scan ${scanBand.map(([a, b]) => `[${a.toFixed(4)}, ${b.toFixed(4)}]`).join(' ')}`);

  // (b) Monte Carlo throughput
  const m = robustnessModel(design, rules);
  sampleMargins(m, 20000, 1); // warm-up
  const mcTimes: number[] = [];
  for (let i = 0; i < 3; i++) {
    const t1 = performance.now();
    sampleMargins(m, 100000, 1 + i);
    mcTimes.push(performance.now() - t1);
  }
  const mcMs = median(mcTimes);
  console.log(`(b) Monte Carlo: 1e5 samples in ${mcMs.toFixed(0)} ms (median of 3) = ${(1e5 / (mcMs / 1000)).toFixed(0)} samples/s on one core (target: 1e5 in ≤ 1000 ms)`);

  const t2 = performance.now();
  sizeDesign(design);
  console.log(`    whole sizing run (band, options, bore, robustness with 1e5 samples): ${(performance.now() - t2).toFixed(0)} ms`);
}
