/**
 * Robustness of a design to what nobody knows exactly: pad friction (front and rear), CG height and
 * front axle load (per load state), dynamic tyre radius, the rear valve's knee and ratio, and the
 * brakes' threshold (push-out) pressures. For each perturbed vehicle the selected curve
 * rules are evaluated exactly (core/sizing/rule-margin.ts on the installed distribution, thresholds,
 * valve and balance bar included; a travel-sensing load-sensing valve's knee follows the braking rear
 * axle load as in core/installed-distribution.ts) and the smallest margin over every rule and load state kept.
 *  - worst-case corners: every input at its ± limit. Pad friction and tyre radius are shared by all
 *    load states, CG height and axle load belong to each state, so the worst corner is the lowest,
 *    over the shared corners, of the lowest over states of each state's own 4 corners (exact, 4·S
 *    evaluations per shared corner instead of 4^S). The shared inputs are pad friction front and rear,
 *    tyre radius, valve knee, valve ratio and the two thresholds; one whose limit is zero or that does
 *    not apply (no valve; the ratio of a limiting valve) sits at its nominal value instead of ±, so a
 *    design has 2^(shared inputs that move) · 4^S corners;
 *  - Monte Carlo, seeded (core/sizing/prng.ts): each ± limit read as 2 standard deviations of a normal
 *    distribution (a state's cg_height_uncertainty_m, a standard uncertainty, is used as is), or as the
 *    bounds of a uniform one. Probability of failure = share of samples whose smallest margin is below
 *    −MARGIN_TOLERANCE; 5th percentile of the smallest margin; histogram;
 *  - sensitivity: each input alone to its − and + limit, ranked by the largest change of the smallest
 *    margin.
 * Pad friction scales a disc brake's gain in proportion (G ∝ μ); a drum's brake factor follows the
 * curve of its `shoe_arrangement` (core/drum-brake-factor.ts: a leading shoe's factor rises faster than
 * μ), and is scaled with μ only where the arrangement is not given. A
 * change of tyre radius scales both gains by R0/R. Mass is held; what the front axle gains the rear
 * loses. The valve knee tolerance scales the knee (a load-sensing valve's whole table) by 1 + dk, the
 * ratio tolerance the ratio by 1 + dr (capped at 1: the rear line never gains more than the master
 * pressure). A threshold tolerance adds to the brake's own threshold in bar, held at 0 or above (a
 * brake cannot push out below zero pressure); with a balance bar the rear one is referred to the front
 * line pressure like the nominal threshold (core/state-model.ts).
 */
import { G_N } from '../constants.ts';
import { brakeFactorAtFriction, NOMINAL_LINING_FRICTION } from '../drum-brake-factor.ts';
import { MARGIN_TOLERANCE } from '../checks/curve-check.ts';
import type { DesignFile, LoadState } from '../design.ts';
import { type Segment, segments } from '../distribution.ts';
import { dynamicSensingDistribution } from '../installed-distribution.ts';
import { axleBrakeForce } from '../brake-force.ts';
import { loadSensingKneeBar, masterPressureForRear, rearPressure, rearValveFamily, type ValveLaw } from '../valves/index.ts';
import { PA_PER_BAR } from '../constants.ts';
import { dynamicSensing, stateModel } from '../state-model.ts';
import { mulberry32 } from './prng.ts';
import { ruleMargin } from './rule-margin.ts';
import type { Geometry } from './rule-margin.ts';
import { balanceBarPressureRatio, DEFAULT_TOLERANCES, type Tolerances } from './sizing-schema.ts';
import type { SizingRule } from './sizing-rules.ts';

export const DEFAULT_SAMPLES = 100000;
export const DEFAULT_SEED = 1;

export type InputName = 'pad_friction_front' | 'pad_friction_rear' | 'tyre_radius' | 'cg_height' | 'front_axle_load' | 'valve_knee' | 'valve_ratio' | 'threshold_front' | 'threshold_rear';

