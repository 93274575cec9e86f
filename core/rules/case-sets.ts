/**
 * The rule sets with the inspection cases of issue 18 added to their editions: residual braking, hot
 * performance and towing in `performance`; hot performance, regeneration categories, antilock and
 * stability control and the combination gradient in `un-r13h`; the failure stops in `fmvss135`.
 */
import type { DecelerationRule, Rule, RuleSet } from './rule-types.ts';
import type { Category } from './rule-types.ts';
import { fmvssFailureStops } from './fmvss-failure-stops.ts';
import { performanceHotRules, r13hHotRule } from './hot.ts';
import { r13hRegenRules, r13hSystemRules } from './r13h-cases.ts';
import { residualRules } from './residual.ts';
import { performanceTowingRules, r13hCombinationParking } from './towing.ts';
import { coreErrors } from '../errors.ts';

const CATEGORIES: readonly Category[] = ['M1', 'M2', 'M3', 'N1', 'N2', 'N3'];

function extended(set: RuleSet, extra: readonly Rule[]): RuleSet {
  return { id: set.id, title: set.title, rules: [...set.rules, ...extra] };
}

export function withCases(performance: RuleSet, unR13h: RuleSet, fmvss135: RuleSet): { performance: RuleSet; unR13h: RuleSet; fmvss135: RuleSet } {
  const service = unR13h.rules.find((r): r is DecelerationRule => r.id === 'un-r13h/service' && r.kind === 'service');
  if (!service) throw coreErrors.ruleTable('service rule in un-r13h');
  return {
    performance: extended(performance, [...residualRules(CATEGORIES), ...performanceHotRules(CATEGORIES), ...performanceTowingRules(CATEGORIES)]),
    unR13h: extended(unR13h, [r13hHotRule(service.figures), ...r13hRegenRules, ...r13hSystemRules, r13hCombinationParking]),
    fmvss135: extended(fmvss135, fmvssFailureStops),
  };
}
