/**
 * The issue-4 curve checks (core/checks/curve-check.ts) run on a design with the full model
 * (thresholds, valve, balance bar): one margin per rule and load state, the smallest of them, and
 * whether every one passes. Used to report what a proposed change actually gives.
 */
import { verifyNoteFor } from '../checks/check-result.ts';
import { checkCurveRule, MARGIN_TOLERANCE } from '../checks/curve-check.ts';
import type { RuleStatus } from '../rules/rule-types.ts';
import type { DesignFile } from '../design.ts';
import { frontShareAtLowPressure } from '../distribution.ts';
import { stateModel } from '../state-model.ts';
import type { SizingRule } from './sizing-rules.ts';

export interface RuleMargin {
  rule: string;
  load_state: string;
  passed: boolean;
  /** Adhesion units; null when the rule's range reaches rear-axle lift-off. */
  margin: number | null;
  /** Branch that passed, or null. */
  branch: string | null;
  /** How sure the rule text is (the passing branch's, or the least certain); VERIFY_NOTE unless verified. */
  status: RuleStatus;
  verify_note?: string;
}

export interface DesignMargins {
  margins: RuleMargin[];
  /** Lowest margin over every rule and load state (null when a range reaches lift-off). */
  smallest_margin: number | null;
  passes: boolean;
  /** Front share of the braking force at low pressure, per load state (null where the axles never both brake). */
  front_share: (number | null)[];
}

export function designMargins(design: DesignFile, rules: readonly SizingRule[]): DesignMargins {
  const models = design.load_states.map((s) => stateModel(design, s));
  const margins: RuleMargin[] = [];
  for (const r of rules) {
    for (const i of r.states) {
      const m = models[i]!;
      const v = checkCurveRule(r.compiled.rule, m.loads, m.dist);
      let best: number | null = null;
      let liftOff = true;
      for (const b of v.branches) {
        if (b.lift_off_in_range) continue;
        liftOff = false;
        const w = b.worst_margin ?? Infinity;
        if (best === null || w > best) best = w;
      }
      margins.push({ rule: r.compiled.rule.id, load_state: m.state.id, passed: v.passed, margin: liftOff ? null : best, branch: v.branch, status: v.status, ...verifyNoteFor(v.status) });
    }
  }
  let smallest: number | null = Infinity;
  for (const m of margins) smallest = m.margin === null || smallest === null ? null : Math.min(smallest, m.margin);
  return {
    margins,
    smallest_margin: smallest === Infinity ? null : smallest,
    passes: margins.every((m) => m.passed),
    front_share: models.map((m) => frontShareAtLowPressure(m.dist)),
  };
}

export { MARGIN_TOLERANCE };