/** What each input is, in words for people (page, text report). */
export const INPUT_LABELS: Readonly<Record<InputName, string>> = {
  pad_friction_front: 'pad friction, front',
  pad_friction_rear: 'pad friction, rear',
  tyre_radius: 'tyre radius',
  cg_height: 'CG height',
  front_axle_load: 'front axle load',
  valve_knee: 'rear valve knee pressure',
  valve_ratio: 'rear valve ratio above the knee',
  threshold_front: 'threshold pressure, front brakes',
  threshold_rear: 'threshold pressure, rear brakes',
};

/** The inputs shared by every load state of one perturbed vehicle. */
export interface SharedPerturbation {
  /** Relative changes (0.1 = +10 %) of pad friction front and rear, tyre radius, valve knee and valve ratio. */
  mu1: number;
  mu2: number;
  radius: number;
  knee: number;
  ratio: number;
  /** Threshold pressure changes, front and rear brakes, Pa (the rear one at the rear brakes, before a balance bar's referral). */
  th1: number;
  th2: number;
}

export interface Perturbation extends SharedPerturbation {
  /** Per load state: CG height change, m, and front axle load change, kg. */
  dh: ArrayLike<number>;
  dfront: ArrayLike<number>;
}

interface NominalState {
  state: LoadState;
  massKg: number;
  frontKg: number;
  h: number;
  E: number;
  G1: number;
  G2: number;
  threshold1: number;
  threshold2: number;
  /** ± limits of this state's CG height, m. */
  hTol: number;
  /** Gain factor for a relative friction change, front and rear (1 + dμ for a disc or a drum of unstated arrangement). */
  gainAt1: (dmu: number) => number;
  gainAt2: (dmu: number) => number;
  /** Valve law referred to the front line pressure (fixed valves; load-sensing is read per sample). */
  knee: number;
  ratio: number;
}

export interface RobustnessModel {
  design: DesignFile;
  rules: readonly SizingRule[];
  states: NominalState[];
  lambda: number;
  tol: Required<Tolerances>;
  /** Rules per state (indices into rules). */
  rulesOf: number[][];
  /** Which valve tolerances apply: the knee to every valve but none, the ratio to proportioning and load-sensing valves. */
  kneeApplies: boolean;
  ratioApplies: boolean;
  /** A load-sensing valve that follows the rear axle load while braking (core/state-model.ts dynamicSensing). */
  dynamic: boolean;
}

export const NO_PERTURBATION: Readonly<SharedPerturbation> = { mu1: 0, mu2: 0, radius: 0, knee: 0, ratio: 0, th1: 0, th2: 0 };

export function resolvedTolerances(design: DesignFile): Required<Tolerances> {
  return { ...DEFAULT_TOLERANCES, ...(design.tolerances ?? {}) };
}

/** How an axle's gain moves with a relative change dμ of its lining friction. */
function frictionGain(b: DesignFile['axles']['front']['brake']): (dmu: number) => number {
  if (b.type !== 'drum' || !b.shoe_arrangement) return (dmu) => 1 + dmu;
  const arr = b.shoe_arrangement;
  const c0 = b.brake_factor;
  return (dmu) => brakeFactorAtFriction(arr, c0, NOMINAL_LINING_FRICTION * (1 + dmu)) / c0;
}

export function robustnessModel(design: DesignFile, rules: readonly SizingRule[]): RobustnessModel {
  const tol = resolvedTolerances(design);
  const h = design.hydraulics;
  const lambda = h.balance_bar ? balanceBarPressureRatio(h.master_cylinder_bore_mm, h.balance_bar) : 1;
  const states = design.load_states.map((st) => {
    const s = stateModel(design, st);
    const u = st.cg_height_uncertainty_m;
    return {
      state: st,
      massKg: st.mass_kg,
      frontKg: st.front_axle_kg,
      h: st.cg_height_m,
      E: design.vehicle.wheelbase_m,
      G1: s.G1,
      G2: s.G2,
      threshold1: s.threshold1,
      threshold2: s.threshold2,
      hTol: u !== undefined && design.tolerances?.cg_height_m === undefined ? 2 * u : tol.cg_height_m,
      knee: s.valve.knee,
      ratio: s.valve.ratio,
      gainAt1: frictionGain(design.axles.front.brake),
      gainAt2: frictionGain(design.axles.rear.brake),
    };
  });
  const rulesOf = states.map((_, i) => rules.flatMap((r, j) => (r.states.includes(i) ? [j] : [])));
  const v = h.rear_valve;
  const dynamic = v.type === 'load_sensing' && v.senses !== 'static';
  const moves = rearValveFamily(v).tolerances; // which valve settings the tolerances move, from the valve's module
  return { design, rules, states, lambda, tol, rulesOf, kneeApplies: moves.knee, ratioApplies: moves.ratio, dynamic };
}

