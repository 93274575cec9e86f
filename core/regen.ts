/**
 * Regenerative braking on the driven axle(s), design-file block `regen` (docs/design-file.md).
 *
 * Largest regenerative braking force at the road against vehicle speed v:
 *   F_max = max_motor_torque_nm · gear_ratio / R_driven          (constant torque)
 *   above the base speed v_b = P_max / F_max: F = P_max / v      (constant power)
 *   from fade_start_kmh down to cutoff_kmh the force fades linearly to zero; none below cutoff_kmh.
 * R_driven is the driven axle's tyre radius (for all-wheel drive the mean of the two, weighted by
 * front_share). Driveline losses are not modelled (the torque is taken as reaching the wheels).
 *
 * Blending (how the pedal demand is shared), both built as a `Distribution` so lock order, crossings
 * and utilisation work unchanged:
 *   regen_first       the regenerative force R covers the demand z·P first; friction (the installed
 *                     hydraulic distribution) supplies the rest: T_i = R_i + T_i,friction((zP − R)/P);
 *   fixed_proportion  the pedal drives the friction brakes as installed and regeneration adds
 *                     proportion × the friction force on top, capped at R.
 * R is split front_share : (1 − front_share) (1 front drive, 0 rear drive; for all-wheel drive the
 * block's front_share, default 0.5).
 */
import type { AxleLoadModel } from './axle-loads.ts';
import { VERIFY_NOTE } from './caution.ts';
import { checkCurveRule, type CurveVerdict, curveRulePasses, MARGIN_TOLERANCE, type MarginForm, pieceClauses } from './checks/curve-check.ts';
import { polyRootsInto } from './checks/polynomial.ts';
import { designRules } from './checks/selection.ts';
import { crossings } from './crossings.ts';
import type { DesignFile, Regen } from './design.ts';
import { type Distribution, forcesAlong, forcesAt, type Segment, segments } from './distribution.ts';
import { firstLock } from './lock-order.ts';
import { SIMULTANEOUS_LOCK_DZ } from './constants.ts';
import { lockAllowed, type LockOrderRange, lockOrderRange } from './lock-order-range.ts';
import { type CurveRule, type RuleStatus, type SelectedRule } from './rules/index.ts';
import type { StateModel } from './state-model.ts';

/** Defaults for the optional keys (engineering choices, documented in docs/design-file.md). */
export const REGEN_DEFAULTS = {
  fade_start_kmh: 15,
  cutoff_kmh: 5,
  all_wheel_front_share: 0.5,
  speeds_kmh: [20, 50, 80, 120],
} as const;

export type RegenBlendingSpec = { type: 'regen_first' } | { type: 'fixed_proportion'; proportion: number };

export interface RegenSetup {
  /** Constant-torque force at the road, N. */
  maxForce: number;
  /** Power limit, W. */
  maxPower: number;
  /** Speeds, m/s. */
  fadeStart: number;
  cutoff: number;
  blending: RegenBlendingSpec;
  /** Share of the regenerative force on the front axle. */
  frontShare: number;
  /** Tyre radius the torque acts through, m, and the motor-to-wheel ratio. */
  radius: number;
  gearRatio: number;
  speeds: number[];
}

export function regenSetup(design: DesignFile, r: Regen): RegenSetup {
  const drive = design.vehicle.drive;
  const frontShare = drive === 'front' ? 1 : drive === 'rear' ? 0 : (r.front_share ?? REGEN_DEFAULTS.all_wheel_front_share);
  const radius = frontShare * design.axles.front.tyre_radius_m + (1 - frontShare) * design.axles.rear.tyre_radius_m;
  return {
    maxForce: (r.max_motor_torque_nm * r.gear_ratio) / radius,
    maxPower: r.max_power_kw * 1e3,
    fadeStart: (r.fade_start_kmh ?? REGEN_DEFAULTS.fade_start_kmh) / 3.6,
    cutoff: (r.cutoff_kmh ?? REGEN_DEFAULTS.cutoff_kmh) / 3.6,
    blending: r.blending,
    frontShare,
    radius,
    gearRatio: r.gear_ratio,
    speeds: [...(r.speeds_kmh ?? REGEN_DEFAULTS.speeds_kmh)],
  };
}

/** Base speed where constant torque gives way to constant power, m/s. */
export function regenBaseSpeed(s: RegenSetup): number {
  return s.maxPower / s.maxForce;
}

/** Largest regenerative braking force at the road at speed v (m/s), N. */
export function regenForceAt(s: RegenSetup, v: number): number {
  if (!(v > s.cutoff)) return 0;
  const full = Math.min(s.maxForce, s.maxPower / v);
  if (v >= s.fadeStart) return full;
  return (full * (v - s.cutoff)) / (s.fadeStart - s.cutoff);
}

/**
 * The distribution with a regenerative force R (N) on the driven axle(s) added to a friction
 * distribution. Exact: the result is piecewise linear with breakpoints where regeneration saturates
 * and at the friction distribution's own breakpoints. R = 0 gives the friction distribution back.
 * The line pressures are kept only for fixed_proportion (the pedal still drives the friction brakes);
 * with regen_first the pedal does not set the pressure directly, so they are left out.
 */
