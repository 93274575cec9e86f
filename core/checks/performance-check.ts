/**
 * Braking-performance checks computed from the hardware model of one load state.
 *
 * Deceleration rules (service, secondary, booster failure): the braking rate reached at the rule's
 * pedal-force limit, z_pedal, is read off the distribution at the master pressure that force gives;
 * it is capped by the first lock of the braked wheels on the test surface (test_adhesion), or, with
 * ABS working, by the surface adhesion itself. a = z·g is compared with the required deceleration:
 * the stated minimum and the one implied by the stopping-distance limit, s ≤ c·v + v²/(25.92·a)
 * (71/320/EEC Annex II 1.1.2 and UN R13 Annex 4 1.1.2, verified: v in km/h, a in m/s², the c·v term
 * is the text's allowance for reaction).
 *
 * Parking: on a gradient of q per cent, θ = atan(q/100); the holding force is m g sin θ; the normal
 * load on the braked axle with the load transfer on the slope is, facing uphill,
 * N_front = P (ψ cos θ − χ sin θ), N_rear = P ((1 − ψ) cos θ + χ sin θ), and the reverse facing
 * downhill (moments about the lower contact patch). The adhesion that axle needs is
 * m g sin θ / N_axle, compared with test_adhesion; the parking brake's capacity where the design
 * gives it. Without a parking_brake block nothing is assumed: the check is "not checked" (issue 12).
 */
import { G_N } from '../constants.ts';
import type { DesignFile } from '../design.ts';
import { firstLock } from '../lock-order.ts';
import { hydraulicPedalModel, pedalForce, pressureForPedalForce } from '../pedal-force.ts';
import type { DecelerationFigures, DecelerationRule, ParkingRule } from '../rules/rule-types.ts';
import type { StateModel } from '../state-model.ts';
import type { CheckScenario } from './check-result.ts';
import { brakingRateAtPressure, type CircuitCase, failedCircuitDistribution, lockAdhesionFor, pressureAtBrakingRate } from './circuit-failure.ts';

/** Test-surface adhesion when the design does not give test_adhesion (issue 4, common practice for a dry test surface). */
export const DEFAULT_TEST_ADHESION = 0.8;

/**
 * The test-surface adhesion a performance rule is judged on: the design's `test_adhesion` when given,
 * else the surface the rule's text names, else DEFAULT_TEST_ADHESION; with words saying which.
 */
export function testSurfaceFor(design: DesignFile, rule: DecelerationRule | ParkingRule): { k: number; source: 'design' | 'rule' | 'default'; words: string } {
  if (design.test_adhesion !== undefined) return { k: design.test_adhesion, source: 'design', words: 'the design\'s test-surface adhesion' };
  if (rule.test_surface) return { k: rule.test_surface.adhesion, source: 'rule', words: rule.test_surface.words };
  return { k: DEFAULT_TEST_ADHESION, source: 'default', words: 'dry test surface, common practice (the text names no figure)' };
}

/** Decelerations within this of the requirement count as met, m/s². */
export const DECELERATION_TOLERANCE = 1e-9;

/** Conversion in the stopping-distance formulas: s = v² / (25.92 · a), v in km/h (71/320/EEC Annex II 1.1.2). */
export const KMH2_PER_M_TO_MS2 = 25.92;

export interface RequiredDeceleration {
  /** The deceleration the figures ask for, m/s² (the higher of the stated minimum and the distance-implied one). */
  required_ms2: number;
  /** Distance limit at the test speed, m (the stricter of formula and fixed distance), or null. */
  distance_limit_m: number | null;
  /** Deceleration implied by the distance limit, m/s², or null. */
  distance_implied_ms2: number | null;
}

export function requiredDeceleration(f: DecelerationFigures): RequiredDeceleration {
  const v = f.speed_kmh;
  const limits: number[] = [];
  if (f.distance) limits.push(f.distance.v_coeff * v + f.distance.v2_coeff * v * v);
  if (f.max_distance_m !== undefined) limits.push(f.max_distance_m);
  const sMax = limits.length ? Math.min(...limits) : null;
  const reaction = (f.distance?.v_coeff ?? 0) * v;
  const implied = sMax !== null && sMax > reaction ? (v * v) / (KMH2_PER_M_TO_MS2 * (sMax - reaction)) : null;
  const req = Math.max(f.min_deceleration_ms2 ?? 0, implied ?? 0);
  return { required_ms2: req, distance_limit_m: sMax, distance_implied_ms2: implied };
}

