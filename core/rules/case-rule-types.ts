/**
 * Rule records for the inspection cases of issue 18 (residual braking, hot performance, the FMVSS 135
 * failure stops, R13-H regeneration categories, towing, ABS/ESC presence). Data like the other rules:
 * figures, document, paragraph, status; the checkers are in core/checks/cases.ts and the modules it names.
 * The records themselves are declared in rule-types.ts with the other rule shapes (one module owns them);
 * this module names the case rules for the modules that work on them.
 */
export type { ResidualRule, FailureStopRule, HotRule, RegenCategoryRule, SystemFittedRule, TowingServiceRule, CombinationParkingRule, CaseRule } from './rule-types.ts';
export { CASE_RULE_KINDS } from './rule-types.ts';