export function regenDistribution(friction: Distribution, R: number, frontShare: number, blending: RegenBlendingSpec): Distribution {
  if (!(R > 0)) return friction;
  const P = friction.P;
  const s = frontShare;
  if (blending.type === 'regen_first') {
    const zr = R / P;
    // Arrays of their final length (this runs inside the searches for the largest allowed force).
    let n = 2;
    for (const zf of friction.z) if (zf > 0) n++;
    const d: Distribution = { P, z: new Array<number>(n), t1: new Array<number>(n), t2: new Array<number>(n) };
    d.z[0] = 0;
    d.t1[0] = 0;
    d.t2[0] = 0;
    d.z[1] = zr;
    d.t1[1] = s * R;
    d.t2[1] = (1 - s) * R;
    let i = 2;
    for (let j = 0; j < friction.z.length; j++) {
      const zf = friction.z[j]!;
      if (!(zf > 0)) continue;
      d.z[i] = zr + zf;
      d.t1[i] = s * R + friction.t1[j]!;
      d.t2[i] = (1 - s) * R + friction.t2[j]!;
      i++;
    }
    return d;
  }
  // fixed_proportion: regeneration r(zf) = min(q·zf·P, R) on top of the friction at rate zf.
  const q = blending.proportion;
  const zCap = R / (q * P);
  const pts: { zf: number; t1: number; t2: number; p: number; p2: number }[] = [];
  for (let j = 0; j < friction.z.length; j++) {
    pts.push({
      zf: friction.z[j]!,
      t1: friction.t1[j]!,
      t2: friction.t2[j]!,
      p: friction.p?.[j] ?? NaN,
      p2: friction.p2?.[j] ?? NaN,
    });
  }
  const lastZf = pts[pts.length - 1]!.zf;
  const addAt = (zf: number) => {
    const f = forcesAt(friction, zf);
    pts.push({ zf, t1: f.front, t2: f.rear, p: f.p, p2: f.p2 });
  };
  addAt(zCap);
  if (zCap >= lastZf) addAt(zCap + 1);
  pts.sort((a, b) => a.zf - b.zf);
  const hasP = friction.p !== undefined && friction.p2 !== undefined;
  const d: Distribution = { P, z: [], t1: [], t2: [], ...(hasP ? { p: [], p2: [] } : {}) };
  for (const pt of pts) {
    const r = Math.min(q * pt.zf * P, R);
    d.z.push(pt.zf + r / P);
    d.t1.push(pt.t1 + s * r);
    d.t2.push(pt.t2 + (1 - s) * r);
    if (hasP) {
      d.p!.push(pt.p);
      d.p2!.push(pt.p2);
    }
  }
  return d;
}

export interface RegenLock {
  adhesion: number;
  first_axle: string;
  braking_rate: number;
  efficiency: number;
  /** Allowed by the lock-order range (see `rule`). */
  allowed: boolean;
}

export interface UtilisationPoint {
  braking_rate: number;
  /** Null beyond rear-axle lift-off. */
  front_utilisation: number | null;
  rear_utilisation: number | null;
}

export interface RegenSpeedCase {
  speed_kmh: number;
  regen_force_n: number;
  lock: RegenLock[];
  critical_braking_rates: number[];
  critical_braking_rate: number | null;
  /** Adhesion utilisation at braking rates 0.02 … 1.0 (step 0.02) with this regenerative force. */
  utilisation: UtilisationPoint[];
}

export interface RegenLimit {
  adhesion: number;
  in_rule_range: boolean;
  /**
   * Largest regenerative force (N) that keeps the lock order allowed on this surface; null when no
   * force up to adhesion × weight upsets it; 0 when it is not allowed even without regeneration.
   */
  max_force_n: number | null;
  max_wheel_torque_nm: number | null;
  max_motor_torque_nm: number | null;
  /** That force over the system's constant-torque force (1 = the full capability is allowed). */
  share_of_capability: number | null;
}

/** One regulation curve check (core/checks, issue 4) on the distribution with a given regenerative force. */
export interface RegenCurveCheck {
  rule: string;
  title: string;
  status: RuleStatus;
  verify_note?: string;
  /** null: zero regeneration. */
  speed_kmh: number | null;
  regen_force_n: number;
  passed: boolean;
  branch: string | null;
  worst_margin: number | null;
  worst_at_braking_rate: number | null;
}

export interface RegenStateResult {
  id: string;
  zero_regen: { lock: RegenLock[]; utilisation: UtilisationPoint[] };
  at_speeds: RegenSpeedCase[];
  limits: RegenLimit[];
  /** The selected curve rules (lock order, efficiency) with zero regeneration and at each speed. */
  checks: RegenCurveCheck[];
  /**
   * Largest regenerative force (N) up to which every selected curve rule that passes without regeneration
   * still passes (at every force from zero to it), solved exactly up to the system's constant-torque force;
   * null when the full force passes or when there is no such rule (see `max_force_basis`).
   */
  max_force_passing_checks_n: number | null;
  /** Rules left out of that search because they fail without regeneration already. */
  failing_without_regen: string[];
  max_force_basis: 'full_force_passes' | 'solved' | 'no_rule_to_keep';
}

export interface RegenFlag {
  /** surface_lock: the lock-order range (`rule`) on one surface; curve_check: a regulation curve rule. */
  kind: 'surface_lock' | 'curve_check';
  /** Rule id for curve_check. */
  rule: string | null;
  load_state: string;
  speed_kmh: number;
  /** Surface for surface_lock, null for curve_check. */
  adhesion: number | null;
  braking_rate: number | null;
  message: string;
}

