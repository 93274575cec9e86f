/**
 * Fluid volume, master-cylinder stroke and pedal travel (issue 9, part 1). SI inside (m, m², m³, Pa).
 *
 * Volume an axle takes at line pressure p > 0 (both wheels together):
 *   V(p) = V_clear + C p,
 *   V_clear = disc: 2 · Σ(piston areas of one caliper) · (running clearance + knock-back)
 *             drum: 2 wheels · 2 wheel-cylinder pistons · A_wc · shoe travel,
 *   C = expansion of hoses, pipes and caliper/drum per pascal + fluid volume / bulk modulus.
 * The clearances are taken up first, at (nearly) zero pressure; above that the volume grows linearly.
 * Front/rear split: one circuit per axle (the rear part at the rear line pressure behind the valve);
 * diagonal split: each circuit feeds one front and one rear wheel, so half of each axle.
 *
 * Tandem master cylinder, bore area A, primary (pushrod-side) and secondary (floating) piston with
 * usable strokes S_p, S_s and dead travel d (compensating port) per piston:
 *   both circuits working: pushrod travel x = (d + V_p / A) + (d + V_s / A);
 *   primary circuit lost:  the primary piston runs through its empty chamber and pushes the secondary
 *                          directly: x = S_p + d + V_s / A;
 *   secondary circuit lost: the secondary piston is pushed to the end of its bore before the primary
 *                          chamber can hold pressure: x = S_s + d + V_p / A.
 * Balance bar (two single master cylinders, front bore A_f and rear bore A_r, the bar sending the share s of the
 * pushrod force to the front): each cylinder moves x_i = d + V_i / A_i, and the bar's pivot, which the pushrod
 * drives, moves x = s · x_f + (1 − s) · x_r (the pivot divides the bar in the ratio of the force shares). With a
 * circuit lost its cylinder runs to the end of its stroke and the bar swivels: x_i = S_i. The front cylinder's
 * stroke is `primary_stroke_mm`, the rear one's `secondary_stroke_mm`. The rear line pressure is λ times the
 * front-referred one (core/state-model.ts), so the rear axle's volume is taken at the real rear pressure.
 * Pedal travel = x · pedal ratio (the booster passes travel through unchanged). A piston that would
 * need more than its stroke "bottoms": the pedal reaches the stop before that pressure.
 * Defaults (HARDWARE_DEFAULTS) are common practice recalled from memory and are listed in the result
 * whenever they are used, never applied silently.
 */
import { pistonArea } from './brake-gain.ts';
import { categoryFigures } from './category-figures.ts';
import { G_N, PA_PER_BAR } from './constants.ts';
import type { Brake, DesignFile } from './design.ts';
import { forcesAt } from './distribution.ts';
import type { AxleHardware, Hardware } from './hardware-schema.ts';
import { pedalForce } from './pedal-force.ts';
import { axleBrakeForce } from './brake-force.ts';
import { masterPressureForRear, rearPressure } from './valves/index.ts';
import type { StateModel } from './state-model.ts';
import type { Warning } from './validate.ts';

/** Defaults, each "common practice, no source; value from memory". Units as in the key names. */
export const HARDWARE_DEFAULTS = {
  running_clearance_mm: 0.15,
  knock_back_mm: 0.05,
  shoe_travel_mm: 0.5,
  expansion_per_bar_mm3: 15,
  fluid_volume_mm3: 50_000,
  fluid_bulk_modulus_bar: 15_000,
  primary_stroke_mm: 16,
  secondary_stroke_mm: 16,
  dead_travel_mm: 1.5,
  primary_feeds: 'front' as 'front' | 'rear',
  pedal_travel_available_mm: 140,
  pedal_travel_warn_pct: 60,
} as const;

export const HARDWARE_DEFAULTS_NOTE = 'default: common practice, no source (value from memory); measure or take from the maker';

/** Highest master pressure searched when a failed circuit has to reach a braking rate, Pa. */
const P_SEARCH_MAX = 1000 * PA_PER_BAR;

/** Fluid model of one axle: clearance volume (m³) and compliance (m³/Pa). */
export interface AxleFluid {
  clearance: number;
  compliance: number;
}

