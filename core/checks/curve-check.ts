/**
 * Exact evaluation of a curve rule (core/rules) on an installed distribution.
 *
 * Every condition of a rule is a margin form m(z) = α + β z + γ1 f1(z) + γ2 f2(z) that must be ≥ 0
 * (f1 − f2 for "front above rear", line − f for an upper limit, f − line for a lower one). On a
 * linear piece of the distribution T_i = a_i + b_i z, and the axle loads N1 = P1 + χP z,
 * N2 = P2 − χP z are linear, so f_i is a ratio of linear functions and
 *   m(z)·N1·N2 = (α + βz) N1 N2 + γ1 T1 N2 + γ2 T2 N1                     (cubic in z)
 *   m'(z)·N1²N2² = β N1² N2² + γ1 (b1 P1 − a1 χP) N2² + γ2 (b2 P2 + a2 χP) N1²   (quartic)
 * Below rear-axle lift-off N1, N2 > 0, so the failing ranges are bounded by roots of the first
 * polynomial and the worst margin lies at a piece end, a root of the second, or where two
 * alternatives of one clause cross (roots of the difference form). No scan is involved.
 */
import type { AxleLoadModel } from '../axle-loads.ts';
import { type Distribution, type Segment, segments } from '../distribution.ts';
import type { Branch, Constraint, CurveRule, Piece, RuleStatus } from '../rules/rule-types.ts';
import { polyRootsInto } from './polynomial.ts';

/** Margins within this of zero count as met (adhesion units). */
export const MARGIN_TOLERANCE = 1e-9;

export interface MarginForm {
  alpha: number;
  beta: number;
  g1: number;
  g2: number;
}

export function constraintForm(c: Constraint): MarginForm {
  switch (c.type) {
    case 'front_above_rear':
      return { alpha: 0, beta: 0, g1: 1, g2: -1 };
    case 'at_most':
      return { alpha: c.line.intercept, beta: c.line.slope, g1: c.axle === 'front' ? -1 : 0, g2: c.axle === 'rear' ? -1 : 0 };
    case 'at_least':
      return { alpha: -c.line.intercept, beta: -c.line.slope, g1: c.axle === 'front' ? 1 : 0, g2: c.axle === 'rear' ? 1 : 0 };
  }
}

function difference(a: MarginForm, b: MarginForm): MarginForm {
  return { alpha: a.alpha - b.alpha, beta: a.beta - b.beta, g1: a.g1 - b.g1, g2: a.g2 - b.g2 };
}

/**
 * The axle loads N1 = n10 + n11 z, N2 = n20 + n21 z of one load model and the products the numerators
 * use, coefficients ascending: N1·N2 = q0 + q1 z + q2 z², N1² = u0 + …, N2² = v0 + …, N1²·N2² = w0 + … + w4 z⁴.
 * Summed in the same order as polyMul would.
 */
interface Loads {
  n10: number;
  n11: number;
  n20: number;
  n21: number;
  q0: number;
  q1: number;
  q2: number;
  u0: number;
  u1: number;
  u2: number;
  v0: number;
  v1: number;
  v2: number;
  w0: number;
  w1: number;
  w2: number;
  w3: number;
  w4: number;
}

// The products are worked out once per load model (and again should its figures have been changed).
const loadsCache = new WeakMap<AxleLoadModel, Loads>();

function loadsOf(m: AxleLoadModel): Loads {
  let L = loadsCache.get(m);
  if (!L || L.n10 !== m.P1 || L.n20 !== m.P2 || L.n11 !== m.chi * m.P) {
    L = loadProducts(m);
    loadsCache.set(m, L);
  }
  return L;
}

function loadProducts(m: AxleLoadModel): Loads {
  const n10 = m.P1;
  const n11 = m.chi * m.P;
  const n20 = m.P2;
  const n21 = -m.chi * m.P;
  const u0 = n10 * n10;
  const u1 = n10 * n11 + n11 * n10;
  const u2 = n11 * n11;
  const v0 = n20 * n20;
  const v1 = n20 * n21 + n21 * n20;
  const v2 = n21 * n21;
  return {
    n10,
    n11,
    n20,
    n21,
    q0: n10 * n20,
    q1: n10 * n21 + n11 * n20,
    q2: n11 * n21,
    u0,
    u1,
    u2,
    v0,
    v1,
    v2,
    w0: u0 * v0,
    w1: u0 * v1 + u1 * v0,
    w2: u0 * v2 + u1 * v1 + u2 * v0,
    w3: u1 * v2 + u2 * v1,
    w4: u2 * v2,
  };
}

