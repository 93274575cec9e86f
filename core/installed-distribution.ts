/**
 * The installed distribution of a hydraulic system: front line at master pressure p, rear line at
 * valve(p); T1 = G1 max(0, p − threshold1), T2 = G2 max(0, p2 − threshold2) (design-file spec).
 * T(p) = T1 + T2 is piecewise linear and non-decreasing in p; its kinks are the thresholds and the
 * valve knee, so the distribution in z is exact at those breakpoints and linear between them.
 */
import type { Distribution, ForcesAt } from './distribution.ts';
import { axleBrakeForce, totalForceAtPressure } from './brake-force.ts';
import { loadSensingKneeBar, masterPressureForRear, rearPressure, type ValveLaw } from './valves/index.ts';

export interface HydraulicAxles {
  /** Vehicle weight P, N. */
  P: number;
  /** Brake gains, N per Pa. */
  G1: number;
  G2: number;
  /** Threshold pressures, Pa. */
  threshold1: number;
  threshold2: number;
  valve: ValveLaw;
}

export function installedDistribution(h: HydraulicAxles): Distribution {
  const raw = [0, h.threshold1, masterPressureForRear(h.valve, h.threshold2), h.valve.knee].filter(
    (p) => Number.isFinite(p) && p >= 0,
  );
  const ps = [...new Set(raw)].sort((a, b) => a - b);
  ps.push(ps[ps.length - 1]! + 1e6);
  const d: Distribution = { P: h.P, z: [], t1: [], t2: [], p: [], p2: [] };
  for (const p of ps) {
    const p2 = rearPressure(h.valve, p);
    const t1 = axleBrakeForce(h.G1, p, h.threshold1);
    const t2 = axleBrakeForce(h.G2, p2, h.threshold2);
    d.z.push((t1 + t2) / h.P);
    d.t1.push(t1);
    d.t2.push(t2);
    d.p!.push(p);
    d.p2!.push(p2);
  }
  return d;
}

/**
 * A load-sensing valve that senses suspension travel follows the rear axle load while braking:
 * N2 = P2 − z·(h/E)·P (Appendix 3.1.3), so its knee is K(z) = knee(m2 − z·χ·m), the table read at the
 * dynamic rear load (kg), divided by `referTo` (λ of a balance bar, else 1). Knee pressures in Pa.
 */
export interface DynamicSensing {
  /** The valve's table: rear axle load (kg) against knee (bar). */
  table: ReadonlyArray<readonly [number, number]>;
  /** Rear static axle load, kg, and the rear load moved to the front per unit z, kg (χ·m). */
  rearKg: number;
  perZ: number;
  /** Knee in Pa referred to the master pressure per bar of the table: 1e5 / λ (and any scaling applied). */
  kneeScale: number;
  /** Braking rates at which the knee changes slope (the table points reached by the dynamic load), ascending. */
  kinks: readonly number[];
  ratio: number;
}

/** Knee pressure (Pa, referred to the master pressure) at braking rate z. */
export function kneeAtRate(s: DynamicSensing, z: number): number {
  return loadSensingKneeBar(s.table, s.rearKg - z * s.perZ) * s.kneeScale;
}

/**
 * The installed distribution with a travel-sensing valve, exact and piecewise linear in z.
 * At a fixed z the knee is fixed, so the forces at z are those of the static distribution with the knee
 * K(z) (installedDistribution), read at z. Between breakpoints T1(z), T2(z) are linear: on a table piece
 * K(z) = a + b·z, and with the pressure above the knee z·P = G1(p − t1) + G2(r·p + (1 − r)·K(z) − t2) is
 * linear in p and z together. The breakpoints are the thresholds, the table points, and the knee crossing
 * z*: the fixed point z = zs(K(z)), where zs(p) = [G1(p − t1)⁺ + G2(p − t2)⁺]/P is the rate at pressure p
 * below the knee. z − zs(K(z)) is increasing (K falls as z rises) and piecewise linear, so z* is found
 * exactly by bracketing between its kinks and interpolating on the bracketing piece.
 */
