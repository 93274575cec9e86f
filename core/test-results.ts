/**
 * Measured brake-test results (`test_results`, core/test-results-schema.ts) against the requirement and
 * the prediction. SI inside (m/s², N, m, m/s); results in the same units.
 *
 * Road test: the requirement is the category's service or secondary figure (core/rules/performance.ts:
 * deceleration, pedal-force limit, stopping distance s ≤ a·v + b·v² at the prescribed speed); the prediction
 * is the deceleration the installed brakes give at the pedal force used (pedal model → master pressure →
 * axle forces, before any wheel locks; intact system, so only for the service test).
 * Mean fully developed deceleration from the four readings: d = (vb² − ve²) / (25.92·(se − sb)), v in km/h,
 * s in m (UN R13 Annex 4 para 1.1.1 definition, from memory).
 * Roller tester: the sum of left and right per axle against the prediction (core/roller-tester.ts) and the
 * imbalance |L − R| / max(L, R).
 */
import { G_N } from './constants.ts';
import type { DesignFile } from './design.ts';
import { pressureForPedalForce } from './pedal-force.ts';
import { rearPressure } from './valves/index.ts';
import type { TesterResult } from './roller-tester.ts';
import { SECONDARY_FIGURES, SERVICE_FIGURES } from './rules/performance.ts';
import { requiredDeceleration } from './checks/performance-check.ts';
import { stateModel } from './state-model.ts';
import type { MfddReadings, RoadTest } from './test-results-schema.ts';

export interface RoadTestOutcome {
  load_state: string;
  test: RoadTest['test'];
  /** Prescribed test speed, m/s. */
  required_speed_ms: number;
  required_ms2: number;
  max_pedal_force_n: number;
  /** Stopping-distance limit at the speed driven (or the prescribed one), m. */
  distance_limit_m: number | null;
  measured_ms2: number | null;
  predicted_ms2: number | null;
  /** Measured minus predicted, m/s². */
  difference_ms2: number | null;
  /** Measured deceleration and pedal force (and distance, when measured) within the requirement; null: not measured. */
  meets: boolean | null;
}

export interface RollerTestOutcome {
  axle: 'front' | 'rear';
  measured_n: number;
  predicted_n: number | null;
  difference_n: number | null;
  imbalance_pct: number;
}

export interface TestResultsOutcome {
  road: RoadTestOutcome[];
  roller: RollerTestOutcome[];
  /** Every measured road test meets its requirement (null: no measured deceleration). */
  meets: boolean | null;
}

export function mfddOf(r: MfddReadings): number | null {
  const ds = r.distance_e_m - r.distance_b_m;
  if (!(ds > 0) || !(r.speed_b_kmh > r.speed_e_kmh)) return null;
  return (r.speed_b_kmh ** 2 - r.speed_e_kmh ** 2) / (25.92 * ds);
}

/** Deceleration of the intact installed brakes at a pedal force, before any wheel locks, m/s². */
export function decelerationAtPedalForce(design: DesignFile, loadStateId: string, pedalForceN: number): number | null {
  const st = design.load_states.find((s) => s.id === loadStateId);
  if (!st) return null;
  const m = stateModel(design, st);
  const p = pressureForPedalForce(m.pedal, pedalForceN);
  const t1 = m.G1 * Math.max(0, p - m.threshold1);
  const t2 = m.G2 * Math.max(0, rearPressure(m.valve, p) - m.threshold2);
  return ((t1 + t2) / m.loads.P) * G_N;
}

export function testResultsOutcome(design: DesignFile, tester: readonly { id: string; tester?: TesterResult | null }[]): TestResultsOutcome | null {
  const tr = design.test_results;
  if (!tr) return null;
  const cat = design.vehicle.category;
  const road = (tr.road ?? []).map((r): RoadTestOutcome => {
    const fig = (r.test === 'service' ? SERVICE_FIGURES : SECONDARY_FIGURES)[cat];
    const req = requiredDeceleration(fig);
    const v = r.speed_kmh ?? fig.speed_kmh;
    const limit = fig.distance ? fig.distance.v_coeff * v + fig.distance.v2_coeff * v * v : null;
    const measured = r.mfdd_ms2 ?? (r.mfdd ? mfddOf(r.mfdd) : null);
    const predicted = r.test === 'service' && r.pedal_force_n !== undefined ? decelerationAtPedalForce(design, r.load_state, r.pedal_force_n) : null;
    const meets =
      measured === null
        ? null
        : measured >= req.required_ms2 &&
          (r.pedal_force_n === undefined || r.pedal_force_n <= fig.max_pedal_force_n) &&
          (r.stopping_distance_m === undefined || limit === null || r.stopping_distance_m <= limit);
    return {
      load_state: r.load_state,
      test: r.test,
      required_speed_ms: fig.speed_kmh / 3.6,
      required_ms2: req.required_ms2,
      max_pedal_force_n: fig.max_pedal_force_n,
      distance_limit_m: limit,
      measured_ms2: measured,
      predicted_ms2: predicted,
      difference_ms2: measured !== null && predicted !== null ? measured - predicted : null,
      meets,
    };
  });
  // the roller prediction of the load state the tester uses (the heaviest, or the one with tester results)
  const pred = tester.find((s) => s.tester)?.tester ?? null;
  const roller = (tr.roller ?? []).map((r): RollerTestOutcome => {
    const measured = r.left_n + r.right_n;
    const p = pred?.axles.find((a) => a.axle === r.axle)?.recorded_force_n ?? null;
    const hi = Math.max(r.left_n, r.right_n);
    return { axle: r.axle, measured_n: measured, predicted_n: p, difference_n: p === null ? null : measured - p, imbalance_pct: hi > 0 ? (Math.abs(r.left_n - r.right_n) / hi) * 100 : 0 };
  });
  const decided = road.filter((r) => r.meets !== null);
  return { road, roller, meets: decided.length === 0 ? null : decided.every((r) => r.meets) };
}
