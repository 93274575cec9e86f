/**
 * Brake heat, estimates only (design-file block `heat`, docs/design-file.md).
 *
 * - Energy of a stop from v1 to v2: E = ½ m (v1² − v2²)(1 + rotating_energy_share); the share for the
 *   rotating parts is 0 unless set (U. C. Jindal, Machine Design, Example 23-5, p. 621, uses 0.10).
 * - Split per axle by the installed distribution at the stop's braking rate: E_i = E · T_i / (T1 + T2);
 *   each axle has two brakes sharing equally. Regeneration is not credited (a full battery or a fault).
 * - Temperature rise of one disc or drum, no cooling during the stop: ΔT = share · E_brake / (m_rotor c),
 *   c = 460 J/(kg K) for grey cast iron by default (Jindal, Example 23-5), share of the
 *   heat going into the rotor 0.9 by default (an assumption, from memory: pads, calipers and hubs take
 *   the rest).
 * - Repeated stops like the Type-I (fade) test, 71/320/EEC Annex II 1.3 (version of
 *   1 January 2007 on legislation.gov.uk): laden; v1 = 80 % of the maximum speed capped at 120 km/h (M1, N1), 100 (M2), 60 (M3, N2, N3);
 *   v2 = v1/2; cycle Δt = 45 s (M1), 55 s (M2, N1), 60 s (others); 15 cycles (M1, M2, N1) or 20; each
 *   braking at 3 m/s². Lumped cooling: dT/dt = q(t)/(m c) − b (T − T_ambient), with b the user's
 *   cooling coefficient (default 0.004 1/s, a rough value from memory; measure one from a cool-down:
 *   b = ln(ΔT_start / ΔT_end) / elapsed time).
 */
import { G_N } from './constants.ts';
import type { DesignFile, HeatOptions, LoadState, Vehicle } from './design.ts';
import { type Distribution, forcesAt } from './distribution.ts';
import { installedDistribution } from './installed-distribution.ts';
import { valveLaw } from './valves/index.ts';
import type { StateModel } from './state-model.ts';

export const HEAT_DEFAULTS = {
  /** Grey cast iron, J/(kg K): U. C. Jindal, Machine Design, Example 23-5. */
  specific_heat_j_per_kg_k: 460,
  /** Assumption, from memory. */
  heat_to_rotor_share: 0.9,
  /** 1/s, rough, from memory. */
  cooling_coefficient_per_s: 0.004,
  ambient_c: 20,
  rotating_energy_share: 0,
} as const;

/** Type-I (fade) test parameters per category, 71/320/EEC Annex II 1.3 (version of 1 January 2007). */
export function typeIParameters(category: Vehicle['category']): { vCapKmh: number; intervalS: number; cycles: number } {
  const vCapKmh = category === 'M1' || category === 'N1' ? 120 : category === 'M2' ? 100 : 60;
  const intervalS = category === 'M1' ? 45 : category === 'M2' || category === 'N1' ? 55 : 60;
  const cycles = category === 'M1' || category === 'M2' || category === 'N1' ? 15 : 20;
  return { vCapKmh, intervalS, cycles };
}

/** Type-I start speed v1, km/h: 80 % of the maximum speed, not above the category cap (the cap when no maximum is given). */
export function typeIStartSpeedKmh(category: Vehicle['category'], maxSpeedKmh: number | undefined): number {
  const cap = typeIParameters(category).vCapKmh;
  return maxSpeedKmh !== undefined ? Math.min(0.8 * maxSpeedKmh, cap) : cap;
}

/** Type-I braking deceleration, m/s² (control force set for 3 m/s² at the first application). */
export const TYPE_I_DECELERATION = 3;

/**
 * Single-stop defaults: the Type-0 (engine disconnected) test speed and mean fully developed
 * deceleration per category, 71/320/EEC Annex II 2.1.1 (the same values are tabulated in Directive
 * 70/311/EEC Annex II; verify against the current official text): M1 80 km/h, 5.8 m/s²; N1 80 km/h,
 * 5.0 m/s²; M2, M3, N2, N3 60 km/h, 5.0 m/s².
 */
export function singleStopDefaults(category: Vehicle['category']): { speedKmh: number; decelerationMs2: number } {
  const speedKmh = category === 'M1' || category === 'N1' ? 80 : 60;
  return { speedKmh, decelerationMs2: category === 'M1' ? 5.8 : 5.0 };
}

/** Kinetic energy released braking from v1 to v2 (m/s), J. */
export function stopEnergy(massKg: number, v1: number, v2: number, rotatingShare = 0): number {
  return 0.5 * massKg * (v1 * v1 - v2 * v2) * (1 + rotatingShare);
}

/** Front share of the braking force at braking rate z (0.5 where neither axle brakes). */
export function frontEnergyShare(d: Distribution, z: number): number {
  const f = forcesAt(d, z);
  const t = f.front + f.rear;
  return t > 0 ? f.front / t : 0.5;
}

/** Temperature rise of one rotor taking `share` of energy E (J), K. */
export function rotorTemperatureRise(energyJ: number, rotorKg: number, specificHeat: number, share: number): number {
  return (share * energyJ) / (rotorKg * specificHeat);
}