// ---- the per-sample evaluation: no allocation in the loop ----

// up to 4 pressures and one step beyond (fixed knee), or 0, 2 thresholds, 20 table kinks, the knee crossing and one step beyond (travel-sensing valve)
const BUF = 32;
const segBuf: Segment[] = Array.from({ length: BUF }, () => ({ zFrom: 0, zTo: 0, a1: 0, b1: 0, a2: 0, b2: 0 }));
const segView: Segment[] = [];
const ps = new Float64Array(BUF);
const zs = new Float64Array(BUF);
const t1s = new Float64Array(BUF);
const t2s = new Float64Array(BUF);
const kinkBuf = new Float64Array(BUF);
const geo: Geometry = { P1: 0, P2: 0, cP: 0, zLift: 0 };
const law: ValveLaw = { knee: 0, ratio: 0 };

let nPs = 0;
function addPressure(p: number): void {
  if (!(Number.isFinite(p) && p >= 0)) return;
  for (let i = 0; i < nPs; i++) if (ps[i] === p) return;
  let j = nPs++;
  while (j > 0 && ps[j - 1]! > p) {
    ps[j] = ps[j - 1]!;
    j--;
  }
  ps[j] = p;
}

/** installedDistribution + segments (core/installed-distribution.ts, core/distribution.ts), into buffers. */
function fillSegments(P: number, G1: number, G2: number, th1: number, th2: number, law: ValveLaw): Segment[] {
  nPs = 0;
  addPressure(0);
  addPressure(th1);
  addPressure(masterPressureForRear(law, th2));
  addPressure(law.knee);
  let n = nPs;
  ps[n] = ps[n - 1]! + 1e6;
  n++;
  for (let i = 0; i < n; i++) {
    const p = ps[i]!;
    const p2 = rearPressure(law, p);
    const a = axleBrakeForce(G1, p, th1);
    const b = axleBrakeForce(G2, p2, th2);
    zs[i] = (a + b) / P;
    t1s[i] = a;
    t2s[i] = b;
  }
  return pointsToSegments(n);
}

/** The state of one travel-sensing evaluation (module scope: no closures per sample). */
const dyn = { P: 0, G1: 0, G2: 0, th1: 0, th2: 0, m2: 0, perZ: 0, kneeScale: 0, ratio: 0, table: [] as ReadonlyArray<readonly [number, number]> };
const dynKnee = (z: number) => loadSensingKneeBar(dyn.table, dyn.m2 - z * dyn.perZ) * dyn.kneeScale;
/** Braking rate at master pressure p with the rear line at p (below the knee). */
const dynZs = (p: number) => (axleBrakeForce(dyn.G1, p, dyn.th1) + axleBrakeForce(dyn.G2, p, dyn.th2)) / dyn.P;

/**
 * dynamicSensingDistribution + segments (core/installed-distribution.ts) into buffers, for a travel-sensing
 * valve whose thresholds lie below its lowest knee (every practical valve; null otherwise, and the caller
 * builds the distribution). The knee K(z) = table(m2 − z·perZ)·kneeScale never meets a threshold then, so
 * z − zs(K(z)) has its kinks at the table points only, and the breakpoints are 0, the thresholds, the table
 * points and the knee crossing z*, as there. The forces at a breakpoint z (target force F = zP):
 *  - z ≤ z*, rear line at master pressure p: F = G1 (p − t1)⁺ + G2 (p − t2)⁺, linear between the thresholds;
 *  - z > z*, both brakes applied above the knee: F = G1 (p − t1) + G2 (K + r (p − K) − t2), so
 *    p = (F + G1 t1 + G2 t2 − G2 K (1 − r)) / (G1 + G2 r).
 */