export function axleFluid(brake: Brake, hw: AxleHardware | undefined, bulkModulusPa: number): AxleFluid {
  const d = HARDWARE_DEFAULTS;
  let clearance: number;
  if (brake.type === 'disc') {
    const areas = brake.piston_diameters_mm.reduce((s, mm) => s + pistonArea(mm * 1e-3), 0);
    const travel = ((hw?.running_clearance_mm ?? d.running_clearance_mm) + (hw?.knock_back_mm ?? d.knock_back_mm)) * 1e-3;
    clearance = 2 * areas * travel;
  } else {
    const travel = (hw?.shoe_travel_mm ?? d.shoe_travel_mm) * 1e-3;
    clearance = 2 * 2 * pistonArea(brake.wheel_cylinder_diameter_mm * 1e-3) * travel;
  }
  const expansion = ((hw?.expansion_per_bar_mm3 ?? d.expansion_per_bar_mm3) * 1e-9) / PA_PER_BAR;
  const fluid = (hw?.fluid_volume_mm3 ?? d.fluid_volume_mm3) * 1e-9;
  return { clearance, compliance: expansion + fluid / bulkModulusPa };
}

/** Volume an axle takes at line pressure p (Pa), m³. */
export function axleVolume(f: AxleFluid, p: number): number {
  return p > 0 ? f.clearance + f.compliance * p : 0;
}

export interface HydraulicCircuit {
  id: string;
  /** Share of the front and of the rear axle this circuit feeds (1, 0.5 or 0). */
  front: number;
  rear: number;
  /** Which master-cylinder chamber feeds it. */
  chamber: 'primary' | 'secondary';
}

export function circuitsOf(design: DesignFile): HydraulicCircuit[] {
  // With a balance bar the front cylinder is "primary" and the rear one "secondary" (the schema refuses a
  // diagonal split with a bar).
  if (design.hydraulics.balance_bar) {
    return [
      { id: 'front', front: 1, rear: 0, chamber: 'primary' },
      { id: 'rear', front: 0, rear: 1, chamber: 'secondary' },
    ];
  }
  if (design.hydraulics.circuit_split === 'diagonal') {
    return [
      { id: 'diagonal_1', front: 0.5, rear: 0.5, chamber: 'primary' },
      { id: 'diagonal_2', front: 0.5, rear: 0.5, chamber: 'secondary' },
    ];
  }
  const primary = design.hardware?.master_cylinder?.primary_feeds ?? HARDWARE_DEFAULTS.primary_feeds;
  return [
    { id: 'front', front: 1, rear: 0, chamber: primary === 'front' ? 'primary' : 'secondary' },
    { id: 'rear', front: 0, rear: 1, chamber: primary === 'rear' ? 'primary' : 'secondary' },
  ];
}

/** Master cylinder in SI: bore area (m²), strokes and dead travel (m). */
export interface TandemMasterCylinder {
  area: number;
  primaryStroke: number;
  secondaryStroke: number;
  deadTravel: number;
}

export interface PushrodTravel {
  /** Pushrod (= master-cylinder primary piston) travel, m. */
  travel: number;
  /** A piston needs more than its stroke. */
  bottomed: boolean;
}

/** Two single master cylinders on a balance bar, SI: front and rear bore areas (m²), front force share s. */
export interface BalanceBarCylinders {
  frontArea: number;
  rearArea: number;
  frontShare: number;
}

/**
 * Pivot (pushrod) travel of a balance bar for the front and rear cylinders' volumes (m³), with one cylinder's
 * circuit lost or none; strokes and dead travel from `mc` (primary = front cylinder, secondary = rear).
 */
export function balanceBarTravel(
  mc: TandemMasterCylinder,
  bar: BalanceBarCylinders,
  vFront: number,
  vRear: number,
  lost: 'none' | 'primary' | 'secondary',
): PushrodTravel {
  const xf = lost === 'primary' ? mc.primaryStroke : mc.deadTravel + vFront / bar.frontArea;
  const xr = lost === 'secondary' ? mc.secondaryStroke : mc.deadTravel + vRear / bar.rearArea;
  const bottomed = (lost !== 'primary' && xf > mc.primaryStroke) || (lost !== 'secondary' && xr > mc.secondaryStroke);
  return { travel: bar.frontShare * xf + (1 - bar.frontShare) * xr, bottomed };
}

/** Pushrod travel for chamber volumes vPrimary, vSecondary (m³), with one chamber lost or none. */
export function pushrodTravel(
  mc: TandemMasterCylinder,
  vPrimary: number,
  vSecondary: number,
  lost: 'none' | 'primary' | 'secondary',
): PushrodTravel {
  const sp = mc.deadTravel + vPrimary / mc.area;
  const ss = mc.deadTravel + vSecondary / mc.area;
  if (lost === 'primary') return { travel: mc.primaryStroke + ss, bottomed: ss > mc.secondaryStroke };
  if (lost === 'secondary') return { travel: mc.secondaryStroke + sp, bottomed: sp > mc.primaryStroke };
  return { travel: sp + ss, bottomed: sp > mc.primaryStroke || ss > mc.secondaryStroke };
}