export interface HeatSetup {
  c: number;
  share: number;
  b: number;
  ambient: number;
  rotating: number;
  frontRotorKg: number;
  rearRotorKg: number;
}

export function heatSetup(h: HeatOptions): HeatSetup {
  return {
    c: h.specific_heat_j_per_kg_k ?? HEAT_DEFAULTS.specific_heat_j_per_kg_k,
    share: h.heat_to_rotor_share ?? HEAT_DEFAULTS.heat_to_rotor_share,
    b: h.cooling_coefficient_per_s ?? HEAT_DEFAULTS.cooling_coefficient_per_s,
    ambient: h.ambient_c ?? HEAT_DEFAULTS.ambient_c,
    rotating: h.rotating_energy_share ?? HEAT_DEFAULTS.rotating_energy_share,
    frontRotorKg: h.front_rotor_kg,
    rearRotorKg: h.rear_rotor_kg,
  };
}

export interface StopHeatRow {
  case: string;
  mass_kg: number;
  energy_j: number;
  front_share: number;
  front_energy_j: number;
  rear_energy_j: number;
  /** Per brake (two brakes per axle). */
  front_brake_energy_j: number;
  rear_brake_energy_j: number;
  front_rotor_rise_k: number;
  rear_rotor_rise_k: number;
}

export function stopHeat(label: string, massKg: number, d: Distribution, v1: number, v2: number, z: number, s: HeatSetup): StopHeatRow {
  const E = stopEnergy(massKg, v1, v2, s.rotating);
  const phi = frontEnergyShare(d, z);
  const Ef = E * phi;
  const Er = E - Ef;
  return {
    case: label,
    mass_kg: massKg,
    energy_j: E,
    front_share: phi,
    front_energy_j: Ef,
    rear_energy_j: Er,
    front_brake_energy_j: Ef / 2,
    rear_brake_energy_j: Er / 2,
    front_rotor_rise_k: rotorTemperatureRise(Ef / 2, s.frontRotorKg, s.c, s.share),
    rear_rotor_rise_k: rotorTemperatureRise(Er / 2, s.rearRotorKg, s.c, s.share),
  };
}

export interface FadeRun {
  case: string;
  mass_kg: number;
  front_share: number;
  /** Rotor temperature at the end of each braking (the peak of the cycle), °C. */
  front_peak_c: number[];
  rear_peak_c: number[];
  front_final_peak_c: number;
  rear_final_peak_c: number;
}

/**
 * One rotor through `cycles` brakings from v1 to v2 at deceleration a, one every `interval` seconds,
 * with lumped cooling. Heat into one rotor: share_rotor · share_axle/2 · m a v(t) (1 + rotating).
 * Integrated with the exact exponential decay over each small step and the input at its midpoint.
 */
export function rotorFadeRun(
  massKg: number,
  axleShare: number,
  rotorKg: number,
  v1: number,
  v2: number,
  a: number,
  interval: number,
  cycles: number,
  s: HeatSetup,
): number[] {
  const C = rotorKg * s.c;
  const tb = (v1 - v2) / a;
  const steps = 400;
  const dt = tb / steps;
  const decay = Math.exp(-s.b * dt);
  const halfDecay = Math.exp(-s.b * dt * 0.5);
  // Every braking is the same, and the steps are linear in the temperature: a braking starting at θ
  // ends at θ·decay^steps + rise, so the step loop runs once (rise and gain) rather than every cycle.
  let rise = 0;
  let gain = 1;
  for (let i = 0; i < steps; i++) {
    const v = v1 - a * (i + 0.5) * dt;
    const q = (s.share * axleShare * 0.5 * massKg * a * v * (1 + s.rotating)) / C; // K/s
    rise = rise * decay + q * dt * halfDecay;
    gain *= decay;
  }
  let theta = 0; // temperature above ambient, K
  const peaks: number[] = [];
  for (let n = 0; n < cycles; n++) {
    theta = theta * gain + rise;
    peaks.push(s.ambient + theta);
    theta *= Math.exp(-s.b * Math.max(0, interval - tb));
  }
  return peaks;
}

export function fadeRun(label: string, massKg: number, d: Distribution, v1: number, v2: number, interval: number, cycles: number, s: HeatSetup): FadeRun {
  const a = TYPE_I_DECELERATION;
  const phi = frontEnergyShare(d, a / G_N);
  const front = rotorFadeRun(massKg, phi, s.frontRotorKg, v1, v2, a, interval, cycles, s);
  const rear = rotorFadeRun(massKg, 1 - phi, s.rearRotorKg, v1, v2, a, interval, cycles, s);
  return {
    case: label,
    mass_kg: massKg,
    front_share: phi,
    front_peak_c: front,
    rear_peak_c: rear,
    front_final_peak_c: front[front.length - 1]!,
    rear_final_peak_c: rear[rear.length - 1]!,
  };
}