export interface DecelerationOutcome {
  scenario: CheckScenario;
  passed: boolean;
  margin_ms2: number;
  note: string;
  details: Record<string, number | string | boolean | null>;
}

function scenarioOf(rule: DecelerationRule, which: CircuitCase | null): CheckScenario {
  if (which) return which;
  return rule.kind === 'booster_failure' ? 'no_booster_assist' : 'as_designed';
}

const LIMIT_WORDS = { pedal: 'the pedal-force limit', lock: 'the first wheel lock on the test surface', adhesion: 'the surface adhesion (ABS working)' };

/**
 * One deceleration rule on one load state: `which` names the failed circuit for secondary braking
 * (null for the intact system).
 */
export function checkDeceleration(design: DesignFile, s: StateModel, rule: DecelerationRule, which: CircuitCase | null): DecelerationOutcome {
  const f = rule.figures;
  const surface = testSurfaceFor(design, rule);
  const k = surface.k;
  const h = design.hydraulics;
  const dist = which ? failedCircuitDistribution(s, which) : s.dist;
  const pedal = rule.kind === 'booster_failure' ? hydraulicPedalModel(h, { assisted: false }) : s.pedal;
  const zPedal = brakingRateAtPressure(dist, pressureForPedalForce(pedal, f.max_pedal_force_n));
  const absWorking = design.vehicle.abs && which === null && rule.kind === 'service';
  const lock = firstLock(s.loads, dist, lockAdhesionFor(which ?? 'intact', k));
  const cap = absWorking ? k : lock.braking_rate;
  const limitedBy: keyof typeof LIMIT_WORDS = zPedal <= cap ? 'pedal' : absWorking ? 'adhesion' : 'lock';
  const z = Math.min(zPedal, cap);
  const a = z * G_N;
  const req = requiredDeceleration(f);
  const zReq = req.required_ms2 / G_N;
  const pReq = zReq <= cap ? pressureAtBrakingRate(dist, zReq) : NaN;
  const forceReq = Number.isFinite(pReq) ? pedalForce(pedal, pReq) : null;
  const v = f.speed_kmh;
  const distance = a > 0 ? (f.distance?.v_coeff ?? 0) * v + (v * v) / (KMH2_PER_M_TO_MS2 * a) : null;
  const margin = a - req.required_ms2;
  const passed = margin >= -DECELERATION_TOLERANCE;
  const notes = [`${a.toFixed(2)} m/s² reached at ${f.max_pedal_force_n} N, limited by ${LIMIT_WORDS[limitedBy]} (test surface adhesion ${k}: ${surface.words})`];
  if (forceReq === null) {
    const why = zReq > cap ? `before ${absWorking ? 'the adhesion limit' : 'a wheel locks'}` : 'with these brakes at any pedal force';
    notes.push(`the required ${req.required_ms2.toFixed(2)} m/s² is not reachable ${why}`);
  }
  else notes.push(`${forceReq.toFixed(0)} N needed for ${req.required_ms2.toFixed(2)} m/s²`);
  if (forceReq !== null && f.min_pedal_force_n !== undefined && forceReq < f.min_pedal_force_n) {
    notes.push(`that is below the ${f.min_pedal_force_n} N lower end of the test pedal-force range`);
  }
  if (which === 'one_diagonal') notes.push('one front and the opposite rear wheel braked; yaw from one-sided braking not modelled');
  return {
    scenario: scenarioOf(rule, which),
    passed,
    margin_ms2: margin,
    note: notes.join('; '),
    details: {
      test_speed_kmh: v,
      test_adhesion: k,
      test_adhesion_source: surface.source,
      pedal_force_limit_n: f.max_pedal_force_n,
      braking_rate_at_pedal_limit: zPedal,
      first_lock_braking_rate: lock.first_axle === 'none' ? null : lock.braking_rate,
      first_lock_axle: lock.first_axle,
      limited_by: limitedBy,
      deceleration_ms2: a,
      required_deceleration_ms2: req.required_ms2,
      minimum_deceleration_ms2: f.min_deceleration_ms2 ?? null,
      pedal_force_for_required_n: forceReq,
      stopping_distance_m: distance,
      stopping_distance_limit_m: req.distance_limit_m,
    },
  };
}

export interface ParkingOutcome {
  scenario: CheckScenario;
  /** Null: not checked, an input is missing (missing_inputs). */
  passed: boolean | null;
  missing_inputs?: string[];
  margin: number | null;
  margin_unit: 'adhesion' | 'N';
  note: string;
  details: Record<string, number | string | boolean | null>;
}