export interface RegenResult {
  estimate: true;
  blending: RegenBlendingSpec['type'];
  proportion: number | null;
  front_share: number;
  /**
   * Design-file paths of defaults the curve checks with regeneration rest on (the user never gave them):
   * `regen.front_share` for all-wheel drive without it. The verdict reports those checks as not checked.
   */
  assumed_inputs: string[];
  max_force_n: number;
  max_power_kw: number;
  base_speed_kmh: number;
  fade_start_kmh: number;
  cutoff_kmh: number;
  tyre_radius_m: number;
  gear_ratio: number;
  /** Force against speed for plotting, every 5 km/h. */
  force_curve: { speed_kmh: number[]; force_n: number[] };
  rule: LockOrderRange;
  load_states: RegenStateResult[];
  flags: RegenFlag[];
  notes: string[];
}

/** The curve rules of the design's rule selection that cover its category and this load-state kind. */
export function regenCurveRules(design: DesignFile, kind: string, selected: readonly SelectedRule[] = designRules(design)): CurveRule[] {
  const out: CurveRule[] = [];
  for (const { rule, covers_category } of selected) {
    if (!covers_category || rule.kind !== 'curve') continue;
    if (rule.load_states !== 'all' && !(rule.load_states as readonly string[]).includes(kind)) continue;
    out.push(rule);
  }
  return out;
}

/**
 * The curve verdicts of one load state per regenerative force, each force checked once: the speeds at or
 * below the base speed share the full force, which the search for the largest passing force tries first.
 */
type VerdictMemo = Map<number, Map<CurveRule, CurveVerdict>>;

function verdictsAt(memo: VerdictMemo, rules: readonly CurveRule[], loads: AxleLoadModel, d: Distribution, R: number): Map<CurveRule, CurveVerdict> {
  let v = memo.get(R);
  if (!v) {
    const segs = segments(d);
    v = new Map(rules.map((rule) => [rule, checkCurveRule(rule, loads, d, segs)]));
    memo.set(R, v);
  }
  return v;
}

function curveChecks(rules: readonly CurveRule[], verdicts: Map<CurveRule, CurveVerdict>, speed: number | null, R: number): RegenCurveCheck[] {
  return rules.map((rule) => {
    const v = verdicts.get(rule)!;
    // Object.assign rather than a spread for the optional key: much cheaper on Node 20, same key order.
    return Object.assign({ rule: rule.id, title: rule.title, status: v.status }, v.status === 'verified' ? {} : { verify_note: VERIFY_NOTE }, {
      speed_kmh: speed,
      regen_force_n: R,
      passed: v.passed,
      branch: v.branch,
      worst_margin: v.worst_margin,
      worst_at_braking_rate: v.worst_at_braking_rate,
    });
  });
}

function maxForcePassing(
  rules: readonly CurveRule[],
  loads: AxleLoadModel,
  friction: Distribution,
  setup: RegenSetup,
  memo: VerdictMemo,
): { force: number | null; basis: RegenStateResult['max_force_basis'] } {
  if (rules.length === 0) return { force: null, basis: 'no_rule_to_keep' };
  const force = firstFailingForce(rules, loads, friction, setup, memo);
  return force === null ? { force: null, basis: 'full_force_passes' } : { force, basis: 'solved' };
}

/** Whether every rule passes with regenerative force R (the verdicts already found are reused). */
function rulesPassWith(rules: readonly CurveRule[], loads: AxleLoadModel, friction: Distribution, setup: RegenSetup, memo: VerdictMemo, R: number): boolean {
  const known = memo.get(R);
  if (known) {
    for (const rule of rules) if (!known.get(rule)!.passed) return false;
    return true;
  }
  const d = regenDistribution(friction, R, setup.frontShare, setup.blending);
  const segs = segments(d);
  for (const rule of rules) if (!curveRulePasses(rule, loads, d, segs)) return false;
  return true;
}

/**
 * One linear piece of the distribution with regenerative force R, as a function of z and R together:
 * T_i = a_i + b_i z + c_i R for z between the largest of the lower bounds and the smallest of the upper bounds,
 * each bound z = e0 + e1 R (flattened pairs).
 */
interface RegenCell {
  a1: number;
  b1: number;
  c1: number;
  a2: number;
  b2: number;
  c2: number;
  lo: number[];
  hi: number[];
}

/**
 * The cells of regenDistribution(friction, R, s, blending) for every R ≥ 0. Above the join the friction
 * distribution is shifted by R: at friction rate z_f = z − R/P, T_i = T_i,f(z_f) + s_i R, so on friction segment
 * T_i,f = a_i + b_i z_f the cell is (a_i, b_i, s_i − b_i/P) between z_from + R/P and z_to + R/P (and, for
 * fixed_proportion, above the cap z = R(1 + q)/(qP)). Below it the force does not depend on R: pure
 * regeneration T_i = s_i P z up to R/P (regen_first), or the friction with q·T_friction added, z = (1 + q) z_f,
 * up to the cap (fixed_proportion).
 */
function regenCells(friction: Distribution, s: number, blending: RegenBlendingSpec): RegenCell[] {
  const P = friction.P;
  const out: RegenCell[] = [];
  const segs = segments(friction);
  if (blending.type === 'regen_first') {
    out.push({ a1: 0, b1: s * P, c1: 0, a2: 0, b2: (1 - s) * P, c2: 0, lo: [0, 0], hi: [0, 1 / P] });
  } else {
    const q = blending.proportion;
    const cap = (1 + q) / (q * P);
    for (const sg of segs) {
      const hi = [0, cap];
      if (Number.isFinite(sg.zTo)) hi.push((1 + q) * sg.zTo, 0);
      out.push({ a1: sg.a1, b1: (sg.b1 + s * q * P) / (1 + q), c1: 0, a2: sg.a2, b2: (sg.b2 + (1 - s) * q * P) / (1 + q), c2: 0, lo: [(1 + q) * sg.zFrom, 0], hi });
    }
  }
  for (const sg of segs) {
    const lo = [sg.zFrom, 1 / P];
    if (blending.type === 'fixed_proportion') lo.push(0, (1 + blending.proportion) / (blending.proportion * P));
    const hi = Number.isFinite(sg.zTo) ? [sg.zTo, 1 / P] : [];
    out.push({ a1: sg.a1, b1: sg.b1, c1: s - sg.b1 / P, a2: sg.a2, b2: sg.b2, c2: 1 - s - sg.b2 / P, lo, hi });
  }
  return out;
}

