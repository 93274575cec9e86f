/**
 * Rule records for the inspection cases of issue 18 (residual braking, hot performance, the FMVSS 135
 * failure stops, R13-H regeneration categories, towing, ABS/ESC presence). Data like the other rules:
 * figures, document, paragraph, status; the checkers are in core/checks/cases.ts and the modules it names.
 */
import type { DecelerationFigures, RuleBase, RuleStatus } from './rule-types.ts';

/** Residual braking after failure of part of the transmission: laden and unladen figures differ. */
export interface ResidualRule extends RuleBase {
  kind: 'residual';
  laden: DecelerationFigures;
  unladen: DecelerationFigures;
  /** How sure we are of the unladen figures (the rule's status covers the laden ones). */
  unladen_status: RuleStatus;
}

/** A stop with the variable-proportioning system (valve or EBD) failed, or with the antilock failed. */
export interface FailureStopRule extends RuleBase {
  kind: 'valve_failure_stop' | 'abs_failure_stop';
  figures: DecelerationFigures;
}

/**
 * Hot performance after the Type-I heating sequence: the hot stop must reach `prescribed_share` of the
 * prescribed (cold) deceleration of `figures` and `cold_share` of the cold result.
 */
export interface HotRule extends RuleBase {
  kind: 'hot';
  figures: DecelerationFigures;
  prescribed_share: number;
  cold_share: number;
}

/** R13-H regeneration category: distribution with regeneration on (B), failure signalled. */
export interface RegenCategoryRule extends RuleBase {
  kind: 'regen_distribution' | 'regen_failure_warning';
}

/** A braking aid the document requires to be fitted and working. */
export interface SystemFittedRule extends RuleBase {
  kind: 'system_fitted';
  system: 'abs' | 'esc';
}

/** Service braking of the towing vehicle with its trailer: nose load on the hitch, unbraked trailer mass to stop. */
export interface TowingServiceRule extends RuleBase {
  kind: 'towing_service';
  figures: DecelerationFigures;
}

/** The towing vehicle's parking brake holds the whole combination on a gradient. */
export interface CombinationParkingRule extends RuleBase {
  kind: 'combination_parking';
  gradient_pct: number;
  max_hand_force_n: number;
  max_foot_force_n: number;
}

export type CaseRule = ResidualRule | FailureStopRule | HotRule | RegenCategoryRule | SystemFittedRule | TowingServiceRule | CombinationParkingRule;

export const CASE_RULE_KINDS: readonly CaseRule['kind'][] = [
  'residual',
  'valve_failure_stop',
  'abs_failure_stop',
  'hot',
  'regen_distribution',
  'regen_failure_warning',
  'system_fitted',
  'towing_service',
  'combination_parking',
];