export interface TravelPoint {
  braking_rate: number;
  master_pressure_bar: number;
  rear_pressure_bar: number;
  /** Fluid each working circuit takes, mm³ (0 for a lost circuit). */
  circuit_volume_mm3: Record<string, number>;
  pushrod_travel_mm: number;
  pedal_travel_mm: number;
  /** Pedal travel as a share of the travel available, %. */
  share_of_available_pct: number;
  /** Travel available minus travel used, mm (negative: the pedal reaches the stop first). */
  margin_mm: number;
  /** A master-cylinder piston runs out of stroke before this pressure. */
  bottomed: boolean;
  pedal_force_n: number;
}

export interface TravelCase {
  /** "service", or "<circuit id>_circuit_failed". */
  case: string;
  failed_circuit: string | null;
  /** Deceleration the case is evaluated at, m/s², and what it is. */
  target_ms2: number;
  target: string;
  target_source: string;
  /** False when the working circuits cannot reach the target at any pressure up to 1000 bar. */
  reached: boolean;
  /** Pedal-force limit of the category for this case, N (the point's pedal_force_n is compared with it). */
  pedal_force_limit_n: number;
  point: TravelPoint | null;
}

export interface TravelSeries {
  case: string;
  braking_rate: number[];
  pedal_travel_mm: number[];
}

export interface PedalTravelState {
  load_state: string;
  cases: TravelCase[];
  series: TravelSeries[];
}

export interface PedalTravelResult {
  pedal_travel_available_mm: number;
  warn_pct: number;
  /** Pushrod travel with every piston at its stop, mm (tandem: both strokes; balance bar: s·S_front + (1 − s)·S_rear). */
  master_cylinder_total_stroke_mm: number;
  circuits: string[];
  /** Keys whose default was used (see HARDWARE_DEFAULTS). */
  defaults_used: string[];
  defaults_note: string;
  states: PedalTravelState[];
  warnings: Warning[];
  method: string;
}

export const PEDAL_TRAVEL_METHOD =
  'Volume per axle = clearance volume + (hose/caliper expansion + fluid volume / bulk modulus) × pressure; ' +
  'tandem master cylinder: pushrod travel = sum of both pistons (dead travel + volume / bore area); with a circuit lost ' +
  'the stroke of its chamber is used up before the other builds pressure; balance bar: pivot travel = s × front cylinder ' +
  'travel + (1 − s) × rear cylinder travel, a lost circuit\'s cylinder running to its stop; pedal travel = pushrod travel × pedal ratio.';

/** Braking rate the working circuits give at master pressure p, and the rear line pressure. */
function rateWithCircuits(s: StateModel, front: number, rear: number, p: number): number {
  const t1 = front * axleBrakeForce(s.G1, p, s.threshold1);
  const t2 = rear * axleBrakeForce(s.G2, rearPressure(s.valve, p), s.threshold2);
  return (t1 + t2) / s.loads.P;
}

/** Master pressures where the working circuits' braking rate has a kink (thresholds, valve knee), ascending, ending at P_SEARCH_MAX. */
function rateKinks(s: StateModel): number[] {
  const kinks = [s.threshold1, masterPressureForRear(s.valve, s.threshold2), s.valve.knee].filter((p) => p > 0 && p < P_SEARCH_MAX);
  kinks.sort((x, y) => x - y);
  kinks.push(P_SEARCH_MAX);
  return kinks;
}

function pressureOnKinks(s: StateModel, front: number, rear: number, z: number, kinks: readonly number[]): number | null {
  if (!(z > 0)) return 0;
  if (rateWithCircuits(s, front, rear, P_SEARCH_MAX) < z) return null;
  let p0 = 0;
  let r0 = rateWithCircuits(s, front, rear, 0);
  for (const p1 of kinks) {
    const r1 = rateWithCircuits(s, front, rear, p1);
    if (r1 >= z) return p0 + ((z - r0) * (p1 - p0)) / (r1 - r0);
    p0 = p1;
    r0 = r1;
  }
  return P_SEARCH_MAX; // not reached: the rate at P_SEARCH_MAX is at least z
}

