/**
 * The regulation checks as tables: per load state one row per check, with the failed-valve and regeneration cases of
 * the verdict (core/verdict.ts) as rows of the same tables; verdict, margin in the unit system, where it fails,
 * source and how sure the rule's text is, with "verify against the current official text" beside every partly
 * verified or from-memory rule. Rows keep the ids the overall verdict links to.
 */
import { type CheckRef, type CheckResult, checkAnchor, type EvaluationResult, type UnitSystem, VERIFY_NOTE, verdictItems } from '../core/index.ts';
import * as F from './format.ts';
import { branchLabel, CHECK_STATUS_LABELS, derivedStateLabel, ruleLabel, RULE_STATUS_LABELS, scenarioLabel } from './labels.ts';
import { type Cell, col, type Row, type Section, type Table, text, type Tone } from './model.ts';
import { stateName } from './states.ts';

/** The verdict word and tone of a check. */
export function checkVerdict(c: Pick<CheckResult, 'applies' | 'passed' | 'advisory'>): { tone: Tone; text: string } {
  if (!c.applies) return { tone: 'na', text: CHECK_STATUS_LABELS.not_applicable };
  if (c.passed === null) return { tone: 'nc', text: CHECK_STATUS_LABELS.not_checked };
  if (c.passed) return { tone: 'ok', text: CHECK_STATUS_LABELS.pass };
  return c.advisory ? { tone: 'info', text: CHECK_STATUS_LABELS.advisory_fail } : { tone: 'fail', text: CHECK_STATUS_LABELS.fail };
}

const statusCell = (status: CheckResult['status']): Cell => ({
  text: RULE_STATUS_LABELS[status],
  ...(status === 'verified' ? {} : { verify: VERIFY_NOTE }),
});

function ruleCell(rule: string, scenario: string, scenarioWords: string, branch: string | null): Cell {
  const sub: string[] = [];
  if (scenario !== 'as_designed' && scenarioWords) sub.push(scenarioWords);
  if (branch && branch !== 'primary' && branch !== 'efficiency-line') sub.push(`met by ${branchLabel(branch)}`);
  return { text: ruleLabel(rule), code: rule, sub };
}

function checkRow(c: CheckResult, units: UnitSystem): Row {
  const v = checkVerdict(c);
  return {
    id: checkAnchor(c.rule, c.load_state, c.scenario),
    tone: v.tone,
    cells: [
      ruleCell(c.rule, c.scenario, scenarioLabel(c.scenario), c.branch),
      { text: v.text, tone: v.tone },
      c.applies && c.passed !== null ? F.margin(c.worst_margin, c.margin_unit, units) : F.DASH,
      c.applies && c.worst_at_braking_rate !== null ? F.brakingRate(c.worst_at_braking_rate) : F.DASH,
      c.failing_ranges.length ? `z ${c.failing_ranges.map(F.zRange).join(', ')}` : F.DASH,
      { text: `${c.source.document}, ${c.source.paragraph}`, ...(c.note ? { more: [c.note] } : {}) },
      statusCell(c.status),
    ],
  };
}

/** The scenario of a failed-valve or regeneration case in the unit system. */
function refScenario(r: CheckRef, units: UnitSystem): string {
  if (r.kind === 'regeneration' && r.regen_force_n !== null && r.speed_kmh !== null) {
    return `with ${F.force(r.regen_force_n, units)} regeneration at ${F.speed(r.speed_kmh, units)}`;
  }
  return scenarioLabel(r.scenario);
}

function refRow(r: CheckRef, advisory: boolean, units: UnitSystem): Row {
  const v = checkVerdict({ applies: true, passed: r.passed, advisory });
  const sub: string[] = [r.title];
  if (r.kind === 'regeneration' && r.passed === false && r.regen_limit_n !== undefined && r.regen_limit_n !== null) {
    sub.push(`largest regenerative force keeping the checks passing: ${F.force(r.regen_limit_n, units)} (${F.torque(r.regen_limit_motor_nm, units)} at the motor)`);
  }
  return {
    id: r.anchor,
    tone: v.tone,
    cells: [
      { text: ruleLabel(r.rule), code: r.rule, sub: [refScenario(r, units)] },
      { text: v.text, tone: v.tone },
      r.passed === null ? F.DASH : F.margin(r.margin, r.margin_unit, units),
      F.DASH,
      F.DASH,
      { text: `${r.source.document}, ${r.source.paragraph}`, sub },
      statusCell(r.status),
    ],
  };
}

const CHECK_COLUMNS = (units: UnitSystem) => [
  col('Check'),
  col('Verdict'),
  col('Margin', units === 'us' ? 'adhesion, ft/s² or lbf' : 'adhesion, m/s² or N'),
  col('Worst at z'),
  col('Fails for'),
  col('Source'),
  col('Status'),
];

function table(id: string, title: string, rows: Row[], units: UnitSystem): Table {
  return { kind: 'table', id, title, columns: CHECK_COLUMNS(units), rows };
}

/** Section `checks`: one table for the whole design, one per load state, one per derived load state. */
export function checksSection(r: EvaluationResult, units: UnitSystem): Section | null {
  if (r.checks.length === 0) return null;
  const blocks: Section['blocks'] = [
    text(`Margins: adhesion units for the curve rules, ${F.unitOf('deceleration', units)} for decelerations, ${F.unitOf('force', units)} for the parking-brake capacity.`, { hint: true }),
  ];
  const general = r.checks.filter((c) => c.load_state === null);
  if (general.length) blocks.push(table('checks-design', 'Whole design', general.map((c) => checkRow(c, units)), units));
  const cases = verdictItems(r).filter((it) => it.ref.kind !== 'check');
  r.load_states.forEach((s, i) => {
    const mine = r.checks.filter((c) => c.load_state === s.id).map((c) => checkRow(c, units));
    const extra = cases.filter((it) => it.ref.load_state === s.id).map((it) => refRow(it.ref, it.advisory, units));
    if (mine.length || extra.length) blocks.push(table(`checks-state-${i}`, `Load state ${stateName(s)}`, [...mine, ...extra], units));
  });
  const own = new Set(r.load_states.map((s) => s.id));
  const derived = [...new Set(r.checks.map((c) => c.load_state).filter((x): x is string => x !== null && !own.has(x)))];
  derived.forEach((id, i) => {
    blocks.push(table(`checks-derived-${i}`, `Derived load state: ${derivedStateLabel(id)} (made from the inputs)`, r.checks.filter((c) => c.load_state === id).map((c) => checkRow(c, units)), units));
  });
  blocks.push(text(`Verdict: ${r.verdict.summary}`));
  return { id: 'checks', title: 'Regulation checks', blocks };
}
