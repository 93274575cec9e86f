/**
 * Everything the engine needs for one load state of a design, in SI: axle loads, the installed
 * distribution and the pedal model. Other features (checks, sizing, limits) start from this.
 */
import { type AxleLoadModel, axleLoadModel } from './axle-loads.ts';
import { brakeGain } from './brake-gain.ts';
import { PA_PER_BAR } from './constants.ts';
import type { DesignFile, LoadState } from './design.ts';
import type { Distribution } from './distribution.ts';
import { type DynamicSensing, dynamicSensingDistribution, installedDistribution } from './installed-distribution.ts';
import { hydraulicPedalModel, type PedalModel } from './pedal-force.ts';
import { type ValveLaw, valveLaw } from './valves/index.ts';
import { balanceBarPressureRatio } from './sizing/sizing-schema.ts';

export interface StateModel {
  state: LoadState;
  loads: AxleLoadModel;
  /** Brake gains, N/Pa, and thresholds, Pa (with a balance bar the rear ones are referred to the front line pressure). */
  G1: number;
  G2: number;
  threshold1: number;
  threshold2: number;
  valve: ValveLaw;
  dist: Distribution;
  pedal: PedalModel;
  /**
   * Rear master pressure per front line pressure: λ of the balance bar, 1 without one. The real rear line
   * pressure is λ · rearPressure(valve, p) and a valve knee read from the design is referred as knee / λ.
   */
  rearMasterRatio: number;
  /**
   * A load-sensing valve that follows the rear axle load while braking (`senses` "dynamic", the default):
   * its knee as a function of z. `valve` then holds the knee at the static load (the vehicle at rest, as
   * on a roller tester). Undefined for every other valve.
   */
  sensing?: DynamicSensing;
}

/** The knee of a travel-sensing load-sensing valve as a function of z (core/installed-distribution.ts), or undefined. */
export function dynamicSensing(design: DesignFile, state: LoadState, lambda: number): DynamicSensing | undefined {
  const v = design.hydraulics.rear_valve;
  if (v.type !== 'load_sensing' || v.senses === 'static') return undefined;
  const m2 = state.mass_kg - state.front_axle_kg;
  const perZ = (state.mass_kg * state.cg_height_m) / design.vehicle.wheelbase_m; // kg of rear load moved per unit z
  const table = v.knee_bar_at_rear_axle_kg;
  const kinks = table.map(([kg]) => (m2 - kg) / perZ).filter((z) => z > 0).sort((a, b) => a - b);
  return { table, rearKg: m2, perZ, kneeScale: PA_PER_BAR / lambda, kinks, ratio: v.ratio };
}

export function stateModel(design: DesignFile, state: LoadState): StateModel {
  const loads = axleLoadModel(state.mass_kg, state.front_axle_kg, state.cg_height_m, design.vehicle.wheelbase_m);
  const G1 = brakeGain(design.axles.front.brake, design.axles.front.tyre_radius_m);
  const G2own = brakeGain(design.axles.rear.brake, design.axles.rear.tyre_radius_m);
  const threshold1 = design.axles.front.brake.threshold_pressure_bar * PA_PER_BAR;
  const threshold2own = design.axles.rear.brake.threshold_pressure_bar * PA_PER_BAR;
  // Rear static axle load in kg taken from the file directly (P2 / g would carry rounding error).
  const law = valveLaw(design.hydraulics.rear_valve, state.mass_kg - state.front_axle_kg);
  const h = design.hydraulics;
  // Balance bar (two master cylinders): the rear master pressure is λ·p, so the rear gain, threshold and
  // valve knee are referred to the front pressure p (G2·λ, threshold2/λ, knee/λ) and the rear line
  // pressures scaled back by λ; the pedal sees the front bore over the bar's front share.
  const bar = h.balance_bar;
  const lambda = bar ? balanceBarPressureRatio(h.master_cylinder_bore_mm, bar) : 1;
  const G2 = G2own * lambda;
  const threshold2 = threshold2own / lambda;
  const valve = bar ? { knee: law.knee / lambda, ratio: law.ratio } : law;
  const sensing = dynamicSensing(design, state, lambda);
  const axles = { P: loads.P, G1, G2, threshold1, threshold2 };
  // no object spread here: on Node 20 it costs more than building the distribution (bench/engine.ts)
  const dist = sensing ? dynamicSensingDistribution(axles, sensing) : installedDistribution({ P: loads.P, G1, G2, threshold1, threshold2, valve });
  if (bar) dist.p2 = dist.p2!.map((q) => q * lambda);
  const model: StateModel = {
    state,
    loads,
    G1,
    G2,
    threshold1,
    threshold2,
    valve,
    dist,
    pedal: hydraulicPedalModel(h),
    rearMasterRatio: lambda,
  };
  if (sensing) model.sensing = sensing;
  return model;
}