/** Normal load on each axle of the vehicle standing on gradient angle θ, N. */
export function slopeAxleLoads(s: StateModel, theta: number, facing: 'uphill' | 'downhill'): { front: number; rear: number } {
  const { P, psi, chi } = s.loads;
  const c = Math.cos(theta);
  const t = Math.sin(theta) * chi * (facing === 'uphill' ? 1 : -1);
  return { front: P * (psi * c - t), rear: P * ((1 - psi) * c + t) };
}

/** Holding force the parking brake produces at the tyres of its axle, N, or null when the design does not say. */
export function parkingBrakeCapacity(design: DesignFile, rule: ParkingRule): { force_n: number; control_force_n: number | null } | null {
  const b = design.parking_brake;
  if (!b) return null;
  if (b.holding_force_n !== undefined) return { force_n: b.holding_force_n, control_force_n: null };
  if (b.lever_ratio === undefined || b.efficiency === undefined || b.brake_factor === undefined || b.effective_radius_m === undefined) return null;
  const limit = b.control === 'hand' ? rule.max_hand_force_n : rule.max_foot_force_n;
  const control = Math.min(b.control_force_n ?? limit, limit);
  const tyre = design.axles[b.axle].tyre_radius_m;
  return { force_n: (control * b.lever_ratio * b.efficiency * b.brake_factor * b.effective_radius_m) / tyre, control_force_n: control };
}

/** Not checked: the design does not describe the parking brake (issue 12 point 5: never an assumed axle). */
export const PARKING_NOT_DESCRIBED =
  'not checked: the parking brake is not described (which axle it brakes, hand or foot control, and its holding force or mechanism)';

export const PARKING_CAPACITY_MISSING =
  "not checked: the parking brake's holding force is not given (give the holding force at the tyres, or the lever ratio, efficiency, brake factor and effective radius)";

export function checkParking(design: DesignFile, s: StateModel, rule: ParkingRule): ParkingOutcome[] {
  const surface = testSurfaceFor(design, rule);
  const k = surface.k;
  if (!design.parking_brake) {
    return [{ scenario: 'as_designed', passed: null, missing_inputs: ['parking_brake'], margin: null, margin_unit: 'N', note: PARKING_NOT_DESCRIBED, details: { gradient_pct: rule.gradient_pct } }];
  }
  const axle = design.parking_brake.axle;
  const theta = Math.atan(rule.gradient_pct / 100);
  const hold = s.loads.P * Math.sin(theta);
  const out: ParkingOutcome[] = [];
  for (const facing of ['uphill', 'downhill'] as const) {
    const n = slopeAxleLoads(s, theta, facing)[axle];
    const need = n > 0 ? hold / n : null;
    const margin = need === null ? null : k - need;
    out.push({
      scenario: facing === 'uphill' ? 'facing_uphill' : 'facing_downhill',
      passed: margin !== null && margin >= -1e-12,
      margin,
      margin_unit: 'adhesion',
      note:
        need === null
          ? `the ${axle} axle carries no load facing ${facing} on ${rule.gradient_pct} %`
          : `facing ${facing} on ${rule.gradient_pct} %: the ${axle} axle needs adhesion ${need.toFixed(3)} (test surface adhesion ${k}: ${surface.words})`,
      details: {
        gradient_pct: rule.gradient_pct,
        holding_force_n: hold,
        braked_axle: axle,
        braked_axle_load_n: n,
        adhesion_needed: need,
        test_adhesion: k,
        test_adhesion_source: surface.source,
      },
    });
  }
  const cap = parkingBrakeCapacity(design, rule);
  if (!cap) {
    out.push({
      scenario: 'parking_brake_capacity',
      passed: null,
      missing_inputs: ['parking_brake.holding_force_n'],
      margin: null,
      margin_unit: 'N',
      note: PARKING_CAPACITY_MISSING,
      details: { gradient_pct: rule.gradient_pct, holding_force_n: hold },
    });
  } else {
    const margin = cap.force_n - hold;
    out.push({
      scenario: 'parking_brake_capacity',
      passed: margin >= 0,
      margin,
      margin_unit: 'N',
      note: `parking brake gives ${cap.force_n.toFixed(0)} N at the tyres${cap.control_force_n === null ? ' (declared)' : ` at ${cap.control_force_n.toFixed(0)} N on the ${design.parking_brake!.control} control`}; ${hold.toFixed(0)} N needed on ${rule.gradient_pct} %`,
      details: { gradient_pct: rule.gradient_pct, holding_force_n: hold, capacity_n: cap.force_n, control_force_n: cap.control_force_n },
    });
  }
  return out;
}
