/**
 * The `lockstep-result/1` for a design: per load state the static loads, the crossings of the
 * ideal and the critical braking rate, the first lock on each surface, the operating points at the
 * requested braking rates and (on request) the plotting curves.
 */
import { CAUTION } from './caution.ts';
import { DEFAULT_ADHESION, DEFAULT_AT } from './constants.ts';
import { crossings } from './crossings.ts';
import { type Curves, curves } from './curves.ts';
import type { DesignFile } from './design.ts';
import { frontShareAtLowPressure, segments } from './distribution.ts';
import { firstLock, type LockResult } from './lock-order.ts';
import { type OperatingPoint, operatingPoint } from './operating-point.ts';
import { type StateModel, stateModel } from './state-model.ts';
import type { Warning } from './validate.ts';
import { LOCKSTEP_VERSION } from './version.ts';
import type { CheckResult } from './checks/check-result.ts';
import { runChecks } from './checks/run-checks.ts';
import { type PedalTravelResult, pedalTravel } from './fluid-volume.ts';
import { type FailureModeResult, valveFailureModes } from './valve-failure.ts';
import { type Pitfall, pitfalls } from './pitfalls.ts';
import { designLimits, type DesignLimits, stateLimits, type StateLimits } from './limits.ts';
import { type LoadStateOrigin, loadStateOrigin } from './build-up.ts';
import { type RatingMargins, ratingMargins, ratingWarnings } from './ratings.ts';
import { buildVerdict, type Verdict } from './verdict.ts';

export interface LoadStateResult {
  id: string;
  label: string;
  kind: string;
  mass_kg: number;
  front_axle_kg: number;
  cg_height_m: number;
  /** Where the figures come from (build_up | measured | entered), and the CG height's own source and uncertainty. */
  derived_from?: LoadStateOrigin['derived_from'];
  cg_height_derived_from?: LoadStateOrigin['cg_height_derived_from'];
  cg_height_uncertainty_m?: LoadStateOrigin['cg_height_uncertainty_m'];
  from_build_up?: LoadStateOrigin['from_build_up'];
  /** Margins against the `ratings` block (null without one). */
  ratings?: RatingMargins | null;
  front_axle_static_n: number;
  rear_axle_static_n: number;
  /** ψ = P1 / P. */
  static_front_share: number;
  /** Front share of the braking force where both axles brake below the first kink (null if never). */
  front_share_low_pressure: number | null;
  /** Braking rate at which the rear axle load reaches zero. */
  rear_lift_off_braking_rate: number;
  critical_braking_rate: number | null;
  critical_braking_rates: number[];
  lock: LockResult[];
  /** Lowest braking efficiency over the surfaces analysed. */
  lowest_efficiency: { adhesion: number; efficiency: number } | null;
  at: OperatingPoint[];
  warnings: Warning[];
  curves?: Curves;
  /** Limits at grip (traction, stopping) and the roller-tester prediction (core/limits.ts). */
  traction: StateLimits['traction'];
  stopping: StateLimits['stopping'];
  tester: StateLimits['tester'];
}

export interface EvaluationResult {
  format: 'lockstep-result/1';
  lockstep_version: string;
  design_name: string;
  /**
   * The one verdict (core/verdict.ts): pass / fail / incomplete from every check that applies, the failed-valve
   * cases and the regeneration cases; every output opens with it.
   */
  verdict: Verdict;
  adhesion_coefficients: number[];
  load_states: LoadStateResult[];
  /** Regulation checks per rule, load state and scenario (core/checks). */
  checks: CheckResult[];
  warnings: Warning[];
  /** Failed distribution valve per mode and load state (71/320 Annex II Appendix point 6). */
  failure_modes: FailureModeResult[];
  /** Fluid volume and pedal travel, service and one circuit failed. */
  pedal_travel: PedalTravelResult;
  /** Practitioner pitfalls the design states facts for. */
  pitfalls: Pitfall[];
  /** Regenerative braking and brake heat (null without a `regen` / `heat` block). */
  regen: DesignLimits['regen'];
  heat: DesignLimits['heat'];
  caution: string;
}

export interface EvaluateOptions {
  /** Braking rates for the `at` list (default 0.1 … 1.0). */
  at?: readonly number[];
  /** Include the plotting series per load state. */
  curves?: boolean;
  /** Rule-set or rule ids to check (overrides the design's `rules` key; default by category). */
  rules?: readonly string[];
  /**
   * Compute the limits (traction, stopping, tester, regeneration, heat), the pedal travel and the failure
   * modes on first read instead of at once: for a view that shows them only on request. The result reads
   * the same, key for key, as without this option.
   */
  deferLimits?: boolean;
}

/**
 * Replaces obj[key] by a getter that computes the value on first read and keeps it (an ordinary enumerable
 * property from then on, in the same place among the keys, so JSON.stringify writes the same text).
 */
function computeOnRead<T extends object, K extends keyof T>(obj: T, key: K, make: () => T[K]): void {
  Object.defineProperty(obj, key, {
    configurable: true,
    enumerable: true,
    get() {
      const value = make();
      Object.defineProperty(obj, key, { value, writable: true, configurable: true, enumerable: true });
      return value;
    },
  });
}