function fillDynamicSegments(): Segment[] | null {
  const { P, G1, G2, th1, th2, table, m2, perZ, ratio } = dyn;
  let nK = 0;
  for (let i = table.length - 1; i >= 0; i--) {
    const z = (m2 - table[i]![0]) / perZ;
    if (z > 0) kinkBuf[nK++] = z; // ascending: the table rises in load
  }
  const last = nK ? kinkBuf[nK - 1]! : 0;
  const kneeLast = dynKnee(last);
  if (!(Math.max(th1, th2) < kneeLast)) return null;
  // knee crossing: g(z) = z − zs(K(z)) bracketed over 0, the kinks and a point beyond where g > 0
  let za = 0;
  let ga = -dynZs(dynKnee(0));
  let zStar = NaN;
  for (let i = 0; i <= nK; i++) {
    const zb = i < nK ? kinkBuf[i]! : last + dynZs(kneeLast) + 1;
    const gb = zb - dynZs(dynKnee(zb));
    if (ga <= 0 && gb > 0) {
      zStar = za - (ga * (zb - za)) / (gb - ga);
      break;
    }
    za = zb;
    ga = gb;
  }
  nPs = 0;
  addPressure(0); // a sorted set of braking rates here
  addPressure(dynZs(th1));
  addPressure(dynZs(th2));
  for (let i = 0; i < nK; i++) addPressure(kinkBuf[i]!);
  addPressure(zStar);
  let n = nPs;
  ps[n] = ps[n - 1]! + 1;
  n++;
  const lowT = Math.min(th1, th2);
  const lowG = th1 <= th2 ? G1 : G2;
  const fAtHighT = lowG * (Math.max(th1, th2) - lowT);
  for (let i = 0; i < n; i++) {
    const z = ps[i]!;
    const F = z * P;
    let p: number;
    if (!(z > 0)) p = 0;
    else if (z <= zStar) p = F <= fAtHighT && lowG > 0 ? lowT + F / lowG : (F + G1 * th1 + G2 * th2) / (G1 + G2);
    else {
      const K = dynKnee(z);
      p = (F + G1 * th1 + G2 * th2 - G2 * K * (1 - ratio)) / (G1 + G2 * ratio);
    }
    const front = axleBrakeForce(G1, p, th1);
    zs[i] = z;
    t1s[i] = front;
    t2s[i] = F - front;
  }
  return pointsToSegments(n);
}

/** The linear pieces through the n points (zs, t1s, t2s), as core/distribution.ts segments. */
function pointsToSegments(n: number): Segment[] {
  segView.length = 0;
  for (let j = 0; j < n - 1; j++) {
    const z0 = zs[j]!;
    const z1 = zs[j + 1]!;
    if (!(z1 > z0)) continue;
    const s = segBuf[segView.length]!;
    const b1 = (t1s[j + 1]! - t1s[j]!) / (z1 - z0);
    const b2 = (t2s[j + 1]! - t2s[j]!) / (z1 - z0);
    s.zFrom = z0;
    s.zTo = j === n - 2 ? Infinity : z1;
    s.a1 = t1s[j]! - b1 * z0;
    s.b1 = b1;
    s.a2 = t2s[j]! - b2 * z0;
    s.b2 = b2;
    segView.push(s);
  }
  return segView;
}

