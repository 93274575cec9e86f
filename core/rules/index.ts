/**
 * The rule-set registry: every edition Lockstep knows, the ids a user may select (a set id such as
 * `eu-appendix`, or one rule such as `eu-appendix/efficiency`) and the default selection.
 */
import { euAppendix } from './eu-appendix.ts';
import { fmvss135 } from './fmvss135.ts';
import { performance } from './performance.ts';
import type { Category, Rule, RuleSet } from './rule-types.ts';
import { unR13h } from './un-r13h.ts';
import { withCases } from './case-sets.ts';
import { coreErrors } from '../errors.ts';

const withCaseRules = withCases(performance, unR13h, fmvss135);

export const RULE_SETS: readonly RuleSet[] = [euAppendix, withCaseRules.performance, withCaseRules.unR13h, withCaseRules.fmvss135];

/** Every id a design file's `rules` key or `--rules` may name: set ids, then rule ids. */
export const RULE_SELECTORS: readonly string[] = [
  ...RULE_SETS.map((s) => s.id),
  ...[...new Set(RULE_SETS.flatMap((s) => s.rules.map((r) => r.id)))],
];

/**
 * Default selection. The distribution rules of the 71/320 Appendix cover every category (the
 * variant of the lock-order rule follows the category), and the performance figures follow the
 * category too. With ABS on every axle the lock-order rules report "not applicable" and are
 * evaluated once more, labelled, for the ABS-failed vehicle.
 */
export function defaultRuleSelection(_category: Category, _abs: boolean): string[] {
  return ['eu-appendix', 'performance'];
}

export interface SelectedRule {
  rule: Rule;
  /** False when the rule set has no record for this category. */
  covers_category: boolean;
}

/** The rule records a selection names, for one category, in registry order, each id once. */
export function selectRules(selection: readonly string[], category: Category): SelectedRule[] {
  const unknown = selection.filter((s) => !RULE_SELECTORS.includes(s));
  if (unknown.length > 0) throw coreErrors.unknownRule(unknown, RULE_SELECTORS);
  const out: SelectedRule[] = [];
  const seen = new Set<string>();
  for (const set of RULE_SETS) {
    for (const r of set.rules) {
      if (seen.has(r.id)) continue;
      if (!selection.includes(set.id) && !selection.includes(r.id)) continue;
      const variants = set.rules.filter((x) => x.id === r.id);
      const match = variants.find((x) => x.categories.includes(category));
      seen.add(r.id);
      out.push(match ? { rule: match, covers_category: true } : { rule: r, covers_category: false });
    }
  }
  return out;
}

export * from './rule-types.ts';
export * from './case-rule-types.ts';
export { euAppendix, fmvss135, performance, unR13h };
