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
import { type Poly, polyAdd, polyMul, polyRootsIn, polyScale } from './polynomial.ts';

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

interface PieceGeometry {
  seg: Segment;
  N1: Poly;
  N2: Poly;
}

function formAt(f: MarginForm, g: PieceGeometry, z: number): number {
  const n1 = g.N1[0]! + g.N1[1]! * z;
  const n2 = g.N2[0]! + g.N2[1]! * z;
  const s = g.seg;
  return f.alpha + f.beta * z + (f.g1 * (s.a1 + s.b1 * z)) / n1 + (f.g2 * (s.a2 + s.b2 * z)) / n2;
}

function valueNumerator(f: MarginForm, g: PieceGeometry): Poly {
  const s = g.seg;
  const n12 = polyMul(g.N1, g.N2);
  return polyAdd(polyAdd(polyMul([f.alpha, f.beta], n12), polyScale(polyMul([s.a1, s.b1], g.N2), f.g1)), polyScale(polyMul([s.a2, s.b2], g.N1), f.g2));
}

function slopeNumerator(f: MarginForm, g: PieceGeometry): Poly {
  const s = g.seg;
  const n1sq = polyMul(g.N1, g.N1);
  const n2sq = polyMul(g.N2, g.N2);
  const c1 = s.b1 * g.N1[0]! - s.a1 * g.N1[1]!;
  const c2 = s.b2 * g.N2[0]! - s.a2 * g.N2[1]!;
  return polyAdd(polyAdd(polyScale(polyMul(n1sq, n2sq), f.beta), polyScale(n2sq, f.g1 * c1)), polyScale(n1sq, f.g2 * c2));
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
function composite(clauses: MarginForm[][], g: PieceGeometry, z: number): number {
  let m = Infinity;
  for (const c of clauses) {
    let best = -Infinity;
    for (const f of c) best = Math.max(best, formAt(f, g, z));
    m = Math.min(m, best);
  }
  return m;
}

export function checkBranch(branch: Branch, m: AxleLoadModel, d: Distribution): BranchVerdict {
  const segs = segments(d);
  const N1: Poly = [m.P1, m.chi * m.P];
  const N2: Poly = [m.P2, -m.chi * m.P];
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
    }
    const hi = Math.min(zB, zTop);
    if (hi < zA) continue;
    const clauses = piece.all_of.map((c) => c.map(constraintForm));
    const forms = clauses.flat();
    for (const seg of segs) {
      const lo = Math.max(zA, seg.zFrom);
      const up = Math.min(hi, seg.zTo);
      if (up < lo) continue;
      const g: PieceGeometry = { seg, N1, N2 };
      const cuts = new Set<number>([lo, up]);
      for (const f of forms) for (const r of polyRootsIn(valueNumerator(f, g), lo, up)) cuts.add(r);
      const candidates = new Set<number>(cuts);
      for (const f of forms) for (const r of polyRootsIn(slopeNumerator(f, g), lo, up)) candidates.add(r);
      for (const c of clauses) {
        for (let i = 0; i < c.length; i++) {
          for (let j = i + 1; j < c.length; j++) for (const r of polyRootsIn(valueNumerator(difference(c[i]!, c[j]!), g), lo, up)) candidates.add(r);
        }
      }
      for (const z of candidates) {
        const v = composite(clauses, g, z);
        if (worst === null || v < worst) {
          worst = v;
          worstAt = z;
        }
      }
      const pts = [...cuts].sort((a, b) => a - b);
      for (let i = 0; i + 1 < pts.length; i++) {
        const a = pts[i]!;
        const b = pts[i + 1]!;
        if (b - a <= 1e-12) continue;
        if (composite(clauses, g, 0.5 * (a + b)) < -MARGIN_TOLERANCE) failing.push([a, b]);
      }
    }
  }
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
export function checkCurveRule(rule: CurveRule, m: AxleLoadModel, d: Distribution): CurveVerdict {
  const branches = rule.branches.map((b) => checkBranch(b, m, d));
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
