/**
 * R13-H regeneration categories (rules: core/rules/r13h-cases.ts, from memory):
 *   category A  regeneration only on accelerator release, not part of service braking: the
 *               distribution rules concern the friction brakes alone (checked as usual);
 *   category B  part of service braking: the Annex 5 curve rules of the selection must still hold
 *               with regeneration acting. Checked per load state with the largest regenerative force
 *               (constant-torque limit, core/regen.ts) added to the friction distribution by the
 *               design's blending; zero regeneration is the ordinary check. With antilock on every
 *               axle that also controls the regenerative axle the curve rules do not apply.
 * A failure that changes the distribution must be signalled to the driver: regen.failure_warning.
 */
import type { DesignFile } from '../design.ts';
import { regenDistribution, regenSetup } from '../regen.ts';
import type { RegenCategoryRule } from '../rules/case-rule-types.ts';
import { type CurveRule, selectRules } from '../rules/index.ts';
import type { StateModel } from '../state-model.ts';
import { type CheckResult, verifyNoteFor } from './check-result.ts';
import { base, factResult, notApplicable, notChecked } from './result-builders.ts';
import { checkCurveRule } from './curve-check.ts';

export const REGEN_NOT_CHECKED =
  'not checked here (a test must show them): the Type-0 test with the battery at its highest recommended charge, ' +
  'the hot performance with regeneration (special procedure for category B), and secondary braking with the electric part lost or at its largest force when its transmission fails';

function curveRulesFor(design: DesignFile, kind: string): CurveRule[] {
  return selectRules(['un-r13h'], design.vehicle.category)
    .filter((x) => x.covers_category && x.rule.kind === 'curve')
    .map((x) => x.rule as CurveRule)
    .filter((r) => r.load_states === 'all' || (r.load_states as readonly string[]).includes(kind));
}

export function regenDistributionResults(design: DesignFile, rule: RegenCategoryRule, states: readonly StateModel[]): CheckResult[] {
  const r = design.regen;
  if (!r) return [notApplicable(rule, null, 'not applicable: the design has no regenerative braking')];
  if (r.category === undefined) return [notChecked(rule, null, ['regen.category'], `not checked: state the regeneration category (A: only on accelerator release; B: part of service braking); ${REGEN_NOT_CHECKED}`)];
  if (r.category === 'A') {
    return [notApplicable(rule, null, `not applicable: category A regeneration is not part of service braking; the distribution rules are checked on the friction brakes alone; ${REGEN_NOT_CHECKED}`)];
  }
  if (design.vehicle.abs && r.abs_controls_regen_axle === undefined) {
    return [notChecked(rule, null, ['regen.abs_controls_regen_axle'], 'not checked: state whether the antilock also controls the regenerative axle (it then takes the vehicle out of the curve rules)')];
  }
  if (design.vehicle.abs && r.abs_controls_regen_axle) {
    return [notApplicable(rule, null, `not applicable: antilock controls every axle, the regenerative one included; ${REGEN_NOT_CHECKED}`)];
  }
  const setup = regenSetup(design, r);
  const R = setup.maxForce;
  return states.map((s) => {
    const rules = curveRulesFor(design, s.state.kind);
    const d = regenDistribution(s.dist, R, setup.frontShare, setup.blending);
    const verdicts = rules.map((cr) => ({ rule: cr, v: checkCurveRule(cr, s.loads, d) }));
    const failed = verdicts.filter((x) => !x.v.passed).map((x) => x.rule.id);
    const worst = verdicts.reduce<{ m: number; z: number | null } | null>((w, x) => (x.v.worst_margin !== null && (w === null || x.v.worst_margin < w.m) ? { m: x.v.worst_margin, z: x.v.worst_at_braking_rate } : w), null);
    const words = verdicts.length === 0
      ? 'no curve rule of R13-H covers this load state'
      : failed.length === 0
        ? `with ${Math.round(R)} N of regeneration every R13-H curve rule holds (${rules.map((x) => x.title.toLowerCase()).join('; ')})`
        : `with ${Math.round(R)} N of regeneration these fail: ${verdicts.filter((x) => !x.v.passed).map((x) => x.rule.title.toLowerCase()).join('; ')}`;
    return Object.assign(base(rule, s.state.id, 'regeneration_on'), verifyNoteFor(rule.status), {
      applies: true,
      passed: failed.length === 0,
      worst_margin: worst?.m ?? null,
      margin_unit: 'adhesion' as const,
      worst_at_braking_rate: worst?.z ?? null,
      note: `category B: ${words}; ${REGEN_NOT_CHECKED}`,
      details: { regen_force_n: R, blending: setup.blending.type, rules_checked: verdicts.length, failing_rules: failed.join(', ') || null },
    });
  });
}

export function regenWarningResult(design: DesignFile, rule: RegenCategoryRule): CheckResult {
  const r = design.regen;
  if (!r) return notApplicable(rule, null, 'not applicable: the design has no regenerative braking');
  if (r.category === undefined) return notChecked(rule, null, ['regen.category'], 'not checked: state the regeneration category (A or B)');
  if (r.category === 'A') return notApplicable(rule, null, 'not applicable: category A regeneration is not part of service braking');
  if (r.failure_warning === undefined) {
    return notChecked(rule, null, ['regen.failure_warning'], 'not checked: state whether a failure of the regeneration that changes the braking distribution lights a warning for the driver');
  }
  return factResult(
    rule,
    r.failure_warning,
    r.failure_warning
      ? 'a failure that changes the distribution is signalled to the driver (as stated; show it at the inspection)'
      : 'a failure of the regeneration that changes the distribution is not signalled to the driver',
  );
}