function formAt(f: MarginForm, L: Loads, s: Segment, z: number): number {
  const n1 = L.n10 + L.n11 * z;
  const n2 = L.n20 + L.n21 * z;
  return f.alpha + f.beta * z + (f.g1 * (s.a1 + s.b1 * z)) / n1 + (f.g2 * (s.a2 + s.b2 * z)) / n2;
}

/** m(z)·N1·N2 = (α + βz) N1 N2 + γ1 T1 N2 + γ2 T2 N1 (cubic) into out[0..3]. */
function valueNumerator(f: MarginForm, L: Loads, s: Segment, out: Float64Array): void {
  out[0] = f.alpha * L.q0 + s.a1 * L.n20 * f.g1 + s.a2 * L.n10 * f.g2;
  out[1] = f.alpha * L.q1 + f.beta * L.q0 + (s.a1 * L.n21 + s.b1 * L.n20) * f.g1 + (s.a2 * L.n11 + s.b2 * L.n10) * f.g2;
  out[2] = f.alpha * L.q2 + f.beta * L.q1 + s.b1 * L.n21 * f.g1 + s.b2 * L.n11 * f.g2;
  out[3] = f.beta * L.q2;
}

/** m'(z)·N1²N2² = β N1² N2² + γ1 (b1 P1 − a1 χP) N2² + γ2 (b2 P2 + a2 χP) N1² (quartic) into out[0..4]. */
function slopeNumerator(f: MarginForm, L: Loads, s: Segment, out: Float64Array): void {
  const k1 = f.g1 * (s.b1 * L.n10 - s.a1 * L.n11);
  const k2 = f.g2 * (s.b2 * L.n20 - s.a2 * L.n21);
  out[0] = L.w0 * f.beta + L.v0 * k1 + L.u0 * k2;
  out[1] = L.w1 * f.beta + L.v1 * k1 + L.u1 * k2;
  out[2] = L.w2 * f.beta + L.v2 * k1 + L.u2 * k2;
  out[3] = L.w3 * f.beta;
  out[4] = L.w4 * f.beta;
}

export interface BranchVerdict {
  id: string;
  label: string;
  status: RuleStatus;
  passed: boolean;
  /** Lowest margin over the branch's ranges (below lift-off); null when nothing lies below lift-off. */
  worst_margin: number | null;
  worst_at_braking_rate: number | null;
  failing_ranges: [number, number][];
  /** True when rear-axle lift-off falls inside a range of the branch (counted as failing there). */
  lift_off_in_range: boolean;
}

function mergeRanges(r: [number, number][]): [number, number][] {
  const sorted = [...r].sort((a, b) => a[0] - b[0]);
  const out: [number, number][] = [];
  for (const x of sorted) {
    const last = out[out.length - 1];
    if (last && x[0] <= last[1] + 1e-9) last[1] = Math.max(last[1], x[1]);
    else out.push([x[0], x[1]]);
  }
  return out;
}

/** Margin of a piece at z: the lowest clause, each clause the best of its alternatives. */
function composite(clauses: readonly MarginForm[][], L: Loads, s: Segment, z: number): number {
  let m = Infinity;
  for (const c of clauses) {
    let best = -Infinity;
    for (const f of c) best = Math.max(best, formAt(f, L, s, z));
    m = Math.min(m, best);
  }
  return m;
}

/** The margin forms of one piece: per clause its alternatives, all of them, and the pairwise differences within a clause. */
interface PieceForms {
  clauses: MarginForm[][];
  forms: MarginForm[];
  differences: MarginForm[];
}

// Rule pieces are constant data: their forms are worked out once.
const formsOf = new WeakMap<Piece, PieceForms>();

function pieceForms(piece: Piece): PieceForms {
  let pf = formsOf.get(piece);
  if (!pf) {
    const clauses = piece.all_of.map((c) => c.map(constraintForm));
    const differences: MarginForm[] = [];
    for (const c of clauses) for (let i = 0; i < c.length; i++) for (let j = i + 1; j < c.length; j++) differences.push(difference(c[i]!, c[j]!));
    pf = { clauses, forms: clauses.flat(), differences };
    formsOf.set(piece, pf);
  }
  return pf;
}