/**
 * Smallest master pressure at which the working circuits reach braking rate z, or null when they do not
 * by 1000 bar. The rate is piecewise linear and non-decreasing in p, with kinks only at the thresholds
 * and the valve knee, so it is inverted exactly on the piece where it reaches z.
 */
export function pressureForRate(s: StateModel, front: number, rear: number, z: number): number | null {
  return pressureOnKinks(s, front, rear, z, rateKinks(s));
}

interface Resolved {
  mc: TandemMasterCylinder;
  bar: BalanceBarCylinders | null;
  front: AxleFluid;
  rear: AxleFluid;
  available: number;
  warnPct: number;
  defaults: string[];
}

function resolve(design: DesignFile): Resolved {
  const hw: Hardware | undefined = design.hardware;
  const d = HARDWARE_DEFAULTS;
  const defaults: string[] = [];
  const pick = <T>(path: string, v: T | undefined, dflt: T): T => {
    if (v === undefined) {
      defaults.push(path);
      return dflt;
    }
    return v;
  };
  const bulk = pick('hardware.fluid_bulk_modulus_bar', hw?.fluid_bulk_modulus_bar, d.fluid_bulk_modulus_bar) * PA_PER_BAR;
  // Only record here which defaults axleFluid will apply to each axle (it reads the same keys).
  for (const axle of ['front', 'rear'] as const) {
    const b = design.axles[axle].brake;
    const h = hw?.[axle];
    if (b.type === 'disc') {
      pick(`hardware.${axle}.running_clearance_mm`, h?.running_clearance_mm, 0);
      pick(`hardware.${axle}.knock_back_mm`, h?.knock_back_mm, 0);
    } else pick(`hardware.${axle}.shoe_travel_mm`, h?.shoe_travel_mm, 0);
    pick(`hardware.${axle}.expansion_per_bar_mm3`, h?.expansion_per_bar_mm3, 0);
    pick(`hardware.${axle}.fluid_volume_mm3`, h?.fluid_volume_mm3, 0);
  }
  const mcIn = hw?.master_cylinder;
  const mc: TandemMasterCylinder = {
    area: pistonArea(design.hydraulics.master_cylinder_bore_mm * 1e-3),
    primaryStroke: pick('hardware.master_cylinder.primary_stroke_mm', mcIn?.primary_stroke_mm, d.primary_stroke_mm) * 1e-3,
    secondaryStroke: pick('hardware.master_cylinder.secondary_stroke_mm', mcIn?.secondary_stroke_mm, d.secondary_stroke_mm) * 1e-3,
    deadTravel: pick('hardware.master_cylinder.dead_travel_mm', mcIn?.dead_travel_mm, d.dead_travel_mm) * 1e-3,
  };
  const barIn = design.hydraulics.balance_bar;
  if (design.hydraulics.circuit_split === 'front_rear' && !barIn) pick('hardware.master_cylinder.primary_feeds', mcIn?.primary_feeds, d.primary_feeds);
  return {
    mc,
    bar: barIn ? { frontArea: mc.area, rearArea: pistonArea(barIn.rear_bore_mm * 1e-3), frontShare: barIn.setting_front_share } : null,
    front: axleFluid(design.axles.front.brake, hw?.front, bulk),
    rear: axleFluid(design.axles.rear.brake, hw?.rear, bulk),
    available: pick('hardware.pedal_travel_available_mm', hw?.pedal_travel_available_mm, d.pedal_travel_available_mm) * 1e-3,
    warnPct: pick('hardware.pedal_travel_warn_pct', hw?.pedal_travel_warn_pct, d.pedal_travel_warn_pct),
    defaults,
  };
}

/** Keys given for a brake type that does not use them: reported, not silently dropped. */
function ignoredKeys(design: DesignFile): Warning[] {
  const w: Warning[] = [];
  if (design.hydraulics.balance_bar && design.hardware?.master_cylinder?.primary_feeds !== undefined) {
    w.push({
      code: 'WARN_HARDWARE_KEY_UNUSED',
      path: 'hardware.master_cylinder.primary_feeds',
      message: 'primary_feeds is given but the design has a balance bar, whose front cylinder feeds the front axle and rear cylinder the rear; the value is ignored',
    });
  }
  for (const axle of ['front', 'rear'] as const) {
    const h = design.hardware?.[axle];
    if (!h) continue;
    const type = design.axles[axle].brake.type;
    const unused = type === 'disc' ? (['shoe_travel_mm'] as const) : (['running_clearance_mm', 'knock_back_mm'] as const);
    for (const k of unused) {
      if (h[k] !== undefined) {
        w.push({
          code: 'WARN_HARDWARE_KEY_UNUSED',
          path: `hardware.${axle}.${k}`,
          message: `${k} is given but the ${axle} brake is a ${type} brake, which does not use it; the value is ignored`,
        });
      }
    }
  }
  return w;
}