export function dynamicSensingDistribution(h: Axles, sensing: DynamicSensing): Distribution {
  // The helpers are module functions, not closures: this runs for every load state of every evaluation.
  const law: ValveLaw = { knee: 0, ratio: sensing.ratio };
  // Knee crossing: kinks of g(z) = z − zs(K(z)) are the table kinks and where K(z) meets a threshold.
  const cand = [0, ...sensing.kinks];
  const n0 = cand.length; // the table kinks are ascending, so K is linear between neighbours
  for (let i = 0; i + 1 < n0; i++) {
    const za = cand[i]!;
    const zb = cand[i + 1]!;
    const ka = kneeAtRate(sensing, za);
    const kb = kneeAtRate(sensing, zb);
    if ((ka - h.threshold1) * (kb - h.threshold1) < 0) cand.push(za + ((h.threshold1 - ka) * (zb - za)) / (kb - ka));
    if ((ka - h.threshold2) * (kb - h.threshold2) < 0) cand.push(za + ((h.threshold2 - ka) * (zb - za)) / (kb - ka));
  }
  const last = cand[n0 - 1]!;
  const kneeLast = kneeAtRate(sensing, last); // K is non-increasing in z (the schema keeps the knee rising with load): its lowest value
  cand.push(last + rateBelowKnee(h, kneeLast) + 1); // beyond the last kink K is constant: g is linear there and positive at this z
  cand.sort((x, y) => x - y);
  let zStar = NaN;
  let ga = kneeGap(h, sensing, cand[0]!);
  for (let i = 0; i + 1 < cand.length; i++) {
    const za = cand[i]!;
    const zb = cand[i + 1]!;
    const gb = kneeGap(h, sensing, zb);
    if (ga <= 0 && gb > 0) {
      zStar = za - (ga * (zb - za)) / (gb - ga);
      break;
    }
    ga = gb;
  }
  const bps = [0, rateBelowKnee(h, h.threshold1), rateBelowKnee(h, h.threshold2), ...sensing.kinks, zStar].sort((x, y) => x - y);
  const zsSorted: number[] = [];
  for (const z of bps) if (Number.isFinite(z) && z >= 0 && z !== zsSorted[zsSorted.length - 1]) zsSorted.push(z);
  zsSorted.push(zsSorted[zsSorted.length - 1]! + 1);
  const d: Distribution = { P: h.P, z: [], t1: [], t2: [], p: [], p2: [] };
  pushPoint(d, 0, forcesWithKneeAt(h, sensing, law, 0));
  // at z = 0 the line pressure rises to the first threshold with no force yet (as installedDistribution lists it)
  law.knee = kneeAtRate(sensing, 0);
  const start: ForcesAt = { front: 0, rear: 0, p: Math.min(h.threshold1, masterPressureForRear(law, h.threshold2)), p2: 0 };
  start.p2 = rearPressure(law, start.p);
  const hasStart = start.p > 0 && Number.isFinite(start.p);
  if (hasStart) pushPoint(d, 0, start);
  // a threshold at or above some knee value is the only case with breakpoints not listed above
  const listed = Math.max(h.threshold1, h.threshold2) < kneeLast;
  for (let i = 1; i < zsSorted.length; i++) {
    if (listed) pushPoint(d, zsSorted[i]!, forcesWithKneeAt(h, sensing, law, zsSorted[i]!));
    else refinePiece(h, sensing, law, d, hasStart ? start : null, zsSorted[i - 1]!, zsSorted[i]!, 0);
  }
  return d;
}

type Axles = Omit<HydraulicAxles, 'valve'>;

/** zs(p): the braking rate at line pressure p below the knee, [G1(p − t1)⁺ + G2(p − t2)⁺]/P. */
function rateBelowKnee(h: Axles, p: number): number {
  return (axleBrakeForce(h.G1, p, h.threshold1) + axleBrakeForce(h.G2, p, h.threshold2)) / h.P;
}

/** g(z) = z − zs(K(z)): negative below the knee crossing, positive above. */
function kneeGap(h: Axles, sensing: DynamicSensing, z: number): number {
  return z - rateBelowKnee(h, kneeAtRate(sensing, z));
}