export function evaluateState(design: DesignFile, s: StateModel, opts: EvaluateOptions = {}): LoadStateResult {
  const adhesion = design.adhesion_coefficients ?? [...DEFAULT_ADHESION];
  const segs = segments(s.dist); // computed once, shared by the crossings, the lock table and the share
  const cross = crossings(s.loads, s.dist, segs);
  const lock = adhesion.map((k) => firstLock(s.loads, s.dist, k, segs));
  const at = (opts.at ?? DEFAULT_AT).map((z) => operatingPoint(s, z));
  const warnings: Warning[] = [];
  const index = design.load_states.indexOf(s.state);
  const zLift = s.loads.zLift;
  if (zLift <= 1) {
    warnings.push({
      code: 'WARN_REAR_LIFT_OFF',
      path: `load_states[${index}]`,
      message: `the rear axle load reaches zero at braking rate ${zLift.toFixed(3)}; utilisations above it are not defined`,
    });
  }
  const lifted = at.filter((p) => p.rear_utilisation === null).map((p) => p.braking_rate);
  if (lifted.length > 0) {
    warnings.push({
      code: 'WARN_AT_BEYOND_LIFT_OFF',
      path: `load_states[${index}]`,
      message: `braking rate ${lifted.join(', ')} is beyond rear-axle lift-off (${zLift.toFixed(3)}): utilisations reported as null`,
    });
  }
  for (const l of lock) {
    if (l.first_axle === 'none') {
      warnings.push({
        code: 'WARN_LIFT_BEFORE_LOCK',
        path: `load_states[${index}]`,
        message: `on adhesion ${l.adhesion} the rear axle lifts off (z = ${zLift.toFixed(3)}) before either axle locks`,
      });
    }
  }
  let lowest: LoadStateResult['lowest_efficiency'] = null;
  for (const l of lock) if (!lowest || l.efficiency < lowest.efficiency) lowest = { adhesion: l.adhesion, efficiency: l.efficiency };
  warnings.push(...ratingWarnings(design, s.state, index));
  const r: LoadStateResult = {
    id: s.state.id,
    label: s.state.label,
    kind: s.state.kind,
    mass_kg: s.state.mass_kg,
    front_axle_kg: s.state.front_axle_kg,
    cg_height_m: s.state.cg_height_m,
    ...loadStateOrigin(s.state),
    ratings: ratingMargins(design, s.state),
    front_axle_static_n: s.loads.P1,
    rear_axle_static_n: s.loads.P2,
    static_front_share: s.loads.psi,
    front_share_low_pressure: frontShareAtLowPressure(s.dist, segs),
    rear_lift_off_braking_rate: zLift,
    critical_braking_rate: cross.critical,
    critical_braking_rates: cross.rates,
    lock,
    lowest_efficiency: lowest,
    at,
    warnings,
    traction: [],
    stopping: null as unknown as StateLimits['stopping'],
    tester: null as unknown as StateLimits['tester'],
  };
  if (opts.deferLimits) {
    let limits: StateLimits | undefined;
    const once = () => (limits ??= stateLimits(design, s, adhesion));
    computeOnRead(r, 'traction', () => once().traction);
    computeOnRead(r, 'stopping', () => once().stopping);
    computeOnRead(r, 'tester', () => once().tester);
  } else Object.assign(r, stateLimits(design, s, adhesion));
  if (opts.curves) r.curves = curves(s, cross.rates, cross.critical);
  return r;
}

export function stateModels(design: DesignFile): StateModel[] {
  return design.load_states.map((st) => stateModel(design, st));
}

export function evaluate(design: DesignFile, opts: EvaluateOptions & { warnings?: Warning[] } = {}): EvaluationResult {
  const models = stateModels(design);
  const adhesion = design.adhesion_coefficients ?? [...DEFAULT_ADHESION];
  const failureModes = () => valveFailureModes(design, models, adhesion);
  const travel = () => pedalTravel(design, models);
  let limits: DesignLimits | undefined;
  const once = () => (limits ??= designLimits(design, models, adhesion));
  const r: EvaluationResult = {
    format: 'lockstep-result/1',
    lockstep_version: LOCKSTEP_VERSION,
    design_name: design.name,
    verdict: null as unknown as Verdict,
    adhesion_coefficients: [...adhesion],
    load_states: models.map((m) => evaluateState(design, m, opts)),
    checks: runChecks(design, models, { rules: opts.rules }),
    warnings: opts.warnings ?? [],
    failure_modes: [],
    pedal_travel: null as unknown as PedalTravelResult,
    pitfalls: pitfalls(design),
    regen: null,
    heat: null,
    caution: CAUTION,
  };
  if (opts.deferLimits) {
    computeOnRead(r, 'failure_modes', failureModes);
    computeOnRead(r, 'pedal_travel', travel);
    computeOnRead(r, 'regen', () => once().regen);
    computeOnRead(r, 'heat', () => once().heat);
    // reading the verdict forces the failure modes and the regeneration cases (not the other limits)
    computeOnRead(r, 'verdict', () => buildVerdict(r));
  } else {
    r.failure_modes = failureModes();
    r.pedal_travel = travel();
    Object.assign(r, once());
    r.verdict = buildVerdict(r);
  }
  return r;
}