/** Pushrod travel and rear line pressure at master pressure p with one circuit lost or none; circuit volumes into `vol` when given. */
function pushrodAt(
  r: Resolved,
  circuits: readonly HydraulicCircuit[],
  s: StateModel,
  p: number,
  lostCircuit: HydraulicCircuit | null,
  vol?: Record<string, number>,
): { p2: number; x: PushrodTravel } {
  // The rear line holds pressure only while a working circuit feeds a rear brake; real pressure (λ times the
  // front-referred one with a balance bar).
  const p2 = circuits.some((c) => c.rear > 0 && c !== lostCircuit) ? s.rearMasterRatio * rearPressure(s.valve, p) : 0;
  let vPrimary = 0;
  let vSecondary = 0;
  for (const c of circuits) {
    const v = c === lostCircuit ? 0 : c.front * axleVolume(r.front, p) + c.rear * axleVolume(r.rear, p2);
    if (vol) vol[c.id] = v * 1e9;
    if (c.chamber === 'primary') vPrimary += v;
    else vSecondary += v;
  }
  const lost = lostCircuit === null ? 'none' : lostCircuit.chamber;
  // At zero pressure the pedal is at rest; any pressure first needs the dead travel and clearances.
  const x =
    p <= 0 ? { travel: 0, bottomed: false } : r.bar ? balanceBarTravel(r.mc, r.bar, vPrimary, vSecondary, lost) : pushrodTravel(r.mc, vPrimary, vSecondary, lost);
  return { p2, x };
}

/** Travel at master pressure p with the given circuits working (`lostCircuit` one of `circuits`, or null). */
function travelAt(
  r: Resolved,
  design: DesignFile,
  circuits: readonly HydraulicCircuit[],
  s: StateModel,
  z: number,
  p: number,
  lostCircuit: HydraulicCircuit | null,
): TravelPoint {
  const vol: Record<string, number> = {};
  const { p2, x } = pushrodAt(r, circuits, s, p, lostCircuit, vol);
  const pedal = x.travel * design.hydraulics.pedal_ratio;
  return {
    braking_rate: z,
    master_pressure_bar: p / PA_PER_BAR,
    rear_pressure_bar: p2 / PA_PER_BAR,
    circuit_volume_mm3: vol,
    pushrod_travel_mm: x.travel * 1e3,
    pedal_travel_mm: pedal * 1e3,
    share_of_available_pct: (pedal / r.available) * 100,
    margin_mm: (r.available - pedal) * 1e3,
    bottomed: x.bottomed,
    pedal_force_n: pedalForce(s.pedal, p),
  };
}

/** travelAt(…).pedal_travel_mm alone, for the series. */
function pedalTravelMm(r: Resolved, design: DesignFile, circuits: readonly HydraulicCircuit[], s: StateModel, p: number, lostCircuit: HydraulicCircuit | null): number {
  return pushrodAt(r, circuits, s, p, lostCircuit).x.travel * design.hydraulics.pedal_ratio * 1e3;
}

const SERIES_STEP = 0.02;