/** Smallest margin of one load state under a perturbation. */
export function stateMargin(m: RobustnessModel, i: number, p: SharedPerturbation, dh: number, dfront: number): number {
  const s = m.states[i]!;
  const rules = m.rulesOf[i]!;
  if (rules.length === 0) return Infinity;
  const P = s.massKg * G_N;
  const frontKg = s.frontKg + dfront;
  const h = s.h + dh;
  const P1 = frontKg * G_N;
  const P2 = P - P1;
  if (!(P1 > 0 && P2 > 0 && h > 0)) return -Infinity;
  const chi = h / s.E;
  geo.P1 = P1;
  geo.P2 = P2;
  geo.cP = chi * P;
  geo.zLift = P2 / (chi * P);
  const rf = 1 / (1 + p.radius);
  const v = m.design.hydraulics.rear_valve;
  const G1 = s.G1 * s.gainAt1(p.mu1) * rf;
  const G2 = s.G2 * s.gainAt2(p.mu2) * rf;
  const th1 = Math.max(0, s.threshold1 + p.th1);
  const th2 = Math.max(0, s.threshold2 + p.th2 / m.lambda);
  let segs: Segment[];
  if (v.type === 'load_sensing' && m.dynamic) {
    // the knee follows the rear axle load while braking (core/state-model.ts dynamicSensing), on the perturbed state
    const ratio = Math.min(1, v.ratio * (1 + p.ratio));
    const perZ = (s.massKg * h) / s.E;
    dyn.P = P;
    dyn.G1 = G1;
    dyn.G2 = G2;
    dyn.th1 = th1;
    dyn.th2 = th2;
    dyn.table = v.knee_bar_at_rear_axle_kg;
    dyn.m2 = s.massKg - frontKg;
    dyn.perZ = perZ;
    dyn.kneeScale = (PA_PER_BAR / m.lambda) * (1 + p.knee);
    dyn.ratio = ratio;
    const fast = fillDynamicSegments();
    if (fast) segs = fast;
    else {
      const base = dynamicSensing(m.design, { ...s.state, front_axle_kg: frontKg, cg_height_m: h }, m.lambda)!;
      segs = segments(dynamicSensingDistribution({ P, G1, G2, threshold1: th1, threshold2: th2 }, { table: base.table, rearKg: base.rearKg, perZ: base.perZ, kneeScale: base.kneeScale * (1 + p.knee), kinks: base.kinks, ratio }));
    }
  } else {
    const kneeNominal = v.type === 'load_sensing' ? (loadSensingKneeBar(v.knee_bar_at_rear_axle_kg, s.massKg - frontKg) * PA_PER_BAR) / m.lambda : s.knee;
    law.knee = kneeNominal * (1 + p.knee);
    law.ratio = Math.min(1, s.ratio * (1 + p.ratio));
    segs = fillSegments(P, G1, G2, th1, th2, law);
  }
  let worst = Infinity;
  for (const j of rules) {
    const v = ruleMargin(m.rules[j]!.compiled, geo, segs);
    if (v < worst) worst = v;
  }
  return worst;
}

export function smallestMargin(m: RobustnessModel, p: Perturbation): number {
  let worst = Infinity;
  for (let i = 0; i < m.states.length; i++) {
    const v = stateMargin(m, i, p, p.dh[i] ?? 0, p.dfront[i] ?? 0);
    if (v < worst) worst = v;
  }
  return worst;
}

export interface Corner {
  smallest_margin: number | null;
  pad_friction_front_pct: number;
  pad_friction_rear_pct: number;
  tyre_radius_pct: number;
  valve_knee_pct: number;
  valve_ratio_pct: number;
  threshold_front_bar: number;
  threshold_rear_bar: number;
  /** Per load state. */
  cg_height_change_m: number[];
  front_axle_change_kg: number[];
}

/** The shared inputs with their ± limits in the units of the perturbation (0 when they do not move). */
function sharedLimits(m: RobustnessModel): SharedPerturbation {
  const t = m.tol;
  return {
    mu1: t.pad_friction_front_pct / 100,
    mu2: t.pad_friction_rear_pct / 100,
    radius: t.tyre_radius_pct / 100,
    knee: m.kneeApplies ? t.valve_knee_pct / 100 : 0,
    ratio: m.ratioApplies ? t.valve_ratio_pct / 100 : 0,
    th1: t.threshold_front_bar * PA_PER_BAR,
    th2: t.threshold_rear_bar * PA_PER_BAR,
  };
}

const SHARED_KEYS = ['mu1', 'mu2', 'radius', 'knee', 'ratio', 'th1', 'th2'] as const;

