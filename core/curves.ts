/**
 * Series for plotting, per load state: on a braking-rate grid 0…1 (step CURVE_STEP) merged with the
 * exact event points (distribution breakpoints such as thresholds and the valve knee, the crossings
 * of the ideal, rear lift-off): f1, f2 and the installed and ideal axle forces divided by the weight.
 */
import { CURVE_STEP, PA_PER_BAR } from './constants.ts';
import { lerpAt } from './distribution.ts';
import { pedalForce } from './pedal-force.ts';
import type { StateModel } from './state-model.ts';

export interface CurveEvent {
  braking_rate: number;
  kind: 'breakpoint' | 'crossing' | 'critical' | 'lift_off';
}

export interface Curves {
  braking_rate: number[];
  front_utilisation: (number | null)[];
  rear_utilisation: (number | null)[];
  /** Installed axle braking forces over the vehicle weight, T_i / P. */
  front_force_per_weight: number[];
  rear_force_per_weight: number[];
  /** Ideal axle braking forces over the vehicle weight, z N_i / P. */
  ideal_front_per_weight: number[];
  ideal_rear_per_weight: number[];
  front_pressure_bar: number[];
  rear_pressure_bar: number[];
  pedal_force_n: number[];
  events: CurveEvent[];
}

export function curveGrid(zMax = 1): number[] {
  const n = Math.round(zMax / CURVE_STEP);
  return Array.from({ length: n + 1 }, (_, i) => Math.round(i * CURVE_STEP * 1e9) / 1e9);
}

/** The grid is the same for every call with the same zMax: built once (read-only use below). */
const gridCache = new Map<number, readonly number[]>();
function cachedGrid(zMax: number): readonly number[] {
  let g = gridCache.get(zMax);
  if (!g) {
    g = curveGrid(zMax);
    gridCache.set(zMax, g);
  }
  return g;
}

/** Two ascending lists merged into one, exact repeats dropped. */
function mergeAscending(a: readonly number[], b: readonly number[]): number[] {
  const out: number[] = new Array(a.length + b.length); // final length set below (growing by push is slower)
  let i = 0;
  let k = 0;
  let m = 0;
  while (i < a.length || k < b.length) {
    const v = k >= b.length || (i < a.length && a[i]! <= b[k]!) ? a[i++]! : b[k++]!;
    if (m === 0 || out[m - 1] !== v) out[m++] = v;
  }
  out.length = m;
  return out;
}

export function curves(s: StateModel, crossingRates: number[], critical: number | null, zMax = 1): Curves {
  const events: CurveEvent[] = [];
  for (const zb of s.dist.z) if (zb > 0 && zb < zMax) events.push({ braking_rate: zb, kind: 'breakpoint' });
  for (const zc of crossingRates) {
    if (zc <= zMax) events.push({ braking_rate: zc, kind: zc === critical ? 'critical' : 'crossing' });
  }
  if (s.loads.zLift <= zMax) events.push({ braking_rate: s.loads.zLift, kind: 'lift_off' });
  events.sort((a, b) => a.braking_rate - b.braking_rate);
  const zs = mergeAscending(cachedGrid(zMax), events.map((e) => e.braking_rate));
  const n = zs.length;
  // Plain local arrays of the final length, filled in one pass (the plotting series are the hot path).
  const fu: (number | null)[] = new Array(n);
  const ru: (number | null)[] = new Array(n);
  const ff: number[] = new Array(n);
  const rf: number[] = new Array(n);
  const fi: number[] = new Array(n);
  const ri: number[] = new Array(n);
  const fp: number[] = new Array(n);
  const rp: number[] = new Array(n);
  const pf: number[] = new Array(n);
  const loads = s.loads;
  const P = loads.P;
  const P1 = loads.P1;
  const P2 = loads.P2;
  const chi = loads.chi;
  const pedal = s.pedal;
  const d = s.dist;
  const bz = d.z;
  const t1 = d.t1;
  const t2 = d.t2;
  const pz = d.p;
  const p2z = d.p2;
  const last = bz.length - 2;
  // The breakpoints are walked once along the ascending grid; the segment choice and the arithmetic
  // are those of forcesAt (see forcesAlong), so every value equals forcesAt(s.dist, z).
  let j = 0;
  for (let i = 0; i < n; i++) {
    const z = zs[i]!;
    // N1, N2 exactly as frontAxleLoad / rearAxleLoad compute them (same operation order)
    const n1 = P1 + z * chi * P;
    const n2 = P2 - z * chi * P;
    let front = 0;
    let rear = 0;
    let p = pz ? 0 : NaN;
    let p2 = p2z ? 0 : NaN;
    if (z > 0) {
      while (j < last && bz[j + 1]! <= z) j++;
      const frac = (z - bz[j]!) / (bz[j + 1]! - bz[j]!);
      front = lerpAt(t1, j, frac);
      rear = lerpAt(t2, j, frac);
      if (pz) p = lerpAt(pz, j, frac);
      if (p2z) p2 = lerpAt(p2z, j, frac);
    }
    // Two stores rather than one `number | null` expression: the mixed value would be boxed first.
    if (n2 > 0) {
      fu[i] = z > 0 ? front / n1 : 0;
      ru[i] = z > 0 ? rear / n2 : 0;
    } else {
      fu[i] = null;
      ru[i] = null;
    }
    ff[i] = front / P;
    rf[i] = rear / P;
    fi[i] = (z * n1) / P;
    ri[i] = (z * n2) / P;
    fp[i] = p / PA_PER_BAR;
    rp[i] = p2 / PA_PER_BAR;
    pf[i] = pedalForce(pedal, p);
  }
  const c: Curves = {
    braking_rate: zs,
    front_utilisation: fu,
    rear_utilisation: ru,
    front_force_per_weight: ff,
    rear_force_per_weight: rf,
    ideal_front_per_weight: fi,
    ideal_rear_per_weight: ri,
    front_pressure_bar: fp,
    rear_pressure_bar: rp,
    pedal_force_n: pf,
    events,
  };
  return c;
}