/** Whether (z, R) lies in the cell (to a relative 1e-9). */
function inCell(cell: RegenCell, z: number, R: number): boolean {
  const eps = 1e-9 * Math.max(1, Math.abs(z));
  for (let i = 0; i < cell.lo.length; i += 2) if (cell.lo[i]! + cell.lo[i + 1]! * R > z + eps) return false;
  for (let i = 0; i < cell.hi.length; i += 2) if (cell.hi[i]! + cell.hi[i + 1]! * R < z - eps) return false;
  return true;
}

// Work space of the event search: polynomial coefficients in z or R (ascending) and their roots.
const evA = new Float64Array(4);
const evB = new Float64Array(2);
const evA2 = new Float64Array(4);
const evB2 = new Float64Array(2);
const evPoly = new Float64Array(6);
const evRoots = new Float64Array(6);

/**
 * m·N1·N2 of a margin form on a cell as pA(z) + R·pB(z) (pA cubic, pB linear; the tolerance added to α, so that
 * the zero is where the check's verdict turns): (α + βz) N1 N2 + γ1 (a1 + b1 z) N2 + γ2 (a2 + b2 z) N1 and
 * γ1 c1 N2 + γ2 c2 N1, with N1 = P1 + χP z, N2 = P2 − χP z.
 */
function cellForm(f: MarginForm, loads: AxleLoadModel, cell: RegenCell, pA: Float64Array, pB: Float64Array): void {
  const n10 = loads.P1;
  const n11 = loads.chi * loads.P;
  const n20 = loads.P2;
  const n21 = -n11;
  const alpha = f.alpha + MARGIN_TOLERANCE;
  pA[0] = alpha * n10 * n20 + f.g1 * cell.a1 * n20 + f.g2 * cell.a2 * n10;
  pA[1] = alpha * (n10 * n21 + n11 * n20) + f.beta * n10 * n20 + f.g1 * (cell.a1 * n21 + cell.b1 * n20) + f.g2 * (cell.a2 * n11 + cell.b2 * n10);
  pA[2] = alpha * n11 * n21 + f.beta * (n10 * n21 + n11 * n20) + f.g1 * cell.b1 * n21 + f.g2 * cell.b2 * n11;
  pA[3] = f.beta * n11 * n21;
  pB[0] = f.g1 * cell.c1 * n20 + f.g2 * cell.c2 * n10;
  pB[1] = f.g1 * cell.c1 * n21 + f.g2 * cell.c2 * n11;
}

function cubicAt(p: Float64Array, z: number): number {
  return p[0]! + z * (p[1]! + z * (p[2]! + z * p[3]!));
}

/** Keeps R as a turn when it lies in (0, rMax) and (z, R) in the cell and the piece [zA, zB]. */
function addTurn(out: number[], rMax: number, cell: RegenCell, z: number, R: number, zA: number, zB: number): void {
  if (R > 0 && R < rMax && z >= zA - 1e-12 && z <= zB + 1e-12 && inCell(cell, z, R)) out.push(R);
}

/** The turns where the zero curve of the form in evA/evB meets the bound z = e0 + e1 R: pA(e0 + e1 R) + R·pB(e0 + e1 R) = 0 (cubic in R). */
function boundTurns(out: number[], rMax: number, cell: RegenCell, e0: number, e1: number, zA: number, zB: number): void {
  // pA(e0 + e1 R) by Taylor shift, plus R·pB(e0 + e1 R)
  const d0 = cubicAt(evA, e0);
  const d1 = evA[1]! + e0 * (2 * evA[2]! + 3 * e0 * evA[3]!);
  const d2 = evA[2]! + 3 * e0 * evA[3]!;
  const b0 = evB[0]! + evB[1]! * e0;
  evPoly[0] = d0;
  evPoly[1] = d1 * e1 + b0;
  evPoly[2] = d2 * e1 * e1 + evB[1]! * e1;
  evPoly[3] = evA[3]! * e1 * e1 * e1;
  for (let k = 0, n = polyRootsInto(evPoly, 4, 0, rMax, evRoots); k < n; k++) addTurn(out, rMax, cell, e0 + e1 * evRoots[k]!, evRoots[k]!, zA, zB);
}

/**
 * The forces in (0, rMax) where a curve rule's verdict can turn, for the largest force passing the checks. For
 * a fixed z each margin form is affine in R on a cell (T_i = a_i + b_i z + c_i R, the axle loads do not depend
 * on R), so the forces where it fails first are bounded by its zero curve R = −pA(z)/pB(z). The first force at
 * which the failing set of a clause (every alternative below zero) appears is a lowest point of its boundary:
 * where a zero curve is level (pA′pB − pA pB′ = 0, cubic in z), where two alternatives' zero curves meet
 * (pA_f pB_g − pA_g pB_f = 0, quartic), or where a zero curve meets a cell bound or a piece end
 * (z = e0 + e1 R put in pA + R pB: cubic in R). Each root is kept when it lies in its cell and piece.
 */
