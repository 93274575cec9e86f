/**
 * The checkers of the inspection-case rules (core/rules/case-rule-types.ts) and the shared builders
 * of their CheckResults. Residual braking, the FMVSS failure stops and the presence of antilock and
 * stability control are here; hot performance, regeneration categories and towing have their own
 * modules. A case whose inputs are missing gives applies: true, passed: null and missing_inputs.
 */
import { systemWorks } from '../cases-schema.ts';
import type { DesignFile } from '../design.ts';
import type { CaseRule, FailureStopRule, ResidualRule, SystemFittedRule } from '../rules/case-rule-types.ts';
import type { StateModel } from '../state-model.ts';
import { failedDistribution, failedValves, type ValveFailureMode } from '../valve-failure.ts';
import type { CheckResult, CheckScenario } from './check-result.ts';
import { circuitCases } from './circuit-failure.ts';
import { hotPerformanceResults } from './hot-performance.ts';
import { checkDeceleration } from './performance-check.ts';
import { regenDistributionResults, regenWarningResult } from './regen-category.ts';
import { asDecelerationRule, decelerationCheck, factResult, notApplicable, notChecked } from './result-builders.ts';
import { combinationParkingResults, towingServiceResults } from './towing.ts';

/** Residual braking: one circuit failed (as secondary braking), laden or unladen figures by load kind. */
function residualResults(design: DesignFile, rule: ResidualRule, s: StateModel): CheckResult[] {
  const unladen = s.state.kind === 'unladen';
  const figures = unladen ? rule.unladen : rule.laden;
  const status = unladen ? rule.unladen_status : rule.status;
  const as = asDecelerationRule(rule, figures, 'secondary');
  const words = `${unladen ? 'unladen' : 'laden'} residual figure ${figures.min_deceleration_ms2} m/s² at ${figures.speed_kmh} km/h`;
  return circuitCases(design.hydraulics.circuit_split).map((which) => decelerationCheck(rule, s.state.id, which, checkDeceleration(design, s, as, which), status, words));
}

const VALVE_SCENARIO: Record<ValveFailureMode, CheckScenario> = {
  passes_full_pressure: 'valve_stuck_open',
  blocks_rear: 'valve_stuck_shut',
  linkage_broken_lowest_knee: 'valve_linkage_lowest_knee',
  linkage_broken_highest_knee: 'valve_linkage_highest_knee',
};

const NO_ABS_CREDIT = 'antilock not credited (stricter reading): capped by the first wheel lock on the test surface';

/**
 * FMVSS stops with a failed part: the proportioning valve in each of its failed states (and, with EBD
 * working, EBD failed: the hydraulic split as installed), or the antilock failed.
 */
function failureStopResults(design: DesignFile, rule: FailureStopRule, s: StateModel): CheckResult[] {
  const as = asDecelerationRule(rule, rule.figures, 'secondary');
  if (rule.kind === 'abs_failure_stop') {
    if (!design.vehicle.abs) return [notApplicable(rule, s.state.id, 'not applicable: no working antilock; the other checks already treat the vehicle as without antilock')];
    return [decelerationCheck(rule, s.state.id, 'antilock_failed', checkDeceleration(design, s, as, null), rule.status, 'capped by the first wheel lock on the test surface')];
  }
  const out: CheckResult[] = [];
  for (const f of failedValves(design.hydraulics.rear_valve)) {
    const failed: StateModel = Object.assign({}, s, { dist: failedDistribution(s, f) });
    out.push(decelerationCheck(rule, s.state.id, VALVE_SCENARIO[f.mode], checkDeceleration(design, failed, as, null), rule.status, NO_ABS_CREDIT));
  }
  if (systemWorks(design.systems?.ebd)) {
    out.push(decelerationCheck(rule, s.state.id, 'ebd_failed', checkDeceleration(design, s, as, null), rule.status, `electronic distribution not acting; ${NO_ABS_CREDIT}`));
  }
  if (out.length === 0) out.push(notApplicable(rule, s.state.id, 'not applicable: no variable proportioning system (no rear valve, no working electronic brake-force distribution)'));
  return out;
}

const SYSTEM_WORDS = { abs: 'antilock', esc: 'stability control' } as const;

function systemFittedResult(design: DesignFile, rule: SystemFittedRule): CheckResult {
  const what = SYSTEM_WORDS[rule.system];
  const status = design.systems?.[rule.system];
  if (rule.system === 'abs') {
    return factResult(rule, design.vehicle.abs, design.vehicle.abs ? `${what} fitted and working` : `no working ${what}${status ? ` (stated: ${status.replace('_', ' ')})` : ''}`);
  }
  const working = status !== undefined ? systemWorks(status) : design.conversion?.stability_control_working;
  if (working === undefined) return notChecked(rule, null, ['systems.esc'], `not checked: state whether ${what} is fitted and working (braking-aid status inputs)`);
  return factResult(rule, working, working ? `${what} fitted and working` : `no working ${what}${status ? ` (stated: ${status.replace('_', ' ')})` : ''}`);
}

/** Every CheckResult of one case rule: `states` are the load states the rule covers, `all` the design's. */
export function caseResults(design: DesignFile, rule: CaseRule, states: readonly StateModel[], all: readonly StateModel[]): CheckResult[] {
  switch (rule.kind) {
    case 'residual':
      return states.flatMap((s) => residualResults(design, rule, s));
    case 'valve_failure_stop':
    case 'abs_failure_stop':
      return states.flatMap((s) => failureStopResults(design, rule, s));
    case 'hot':
      return hotPerformanceResults(design, rule, states);
    case 'regen_distribution':
      return regenDistributionResults(design, rule, states);
    case 'regen_failure_warning':
      return [regenWarningResult(design, rule)];
    case 'system_fitted':
      return [systemFittedResult(design, rule)];
    case 'towing_service':
      return towingServiceResults(design, rule, states, all);
    case 'combination_parking':
      return combinationParkingResults(design, rule, states, all);
  }
}
