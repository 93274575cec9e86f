/**
 * Towing (rules: core/rules/towing.ts, from memory).
 *
 * Towing load state: the nose load n (kg) of the trailer on a hitch e metres behind the rear axle is
 * added to a laden load state (towing.load_state, else the heaviest laden one): mass m' = m + n, front
 * axle f' = f − n·e/E (the hitch behind the rear axle lifts the front), CG height
 * h' = (m·h + n·h_c)/m' with h_c the hitch height (default h: the stricter choice for the rear axle).
 *
 * Service braking of the combination: the towing vehicle's brakes stop m' plus the trailer's free
 * mass m_f = m_T − n when the trailer is unbraked (m_f = 0 with its own brakes). Moments about the
 * rear contact patch: the free mass pushes at the hitch height, so with T = (m' + m_f)·g·z_c
 *   N1 = P1' + z_c·g·(m'·h' + m_f·h_c)/E.
 * In the vehicle's own braking rate z = T/P' (the distribution's axis) this is N1 = P1' + z·χ_eq·P'
 * with χ_eq = (m'·h' + m_f·h_c)/((m' + m_f)·E), so the lock order and the pedal-force reading of
 * the ordinary service check apply on a load model with χ_eq, and z_c = z·m'/(m' + m_f).
 *
 * Parking on the combination gradient: the parking brake holds the whole combination,
 * (m + m_T)·g·sin θ (the trailer's own parking brake not credited); the free trailer mass pulls along
 * the slope at the hitch height, moving m_f·g·sin θ·h_c/E onto the rear axle facing uphill and off it
 * facing downhill, beside the vehicle's own load transfer (core/checks/performance-check.ts).
 */
import type { AxleLoadModel } from '../axle-loads.ts';
import { G_N } from '../constants.ts';
import type { DesignFile, LoadState } from '../design.ts';
import { firstLock } from '../lock-order.ts';
import { pressureForPedalForce } from '../pedal-force.ts';
import type { CombinationParkingRule, TowingServiceRule } from '../rules/case-rule-types.ts';
import type { ParkingRule } from '../rules/rule-types.ts';
import { type StateModel, stateModel } from '../state-model.ts';
import { type CheckResult, type CheckScenario, verifyNoteFor } from './check-result.ts';
import { brakingRateAtPressure } from './circuit-failure.ts';
import { base, notApplicable, notChecked } from './result-builders.ts';
import { DECELERATION_TOLERANCE, DEFAULT_TEST_ADHESION, KMH2_PER_M_TO_MS2, parkingBrakeCapacity, requiredDeceleration, slopeAxleLoads } from './performance-check.ts';

export const TOWING_ID = 'towing';

export interface TowingCase {
  state: StateModel;
  /** Load model for the combination's braking (χ_eq), in the vehicle's own braking rate. */
  loads: AxleLoadModel;
  /** Vehicle with nose load m', free trailer mass m_f, whole trailer m_T, kg. */
  towing_mass_kg: number;
  free_mass_kg: number;
  trailer_mass_kg: number;
  hitch_height_m: number;
  base_state: string;
}

