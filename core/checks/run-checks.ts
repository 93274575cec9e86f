/**
 * Runs the selected rule sets on every load state of a design and returns one CheckResult per rule,
 * load state and scenario. Selection: the `--rules` option, else the design's `rules` key, else the
 * default for the category and ABS (core/rules/index.ts).
 */
import type { DesignFile } from '../design.ts';
import type { CurveRule, DecelerationRule, ParkingRule, Rule } from '../rules/rule-types.ts';
import type { StateModel } from '../state-model.ts';
import { type CheckResult, type CheckScenario, verifyNoteFor } from './check-result.ts';
import { circuitCases } from './circuit-failure.ts';
import { checkCurveRule } from './curve-check.ts';
import { checkDeceleration, checkParking } from './performance-check.ts';
import { caseResults } from './cases.ts';
import { base, isCaseRule, notApplicable } from './result-builders.ts';
import { designRules, type RunChecksOptions } from './selection.ts';
import { derivedForRule, derivedStates } from './lightly-loaded.ts';

export const ABS_EXEMPT_NOTE =
  'not applicable: ABS directly controls the wheels of every axle (71/320/EEC Annex II Appendix point 1 with Annex X; ' +
  'R13-H likewise, from memory); the curves are still shown, and the ABS-failed case is checked below as a vehicle without ABS';

export const ABS_FAILED_NOTE = 'ABS failed: evaluated as a vehicle without ABS (the hydraulic valve as designed); shown for information';

/** What a load-sensing valve was modelled as reading, for the curve checks' notes (issue 12 point 7). */
function valveNoteOf(design: DesignFile): string | null {
  const v = design.hydraulics.rear_valve;
  if (v.type !== 'load_sensing') return null;
  return v.senses === 'static'
    ? 'load-sensing valve: knee read off the static rear axle load (as stated in the design)'
    : 'load-sensing valve: knee follows the rear axle load while braking (suspension travel, the default)';
}

function curveResult(rule: CurveRule, s: StateModel, scenario: CheckScenario, advisory: boolean, valveNote: string | null): CheckResult {
  const v = checkCurveRule(rule, s.loads, s.dist);
  const lift = v.branches.some((b) => b.lift_off_in_range);
  const notes = [rule.note ?? ''];
  if (advisory) notes.unshift(ABS_FAILED_NOTE);
  if (lift) notes.push(`the rear axle lifts off at z = ${s.loads.zLift.toFixed(3)}, inside the checked range (counted as failing above it)`);
  if (valveNote) notes.push(valveNote);
  const extra: Pick<CheckResult, 'details'> = {};
  if (rule.requirement_words) {
    // light N1 (core/rules/light-n1.ts): which requirement decided, and the one it replaced for information
    const replaced = rule.replaces ? checkCurveRule(rule.replaces, s.loads, s.dist) : null;
    extra.details = {
      requirement_applied: rule.replaces ? 'M1' : 'N1',
      requirement_reason: rule.requirement_words,
      replaced_requirement_passed: replaced ? replaced.passed : null,
      replaced_requirement_margin: replaced ? replaced.worst_margin : null,
    };
    if (replaced) notes.push(`the N1 requirement alone would ${replaced.passed ? 'pass' : 'fail'}, margin ${replaced.worst_margin === null ? 'none' : replaced.worst_margin.toFixed(3)} (for information)`);
  }
  return Object.assign(base(rule, s.state.id, scenario), { status: v.status }, verifyNoteFor(v.status), {
    applies: true,
    passed: v.passed,
    advisory,
    worst_margin: v.worst_margin,
    margin_unit: 'adhesion' as const,
    worst_at_braking_rate: v.worst_at_braking_rate,
    failing_ranges: v.failing_ranges,
    branch: v.branch,
    branches: v.branches,
    note: notes.filter(Boolean).join('; '),
  }, extra);
}

/**
 * A booster without a stated runout pressure is modelled as never running out. Whether that decides a verdict is
 * tested with the lowest possible runout (0: no assist at all, which any real booster beats): when the two readings
 * disagree the verdict rests on the missing runout, and the check is "not checked" (issue 12 point 5).
 */
function restsOnRunout(design: DesignFile, rule: DecelerationRule, s: StateModel, which: Parameters<typeof checkDeceleration>[3], passed: boolean): boolean {
  const h = design.hydraulics;
  if (rule.kind === 'booster_failure' || h.booster_ratio <= 1 || h.booster_runout_bar !== undefined || !passed) return false;
  const none = { ...s, pedal: { ...s.pedal, runout: 0 } };
  return !checkDeceleration(design, none, rule, which).passed;
}