export function pedalTravel(design: DesignFile, models: StateModel[]): PedalTravelResult {
  const r = resolve(design);
  const fig = categoryFigures(design.vehicle.category);
  const circuits = circuitsOf(design);
  const warnings = ignoredKeys(design);
  const zService = fig.service_test_ms2 / G_N;
  const zSecondary = fig.secondary_ms2 / G_N;
  const states: PedalTravelState[] = models.map((s) => {
    const id = s.state.id;
    const cases: TravelCase[] = [];
    const series: TravelSeries[] = [];
    const zTop = Math.min(1, s.loads.zLift);
    const kinks = rateKinks(s);
    // Service: both circuits, pressure from the installed distribution.
    const pService = forcesAt(s.dist, zService).p;
    const service = travelAt(r, design, circuits, s, zService, pService, null);
    cases.push({
      case: 'service',
      failed_circuit: null,
      target_ms2: fig.service_test_ms2,
      target: 'service brake test deceleration (Type-0)',
      target_source: fig.serviceSource,
      reached: true,
      pedal_force_limit_n: fig.service_foot_force_n,
      point: service,
    });
    const sv: TravelSeries = { case: 'service', braking_rate: [], pedal_travel_mm: [] };
    for (let i = 0; i * SERIES_STEP <= zTop + 1e-9; i++) {
      const z = Math.min(i * SERIES_STEP, zTop);
      sv.braking_rate.push(z);
      sv.pedal_travel_mm.push(pedalTravelMm(r, design, circuits, s, forcesAt(s.dist, z).p, null));
    }
    series.push(sv);
    if (service.share_of_available_pct > r.warnPct) {
      warnings.push({
        code: 'WARN_PEDAL_TRAVEL_SHARE',
        path: 'hardware.pedal_travel_available_mm',
        message:
          `load state "${id}": the service test deceleration (${fig.service_test_ms2} m/s²) takes ${service.pedal_travel_mm.toFixed(0)} mm ` +
          `of pedal travel, ${service.share_of_available_pct.toFixed(0)} % of the ${(r.available * 1e3).toFixed(0)} mm available ` +
          `(warning above ${r.warnPct} %); check master-cylinder displacement against the calipers`,
      });
    }
    if (service.bottomed || service.margin_mm < 0) {
      warnings.push({
        code: 'WARN_PEDAL_TRAVEL_EXHAUSTED',
        path: 'hydraulics.master_cylinder_bore_mm',
        message: `load state "${id}": the pedal ${service.bottomed ? 'runs out of master-cylinder stroke' : 'reaches its stop'} before the service test deceleration`,
      });
    }
    // One circuit failed: the others must reach the secondary-braking deceleration.
    for (const lost of circuits) {
      const front = circuits.filter((c) => c !== lost).reduce((a, c) => a + c.front, 0);
      const rear = circuits.filter((c) => c !== lost).reduce((a, c) => a + c.rear, 0);
      const name = `${lost.id}_circuit_failed`;
      const p = pressureOnKinks(s, front, rear, zSecondary, kinks);
      const point = p === null ? null : travelAt(r, design, circuits, s, zSecondary, p, lost);
      cases.push({
        case: name,
        failed_circuit: lost.id,
        target_ms2: fig.secondary_ms2,
        target: 'secondary braking deceleration',
        target_source: fig.secondarySource,
        reached: p !== null,
        pedal_force_limit_n: fig.secondary_foot_force_n,
        point,
      });
      const fs: TravelSeries = { case: name, braking_rate: [], pedal_travel_mm: [] };
      for (let i = 0; i * SERIES_STEP <= zTop + 1e-9; i++) {
        const z = Math.min(i * SERIES_STEP, zTop);
        const pz = pressureOnKinks(s, front, rear, z, kinks);
        if (pz === null) break;
        fs.braking_rate.push(z);
        fs.pedal_travel_mm.push(pedalTravelMm(r, design, circuits, s, pz, lost));
      }
      series.push(fs);
      if (point === null) {
        warnings.push({
          code: 'WARN_FAILED_CIRCUIT_TARGET_UNREACHED',
          path: 'hydraulics.circuit_split',
          message: `load state "${id}": with the ${lost.id} circuit failed the remaining brakes cannot reach ${fig.secondary_ms2} m/s² at any pressure`,
        });
      } else if (point.bottomed || point.margin_mm < 0) {
        warnings.push({
          code: 'WARN_PEDAL_TRAVEL_EXHAUSTED',
          path: 'hardware.pedal_travel_available_mm',
          message:
            `load state "${id}": with the ${lost.id} circuit failed the pedal ` +
            `${point.bottomed ? 'runs out of master-cylinder stroke' : `needs ${point.pedal_travel_mm.toFixed(0)} mm, more than the ${(r.available * 1e3).toFixed(0)} mm available,`} ` +
            `before ${fig.secondary_ms2} m/s²`,
        });
      }
    }
    return { load_state: id, cases, series };
  });
  return {
    pedal_travel_available_mm: r.available * 1e3,
    warn_pct: r.warnPct,
    master_cylinder_total_stroke_mm:
      (r.bar ? r.bar.frontShare * r.mc.primaryStroke + (1 - r.bar.frontShare) * r.mc.secondaryStroke : r.mc.primaryStroke + r.mc.secondaryStroke) * 1e3,
    circuits: circuits.map((c) => c.id),
    defaults_used: r.defaults,
    defaults_note: HARDWARE_DEFAULTS_NOTE,
    states,
    warnings,
    method: PEDAL_TRAVEL_METHOD,
  };
}
