/**
 * The limit lines and corridors of the curve rules for one category, as plot-ready series for the
 * adhesion-utilisation chart (k against z): each constraint line over its z range, with the rule,
 * branch, axle it limits and the status of its source. Straight lines, so two points each.
 */
import type { Category } from '../rules/rule-types.ts';
import type { RuleStatus } from '../rules/rule-types.ts';
import { RULE_SETS, selectRules } from '../rules/index.ts';

export interface LimitSeries {
  rule: string;
  branch: string;
  /** "upper": the curve of `axle` must stay at or below; "lower": at or above. */
  kind: 'upper' | 'lower';
  axle: 'front' | 'rear';
  label: string;
  status: RuleStatus;
  braking_rate: [number, number];
  adhesion: [number, number];
}

/** Series for the curve rules of a selection (default: every rule set) that cover the category. */
export function limitSeries(category: Category, selection: readonly string[] = RULE_SETS.map((s) => s.id)): LimitSeries[] {
  const out: LimitSeries[] = [];
  for (const { rule, covers_category } of selectRules(selection, category)) {
    if (rule.kind !== 'curve' || !covers_category) continue;
    for (const b of rule.branches) {
      for (const p of b.pieces) {
        for (const clause of p.all_of) {
          for (const c of clause) {
            if (c.type === 'front_above_rear') continue;
            const [z0, z1] = p.z;
            const side = c.type === 'at_most' ? 'upper' : 'lower';
            out.push({
              rule: rule.id,
              branch: b.id,
              kind: side,
              axle: c.axle,
              label: `${rule.id} (${b.id}): ${c.axle} ${side === 'upper' ? '≤' : '≥'} ${c.line.intercept >= 0 ? '' : '−'}${Math.abs(c.line.intercept).toFixed(3)} + ${c.line.slope.toFixed(3)}·z, z ${z0}–${z1}`,
              status: b.status,
              braking_rate: [z0, z1],
              adhesion: [c.line.intercept + c.line.slope * z0, c.line.intercept + c.line.slope * z1],
            });
          }
        }
      }
    }
  }
  return out;
}