export const RUNOUT_MISSING_NOTE = 'not checked: the verdict depends on the booster runout pressure, which is not given';

function decelerationResults(design: DesignFile, rule: DecelerationRule, s: StateModel): CheckResult[] {
  const cases = rule.kind === 'secondary' ? circuitCases(design.hydraulics.circuit_split) : [null];
  return cases.map((which) => {
    const o = checkDeceleration(design, s, rule, which);
    if (restsOnRunout(design, rule, s, which, o.passed)) {
      return Object.assign(base(rule, s.state.id, o.scenario), verifyNoteFor(rule.status), {
        applies: true,
        passed: null,
        missing_inputs: ['hydraulics.booster_runout_bar'],
        worst_margin: null,
        margin_unit: 'm/s²' as const,
        note: `${RUNOUT_MISSING_NOTE} (with unlimited assist: ${o.note})`,
        details: o.details,
      });
    }
    return Object.assign(base(rule, s.state.id, o.scenario), verifyNoteFor(rule.status), {
      applies: true,
      passed: o.passed,
      worst_margin: o.margin_ms2,
      margin_unit: 'm/s²' as const,
      note: o.note,
      details: o.details,
    });
  });
}

function parkingResults(design: DesignFile, rule: ParkingRule, s: StateModel): CheckResult[] {
  return checkParking(design, s, rule).map((o) =>
    Object.assign(base(rule, s.state.id, o.scenario), verifyNoteFor(rule.status), {
      applies: true,
      passed: o.passed,
      ...(o.missing_inputs ? { missing_inputs: o.missing_inputs } : {}),
      worst_margin: o.margin,
      margin_unit: o.margin_unit,
      note: o.note,
      details: o.details,
    }),
  );
}

export { base, notApplicable } from './result-builders.ts';
export { type RunChecksOptions, ruleSelection } from './selection.ts';

export function runChecks(design: DesignFile, models: readonly StateModel[], opts: RunChecksOptions = {}): CheckResult[] {
  const category = design.vehicle.category;
  // the maximum permitted mass where the design rates it (GVWR), else the heaviest load state
  const rated = design.ratings?.max_mass_kg;
  const heaviest = rated ?? Math.max(...models.map((m) => m.state.mass_kg));
  const massWords = rated !== undefined ? 'the maximum permitted mass (ratings.max_mass_kg) is' : 'the heaviest load state is';
  const out: CheckResult[] = [];
  const valveNote = valveNoteOf(design);
  const selected = designRules(design, opts);
  const derived = derivedStates(design, selected); // the FMVSS lightly loaded vehicle, when those rules are selected
  for (const { rule, covers_category } of selected) {
    if (!covers_category) {
      out.push(notApplicable(rule, null, `not applicable: ${rule.rule_set} has no requirement "${rule.id}" for category ${category} (covers ${rule.categories.join(', ')})`));
      continue;
    }
    if (rule.max_mass_kg !== undefined && heaviest > rule.max_mass_kg) {
      out.push(notApplicable(rule, null, `not applicable: covers vehicles up to ${rule.max_mass_kg} kg; ${massWords} ${heaviest} kg`));
      continue;
    }
    const extra = derivedForRule(rule, derived);
    const pool = extra.models.length ? [...models, ...extra.models] : models;
    out.push(...extra.not_checked);
    const states = rule.load_states === 'all' ? pool : pool.filter((m) => (rule.load_states as readonly string[]).includes(m.state.kind));
    if (states.length === 0) {
      // The rule applies to every vehicle of the category: without the load state it needs it is not checked (never a pass).
      const kinds = (rule.load_states as readonly string[]).join(' or ');
      out.push(
        Object.assign(notApplicable(rule, null, `not checked: needs a load state of kind ${kinds}`), {
          applies: true,
          missing_inputs: ['load_states'],
          details: { needs_load_state_kind: kinds },
        }),
      );
      continue;
    }
    if (isCaseRule(rule)) {
      out.push(...caseResults(design, rule, states, models));
      continue;
    }
    const first = out.length;
    for (const s of states) {
      if (rule.kind === 'curve') {
        if (rule.abs_exempt && design.vehicle.abs) {
          out.push(notApplicable(rule, s.state.id, ABS_EXEMPT_NOTE));
          out.push(curveResult(rule, s, 'abs_failed', true, valveNote));
        } else out.push(curveResult(rule, s, 'as_designed', false, valveNote));
      } else if (rule.kind === 'parking') out.push(...parkingResults(design, rule, s));
      else out.push(...decelerationResults(design, rule, s));
    }
    extra.annotate(out, first, states);
  }
  return out;
}
