/**
 * Series for plotting, per load state: on a braking-rate grid 0…1 (step CURVE_STEP) merged with the
 * exact event points (distribution breakpoints such as thresholds and the valve knee, the crossings
 * of the ideal, rear lift-off): f1, f2 and the installed and ideal axle forces divided by the weight.
 */
import { frontAxleLoad, rearAxleLoad } from './axle-loads.ts';
import { CURVE_STEP, PA_PER_BAR } from './constants.ts';
import { forcesAt } from './distribution.ts';
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

export function curves(s: StateModel, crossingRates: number[], critical: number | null, zMax = 1): Curves {
  const events: CurveEvent[] = [];
  for (const zb of s.dist.z) if (zb > 0 && zb < zMax) events.push({ braking_rate: zb, kind: 'breakpoint' });
  for (const zc of crossingRates) {
    if (zc <= zMax) events.push({ braking_rate: zc, kind: zc === critical ? 'critical' : 'crossing' });
  }
  if (s.loads.zLift <= zMax) events.push({ braking_rate: s.loads.zLift, kind: 'lift_off' });
  const zs = [...new Set([...curveGrid(zMax), ...events.map((e) => e.braking_rate)])].sort((a, b) => a - b);
  const c: Curves = {
    braking_rate: zs,
    front_utilisation: [],
    rear_utilisation: [],
    front_force_per_weight: [],
    rear_force_per_weight: [],
    ideal_front_per_weight: [],
    ideal_rear_per_weight: [],
    front_pressure_bar: [],
    rear_pressure_bar: [],
    pedal_force_n: [],
    events: events.sort((a, b) => a.braking_rate - b.braking_rate),
  };
  const P = s.loads.P;
  for (const z of zs) {
    const n1 = frontAxleLoad(s.loads, z);
    const n2 = rearAxleLoad(s.loads, z);
    const f = forcesAt(s.dist, z);
    const up = n2 > 0 && z > 0;
    c.front_utilisation.push(n2 > 0 ? (z > 0 ? f.front / n1 : 0) : null);
    c.rear_utilisation.push(up ? f.rear / n2 : n2 > 0 ? 0 : null);
    c.front_force_per_weight.push(f.front / P);
    c.rear_force_per_weight.push(f.rear / P);
    c.ideal_front_per_weight.push((z * n1) / P);
    c.ideal_rear_per_weight.push((z * n2) / P);
    c.front_pressure_bar.push(f.p / PA_PER_BAR);
    c.rear_pressure_bar.push(f.p2 / PA_PER_BAR);
    c.pedal_force_n.push(pedalForce(s.pedal, f.p));
  }
  return c;
}