/** The margin forms of a rule piece, per clause its alternatives (a clause holds when any alternative is ≥ 0). */
export function pieceClauses(piece: Piece): readonly (readonly MarginForm[])[] {
  return pieceForms(piece).clauses;
}

// Work space reused by every check (the checks are not re-entrant): polynomial coefficients, roots,
// and the cut points and candidate points of one piece in insertion order without repeats.
const coeffs = new Float64Array(5);
const roots = new Float64Array(5);
const cuts: number[] = [];
const candidates: number[] = [];

function addOnce(list: number[], z: number): void {
  if (!list.includes(z)) list.push(z);
}

function addRoots(list: number[], n: number): void {
  for (let i = 0; i < n; i++) addOnce(list, roots[i]!);
}

/** Sorts the few cut points ascending in place (insertion sort: Array.prototype.sort allocates a copy). */
function sortCuts(): void {
  for (let i = 1; i < cuts.length; i++) {
    const x = cuts[i]!;
    let j = i - 1;
    for (; j >= 0 && cuts[j]! > x; j--) cuts[j + 1] = cuts[j]!;
    cuts[j + 1] = x;
  }
}

function branchVerdict(branch: Branch, worst: number | null, worstAt: number | null, failing: [number, number][], liftOff: boolean): BranchVerdict {
  const ranges = mergeRanges(failing);
  return {
    id: branch.id,
    label: branch.label,
    status: branch.status,
    passed: !liftOff && (worst === null || worst >= -MARGIN_TOLERANCE) && ranges.length === 0,
    worst_margin: worst,
    worst_at_braking_rate: worstAt,
    failing_ranges: ranges,
    lift_off_in_range: liftOff,
  };
}

/**
 * Pass/fail shortcut on one segment. Between neighbouring cuts every margin form keeps its sign
 * (N1, N2 > 0 below lift-off), and so does the margin, so one value per gap tells it: 'fails' when a
 * gap is below the tolerance, 'holds' when every gap is at or above zero. Otherwise (a gap just below
 * zero, a gap too short to test, a single point) the full search for the worst margin decides.
 * Sorts `cuts`.
 */
function gapSigns(clauses: readonly MarginForm[][], L: Loads, seg: Segment): 'fails' | 'holds' | 'unsure' {
  sortCuts();
  if (cuts.length < 2) return 'unsure';
  let result: 'holds' | 'unsure' = 'holds';
  for (let i = 0; i + 1 < cuts.length; i++) {
    const a = cuts[i]!;
    const b = cuts[i + 1]!;
    if (b - a <= 1e-12) {
      result = 'unsure';
      continue;
    }
    const v = composite(clauses, L, seg, 0.5 * (a + b));
    if (v < -MARGIN_TOLERANCE) return 'fails';
    if (v < 0) result = 'unsure';
  }
  return result;
}

/**
 * The branch verdict. With `stopAtFailure` the scan ends at the first evidence that the branch fails
 * (then only `passed` is meaningful): the pass/fail question the regeneration search asks many times.
 */