/** The towing load state and its combination load model, or the reason it cannot be made. */
export function towingCase(design: DesignFile, all: readonly StateModel[]): TowingCase | { reason: string } {
  const t = design.towing!;
  const laden = all.filter((m) => m.state.kind === 'laden' && design.load_states.includes(m.state));
  const pick = t.load_state !== undefined ? all.find((m) => m.state.id === t.load_state) : laden.reduce<StateModel | undefined>((a, b) => (!a || b.state.mass_kg > a.state.mass_kg ? b : a), undefined);
  if (!pick) return { reason: 'needs a laden load state to add the trailer nose load to' };
  const st = pick.state;
  const E = design.vehicle.wheelbase_m;
  const n = t.nose_load_kg;
  const hc = t.hitch_height_m ?? st.cg_height_m;
  const mass = st.mass_kg + n;
  const front = st.front_axle_kg - (n * t.hitch_behind_rear_axle_m) / E;
  if (!(front > 0)) return { reason: `the nose load lifts the front axle off (front axle load ${front.toFixed(0)} kg): reduce the nose load or the hitch overhang` };
  const taken = new Set(design.load_states.map((s) => s.id));
  const id = taken.has(TOWING_ID) ? `${TOWING_ID}-derived` : TOWING_ID;
  const state: LoadState = { id, label: `${st.label}, towing (nose load ${n} kg)`, kind: 'laden', mass_kg: mass, front_axle_kg: front, cg_height_m: (st.mass_kg * st.cg_height_m + n * hc) / mass };
  const sm = stateModel(design, state);
  const mf = t.trailer_braked ? 0 : t.trailer_mass_kg - n;
  const chi = (mass * state.cg_height_m + mf * hc) / ((mass + mf) * E);
  const loads: AxleLoadModel = Object.assign({}, sm.loads, { chi, h: chi * E, zLift: sm.loads.P2 / (chi * sm.loads.P) });
  return { state: sm, loads, towing_mass_kg: mass, free_mass_kg: mf, trailer_mass_kg: t.trailer_mass_kg, hitch_height_m: hc, base_state: st.id };
}

function caseOrResult(design: DesignFile, rule: TowingServiceRule | CombinationParkingRule, all: readonly StateModel[]): TowingCase | CheckResult {
  if (!design.towing) return notApplicable(rule, null, 'not applicable: no trailer given (towing inputs)');
  const c = towingCase(design, all);
  return 'reason' in c ? notChecked(rule, null, ['towing.load_state'], `not checked: ${c.reason}`, 'with_trailer') : c;
}

export function towingServiceResults(design: DesignFile, rule: TowingServiceRule, _states: readonly StateModel[], all: readonly StateModel[]): CheckResult[] {
  const c = caseOrResult(design, rule, all);
  if (!('state' in c)) return [c];
  const s = c.state;
  const f = rule.figures;
  const k = design.test_adhesion ?? DEFAULT_TEST_ADHESION;
  const scale = c.towing_mass_kg / (c.towing_mass_kg + c.free_mass_kg); // z_c per z
  const zPedal = brakingRateAtPressure(s.dist, pressureForPedalForce(s.pedal, f.max_pedal_force_n));
  const lock = firstLock(c.loads, s.dist, k);
  const abs = design.vehicle.abs;
  const cap = abs ? k : lock.braking_rate;
  const z = Math.min(zPedal, cap);
  const a = z * scale * G_N;
  const req = requiredDeceleration(f);
  const margin = a - req.required_ms2;
  const v = f.speed_kmh;
  const limited = zPedal <= cap ? 'the pedal-force limit' : abs ? 'the surface adhesion (ABS working)' : 'the first wheel lock on the test surface';
  const trailer = design.towing!.trailer_braked
    ? `braked trailer (${c.trailer_mass_kg} kg) brakes itself; nose load ${design.towing!.nose_load_kg} kg on the hitch`
    : `unbraked trailer: ${c.free_mass_kg} kg more to stop, pushing at the hitch`;
  return [
    Object.assign(base(rule, s.state.id, 'with_trailer' as CheckScenario), verifyNoteFor(rule.status), {
      applies: true,
      passed: margin >= -DECELERATION_TOLERANCE,
      worst_margin: margin,
      margin_unit: 'm/s²' as const,
      note:
        `combination ${a.toFixed(2)} m/s² at ${f.max_pedal_force_n} N, limited by ${limited} (adhesion ${k}); ${req.required_ms2.toFixed(2)} m/s² required; ` +
        `${trailer}; first lock on the test surface: ${lock.first_axle} axle`,
      details: {
        base_load_state: c.base_state,
        towing_mass_kg: c.towing_mass_kg,
        towing_front_axle_kg: s.state.front_axle_kg,
        towing_cg_height_m: s.state.cg_height_m,
        trailer_mass_kg: c.trailer_mass_kg,
        trailer_braked: design.towing!.trailer_braked,
        unbraked_mass_kg: c.free_mass_kg,
        combination_mass_kg: c.towing_mass_kg + c.free_mass_kg,
        test_adhesion: k,
        braking_rate_at_pedal_limit: zPedal * scale,
        first_lock_axle: lock.first_axle,
        first_lock_braking_rate: lock.first_axle === 'none' ? null : lock.braking_rate * scale,
        deceleration_ms2: a,
        required_deceleration_ms2: req.required_ms2,
        stopping_distance_m: a > 0 ? (f.distance?.v_coeff ?? 0) * v + (v * v) / (KMH2_PER_M_TO_MS2 * a) : null,
        stopping_distance_limit_m: req.distance_limit_m,
      },
    }),
  ];
}

