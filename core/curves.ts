/**
 * Series for plotting, per load state: on a braking-rate grid 0…1 (step CURVE_STEP) merged with the
 * exact event points (distribution breakpoints such as thresholds and the valve knee, the crossings
 * of the ideal, rear lift-off): f1, f2 and the installed and ideal axle forces divided by the weight.
 */
import { frontAxleLoad, rearAxleLoad } from './axle-loads.ts';
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
  const out: number[] = [];
  let i = 0;
  let k = 0;
  while (i < a.length || k < b.length) {
    const v = k >= b.length || (i < a.length && a[i]! <= b[k]!) ? a[i++]! : b[k++]!;
    if (out.length === 0 || out[out.length - 1] !== v) out.push(v);
  }
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
  const c: Curves = {
    braking_rate: zs,
    front_utilisation: new Array<number | null>(n),
    rear_utilisation: new Array<number | null>(n),
    front_force_per_weight: new Array<number>(n),
    rear_force_per_weight: new Array<number>(n),
    ideal_front_per_weight: new Array<number>(n),
    ideal_rear_per_weight: new Array<number>(n),
    front_pressure_bar: new Array<number>(n),
    rear_pressure_bar: new Array<number>(n),
    pedal_force_n: new Array<number>(n),
    events,
  };
  const P = s.loads.P;
  // The breakpoints are walked once along the ascending grid; the segment choice and the arithmetic
  // are those of forcesAt (see forcesAlong), so every value equals forcesAt(s.dist, z).
  const d = s.dist;
  const bz = d.z;
  const last = bz.length - 2;
  let j = 0;
  for (let i = 0; i < n; i++) {
    const z = zs[i]!;
    const n1 = frontAxleLoad(s.loads, z);
    const n2 = rearAxleLoad(s.loads, z);
    let front = 0;
    let rear = 0;
    let p = d.p ? 0 : NaN;
    let p2 = d.p2 ? 0 : NaN;
    if (z > 0) {
      while (j < last && bz[j + 1]! <= z) j++;
      const frac = (z - bz[j]!) / (bz[j + 1]! - bz[j]!);
      front = lerpAt(d.t1, j, frac);
      rear = lerpAt(d.t2, j, frac);
      if (d.p) p = lerpAt(d.p, j, frac);
      if (d.p2) p2 = lerpAt(d.p2, j, frac);
    }
    const up = n2 > 0 && z > 0;
    c.front_utilisation[i] = n2 > 0 ? (z > 0 ? front / n1 : 0) : null;
    c.rear_utilisation[i] = up ? rear / n2 : n2 > 0 ? 0 : null;
    c.front_force_per_weight[i] = front / P;
    c.rear_force_per_weight[i] = rear / P;
    c.ideal_front_per_weight[i] = (z * n1) / P;
    c.ideal_rear_per_weight[i] = (z * n2) / P;
    c.front_pressure_bar[i] = p / PA_PER_BAR;
    c.rear_pressure_bar[i] = p2 / PA_PER_BAR;
    c.pedal_force_n[i] = pedalForce(s.pedal, p);
  }
  return c;
}