function verdictTurns(rule: CurveRule, loads: AxleLoadModel, cells: readonly RegenCell[], rMax: number, out: number[]): void {
  const zTop = loads.zLift * (1 - 1e-9);
  for (const branch of rule.branches) {
    // a branch with a piece beyond lift-off fails at every force: it never turns the verdict
    if (branch.pieces.some((pc) => pc.z[1] > zTop)) continue;
    for (const piece of branch.pieces) {
      const zA = piece.z[0];
      const zB = Math.min(piece.z[1], zTop);
      if (zB < zA) continue;
      const clauses = pieceClauses(piece);
      for (const cell of cells) {
        // the cell's z range over 0 ≤ R ≤ rMax (within: each bound at its own extreme) must meet the piece
        let lo = -Infinity;
        for (let i = 0; i < cell.lo.length; i += 2) lo = Math.max(lo, Math.min(cell.lo[i]!, cell.lo[i]! + cell.lo[i + 1]! * rMax));
        let hi = Infinity;
        for (let i = 0; i < cell.hi.length; i += 2) hi = Math.min(hi, Math.max(cell.hi[i]!, cell.hi[i]! + cell.hi[i + 1]! * rMax));
        if (lo > zB || hi < zA) continue;
        for (const clause of clauses) {
          for (let fi = 0; fi < clause.length; fi++) {
            cellForm(clause[fi]!, loads, cell, evA, evB);
            // level points of the zero curve: pA′ pB − pA pB′
            evPoly[0] = evA[1]! * evB[0]! - evA[0]! * evB[1]!;
            evPoly[1] = 2 * evA[2]! * evB[0]! + evA[1]! * evB[1]! - evA[1]! * evB[1]!;
            evPoly[2] = 3 * evA[3]! * evB[0]! + 2 * evA[2]! * evB[1]! - evA[2]! * evB[1]!;
            evPoly[3] = 3 * evA[3]! * evB[1]! - evA[3]! * evB[1]!;
            for (let k = 0, n = polyRootsInto(evPoly, 4, zA, zB, evRoots); k < n; k++) {
              const z = evRoots[k]!;
              const b = evB[0]! + evB[1]! * z;
              if (b !== 0) addTurn(out, rMax, cell, z, -cubicAt(evA, z) / b, zA, zB);
            }
            // where the zero curve meets a bound z = e0 + e1 R of the cell or a piece end
            for (let i = 0; i < cell.lo.length; i += 2) boundTurns(out, rMax, cell, cell.lo[i]!, cell.lo[i + 1]!, zA, zB);
            for (let i = 0; i < cell.hi.length; i += 2) boundTurns(out, rMax, cell, cell.hi[i]!, cell.hi[i + 1]!, zA, zB);
            boundTurns(out, rMax, cell, zA, 0, zA, zB);
            boundTurns(out, rMax, cell, zB, 0, zA, zB);
            // where two alternatives of the clause are zero together: pA_f pB_g − pA_g pB_f (quartic in z)
            for (let gi = fi + 1; gi < clause.length; gi++) {
              cellForm(clause[gi]!, loads, cell, evA2, evB2);
              for (let k = 0; k < 5; k++) evPoly[k] = 0;
              for (let i = 0; i < 4; i++) {
                for (let j = 0; j < 2; j++) evPoly[i + j]! += evA[i]! * evB2[j]! - evA2[i]! * evB[j]!;
              }
              for (let k = 0, n = polyRootsInto(evPoly, 5, zA, zB, evRoots); k < n; k++) {
                const z = evRoots[k]!;
                const b = evB[0]! + evB[1]! * z;
                const b2 = evB2[0]! + evB2[1]! * z;
                if (b !== 0) addTurn(out, rMax, cell, z, -cubicAt(evA, z) / b, zA, zB);
                else if (b2 !== 0) addTurn(out, rMax, cell, z, -cubicAt(evA2, z) / b2, zA, zB);
              }
            }
          }
        }
      }
    }
  }
}

/** firstFailingForce for the rules given (each passing without regeneration), with no verdicts known yet. */
export function largestForcePassingChecks(rules: readonly CurveRule[], loads: AxleLoadModel, friction: Distribution, setup: RegenSetup): number | null {
  return firstFailingForce(rules, loads, friction, setup, new Map());
}

/**
 * The largest force R such that every rule passes at every force from 0 to R (the rules pass at 0), null when
 * they pass at every force up to the full one. The verdicts can turn only at the forces verdictTurns finds, so between two neighbouring ones a
 * single check decides: the answer is the lower end of the first stretch that fails.
 */
function firstFailingForce(rules: readonly CurveRule[], loads: AxleLoadModel, friction: Distribution, setup: RegenSetup, memo: VerdictMemo): number | null {
  const cells = regenCells(friction, setup.frontShare, setup.blending);
  const turns: number[] = [0];
  for (const rule of rules) verdictTurns(rule, loads, cells, setup.maxForce, turns);
  turns.push(setup.maxForce);
  turns.sort((x, y) => x - y);
  for (let i = 0; i + 1 < turns.length; i++) {
    const a = turns[i]!;
    const b = turns[i + 1]!;
    if (b - a <= 1e-9 * Math.max(1, b)) continue;
    if (!rulesPassWith(rules, loads, friction, setup, memo, 0.5 * (a + b))) return a;
  }
  return rulesPassWith(rules, loads, friction, setup, memo, setup.maxForce) ? null : setup.maxForce;
}

