/**
 * The feasible band of a fixed front/rear split, computed exactly from the rule definitions.
 *
 * With a constant front share φ = T1/(T1 + T2), ψ = P1/P and χ = h/E (symbols and axle-load formulas of
 * 71/320/EEC Annex II Appendix, points 2 and 3.1.3; the form in φ below is derived from them):
 *   f1 = φ z / n1,  f2 = (1 − φ) z / n2,  n1 = ψ + χ z,  n2 = 1 − ψ − χ z.
 * A margin form m = α + βz + γ1 f1 + γ2 f2 (core/checks/curve-check.ts) is then linear in φ:
 *   m = A(z) + φ B(z),  A = α + βz + γ2 z/n2,  B = z (γ1/n1 − γ2/n2),
 * so at each z the constraint m ≥ 0 is φ ≥ r(z) when B > 0 and φ ≤ r(z) when B < 0, with
 *   r(z) = −A/B = −[(α + βz) n1 n2 + γ2 z n1] / [z (γ1 n2 − γ2 n1)],
 * a rational function of z. The sign of B is that of γ1 n2 − γ2 n1, linear in z: ranges are split at
 * its root. A clause (any one of its alternatives) fails for φ strictly between U(z) = the highest upper
 * bound and L(z) = the lowest lower bound, where U < L. Over a z range the failing φ are the union of
 * those open intervals; between consecutive candidate points (range ends, stationary points of each r,
 * crossings of two r's — all roots of polynomials of degree ≤ 5, found to machine precision by
 * core/checks/polynomial.ts) the envelopes are monotone and keep their order, so the union over each
 * run where U < L is (min U, max L) taken over the run's candidate points. Nothing is scanned.
 * A branch is the intersection over its pieces and clauses, empty when a range reaches rear-axle lift
 * ((1 − ψ)/χ); a rule the union of its branches; the band the intersection over rules and load states.
 */
import { axleLoadModel } from '../axle-loads.ts';
import type { MarginForm } from '../checks/curve-check.ts';
import { type Poly, polyAdd, polyDerivative, polyEval, polyMul, polyRootsIn, polyScale } from '../checks/polynomial.ts';
import type { DesignFile } from '../design.ts';
import type { CompiledBranch, CompiledRule } from './rule-margin.ts';
import { verifyNoteFor } from '../checks/check-result.ts';
import type { RuleStatus } from '../rules/rule-types.ts';

/** A set of φ as sorted, disjoint closed intervals inside [0, 1]. */
export type IntervalSet = [number, number][];

export const FULL: IntervalSet = [[0, 1]];

export function intersect(a: IntervalSet, b: IntervalSet): IntervalSet {
  const out: IntervalSet = [];
  let i = 0;
  let j = 0;
  while (i < a.length && j < b.length) {
    const lo = Math.max(a[i]![0], b[j]![0]);
    const hi = Math.min(a[i]![1], b[j]![1]);
    if (lo <= hi) out.push([lo, hi]);
    if (a[i]![1] < b[j]![1]) i++;
    else j++;
  }
  return out;
}

export function union(a: IntervalSet, b: IntervalSet): IntervalSet {
  const all = [...a, ...b].sort((x, y) => x[0] - y[0]);
  const out: IntervalSet = [];
  for (const [lo, hi] of all) {
    const last = out[out.length - 1];
    if (last && lo <= last[1]) last[1] = Math.max(last[1], hi);
    else out.push([lo, hi]);
  }
  return out;
}

/** [0, 1] without the open intervals given. */
function complementOfOpen(bad: [number, number][]): IntervalSet {
  let set: IntervalSet = FULL.map(([a, b]) => [a, b] as [number, number]);
  for (const [lo, hi] of bad) {
    if (!(hi > lo)) continue;
    const next: IntervalSet = [];
    for (const [a, b] of set) {
      if (hi <= a || lo >= b) next.push([a, b]);
      else {
        if (lo > a) next.push([a, lo]);
        if (hi < b) next.push([hi, b]);
        if (lo <= a && hi >= b) continue;
      }
    }
    set = next;
  }
  return set;
}

interface Rational {
  num: Poly;
  den: Poly;
}

/** r(z) = −A/B of a form for a state (ψ, χ); den carries the sign of B (n1 n2 > 0 below lift-off). */
function boundOf(f: MarginForm, psi: number, chi: number): Rational {
  const n1: Poly = [psi, chi];
  const n2: Poly = [1 - psi, -chi];
  const zPoly: Poly = [0, 1];
  const aNum = polyAdd(polyMul([f.alpha, f.beta], polyMul(n1, n2)), polyScale(polyMul(zPoly, n1), f.g2));
  const bNum = polyMul(zPoly, polyAdd(polyScale(n2, f.g1), polyScale(n1, -f.g2)));
  return { num: polyScale(aNum, -1), den: bNum };
}

function evalR(r: Rational, z: number): number {
  return polyEval(r.num, z) / polyEval(r.den, z);
}

function sortUnique(xs: number[]): number[] {
  const s = [...xs].sort((a, b) => a - b);
  return s.filter((x, i) => i === 0 || x - s[i - 1]! > 1e-12);
}

