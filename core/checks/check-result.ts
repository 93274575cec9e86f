/**
 * One regulation check on one load state (and scenario): the data object the CLI JSON, the page
 * and the evidence packet show unchanged.
 */
import { VERIFY_NOTE } from '../caution.ts';
import type { RuleSource, RuleStatus } from '../rules/rule-types.ts';
import type { BranchVerdict } from './curve-check.ts';

export type CheckScenario =
  | 'as_designed'
  | 'abs_failed'
  | 'front_circuit_only'
  | 'rear_circuit_only'
  | 'one_diagonal'
  | 'no_booster_assist'
  | 'facing_uphill'
  | 'facing_downhill'
  | 'parking_brake_capacity'
  | 'valve_stuck_open'
  | 'valve_stuck_shut'
  | 'valve_linkage_lowest_knee'
  | 'valve_linkage_highest_knee'
  | 'ebd_failed'
  | 'antilock_failed'
  | 'hot_brakes'
  | 'with_trailer'
  | 'regeneration_on';

/** 'none': a check of a stated fact (a system fitted, a warning signal), without a margin. */
export type MarginUnit = 'adhesion' | 'm/s²' | 'N' | 'none';

export interface CheckResult {
  /** Rule id, e.g. `eu-appendix/lock-order`. */
  rule: string;
  rule_set: string;
  title: string;
  source: RuleSource;
  status: RuleStatus;
  /** Load-state id; null for a verdict about the whole design (rule not applicable). */
  load_state: string | null;
  scenario: CheckScenario;
  /** False when the rule does not apply (ABS, category, mass); then passed is null. */
  applies: boolean;
  /** Null with applies true: the check could not be made (see missing_inputs); never counted as a pass. */
  passed: boolean | null;
  /** Design-file paths of the inputs a check that applies could not be made without (then passed is null). */
  missing_inputs?: string[];
  /** True for results shown for information that do not decide the exit status (the ABS-failed case). */
  advisory: boolean;
  /** Signed: positive = met with room to spare. */
  worst_margin: number | null;
  margin_unit: MarginUnit;
  worst_at_braking_rate: number | null;
  failing_ranges: [number, number][];
  /** Curve rules: the branch that passed (main requirement or an accepted alternative). */
  branch: string | null;
  branches?: BranchVerdict[];
  /** VERIFY_NOTE when the status is not "verified". */
  verify_note?: string;
  /** What the figures mean, why the rule does not apply, what limited the result. */
  note?: string;
  /** Figures behind the verdict, units in the key names. */
  details?: Record<string, number | string | boolean | null>;
}

export function verifyNoteFor(status: RuleStatus): { verify_note?: string } {
  return status === 'verified' ? {} : { verify_note: VERIFY_NOTE };
}

/** Checks that decide the outcome and did not pass (advisory and not-applicable results excluded). */
export function failedChecks(checks: readonly CheckResult[]): CheckResult[] {
  return checks.filter((c) => c.applies && !c.advisory && c.passed === false);
}

/** Words for each scenario, shared by the command line, the page and the evidence packet ('' = as designed). */
export const SCENARIO_LABELS: Record<CheckScenario, string> = {
  as_designed: '',
  abs_failed: 'ABS failed: checked as a vehicle without ABS, for information',
  front_circuit_only: 'rear circuit failed: front brakes only',
  rear_circuit_only: 'front circuit failed: rear brakes only',
  one_diagonal: 'one diagonal circuit failed',
  no_booster_assist: 'booster failed: no assist',
  facing_uphill: 'facing uphill',
  facing_downhill: 'facing downhill',
  parking_brake_capacity: 'parking-brake capacity',
  valve_stuck_open: 'proportioning valve stuck open: full pressure to the rear',
  valve_stuck_shut: 'proportioning valve stuck shut: no rear braking',
  valve_linkage_lowest_knee: 'load-sensing linkage broken: valve reads the vehicle as empty',
  valve_linkage_highest_knee: 'load-sensing linkage broken: valve reads the vehicle as fully laden',
  antilock_failed: 'antilock failed: the hydraulic distribution alone',
  ebd_failed: 'electronic brake-force distribution failed: hydraulic split as installed',
  hot_brakes: 'hot brakes after the heating sequence',
  with_trailer: 'towing the trailer',
  regeneration_on: 'largest regenerative force acting',
};