function lockRow(loads: AxleLoadModel, d: Distribution, k: number, rule: LockOrderRange, segs: readonly Segment[] = segments(d)): RegenLock {
  const l = firstLock(loads, d, k, segs);
  return {
    adhesion: k,
    first_axle: l.first_axle,
    braking_rate: l.braking_rate,
    efficiency: l.efficiency,
    allowed: lockAllowed(rule, k, l.first_axle, l.braking_rate),
  };
}

/**
 * Largest R in [0, k·P] for which the first lock on surface k stays allowed; null when even k·P keeps it
 * allowed, 0 when it is not allowed without regeneration. Solved exactly, piece by piece (no search):
 *
 * With regeneration R the distribution is a lower branch that does not depend on R (pure regeneration for
 * regen_first, T = (s, 1 − s)·P z; for fixed_proportion the friction with q·T_friction added,
 * z = (1 + q) z_f) up to the join z_J(R) (R/P, or R(1 + q)/(qP)), then the friction distribution shifted by
 * R: at friction rate z_f, z = z_f + R/P and T_i = T_i,f(z_f) + s_i R. On the shifted part axle i reaches k
 * where G_i(z_f) + c_i R = 0, with G_1 = T_1,f − k(P1 + χP z_f), c_1 = s − kχ and G_2 = T_2,f − k(P2 − χP z_f),
 * c_2 = (1 − s) + kχ (the axle loads of 71/320/EEC Annex II Appendix 3.1.3 with z = z_f + R/P). So each
 * axle's lock rate is piecewise linear in R, its pieces ending where the level −c_i R passes a breakpoint
 * value of G_i, where the join passes the lower branch's own lock, or (fixed_proportion) where the cap passes
 * a friction breakpoint. On each piece the lock rates are fitted exactly from two points and the conditions
 * of a disallowed rear-first lock (lockAllowed; "both" within SIMULTANEOUS_LOCK_DZ, none beyond lift-off)
 * are linear inequalities in R: the first R where they hold is the answer.
 */
export function maxAllowedRegenForce(
  loads: AxleLoadModel,
  friction: Distribution,
  k: number,
  frontShare: number,
  blending: RegenBlendingSpec,
  rule: LockOrderRange,
): number | null {
  // A surface outside the rule's range is never judged: every force keeps it allowed.
  if (lockAllowed(rule, k, 'rear', 0)) return null;
  const hi = k * friction.P;
  const sv = new SurfaceLockSolver(loads, friction, k, frontShare, blending);
  const zR0 = sv.rate(2, 0);
  const zF0 = sv.rate(1, 0);
  if (zR0 < loads.zLift && zR0 <= rule.z_to + 1e-12 && (zF0 >= loads.zLift || zF0 - zR0 >= SIMULTANEOUS_LOCK_DZ)) return 0;
  const cuts = sv.breakpoints(hi);
  for (let i = 0; i + 1 < cuts.length; i++) {
    const a = cuts[i]!;
    const b = cuts[i + 1]!;
    if (!(b > a)) continue;
    const r1 = a + 0.25 * (b - a);
    const r2 = a + 0.75 * (b - a);
    const rear = affine(r1, sv.rate(2, r1), r2, sv.rate(2, r2));
    if (rear === null) continue; // the rear does not lock before lift-off on this piece
    const front = affine(r1, sv.rate(1, r1), r2, sv.rate(1, r2));
    // the rear locks before lift-off, at or below z_to ...
    const span = intersect(atMost(a, b, rear, loads.zLift), atMost(a, b, rear, rule.z_to + 1e-12));
    if (!span) continue;
    // ... and the front does not lock within SIMULTANEOUS_LOCK_DZ after it (or not before lift-off)
    const apart = front === null ? [span] : [intersect(span, atLeast(a, b, front, loads.zLift)), intersect(span, atLeast(a, b, minus(front, rear), SIMULTANEOUS_LOCK_DZ))];
    let first = Infinity;
    for (const x of apart) if (x && x[1] - x[0] > 1e-12 * Math.max(1, hi)) first = Math.min(first, x[0]);
    if (first < Infinity) return first;
  }
  return null;
}

/** z = c0 + c1 R through two points; null when the rate is infinite (no lock) at both. */
type Affine = { c0: number; c1: number };
function affine(r1: number, z1: number, r2: number, z2: number): Affine | null {
  if (!Number.isFinite(z1) && !Number.isFinite(z2)) return null;
  // one end infinite: the piece's ends were missed; take the finite value as constant (never met in the tests)
  if (!Number.isFinite(z1) || !Number.isFinite(z2)) return { c0: Number.isFinite(z1) ? z1 : z2, c1: 0 };
  const c1 = (z2 - z1) / (r2 - r1);
  return { c0: z1 - c1 * r1, c1 };
}
const minus = (f: Affine, g: Affine): Affine => ({ c0: f.c0 - g.c0, c1: f.c1 - g.c1 });

/** The part of [a, b] where sign·(f(R) − limit) ≥ 0, or null. */
function where(a: number, b: number, f: Affine, limit: number, sign: 1 | -1): [number, number] | null {
  const g0 = sign * (f.c0 - limit);
  const g1 = sign * f.c1;
  if (g1 === 0) return g0 >= 0 ? [a, b] : null;
  const root = -g0 / g1;
  const lo = g1 > 0 ? Math.max(a, root) : a;
  const up = g1 > 0 ? b : Math.min(b, root);
  return up >= lo ? [lo, up] : null;
}
const atMost = (a: number, b: number, f: Affine, limit: number) => where(a, b, f, limit, -1);
const atLeast = (a: number, b: number, f: Affine, limit: number) => where(a, b, f, limit, 1);
function intersect(x: [number, number] | null, y: [number, number] | null): [number, number] | null {
  if (!x || !y) return null;
  const lo = Math.max(x[0], y[0]);
  const up = Math.min(x[1], y[1]);
  return up >= lo ? [lo, up] : null;
}