/** φ that satisfy one clause for every z in [zA, zB] (zA > 0, below lift-off). */
function clauseSet(clause: readonly MarginForm[], psi: number, chi: number, zA: number, zB: number): IntervalSet {
  const bounds = clause.map((f) => boundOf(f, psi, chi));
  // split where some B changes sign (root of γ1 n2 − γ2 n1); at such a point r is unbounded
  const splits: number[] = [zA, zB];
  for (const f of clause) {
    const lin = polyAdd(polyScale([1 - psi, -chi], f.g1), polyScale([psi, chi], -f.g2));
    for (const r of polyRootsIn(lin, zA, zB)) splits.push(r);
  }
  const edges = sortUnique(splits);
  const bad: [number, number][] = [];
  for (let e = 0; e + 1 < edges.length; e++) {
    let lo = edges[e]!;
    let hi = edges[e + 1]!;
    if (hi - lo <= 1e-12) continue;
    if (e > 0) lo += 1e-12 * Math.max(1, lo);
    if (e + 2 < edges.length) hi -= 1e-12 * Math.max(1, hi);
    const mid = 0.5 * (lo + hi);
    const sign = bounds.map((b) => Math.sign(polyEval(b.den, mid)));
    const pts: number[] = [lo, hi];
    for (let i = 0; i < bounds.length; i++) {
      const b = bounds[i]!;
      if (sign[i] === 0) continue;
      const slope = polyAdd(polyMul(polyDerivative(b.num), b.den), polyScale(polyMul(b.num, polyDerivative(b.den)), -1));
      pts.push(...polyRootsIn(slope, lo, hi));
      for (let j = i + 1; j < bounds.length; j++) {
        const c = bounds[j]!;
        pts.push(...polyRootsIn(polyAdd(polyMul(b.num, c.den), polyScale(polyMul(c.num, b.den), -1)), lo, hi));
      }
    }
    const zs = sortUnique(pts);
    const upper = (z: number) => {
      let u = -Infinity;
      for (let i = 0; i < bounds.length; i++) if (sign[i]! < 0) u = Math.max(u, evalR(bounds[i]!, z));
      return u;
    };
    const lower = (z: number) => {
      let l = Infinity;
      for (let i = 0; i < bounds.length; i++) if (sign[i]! > 0) l = Math.min(l, evalR(bounds[i]!, z));
      return l;
    };
    // a form with B ≡ 0 on this range (none of the rule constraints) holds or fails whatever φ is
    for (let i = 0; i < bounds.length; i++) {
      if (sign[i] !== 0) continue;
      const f = clause[i]!;
      const holdsEverywhere = zs.every((z) => f.alpha + f.beta * z + (f.g2 * z) / (1 - psi - chi * z) >= -1e-12);
      if (holdsEverywhere) return FULL.map(([a, b]) => [a, b] as [number, number]);
    }
    // walk the candidate points and the midpoints between them; runs where U < L fail (U, L)
    let runLo = Infinity;
    let runHi = -Infinity;
    let inRun = false;
    const visit = (z: number) => {
      const u = upper(z);
      const l = lower(z);
      if (u < l) {
        inRun = true;
        runLo = Math.min(runLo, u);
        runHi = Math.max(runHi, l);
      } else if (inRun) {
        bad.push([runLo, runHi]);
        inRun = false;
        runLo = Infinity;
        runHi = -Infinity;
      }
    };
    for (let k = 0; k < zs.length; k++) {
      visit(zs[k]!);
      if (k + 1 < zs.length) visit(0.5 * (zs[k]! + zs[k + 1]!));
    }
    if (inRun) bad.push([runLo, runHi]);
  }
  return complementOfOpen(bad);
}

export function branchSet(b: CompiledBranch, psi: number, chi: number): IntervalSet {
  const zLift = (1 - psi) / chi;
  let set: IntervalSet = FULL.map(([a, c]) => [a, c] as [number, number]);
  for (const p of b.pieces) {
    if (p.z1 > zLift * (1 - 1e-9)) return [];
    const zA = Math.max(p.z0, 1e-9);
    for (const c of p.clauses) {
      set = intersect(set, clauseSet(c, psi, chi, zA, p.z1));
      if (set.length === 0) return set;
    }
  }
  return set;
}

export interface RuleBand {
  rule: string;
  load_state: string;
  /** The rule record's status; VERIFY_NOTE unless verified. */
  status: RuleStatus;
  verify_note?: string;
  /** φ that pass the rule in this load state (union of its branches). */
  intervals: IntervalSet;
  branches: { id: string; intervals: IntervalSet }[];
}

export interface SplitBand {
  per_rule: RuleBand[];
  /** Intersection over every rule and load state. */
  intervals: IntervalSet;
}

export function splitBand(design: DesignFile, rules: readonly { compiled: CompiledRule; states: number[] }[]): SplitBand {
  const per: RuleBand[] = [];
  let all: IntervalSet = FULL.map(([a, b]) => [a, b] as [number, number]);
  for (const r of rules) {
    for (const i of r.states) {
      const s = design.load_states[i]!;
      const m = axleLoadModel(s.mass_kg, s.front_axle_kg, s.cg_height_m, design.vehicle.wheelbase_m);
      const branches = r.compiled.branches.map((b) => ({ id: b.id, intervals: branchSet(b, m.psi, m.chi) }));
      const set = branches.reduce<IntervalSet>((acc, b) => union(acc, b.intervals), []);
      per.push({ rule: r.compiled.rule.id, load_state: s.id, status: r.compiled.rule.status, ...verifyNoteFor(r.compiled.rule.status), intervals: set, branches });
      all = intersect(all, set);
    }
  }
  return { per_rule: per, intervals: all };
}
