/**
 * Fast exact margins of curve rules (core/rules) for the sizing searches and the Monte Carlo.
 *
 * Same definitions as core/checks/curve-check.ts: every constraint is a margin form
 * m(z) = α + βz + γ1·T1/N1 + γ2·T2/N2 that must be ≥ 0; a clause holds where its best alternative
 * does, a piece where its worst clause does, a branch is the worst over its pieces, a rule the best
 * over its branches. On one linear piece of the distribution (T_i = a_i + b_i z) the lowest value of
 * min-over-clauses(max-over-alternatives) lies at a range end, at a stationary point of one form, or
 * where two alternatives of a clause cross. For the forms the rules use, these points have closed
 * forms (N1 = P1 + χP z, N2 = P2 − χP z):
 *   stationary:  m' = β + γ1 C1/N1² + γ2 C2/N2², C1 = b1 P1 − a1 χP, C2 = b2 P2 + a2 χP;
 *                with one axle term, N² = −γC/β; with β = 0, N2/N1 = √(−γ2 C2 / (γ1 C1));
 *   crossings:   the zero of the difference form, a quadratic after multiplying by N1 (or N2, or N1·N2
 *                when β = 0).
 * Anything else (both axle terms and β ≠ 0) falls back to polynomial roots (core/checks/polynomial.ts).
 * No scan and no result objects: one number per rule and load state.
 */
import type { AxleLoadModel } from '../axle-loads.ts';
import { constraintForm, type MarginForm } from '../checks/curve-check.ts';
import { type Poly, polyAdd, polyMul, polyRootsIn, polyScale } from '../checks/polynomial.ts';
import type { Segment } from '../distribution.ts';
import type { CurveRule } from '../rules/rule-types.ts';

/** Margin of a branch whose z range reaches rear-axle lift-off (the check fails it outright). */
export const LIFT_OFF_MARGIN = -Infinity;

export interface CompiledPiece {
  z0: number;
  z1: number;
  clauses: MarginForm[][];
  /** Every form of the piece, once. */
  forms: MarginForm[];
  /** Difference forms of the alternatives within each clause (their zeros are the crossings). */
  crossings: MarginForm[];
}

export interface CompiledBranch {
  id: string;
  pieces: CompiledPiece[];
}

export interface CompiledRule {
  rule: CurveRule;
  branches: CompiledBranch[];
}

export function compileRule(rule: CurveRule): CompiledRule {
  return {
    rule,
    branches: rule.branches.map((b) => ({
      id: b.id,
      pieces: b.pieces.map((p) => {
        const clauses = p.all_of.map((c) => c.map(constraintForm));
        const crossings: MarginForm[] = [];
        for (const c of clauses) {
          for (let i = 0; i < c.length; i++) {
            for (let j = i + 1; j < c.length; j++) {
              const a = c[i]!;
              const d = c[j]!;
              crossings.push({ alpha: a.alpha - d.alpha, beta: a.beta - d.beta, g1: a.g1 - d.g1, g2: a.g2 - d.g2 });
            }
          }
        }
        return { z0: p.z[0], z1: p.z[1], clauses, forms: clauses.flat(), crossings };
      }),
    })),
  };
}

/** The load geometry the margins need: P1, P2 (N), χP (N) and the lift-off braking rate. */
export interface Geometry {
  P1: number;
  P2: number;
  cP: number;
  zLift: number;
}

export function geometryOf(m: AxleLoadModel): Geometry {
  return { P1: m.P1, P2: m.P2, cP: m.chi * m.P, zLift: m.zLift };
}

/** Candidate buffer (reused: the searches call this millions of times; a piece has at most a few dozen). */
const CAND_MAX = 256;
const cand = new Float64Array(CAND_MAX);
let nCand = 0;

function push(z: number, lo: number, up: number): void {
  if (z >= lo && z <= up && nCand < CAND_MAX) cand[nCand++] = z;
}

/** Real roots of c0 + c1 z + c2 z² inside [lo, up]. */
function quadraticRoots(c0: number, c1: number, c2: number, lo: number, up: number): void {
  const scale = Math.max(Math.abs(c0), Math.abs(c1), Math.abs(c2));
  if (scale === 0) return;
  if (Math.abs(c2) <= scale * 1e-14) {
    if (c1 !== 0) push(-c0 / c1, lo, up);
    return;
  }
  const disc = c1 * c1 - 4 * c2 * c0;
  if (disc < 0) return;
  const sq = Math.sqrt(disc);
  const q = -0.5 * (c1 + (c1 >= 0 ? sq : -sq));
  if (q !== 0) {
    push(q / c2, lo, up);
    push(c0 / q, lo, up);
  } else push(0, lo, up);
}

function linear(c0: number, c1: number): Poly {
  return [c0, c1];
}

/** Slow path: the general polynomial of a form times N1²N2² (stationary) or N1·N2 (zero). */
function generalRoots(f: MarginForm, s: Segment, g: Geometry, lo: number, up: number, stationary: boolean): void {
  const N1 = linear(g.P1, g.cP);
  const N2 = linear(g.P2, -g.cP);
  let poly: Poly;
  if (stationary) {
    const c1 = s.b1 * g.P1 - s.a1 * g.cP;
    const c2 = s.b2 * g.P2 + s.a2 * g.cP;
    const n1sq = polyMul(N1, N1);
    const n2sq = polyMul(N2, N2);
    poly = polyAdd(polyAdd(polyScale(polyMul(n1sq, n2sq), f.beta), polyScale(n2sq, f.g1 * c1)), polyScale(n1sq, f.g2 * c2));
  } else {
    poly = polyAdd(
      polyAdd(polyMul(linear(f.alpha, f.beta), polyMul(N1, N2)), polyScale(polyMul(linear(s.a1, s.b1), N2), f.g1)),
      polyScale(polyMul(linear(s.a2, s.b2), N1), f.g2),
    );
  }
  for (const r of polyRootsIn(poly, lo, up)) push(r, lo, up);
}