export interface HeatResult {
  estimate: true;
  specific_heat_j_per_kg_k: number;
  heat_to_rotor_share: number;
  cooling_coefficient_per_s: number;
  ambient_c: number;
  rotating_energy_share: number;
  front_rotor_kg: number;
  rear_rotor_kg: number;
  single_stop: { speed_kmh: number; deceleration_ms2: number; rows: StopHeatRow[] };
  type_i: {
    load_state: string;
    v1_kmh: number;
    v2_kmh: number;
    interval_s: number;
    cycles: number;
    deceleration_ms2: number;
    vehicle: FadeRun;
    base_vehicle: FadeRun | null;
  };
  notes: string[];
}

/** Distribution of the same brakes on the base vehicle (own mass and rear load for a load-sensing valve). */
function baseDistribution(design: DesignFile, ref: StateModel, massKg: number, frontKg: number): Distribution {
  return installedDistribution({
    P: massKg * G_N,
    G1: ref.G1,
    G2: ref.G2,
    threshold1: ref.threshold1,
    threshold2: ref.threshold2,
    valve: valveLaw(design.hydraulics.rear_valve, massKg - frontKg),
  });
}

/** The laden state for the Type-I run: the heaviest of kind "laden", else the heaviest of all. */
export function typeIState(models: readonly StateModel[]): StateModel {
  const laden = models.filter((m) => m.state.kind === 'laden');
  const pool = laden.length ? laden : models;
  return pool.reduce((a, b) => (b.state.mass_kg > a.state.mass_kg ? b : a));
}

export function heatAnalysis(design: DesignFile, models: readonly StateModel[]): HeatResult | null {
  const h = design.heat;
  if (!h || models.length === 0) return null;
  const s = heatSetup(h);
  const cat = design.vehicle.category;
  const stop = singleStopDefaults(cat);
  const stopKmh = h.stop_speed_kmh ?? stop.speedKmh;
  const zStop = stop.decelerationMs2 / G_N;
  const ref = typeIState(models);
  const st: LoadState = ref.state;
  let base: { mass: number; dist: Distribution } | null = null;
  if (h.base_vehicle_mass_kg !== undefined) {
    const mass = h.base_vehicle_mass_kg;
    const front = h.base_vehicle_front_axle_kg ?? mass * (st.front_axle_kg / st.mass_kg);
    base = { mass, dist: baseDistribution(design, ref, mass, front) };
  }
  const rows = models.map((m) => stopHeat(m.state.id, m.state.mass_kg, m.dist, stopKmh / 3.6, 0, zStop, s));
  if (base) rows.push(stopHeat('base_vehicle', base.mass, base.dist, stopKmh / 3.6, 0, zStop, s));
  const t = typeIParameters(cat);
  const v1Kmh = typeIStartSpeedKmh(cat, h.max_speed_kmh);
  const v1 = v1Kmh / 3.6;
  const v2 = v1 / 2;
  const notes = [
    'Estimates: lumped rotor temperature, uniform in the rotor; no fade of pad friction is modelled.',
    `Specific heat ${s.c} J/(kg K)${h.specific_heat_j_per_kg_k === undefined ? ' (grey cast iron, U. C. Jindal, Machine Design, Ex. 23-5)' : ' (user value)'}; ` +
      `${Math.round(s.share * 100)} % of the heat into the rotor${h.heat_to_rotor_share === undefined ? ' (assumption, from memory)' : ' (user value)'}; ` +
      `cooling coefficient ${s.b} 1/s${h.cooling_coefficient_per_s === undefined ? ' (rough default, from memory; measure yours)' : ' (user value)'}.`,
    'Regenerative braking is not credited: the friction brakes take the whole energy (full battery or a fault).',
    `Type-I sequence after 71/320/EEC Annex II 1.3: v1 = ${h.max_speed_kmh !== undefined ? '80 % of the maximum speed' : 'the category cap (vehicle maximum speed not given: 80 % of the maximum speed is assumed to reach it)'}, ` +
      `v2 = v1/2, braking at ${TYPE_I_DECELERATION} m/s².`,
  ];
  if (base && h.base_vehicle_front_axle_kg === undefined) {
    notes.push('Base vehicle front axle load not given: taken with the same front share as the Type-I load state.');
  }
  return {
    estimate: true,
    specific_heat_j_per_kg_k: s.c,
    heat_to_rotor_share: s.share,
    cooling_coefficient_per_s: s.b,
    ambient_c: s.ambient,
    rotating_energy_share: s.rotating,
    front_rotor_kg: s.frontRotorKg,
    rear_rotor_kg: s.rearRotorKg,
    single_stop: { speed_kmh: stopKmh, deceleration_ms2: stop.decelerationMs2, rows },
    type_i: {
      load_state: st.id,
      v1_kmh: v1Kmh,
      v2_kmh: v1Kmh / 2,
      interval_s: t.intervalS,
      cycles: t.cycles,
      deceleration_ms2: TYPE_I_DECELERATION,
      vehicle: fadeRun(st.id, st.mass_kg, ref.dist, v1, v2, t.intervalS, t.cycles, s),
      base_vehicle: base ? fadeRun('base_vehicle', base.mass, base.dist, v1, v2, t.intervalS, t.cycles, s) : null,
    },
    notes,
  };
}