export function worstCorner(m: RobustnessModel): { worst: Corner; failing_corners: number; corners: number } {
  const t = m.tol;
  const signs = [-1, 1];
  const lim = sharedLimits(m);
  const moving = SHARED_KEYS.filter((k) => lim[k] > 0);
  let worst: Corner | null = null;
  let failing = 0;
  let corners = 0;
  const p: SharedPerturbation = { ...NO_PERTURBATION };
  for (let bits = 0; bits < 1 << moving.length; bits++) {
    moving.forEach((k, j) => {
      p[k] = (bits >> j) & 1 ? lim[k] : -lim[k];
    });
    let total = Infinity;
    const dh: number[] = [];
    const df: number[] = [];
    let combos = 1;
    let passingCombos = 1;
    m.states.forEach((s, i) => {
      let w = { v: Infinity, dh: 0, df: 0 };
      let passing = 0;
      for (const sh of signs) {
        for (const sf of signs) {
          const v = stateMargin(m, i, p, sh * s.hTol, sf * t.front_axle_kg);
          if (v >= -MARGIN_TOLERANCE) passing++;
          if (v < w.v) w = { v, dh: sh * s.hTol, df: sf * t.front_axle_kg };
        }
      }
      combos *= 4;
      passingCombos *= passing;
      dh.push(w.dh);
      df.push(w.df);
      total = Math.min(total, w.v);
    });
    corners += combos;
    failing += combos - passingCombos;
    if (!worst || total < (worst.smallest_margin ?? -Infinity)) {
      worst = {
        smallest_margin: Number.isFinite(total) ? total : null,
        pad_friction_front_pct: Math.sign(p.mu1) * t.pad_friction_front_pct,
        pad_friction_rear_pct: Math.sign(p.mu2) * t.pad_friction_rear_pct,
        tyre_radius_pct: Math.sign(p.radius) * t.tyre_radius_pct,
        valve_knee_pct: Math.sign(p.knee) * t.valve_knee_pct,
        valve_ratio_pct: Math.sign(p.ratio) * t.valve_ratio_pct,
        threshold_front_bar: Math.sign(p.th1) * t.threshold_front_bar,
        threshold_rear_bar: Math.sign(p.th2) * t.threshold_rear_bar,
        cg_height_change_m: dh,
        front_axle_change_kg: df,
      };
    }
  }
  return { worst: worst!, failing_corners: failing, corners };
}

export interface Histogram {
  /** Bin edges, adhesion units (bins + 1 values); margins below the first edge (lift-off) fall in the first bin. */
  edges: number[];
  counts: number[];
}

export interface MonteCarlo {
  samples: number;
  seed: number;
  distribution: 'normal' | 'uniform';
  probability_of_failure: number;
  /** Standard error of that estimate, √(p(1 − p)/n). */
  probability_standard_error: number;
  p05_margin: number | null;
  median_margin: number | null;
  histogram: Histogram;
}

/** The Monte Carlo smallest margins (exposed for tests and the benchmark). */
export function sampleMargins(m: RobustnessModel, samples: number, seed: number): Float64Array {
  const rng = mulberry32(seed);
  const t = m.tol;
  const normal = t.distribution === 'normal';
  // a ± limit is 2 standard deviations (normal) or the bound (uniform)
  const draw = normal ? (lim: number) => (lim === 0 ? 0 : 0.5 * lim * rng.normal()) : (lim: number) => (lim === 0 ? 0 : lim * (2 * rng.uniform() - 1));
  const out = new Float64Array(samples);
  const n = m.states.length;
  const lim = sharedLimits(m);
  const p: SharedPerturbation = { ...NO_PERTURBATION };
  for (let k = 0; k < samples; k++) {
    p.mu1 = draw(lim.mu1);
    p.mu2 = draw(lim.mu2);
    p.radius = draw(lim.radius);
    p.knee = draw(lim.knee);
    p.ratio = draw(lim.ratio);
    p.th1 = draw(lim.th1);
    p.th2 = draw(lim.th2);
    let worst = Infinity;
    for (let i = 0; i < n; i++) {
      const dh = draw(m.states[i]!.hTol);
      const df = draw(t.front_axle_kg);
      const v = stateMargin(m, i, p, dh, df);
      if (v < worst) worst = v;
    }
    out[k] = worst;
  }
  return out;
}

function quantile(sorted: Float64Array, q: number): number {
  const pos = q * (sorted.length - 1);
  const i = Math.floor(pos);
  const f = pos - i;
  const a = sorted[i]!;
  return i + 1 < sorted.length ? a + (sorted[i + 1]! - a) * f : a;
}