export function combinationParkingResults(design: DesignFile, rule: CombinationParkingRule, _states: readonly StateModel[], all: readonly StateModel[]): CheckResult[] {
  const c = caseOrResult(design, rule, all);
  if (!('state' in c)) return [c];
  const s = c.state;
  const k = design.test_adhesion ?? DEFAULT_TEST_ADHESION;
  const axle = design.parking_brake?.axle ?? 'rear';
  const theta = Math.atan(rule.gradient_pct / 100);
  const pull = (c.trailer_mass_kg - design.towing!.nose_load_kg) * G_N * Math.sin(theta); // free trailer mass along the slope
  const hold = s.loads.P * Math.sin(theta) + pull;
  const shift = (pull * c.hitch_height_m) / s.loads.E;
  const out: CheckResult[] = [];
  for (const facing of ['uphill', 'downhill'] as const) {
    const own = slopeAxleLoads(s, theta, facing);
    const sign = facing === 'uphill' ? 1 : -1;
    const n = axle === 'rear' ? own.rear + sign * shift : own.front - sign * shift;
    const need = n > 0 ? hold / n : null;
    const margin = need === null ? null : k - need;
    out.push(
      Object.assign(base(rule, s.state.id, facing === 'uphill' ? 'facing_uphill' : 'facing_downhill'), verifyNoteFor(rule.status), {
        applies: true,
        passed: margin !== null && margin >= -1e-12,
        worst_margin: margin,
        margin_unit: 'adhesion' as const,
        note:
          need === null
            ? `the ${axle} axle carries no load facing ${facing} on ${rule.gradient_pct} % with the trailer`
            : `combination facing ${facing} on ${rule.gradient_pct} %: ${hold.toFixed(0)} N to hold (trailer's own parking brake not credited); the ${axle} axle needs adhesion ${need.toFixed(3)} (test surface ${k})`,
        details: { gradient_pct: rule.gradient_pct, holding_force_n: hold, braked_axle: axle, braked_axle_load_n: n, adhesion_needed: need, test_adhesion: k, trailer_mass_kg: c.trailer_mass_kg },
      }),
    );
  }
  const asParking: ParkingRule = Object.assign({}, rule, { kind: 'parking' as const });
  const cap = parkingBrakeCapacity(design, asParking);
  if (cap) {
    const margin = cap.force_n - hold;
    out.push(
      Object.assign(base(rule, s.state.id, 'parking_brake_capacity'), verifyNoteFor(rule.status), {
        applies: true,
        passed: margin >= 0,
        worst_margin: margin,
        margin_unit: 'N' as const,
        note: `parking brake gives ${cap.force_n.toFixed(0)} N at the tyres; ${hold.toFixed(0)} N needed to hold the combination on ${rule.gradient_pct} %`,
        details: { gradient_pct: rule.gradient_pct, holding_force_n: hold, capacity_n: cap.force_n, control_force_n: cap.control_force_n },
      }),
    );
  }
  return out;
}