/** The forces at z with the knee of the dynamic rear load at z (law is reused as scratch). */
function forcesWithKneeAt(h: Axles, sensing: DynamicSensing, law: ValveLaw, z: number): ForcesAt {
  law.knee = kneeAtRate(sensing, z);
  return staticForcesAt(h, law, z);
}

function pushPoint(d: Distribution, z: number, f: ForcesAt): void {
  d.z.push(z);
  d.t1.push(f.front);
  d.t2.push(f.rear);
  d.p!.push(f.p);
  d.p2!.push(f.p2);
}

function offChord(fm: ForcesAt, fa: ForcesAt, fb: ForcesAt, k: 'front' | 'rear' | 'p'): boolean {
  return Math.abs(fm[k] - (fa[k] + fb[k]) / 2) > 1e-10 * Math.max(1, Math.abs(fb[k]));
}

/**
 * Adds the breakpoint zb after za. With thresholds below the knee (every practical valve) the pieces
 * are linear already; a threshold above the knee moves its own breakpoint with z, and those pieces are
 * split until the midpoint of forces and pressure lies on the chord (to 1e-10 relative). `start` is the
 * point at z = 0 where the pressure stands at the first threshold (null when there is none).
 */
function refinePiece(h: Axles, sensing: DynamicSensing, law: ValveLaw, d: Distribution, start: ForcesAt | null, za: number, zb: number, depth: number): void {
  if (!(zb > za)) return;
  const zm = (za + zb) / 2;
  const fa = za === 0 && start ? start : forcesWithKneeAt(h, sensing, law, za);
  const fb = forcesWithKneeAt(h, sensing, law, zb);
  const fm = forcesWithKneeAt(h, sensing, law, zm);
  if (depth < 40 && (offChord(fm, fa, fb, 'front') || offChord(fm, fa, fb, 'rear') || offChord(fm, fa, fb, 'p'))) {
    refinePiece(h, sensing, law, d, start, za, zm, depth + 1);
    refinePiece(h, sensing, law, d, start, zm, zb, depth + 1);
    return;
  }
  pushPoint(d, zb, fb);
}

/**
 * The forces and pressures of installedDistribution(h with valve law) at braking rate z, without building
 * it: the total force F(p) = G1 (p − t1)⁺ + G2 (p2(p) − t2)⁺ is linear between the kinks t1, the master
 * pressure at the rear threshold and the knee, so p for F(p) = z·P is interpolated on its piece.
 */
const KS = new Float64Array(4);
function staticForcesAt(h: Omit<HydraulicAxles, 'valve'>, law: ValveLaw, z: number): ForcesAt {
  const target = z * h.P;
  const k1 = h.threshold1;
  const k2 = masterPressureForRear(law, h.threshold2);
  const k3 = law.knee;
  let lo = 0;
  let flo = 0;
  // the kinks in ascending order (at most three; Infinity when absent), then one step beyond the last
  let a = Number.isFinite(k1) && k1 > 0 ? k1 : Infinity;
  let b = Number.isFinite(k2) && k2 > 0 ? k2 : Infinity;
  let c = Number.isFinite(k3) && k3 > 0 ? k3 : Infinity;
  let t: number;
  if (a > b) (t = a), (a = b), (b = t);
  if (b > c) (t = b), (b = c), (c = t);
  if (a > b) (t = a), (a = b), (b = t);
  const n = c < Infinity ? 3 : b < Infinity ? 2 : a < Infinity ? 1 : 0;
  const ks = KS;
  ks[0] = a;
  ks[1] = b;
  ks[2] = c;
  ks[n] = (n ? ks[n - 1]! : 0) + 1e6;
  let p = NaN;
  for (let i = 0; i <= n; i++) {
    const hi = ks[i]!;
    const fhi = totalForceAtPressure(h, law, hi);
    if (fhi >= target || i === n) {
      p = fhi > flo ? lo + ((target - flo) * (hi - lo)) / (fhi - flo) : lo;
      break;
    }
    lo = hi;
    flo = fhi;
  }
  if (!(z > 0)) p = 0;
  const p2 = rearPressure(law, p);
  const front = axleBrakeForce(h.G1, p, h.threshold1);
  return { front, rear: target - front, p, p2 };
}