function stationaryPoints(f: MarginForm, s: Segment, g: Geometry, lo: number, up: number): void {
  const k1 = f.g1 * (s.b1 * g.P1 - s.a1 * g.cP);
  const k2 = f.g2 * (s.b2 * g.P2 + s.a2 * g.cP);
  if (k1 === 0 && k2 === 0) return; // linear in z
  if (k2 === 0) {
    if (f.beta === 0) return;
    const q = -k1 / f.beta;
    if (q > 0) push((Math.sqrt(q) - g.P1) / g.cP, lo, up);
    return;
  }
  if (k1 === 0) {
    if (f.beta === 0) return;
    const q = -k2 / f.beta;
    if (q > 0) push((g.P2 - Math.sqrt(q)) / g.cP, lo, up);
    return;
  }
  if (f.beta === 0) {
    const rho = -k2 / k1;
    if (rho > 0) {
      const r = Math.sqrt(rho);
      push((g.P2 - r * g.P1) / (g.cP * (1 + r)), lo, up);
    }
    return;
  }
  generalRoots(f, s, g, lo, up, true);
}

function zeroPoints(f: MarginForm, s: Segment, g: Geometry, lo: number, up: number): void {
  const has1 = f.g1 !== 0 && (s.a1 !== 0 || s.b1 !== 0);
  const has2 = f.g2 !== 0 && (s.a2 !== 0 || s.b2 !== 0);
  const { P1, P2, cP } = g;
  if (!has1 && !has2) {
    if (f.beta !== 0) push(-f.alpha / f.beta, lo, up);
    return;
  }
  if (!has2) {
    // (α + βz)(P1 + cP z) + γ1 (a1 + b1 z)
    quadraticRoots(f.alpha * P1 + f.g1 * s.a1, f.alpha * cP + f.beta * P1 + f.g1 * s.b1, f.beta * cP, lo, up);
    return;
  }
  if (!has1) {
    // (α + βz)(P2 − cP z) + γ2 (a2 + b2 z)
    quadraticRoots(f.alpha * P2 + f.g2 * s.a2, -f.alpha * cP + f.beta * P2 + f.g2 * s.b2, -f.beta * cP, lo, up);
    return;
  }
  if (f.beta === 0) {
    // α N1 N2 + γ1 T1 N2 + γ2 T2 N1
    const c0 = f.alpha * P1 * P2 + f.g1 * s.a1 * P2 + f.g2 * s.a2 * P1;
    const c1 = f.alpha * cP * (P2 - P1) + f.g1 * (s.b1 * P2 - s.a1 * cP) + f.g2 * (s.b2 * P1 + s.a2 * cP);
    const c2 = -f.alpha * cP * cP - f.g1 * s.b1 * cP + f.g2 * s.b2 * cP;
    quadraticRoots(c0, c1, c2, lo, up);
    return;
  }
  generalRoots(f, s, g, lo, up, false);
}

function composite(p: CompiledPiece, s: Segment, g: Geometry, z: number): number {
  let m = Infinity;
  const cl = p.clauses;
  const n1 = g.P1 + g.cP * z;
  const n2 = g.P2 - g.cP * z;
  const f1 = (s.a1 + s.b1 * z) / n1;
  const f2 = (s.a2 + s.b2 * z) / n2;
  for (let i = 0; i < cl.length; i++) {
    const c = cl[i]!;
    let best = -Infinity;
    for (let j = 0; j < c.length; j++) {
      const f = c[j]!;
      const v = f.alpha + f.beta * z + f.g1 * f1 + f.g2 * f2;
      if (v > best) best = v;
    }
    if (best < m) m = best;
  }
  return m;
}

/** Lowest margin of a branch over its ranges; LIFT_OFF_MARGIN when a range reaches lift-off. */
export function branchMargin(b: CompiledBranch, g: Geometry, segs: readonly Segment[]): number {
  const zTop = g.zLift * (1 - 1e-9);
  let worst = Infinity;
  for (const p of b.pieces) {
    if (p.z1 > zTop) return LIFT_OFF_MARGIN;
    for (const s of segs) {
      const lo = p.z0 > s.zFrom ? p.z0 : s.zFrom;
      const up = p.z1 < s.zTo ? p.z1 : s.zTo;
      if (up < lo) continue;
      nCand = 0;
      push(lo, lo, up);
      push(up, lo, up);
      const forms = p.forms;
      for (let k = 0; k < forms.length; k++) stationaryPoints(forms[k]!, s, g, lo, up);
      const cr = p.crossings;
      for (let k = 0; k < cr.length; k++) zeroPoints(cr[k]!, s, g, lo, up);
      for (let i = 0; i < nCand; i++) {
        const v = composite(p, s, g, cand[i]!);
        if (v < worst) worst = v;
      }
    }
  }
  return worst;
}

/** Margin of a rule: the best of its branches (a rule passes when any branch passes). */
export function ruleMargin(r: CompiledRule, g: Geometry, segs: readonly Segment[]): number {
  let best = -Infinity;
  for (const b of r.branches) {
    const v = branchMargin(b, g, segs);
    if (v > best) best = v;
  }
  return best;
}

/** The single linear piece of a fixed split: T1 = φ z P, T2 = (1 − φ) z P. */
export function fixedSplitSegments(phi: number, P: number): Segment[] {
  return [{ zFrom: 0, zTo: Infinity, a1: 0, b1: phi * P, a2: 0, b2: (1 - phi) * P }];
}
