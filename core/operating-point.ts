/**
 * Everything at one braking rate: axle loads, ideal and installed forces, adhesion utilisation,
 * line pressures and pedal force (the rows of the result's `at` list).
 */
import { frontAxleLoad, rearAxleLoad } from './axle-loads.ts';
import { PA_PER_BAR } from './constants.ts';
import { forcesAt } from './distribution.ts';
import { pedalForce } from './pedal-force.ts';
import type { StateModel } from './state-model.ts';

export interface OperatingPoint {
  braking_rate: number;
  front_axle_load_n: number;
  rear_axle_load_n: number;
  ideal_front_force_n: number;
  ideal_rear_force_n: number;
  front_force_n: number;
  rear_force_n: number;
  /** Null beyond rear-axle lift-off. */
  front_utilisation: number | null;
  rear_utilisation: number | null;
  front_pressure_bar: number;
  rear_pressure_bar: number;
  pedal_force_n: number;
}

export function operatingPoint(s: StateModel, z: number): OperatingPoint {
  const n1 = frontAxleLoad(s.loads, z);
  const n2 = rearAxleLoad(s.loads, z);
  const f = forcesAt(s.dist, z);
  const lifted = !(n2 > 0);
  return {
    braking_rate: z,
    front_axle_load_n: n1,
    rear_axle_load_n: n2,
    ideal_front_force_n: z * n1,
    ideal_rear_force_n: z * n2,
    front_force_n: f.front,
    rear_force_n: f.rear,
    front_utilisation: lifted ? null : f.front / n1,
    rear_utilisation: lifted ? null : f.rear / n2,
    front_pressure_bar: f.p / PA_PER_BAR,
    rear_pressure_bar: f.p2 / PA_PER_BAR,
    pedal_force_n: pedalForce(s.pedal, f.p),
  };
}