/**
 * The lock rates of one surface as functions of the regenerative force (a class, so that its two functions are
 * made once, not per surface).
 */
class SurfaceLockSolver {
  private readonly P: number;
  private readonly k: number;
  private readonly segs: Segment[];
  private readonly friction: Distribution;
  /** z_J(R) = join · R; the friction rate at the join is zfJoin · R. */
  private readonly join: number;
  private readonly zfJoin: number;
  /** Lock rates of the lower branch (index 1 front, 2 rear; Infinity: no lock). */
  private readonly lowRate: number[];
  /** G_i(z_f) = T_i,f − k(n0_i + n1_i z_f) on each friction segment; c_i the coefficient of R. */
  private readonly n0: number[];
  private readonly n1: number[];
  private readonly c: number[];

  constructor(loads: AxleLoadModel, friction: Distribution, k: number, s: number, blending: RegenBlendingSpec) {
    const P = friction.P;
    const chiP = loads.chi * P;
    this.P = P;
    this.k = k;
    this.friction = friction;
    this.segs = segments(friction);
    const q = blending.type === 'fixed_proportion' ? blending.proportion : 0;
    this.join = blending.type === 'regen_first' ? 1 / P : (1 + q) / (q * P);
    this.zfJoin = blending.type === 'regen_first' ? 0 : 1 / (q * P);
    const lower: Distribution =
      blending.type === 'regen_first'
        ? { P, z: [0, 1], t1: [0, s * P], t2: [0, (1 - s) * P] }
        : { P, z: friction.z.map((z) => z * (1 + q)), t1: friction.t1.map((t, j) => t + s * q * P * friction.z[j]!), t2: friction.t2.map((t, j) => t + (1 - s) * q * P * friction.z[j]!) };
    const low = firstLock(loads, lower, k);
    this.lowRate = [Infinity, low.front_lock_braking_rate ?? Infinity, low.rear_lock_braking_rate ?? Infinity];
    this.n0 = [0, loads.P1, loads.P2];
    this.n1 = [0, chiP, -chiP];
    this.c = [0, s - k * loads.chi, 1 - s + k * loads.chi];
  }

  /** Braking rate at which axle 1 (front) or 2 (rear) first reaches k with regenerative force R (Infinity: never; may lie beyond lift-off). */
  rate(axle: 1 | 2, R: number): number {
    const zL = this.lowRate[axle]!;
    if (zL <= this.join * R) return zL;
    const zfMin = this.zfJoin * R;
    const level = this.c[axle]! * R;
    const k = this.k;
    // not cut at lift-off (the caller compares with it), so that the rate stays linear on each piece
    for (const sg of this.segs) {
      if (sg.zTo < zfMin) continue;
      const from = Math.max(sg.zFrom, zfMin);
      const a = axle === 1 ? sg.a1 : sg.a2;
      const b = axle === 1 ? sg.b1 : sg.b2;
      const g0 = a - k * this.n0[axle]! + level;
      const g1 = b - k * this.n1[axle]!;
      if (g0 + g1 * from >= 0) return from + R / this.P;
      if (g1 > 0) {
        const root = -g0 / g1;
        if (root <= sg.zTo) return root + R / this.P;
      }
    }
    return Infinity;
  }

  /** 0, the forces in (0, hi) where a lock rate changes its linear piece, and hi, ascending. */
  breakpoints(hi: number): number[] {
    const out = [0, hi];
    const { friction, k, c, n0, n1 } = this;
    for (const axle of [1, 2] as const) {
      const cuts: number[] = [];
      if (Number.isFinite(this.lowRate[axle]!)) cuts.push(this.lowRate[axle]! / this.join);
      for (let j = 0; j < friction.z.length; j++) {
        const zf = friction.z[j]!;
        const G = (axle === 1 ? friction.t1[j]! : friction.t2[j]!) - k * (n0[axle]! + n1[axle]! * zf);
        if (c[axle] !== 0) cuts.push(-G / c[axle]!);
        if (this.zfJoin > 0) cuts.push(zf / this.zfJoin);
      }
      for (const R of cuts) if (R > 0 && R < hi) out.push(R);
    }
    return out.sort((x, y) => x - y);
  }
}

const UTIL_AT = Array.from({ length: 50 }, (_, i) => Math.round((i + 1) * 0.02 * 1e9) / 1e9);

function utilisationSeries(loads: AxleLoadModel, d: Distribution): UtilisationPoint[] {
  const f = forcesAlong(d, UTIL_AT); // the same values as forcesAt point by point
  return UTIL_AT.map((z, i) => {
    const n1 = loads.P1 + z * loads.chi * loads.P;
    const n2 = loads.P2 - z * loads.chi * loads.P;
    return { braking_rate: z, front_utilisation: n2 > 0 ? f.front[i]! / n1 : null, rear_utilisation: n2 > 0 ? f.rear[i]! / n2 : null };
  });
}