function scanBranch(branch: Branch, m: AxleLoadModel, segs: readonly Segment[], stopAtFailure: boolean): BranchVerdict {
  const L = loadsOf(m);
  const zTop = m.zLift * (1 - 1e-9);
  let worst: number | null = null;
  let worstAt: number | null = null;
  const failing: [number, number][] = [];
  let liftOff = false;
  for (const piece of branch.pieces as readonly Piece[]) {
    const [zA, zB] = piece.z;
    if (zB > zTop) {
      liftOff = true;
      failing.push([Math.max(zA, m.zLift), zB]);
      if (stopAtFailure) return branchVerdict(branch, worst, worstAt, failing, liftOff);
    }
    const hi = Math.min(zB, zTop);
    if (hi < zA) continue;
    const { clauses, forms, differences } = pieceForms(piece);
    for (const seg of segs) {
      const lo = Math.max(zA, seg.zFrom);
      const up = Math.min(hi, seg.zTo);
      if (up < lo) continue;
      // Cuts: the piece ends and where a margin form changes sign. Candidates for the worst margin:
      // the cuts, where a form is stationary, and where two alternatives of a clause cross.
      cuts.length = 0;
      addOnce(cuts, lo);
      addOnce(cuts, up);
      for (const f of forms) {
        valueNumerator(f, L, seg, coeffs);
        addRoots(cuts, polyRootsInto(coeffs, 4, lo, up, roots));
      }
      if (stopAtFailure) {
        const signs = gapSigns(clauses, L, seg);
        if (signs === 'fails') {
          failing.push([lo, up]);
          return branchVerdict(branch, worst, worstAt, failing, liftOff);
        }
        if (signs === 'holds') continue;
      }
      candidates.length = 0;
      for (const z of cuts) candidates.push(z);
      for (const f of forms) {
        slopeNumerator(f, L, seg, coeffs);
        addRoots(candidates, polyRootsInto(coeffs, 5, lo, up, roots));
      }
      for (const f of differences) {
        valueNumerator(f, L, seg, coeffs);
        addRoots(candidates, polyRootsInto(coeffs, 4, lo, up, roots));
      }
      for (const z of candidates) {
        const v = composite(clauses, L, seg, z);
        if (worst === null || v < worst) {
          worst = v;
          worstAt = z;
        }
      }
      if (stopAtFailure && worst !== null && worst < -MARGIN_TOLERANCE) return branchVerdict(branch, worst, worstAt, failing, liftOff);
      sortCuts();
      for (let i = 0; i + 1 < cuts.length; i++) {
        const a = cuts[i]!;
        const b = cuts[i + 1]!;
        if (b - a <= 1e-12) continue;
        if (composite(clauses, L, seg, 0.5 * (a + b)) < -MARGIN_TOLERANCE) {
          failing.push([a, b]);
          if (stopAtFailure) return branchVerdict(branch, worst, worstAt, failing, liftOff);
        }
      }
    }
  }
  return branchVerdict(branch, worst, worstAt, failing, liftOff);
}

/** `segs` may be passed in when the caller has them already (segments(d) of the same distribution). */
export function checkBranch(branch: Branch, m: AxleLoadModel, d: Distribution, segs: readonly Segment[] = segments(d)): BranchVerdict {
  return scanBranch(branch, m, segs, false);
}

const CERTAINTY: Record<RuleStatus, number> = { verified: 0, partial: 1, memory: 2 };

export function leastCertain(statuses: readonly RuleStatus[]): RuleStatus {
  return statuses.reduce<RuleStatus>((w, s) => (CERTAINTY[s] > CERTAINTY[w] ? s : w), 'verified');
}

export interface CurveVerdict {
  passed: boolean;
  /** The branch that passed (the first one in the rule's order), or null when none did. */
  branch: string | null;
  /** Status of the verdict: the passing branch's, or the least certain of all when every branch fails. */
  status: RuleStatus;
  worst_margin: number | null;
  worst_at_braking_rate: number | null;
  failing_ranges: [number, number][];
  branches: BranchVerdict[];
}

/**
 * A curve rule passes when any branch passes. Margin, location and failing ranges come from the
 * branch that passed, or from the main requirement (the first branch) when none did.
 */
export function checkCurveRule(rule: CurveRule, m: AxleLoadModel, d: Distribution, segs: readonly Segment[] = segments(d)): CurveVerdict {
  const branches = rule.branches.map((b) => scanBranch(b, m, segs, false));
  const pass = branches.find((b) => b.passed);
  const shown = pass ?? branches[0]!;
  return {
    passed: pass !== undefined,
    branch: pass ? pass.id : null,
    status: pass ? pass.status : leastCertain(branches.map((b) => b.status)),
    worst_margin: shown.worst_margin,
    worst_at_braking_rate: shown.worst_at_braking_rate,
    failing_ranges: shown.failing_ranges,
    branches,
  };
}

/** checkCurveRule(rule, m, d).passed, without the figures: stops at the first passing branch and at a branch's first failure. */
export function curveRulePasses(rule: CurveRule, m: AxleLoadModel, d: Distribution, segs: readonly Segment[] = segments(d)): boolean {
  return rule.branches.some((b) => scanBranch(b, m, segs, true).passed);
}
