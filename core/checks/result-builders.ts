/**
 * The builders every regulation check shares for its CheckResult: the common head of a result, the
 * not-applicable and not-checked results, a verdict on a stated fact and a deceleration outcome as a result
 * (here, below the modules that run the checks, so that none of them imports another back).
 */
import type { CaseRule } from '../rules/case-rule-types.ts';
import { CASE_RULE_KINDS } from '../rules/case-rule-types.ts';
import type { DecelerationFigures, DecelerationRule, Rule, RuleStatus } from '../rules/rule-types.ts';
import { type CheckResult, type CheckScenario, type MarginUnit, verifyNoteFor } from './check-result.ts';
import type { DecelerationOutcome } from './performance-check.ts';

// Results are built with Object.assign rather than object spread: on Node 20 spreading a result-sized
// object costs microseconds each, a large share of a whole evaluation (bench/evaluate.ts).
export function base(rule: Rule, loadState: string | null, scenario: CheckScenario): Omit<CheckResult, 'applies' | 'passed' | 'worst_margin' | 'margin_unit'> {
  return {
    rule: rule.id,
    rule_set: rule.rule_set,
    title: rule.title,
    source: rule.source,
    status: rule.status,
    load_state: loadState,
    scenario,
    advisory: false,
    worst_at_braking_rate: null,
    failing_ranges: [],
    branch: null,
  };
}

function marginUnit(rule: Rule): CheckResult['margin_unit'] {
  if (isCaseRule(rule)) return caseMarginUnit(rule);
  return rule.kind === 'curve' || rule.kind === 'parking' ? 'adhesion' : 'm/s²';
}

export function notApplicable(rule: Rule, loadState: string | null, note: string, scenario: CheckScenario = 'as_designed'): CheckResult {
  return Object.assign(base(rule, loadState, scenario), verifyNoteFor(rule.status), {
    applies: false,
    passed: null,
    worst_margin: null,
    margin_unit: marginUnit(rule),
    note,
  });
}

export function isCaseRule(rule: Rule): rule is CaseRule {
  return (CASE_RULE_KINDS as readonly string[]).includes(rule.kind);
}

export function caseMarginUnit(rule: CaseRule): MarginUnit {
  if (rule.kind === 'combination_parking') return 'adhesion';
  return rule.kind === 'regen_distribution' ? 'adhesion' : rule.kind === 'regen_failure_warning' || rule.kind === 'system_fitted' ? 'none' : 'm/s²';
}

/** Applies, but an input is missing: never a pass. */
export function notChecked(rule: Rule, loadState: string | null, missing: string[], note: string, scenario: CheckScenario = 'as_designed'): CheckResult {
  return Object.assign(base(rule, loadState, scenario), verifyNoteFor(rule.status), {
    applies: true,
    passed: null,
    worst_margin: null,
    margin_unit: isCaseRule(rule) ? caseMarginUnit(rule) : ('m/s²' as const),
    missing_inputs: missing,
    note,
  });
}

/** A verdict on a stated fact (no margin). */
export function factResult(rule: Rule, passed: boolean, note: string, details?: CheckResult['details']): CheckResult {
  return Object.assign(base(rule, null, 'as_designed'), verifyNoteFor(rule.status), {
    applies: true,
    passed,
    worst_margin: null,
    margin_unit: 'none' as const,
    note,
  }, details ? { details } : {});
}

/** A deceleration outcome as a CheckResult of a case rule. */
export function decelerationCheck(rule: Rule, loadState: string, scenario: CheckScenario, o: DecelerationOutcome, status: RuleStatus = rule.status, extraNote = ''): CheckResult {
  return Object.assign(base(rule, loadState, scenario), { status }, verifyNoteFor(status), {
    applies: true,
    passed: o.passed,
    worst_margin: o.margin_ms2,
    margin_unit: 'm/s²' as const,
    note: extraNote ? `${o.note}; ${extraNote}` : o.note,
    details: o.details,
  });
}

/**
 * The record a case rule's deceleration figures are checked as, through checkDeceleration. Kind
 * "secondary" with no failed circuit means: the distribution given, service pedal model, no ABS credit.
 */
export function asDecelerationRule(rule: CaseRule, figures: DecelerationFigures, kind: DecelerationRule['kind']): DecelerationRule {
  return { id: rule.id, rule_set: rule.rule_set, title: rule.title, source: rule.source, status: rule.status, categories: rule.categories, load_states: rule.load_states, kind, figures };
}