export function regenAnalysis(design: DesignFile, models: readonly StateModel[], adhesions: readonly number[]): RegenResult | null {
  const r = design.regen;
  if (!r) return null;
  const setup = regenSetup(design, r);
  const rule = lockOrderRange(design.vehicle.category);
  const flags: RegenFlag[] = [];
  const selected = designRules(design);
  const states: RegenStateResult[] = models.map((m) => {
    const zeroSegs = segments(m.dist);
    const zero = adhesions.map((k) => lockRow(m.loads, m.dist, k, rule, zeroSegs));
    const rules = regenCurveRules(design, m.state.kind, selected);
    const memo: VerdictMemo = new Map();
    const checks = curveChecks(rules, verdictsAt(memo, rules, m.loads, m.dist, 0), null, 0);
    const zeroPassed = new Map(checks.map((c) => [c.rule, c.passed]));
    const atSpeeds = setup.speeds.map((kmh): RegenSpeedCase => {
      const R = regenForceAt(setup, kmh / 3.6);
      const d = regenDistribution(m.dist, R, setup.frontShare, setup.blending);
      const segs = segments(d);
      const lock = adhesions.map((k) => lockRow(m.loads, d, k, rule, segs));
      lock.forEach((l, i) => {
        if (!l.allowed && zero[i]!.allowed) {
          flags.push({
            kind: 'surface_lock',
            rule: null,
            load_state: m.state.id,
            speed_kmh: kmh,
            adhesion: l.adhesion,
            braking_rate: l.braking_rate,
            message:
              `with ${Math.round(R)} N of regeneration at ${kmh} km/h the ${l.first_axle} axle locks first on adhesion ` +
              `${l.adhesion} (z = ${l.braking_rate.toFixed(3)}), inside the ${rule.category} lock-order range; ` +
              'without regeneration the front locks first',
          });
        }
      });
      for (const c of curveChecks(rules, verdictsAt(memo, rules, m.loads, d, R), kmh, R)) {
        checks.push(c);
        if (!c.passed && zeroPassed.get(c.rule)) {
          flags.push({
            kind: 'curve_check',
            rule: c.rule,
            load_state: m.state.id,
            speed_kmh: kmh,
            adhesion: null,
            braking_rate: c.worst_at_braking_rate,
            message:
              `${c.rule} (${c.title}) passes without regeneration but fails with ${Math.round(R)} N at ${kmh} km/h` +
              (c.worst_at_braking_rate !== null ? `, worst at z = ${c.worst_at_braking_rate.toFixed(3)}` : '') +
              (c.verify_note ? ` (${c.verify_note})` : ''),
          });
        }
      }
      const cr = crossings(m.loads, d, segs);
      const utilisation = utilisationSeries(m.loads, d);
      return {
        speed_kmh: kmh,
        regen_force_n: R,
        lock,
        critical_braking_rates: cr.rates,
        critical_braking_rate: cr.critical,
        utilisation,
      };
    });
    const limits = adhesions.map((k): RegenLimit => {
      const F = maxAllowedRegenForce(m.loads, m.dist, k, setup.frontShare, setup.blending, rule);
      return {
        adhesion: k,
        in_rule_range: k >= rule.k_from - 1e-12 && k <= rule.k_to + 1e-12,
        max_force_n: F,
        max_wheel_torque_nm: F === null ? null : F * setup.radius,
        max_motor_torque_nm: F === null ? null : (F * setup.radius) / setup.gearRatio,
        share_of_capability: F === null ? null : F / setup.maxForce,
      };
    });
    const keep = rules.filter((rl) => zeroPassed.get(rl.id));
    const best = maxForcePassing(keep, m.loads, m.dist, setup, memo);
    return {
      id: m.state.id,
      zero_regen: { lock: zero, utilisation: utilisationSeries(m.loads, m.dist) },
      at_speeds: atSpeeds,
      limits,
      checks,
      max_force_passing_checks_n: best.force,
      failing_without_regen: rules.filter((rl) => !zeroPassed.get(rl.id)).map((rl) => rl.id),
      max_force_basis: best.basis,
    };
  });
  const speeds: number[] = [];
  const forces: number[] = [];
  const top = Math.max(130, ...setup.speeds);
  for (let v = 0; v <= top + 1e-9; v += 5) {
    speeds.push(v);
    forces.push(regenForceAt(setup, v / 3.6));
  }
  return {
    estimate: true,
    blending: setup.blending.type,
    proportion: setup.blending.type === 'fixed_proportion' ? setup.blending.proportion : null,
    front_share: setup.frontShare,
    assumed_inputs: design.vehicle.drive === 'all' && r.front_share === undefined ? ['regen.front_share'] : [],
    max_force_n: setup.maxForce,
    max_power_kw: setup.maxPower / 1e3,
    base_speed_kmh: regenBaseSpeed(setup) * 3.6,
    fade_start_kmh: setup.fadeStart * 3.6,
    cutoff_kmh: setup.cutoff * 3.6,
    tyre_radius_m: setup.radius,
    gear_ratio: setup.gearRatio,
    force_curve: { speed_kmh: speeds, force_n: forces },
    rule,
    load_states: states,
    flags,
    notes: [
      ...(design.vehicle.abs
        ? ['ABS is fitted: where ABS controls every axle the lock-order rules may not apply; the figures here are for ABS not intervening (failed or not yet active).']
        : []),
      `Lock order judged against ${rule.source} [${rule.status}]: ${rule.note}.`,
      'Zero regeneration stands for a full battery, a cold battery or a fault; the regenerative force is the largest the motor may give at that speed.',
      'Driveline losses, the speed change during the stop and any ABS/EBD intervention are not modelled.',
    ],
  };
}