export function monteCarlo(m: RobustnessModel, samples = DEFAULT_SAMPLES, seed = DEFAULT_SEED, bins = 40): MonteCarlo {
  const margins = sampleMargins(m, samples, seed);
  let fails = 0;
  for (let k = 0; k < samples; k++) if (!(margins[k]! >= -MARGIN_TOLERANCE)) fails++;
  const sorted = Float64Array.from(margins).sort();
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of sorted) {
    if (!Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  const edges: number[] = [];
  const counts = new Array<number>(bins).fill(0);
  if (lo <= hi) {
    const width = hi > lo ? (hi - lo) / bins : 1e-6;
    for (let b = 0; b <= bins; b++) edges.push(lo + b * width);
    for (const v of sorted) {
      const b = Number.isFinite(v) ? Math.min(bins - 1, Math.floor((v - lo) / width)) : v < 0 ? 0 : bins - 1;
      counts[b]!++;
    }
  }
  const p = fails / samples;
  const fin = (x: number) => (Number.isFinite(x) ? x : null);
  return {
    samples,
    seed,
    distribution: m.tol.distribution,
    probability_of_failure: p,
    probability_standard_error: Math.sqrt((p * (1 - p)) / samples),
    p05_margin: samples > 0 ? fin(quantile(sorted, 0.05)) : null,
    median_margin: samples > 0 ? fin(quantile(sorted, 0.5)) : null,
    histogram: { edges, counts },
  };
}

export interface Sensitivity {
  input: InputName;
  /** The input in words for people. */
  label: string;
  /** The ± limit used, with its unit. */
  tolerance: string;
  margin_at_minus: number | null;
  margin_at_plus: number | null;
  /** Largest change of the smallest margin from the nominal one, adhesion units. */
  effect: number;
}

/** One-at-a-time sensitivity; inputs that do not apply to the design (valve tolerances without a valve, the ratio of a limiting valve) are left out. */
export function sensitivity(m: RobustnessModel): { nominal: number | null; ranking: Sensitivity[] } {
  const n = m.states.length;
  const zero = new Array<number>(n).fill(0);
  const t = m.tol;
  const lim = sharedLimits(m);
  const base: Perturbation = { ...NO_PERTURBATION, dh: zero, dfront: zero };
  const nominal = smallestMargin(m, base);
  const shared = (input: InputName, key: keyof SharedPerturbation, tolerance: string) => ({ input, tolerance, at: (s: number): Perturbation => ({ ...base, [key]: s * lim[key] }) });
  const cases: { input: InputName; tolerance: string; at: (sign: number) => Perturbation }[] = [
    shared('pad_friction_front', 'mu1', `±${t.pad_friction_front_pct} %`),
    shared('pad_friction_rear', 'mu2', `±${t.pad_friction_rear_pct} %`),
    shared('tyre_radius', 'radius', `±${t.tyre_radius_pct} %`),
    { input: 'cg_height', tolerance: m.states.some((x) => x.hTol !== t.cg_height_m) ? `±${m.states.map((x) => x.hTol.toFixed(3)).join(' / ')} m` : `±${t.cg_height_m} m`, at: (s) => ({ ...base, dh: m.states.map((x) => s * x.hTol) }) },
    { input: 'front_axle_load', tolerance: `±${t.front_axle_kg} kg`, at: (s) => ({ ...base, dfront: m.states.map(() => s * t.front_axle_kg) }) },
    ...(m.kneeApplies ? [shared('valve_knee', 'knee', `±${t.valve_knee_pct} %`)] : []),
    ...(m.ratioApplies ? [shared('valve_ratio', 'ratio', `±${t.valve_ratio_pct} %`)] : []),
    shared('threshold_front', 'th1', `±${t.threshold_front_bar} bar`),
    shared('threshold_rear', 'th2', `±${t.threshold_rear_bar} bar`),
  ];
  const fin = (x: number) => (Number.isFinite(x) ? x : null);
  const ranking = cases.map((c) => {
    const lo = smallestMargin(m, c.at(-1));
    const hi = smallestMargin(m, c.at(1));
    const eff = Math.max(Math.abs(lo - nominal), Math.abs(hi - nominal));
    return { input: c.input, label: INPUT_LABELS[c.input], tolerance: c.tolerance, margin_at_minus: fin(lo), margin_at_plus: fin(hi), effect: Number.isFinite(eff) ? eff : Number.MAX_VALUE };
  });
  ranking.sort((a, b) => b.effect - a.effect);
  return { nominal: fin(nominal), ranking };
}
