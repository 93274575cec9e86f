/**
 * Failure of the distribution device (71/320/EEC Annex II Appendix point 6, partly verified: read in
 * the EU agricultural-tractor text of the same structure; verify against the current official text):
 * when compliance relies on a special device such as a rear valve, a failure of its
 * control must still let the vehicle stop under the secondary-braking conditions (R13 Annex 4 2.2).
 *
 * Failed states per rear-valve type, each built as a `Distribution` so lock order works unchanged:
 *   proportioning, limiting: `passes_full_pressure` (valve stuck open: rear line = master pressure)
 *                            and `blocks_rear` (valve stuck shut: no rear braking, rear gain 0);
 *   load_sensing:            `linkage_broken_lowest_knee` and `linkage_broken_highest_knee` (the linkage
 *                            to the axle is broken and the valve holds the knee of the lightest or
 *                            heaviest row of its table whatever the load);
 *   none:                    no device, nothing to fail.
 * Per failed state and load state: first lock per surface, and the deceleration at the pedal-force
 * limit of the category, not above the first lock on the test surface (test_adhesion, default 0.8),
 * compared with the secondary-braking deceleration of the category.
 */
import { VERIFY_NOTE } from './caution.ts';
import { categoryFigures } from './category-figures.ts';
import { G_N, PA_PER_BAR } from './constants.ts';
import type { DesignFile } from './design.ts';
import { axleBrakeForce } from './brake-force.ts';
import type { Distribution } from './distribution.ts';
import { installedDistribution } from './installed-distribution.ts';
import { firstLock, type FirstAxle } from './lock-order.ts';
import { pressureForPedalForce } from './pedal-force.ts';
import { type FailedValve, failedValves, rearPressure, type ValveFailureMode, type ValveLaw } from './valves/index.ts';
import type { StateModel } from './state-model.ts';

export type { FailedValve, ValveFailureMode } from './valves/index.ts';
export { failedValves };

/**
 * The failed law referred to the front line pressure of the state model: with a balance bar the valve sits
 * behind the rear master cylinder, so its knee is knee / λ in front pressure (core/state-model.ts).
 */
function referredLaw(s: StateModel, f: FailedValve): ValveLaw {
  return { knee: f.law.knee / s.rearMasterRatio, ratio: f.law.ratio };
}

/** The distribution of one load state with the valve failed. */
export function failedDistribution(s: StateModel, f: FailedValve): Distribution {
  const d = installedDistribution({
    P: s.loads.P,
    G1: s.G1,
    G2: f.rearBlocked ? 0 : s.G2,
    threshold1: s.threshold1,
    threshold2: s.threshold2,
    valve: referredLaw(s, f),
  });
  // real rear line pressures, as in core/state-model.ts
  if (s.rearMasterRatio !== 1 && d.p2) d.p2 = d.p2.map((q) => q * s.rearMasterRatio);
  return d;
}

/** Braking rate at master pressure p with the valve failed. */
export function failedRateAtPressure(s: StateModel, f: FailedValve, p: number): number {
  const t1 = axleBrakeForce(s.G1, p, s.threshold1);
  const t2 = f.rearBlocked ? 0 : axleBrakeForce(s.G2, rearPressure(referredLaw(s, f), p), s.threshold2);
  return (t1 + t2) / s.loads.P;
}

export interface FirstAxleOn {
  adhesion: number;
  first_axle: FirstAxle;
  braking_rate: number;
}

export interface FailureModeResult {
  mode: ValveFailureMode;
  description: string;
  load_state: string;
  /** Deceleration reached at the pedal-force limit, not above the first lock on the test surface, m/s². */
  max_deceleration_ms2: number;
  required_ms2: number;
  passed: boolean;
  /** What limits max_deceleration_ms2. */
  limited_by: 'pedal_force' | 'wheel_lock' | 'rear_lift_off';
  pedal_force_limit_n: number;
  master_pressure_at_limit_bar: number;
  pedal_limited_ms2: number;
  test_adhesion: number;
  lock_limited_ms2: number;
  first_axle_on: FirstAxleOn[];
  /** Surfaces (within 0.2 ≤ k ≤ 0.8) on which the rear axle locks first with the valve failed. */
  rear_first_on: number[];
  source: string;
  status: 'P';
  verify_note: string;
}

export const VALVE_FAILURE_SOURCE =
  '71/320/EEC Annex II Appendix point 6 (failure of the distribution device); required deceleration: UN R13 Annex 4 2.2 (secondary braking)';

export function valveFailureModes(design: DesignFile, models: StateModel[], adhesion: readonly number[]): FailureModeResult[] {
  const modes = failedValves(design.hydraulics.rear_valve);
  const fig = categoryFigures(design.vehicle.category);
  const kTest = (design as { test_adhesion?: number }).test_adhesion ?? 0.8;
  const out: FailureModeResult[] = [];
  for (const f of modes) {
    for (const s of models) {
      // A load-sensing law is read per load state; a broken linkage holds the same knee in every state.
      const d = failedDistribution(s, f);
      const pLimit = pressureForPedalForce(s.pedal, fig.secondary_foot_force_n);
      const zPedal = Math.min(failedRateAtPressure(s, f, pLimit), s.loads.zLift);
      const testLock = firstLock(s.loads, d, kTest);
      const zLock = testLock.braking_rate;
      const zMax = Math.min(zPedal, zLock);
      const limitedBy: FailureModeResult['limited_by'] =
        zPedal <= zLock ? (zPedal >= s.loads.zLift ? 'rear_lift_off' : 'pedal_force') : testLock.first_axle === 'none' ? 'rear_lift_off' : 'wheel_lock';
      const locks = adhesion.map((k) => firstLock(s.loads, d, k));
      const maxMs2 = zMax * G_N;
      out.push({
        mode: f.mode,
        description: f.description,
        load_state: s.state.id,
        max_deceleration_ms2: maxMs2,
        required_ms2: fig.secondary_ms2,
        passed: maxMs2 >= fig.secondary_ms2,
        limited_by: limitedBy,
        pedal_force_limit_n: fig.secondary_foot_force_n,
        master_pressure_at_limit_bar: pLimit / PA_PER_BAR,
        pedal_limited_ms2: zPedal * G_N,
        test_adhesion: kTest,
        lock_limited_ms2: zLock * G_N,
        first_axle_on: locks.map((l) => ({ adhesion: l.adhesion, first_axle: l.first_axle, braking_rate: l.braking_rate })),
        rear_first_on: locks.filter((l) => l.first_axle === 'rear' && l.adhesion >= 0.2 && l.adhesion <= 0.8).map((l) => l.adhesion),
        source: VALVE_FAILURE_SOURCE,
        status: 'P',
        verify_note: VERIFY_NOTE,
      });
    }
  }
  return out;
}
