/**
 * Everything the engine needs for one load state of a design, in SI: axle loads, the installed
 * distribution and the pedal model. Other features (checks, sizing, limits) start from this.
 */
import { type AxleLoadModel, axleLoadModel } from './axle-loads.ts';
import { brakeGain } from './brake-gain.ts';
import { G_N, PA_PER_BAR } from './constants.ts';
import type { DesignFile, LoadState } from './design.ts';
import type { Distribution } from './distribution.ts';
import { installedDistribution } from './installed-distribution.ts';
import { type PedalModel, pedalModel } from './pedal-force.ts';
import { type ValveLaw, valveLaw } from './rear-valve.ts';

export interface StateModel {
  state: LoadState;
  loads: AxleLoadModel;
  /** Brake gains, N/Pa, and thresholds, Pa. */
  G1: number;
  G2: number;
  threshold1: number;
  threshold2: number;
  valve: ValveLaw;
  dist: Distribution;
  pedal: PedalModel;
}

export function stateModel(design: DesignFile, state: LoadState): StateModel {
  const loads = axleLoadModel(state.mass_kg, state.front_axle_kg, state.cg_height_m, design.vehicle.wheelbase_m);
  const G1 = brakeGain(design.axles.front.brake, design.axles.front.tyre_radius_m);
  const G2 = brakeGain(design.axles.rear.brake, design.axles.rear.tyre_radius_m);
  const threshold1 = design.axles.front.brake.threshold_pressure_bar * PA_PER_BAR;
  const threshold2 = design.axles.rear.brake.threshold_pressure_bar * PA_PER_BAR;
  const valve = valveLaw(design.hydraulics.rear_valve, loads.P2 / G_N);
  const h = design.hydraulics;
  return {
    state,
    loads,
    G1,
    G2,
    threshold1,
    threshold2,
    valve,
    dist: installedDistribution({ P: loads.P, G1, G2, threshold1, threshold2, valve }),
    pedal: pedalModel(h.master_cylinder_bore_mm, h.pedal_ratio, h.booster_ratio, h.booster_runout_bar),
  };
}
