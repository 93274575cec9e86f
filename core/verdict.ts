/**
 * The one verdict of a design (issue 12): every check that applies — the regulation checks (`checks`),
 * the failed distribution device per mode and load state (`failure_modes`, 71/320/EEC Annex II Appendix
 * point 6) and the regulation curve checks with regeneration at each analysed speed (`regen`) — sorted into
 * failed, not checked (an input is missing; never a pass) and advisories (shown for information, not deciding).
 *
 *   overall = "fail"        when anything that decides fails,
 *             "incomplete"  else when anything that decides could not be checked, or nothing was checked at all,
 *             "pass"        else.
 *
 * The command line, the workbench and the evidence packet print `summary` and each item's `description`
 * as they are, so all three say the same in the same words. Pure: reads result objects only.
 */
import type { CheckResult, MarginUnit } from './checks/check-result.ts';
import { SCENARIO_LABELS } from './checks/check-result.ts';
import type { RegenResult } from './regen.ts';
import type { RuleSource, RuleStatus } from './rules/rule-types.ts';
import { VALVE_FAILURE_SOURCE, type FailureModeResult } from './valve-failure.ts';

export type VerdictOverall = 'pass' | 'fail' | 'incomplete';

/** Where an item comes from: a regulation check, a failed distribution valve, a curve check with regeneration. */
export type CheckRefKind = 'check' | 'failure_mode' | 'regeneration';

export interface CheckRef {
  kind: CheckRefKind;
  /** Rule id (JSON readers); people read `title`. */
  rule: string;
  title: string;
  source: RuleSource;
  /** How sure we are of the rule's text. */
  status: RuleStatus;
  load_state: string | null;
  load_state_label: string | null;
  /** A check scenario (core/checks/check-result.ts), a valve failure mode, or "with_regeneration". */
  scenario: string;
  /** The scenario in words ('' = as designed). */
  scenario_label: string;
  /** Regeneration: the vehicle speed and the regenerative force at it; null otherwise. */
  speed_kmh: number | null;
  regen_force_n: number | null;
  /**
   * Regeneration: the largest regenerative force with which this load state's curve checks that pass without
   * regeneration still pass (N); null when the full force passes or there is none to keep (see regen).
   */
  regen_limit_n?: number | null;
  regen_limit_motor_nm?: number | null;
  passed: boolean | null;
  margin: number | null;
  margin_unit: MarginUnit;
  /** One line in plain words: where, what, by how much (printed as it is by every output). */
  description: string;
  /** Stable id of the item's row in the checks table of the workbench. */
  anchor: string;
}

export interface NotCheckedRef extends CheckRef {
  /** The missing inputs in words. */
  missing: string[];
  /** Their design-file paths. */
  missing_inputs: string[];
}

export interface Verdict {
  overall: VerdictOverall;
  /** One sentence: the overall verdict and the counts. */
  summary: string;
  counts: { checked: number; passed: number; failed: number; not_checked: number; advisories: number };
  failed: CheckRef[];
  not_checked: NotCheckedRef[];
  /** Results shown for information that do not decide (the ABS-failed case) and did not pass. */
  advisories: CheckRef[];
}

/** What the verdict is built from (parts of a lockstep-result/1). */
export interface VerdictInput {
  checks: readonly CheckResult[];
  failure_modes: readonly FailureModeResult[];
  regen: RegenResult | null;
  load_states: readonly { id: string; label: string }[];
}

// ---------------------------------------------------------------- words

const OVERALL_WORDS: Record<VerdictOverall, string> = { pass: 'PASS', fail: 'FAIL', incomplete: 'INCOMPLETE' };

/** "PASS", "FAIL", "INCOMPLETE". */
export function overallWord(v: Pick<Verdict, 'overall'>): string {
  return OVERALL_WORDS[v.overall];
}

/** Words for the design-file paths a check can be missing. */
const MISSING_WORDS: Record<string, string> = {
  parking_brake: 'the parking brake (which axle it brakes, hand or foot control, and its holding force or mechanism)',
  'hydraulics.booster_runout_bar': 'the booster runout pressure (the assist runs out above it; the check passes with unlimited assist and fails without any)',
  'regen.front_share': 'the share of the regenerative braking force on the front axle (all-wheel drive)',
  'parking_brake.holding_force_n':
    "the parking brake's holding force at the tyres, or its mechanism (lever ratio, efficiency, brake factor and effective radius)",
  'heat.front_rotor_kg': 'the front rotor (or drum) mass (brake heat inputs)',
  'heat.rear_rotor_kg': 'the rear rotor (or drum) mass (brake heat inputs)',
  'towing.load_state': 'the load state the trailer is towed in (towing inputs)',
  lightly_loaded: 'the lightly loaded vehicle: the unloaded vehicle and where the driver and instruments sit',
  'lightly_loaded.added_behind_front_axle_m': 'where the driver and instruments of the lightly loaded vehicle sit (distance behind the front axle)',
  'regen.category': 'the regeneration category (A: only on accelerator release; B: part of service braking)',
  'regen.abs_controls_regen_axle': 'whether the antilock also controls the regenerative axle',
  'regen.failure_warning': 'whether a regeneration failure that changes the braking distribution lights a warning',
  'systems.abs': 'the antilock status (braking-aid status inputs)',
  'systems.esc': 'the stability-control status (braking-aid status inputs)',
  'systems.ebd': 'the electronic brake-force distribution status (braking-aid status inputs)',
};

function missingWords(c: CheckResult): string[] {
  return (c.missing_inputs ?? []).map((p) => {
    if (p === 'load_states') return `a load state of kind ${String(c.details?.needs_load_state_kind ?? 'needed by the rule')}`;
    return Object.hasOwn(MISSING_WORDS, p) ? MISSING_WORDS[p]! : 'an input the check needs (named in the check\'s note)';
  });
}

function fixed(v: number, digits: number): string {
  const s = v.toFixed(digits);
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s;
}

function marginDigits(unit: MarginUnit): number {
  return unit === 'adhesion' ? 3 : unit === 'N' ? 0 : 2;
}

function amount(v: number, unit: MarginUnit): string {
  const n = fixed(Math.abs(v), marginDigits(unit));
  return unit === 'adhesion' ? `${n} (adhesion)` : `${n} ${unit}`;
}

/** "fails by 0.173 (adhesion)", "passes with 1.78 m/s² to spare", "not checked". */
function outcomeWords(passed: boolean | null, margin: number | null, unit: MarginUnit): string {
  if (passed === null) return 'not checked';
  if (margin === null || !Number.isFinite(margin)) return passed ? 'passes' : 'fails';
  return passed ? `passes with ${amount(margin, unit)} to spare` : `fails by ${amount(margin, unit)}`;
}

function where(label: string | null): string {
  return label ?? 'Whole design';
}

// ---------------------------------------------------------------- anchors

const slug = (s: string) => s.replace(/[^A-Za-z0-9_-]+/g, '-');

/** Id of a check's row in the checks table (stable: rule, load state, scenario, speed). */
export function checkAnchor(rule: string, loadState: string | null, scenario: string, speedKmh: number | null = null): string {
  return `check-${slug(rule)}-${slug(loadState ?? 'design')}-${slug(scenario)}${speedKmh === null ? '' : `-${slug(String(speedKmh))}kmh`}`;
}

// ---------------------------------------------------------------- the refs

function checkRef(c: CheckResult, labels: ReadonlyMap<string, string>): CheckRef {
  const label = c.load_state === null ? null : (labels.get(c.load_state) ?? c.load_state);
  const scen = SCENARIO_LABELS[c.scenario];
  const what = `${c.title}${scen ? ` (${scen})` : ''}`;
  const outcome =
    c.passed === null ? `not checked: needs ${missingWords(c).join('; ')}` : outcomeWords(c.passed, c.worst_margin, c.margin_unit);
  return {
    kind: 'check',
    rule: c.rule,
    title: c.title,
    source: c.source,
    status: c.status,
    load_state: c.load_state,
    load_state_label: label,
    scenario: c.scenario,
    scenario_label: scen,
    speed_kmh: null,
    regen_force_n: null,
    passed: c.passed,
    margin: c.worst_margin,
    margin_unit: c.margin_unit,
    description: `${where(label)}: ${what}: ${outcome}${c.advisory ? ' (for information)' : ''}`,
    anchor: checkAnchor(c.rule, c.load_state, c.scenario),
  };
}

export const VALVE_FAILURE_RULE = 'valve-failure';
const VALVE_FAILURE_TITLE = 'Distribution valve failed: secondary-braking deceleration';

function failureModeRef(f: FailureModeResult, labels: ReadonlyMap<string, string>): CheckRef {
  const label = labels.get(f.load_state) ?? f.load_state;
  const margin = f.max_deceleration_ms2 - f.required_ms2;
  return {
    kind: 'failure_mode',
    rule: VALVE_FAILURE_RULE,
    title: VALVE_FAILURE_TITLE,
    source: { document: '71/320/EEC Annex II', paragraph: VALVE_FAILURE_SOURCE.replace(/^71\/320\/EEC Annex II /, '') },
    status: 'partial',
    load_state: f.load_state,
    load_state_label: label,
    scenario: f.mode,
    scenario_label: f.description,
    speed_kmh: null,
    regen_force_n: null,
    passed: f.passed,
    margin,
    margin_unit: 'm/s²',
    description:
      `${label}: ${f.description}: ${fixed(f.max_deceleration_ms2, 2)} m/s² reached, ${fixed(f.required_ms2, 2)} m/s² required, ` +
      outcomeWords(f.passed, margin, 'm/s²'),
    anchor: checkAnchor(VALVE_FAILURE_RULE, f.load_state, f.mode),
  };
}

/** The regulation check of the same rule and load state that applies (null: not selected or not applicable). */
function matchingCheck(checks: readonly CheckResult[], rule: string, loadState: string): CheckResult | null {
  return checks.find((c) => c.rule === rule && c.load_state === loadState && c.applies) ?? null;
}

/** One item of the verdict; the ref (words and all) is built only when asked for (most items pass). */
interface Item {
  passed: boolean | null;
  advisory: boolean;
  ref: () => CheckRef;
  /** Not checked: the missing inputs in words and their paths. */
  missing?: () => { missing: string[]; missing_inputs: string[] };
}

function regenItems(regen: RegenResult, checks: readonly CheckResult[], labels: ReadonlyMap<string, string>, out: Item[]): void {
  // a case resting on a default nobody confirmed (the all-wheel-drive front share) is not checked
  const assumed = regen.assumed_inputs ?? [];
  const missing = assumed.length ? () => ({ missing: assumed.map((p) => MISSING_WORDS[p] ?? p), missing_inputs: [...assumed] }) : undefined;
  for (const st of regen.load_states) {
    const label = labels.get(st.id) ?? st.id;
    const limit = st.max_force_passing_checks_n;
    const motor = limit === null ? null : (limit * regen.tyre_radius_m) / regen.gear_ratio;
    const limitWords = () =>
      st.max_force_basis === 'full_force_passes'
        ? `; the full ${fixed(regen.max_force_n, 0)} N keeps the checks passing`
        : limit !== null
          ? `; largest regenerative force that keeps the checks passing ${fixed(limit, 0)} N (${fixed(motor!, 1)} N·m at the motor)`
          : '';
    for (const rc of st.checks) {
      if (rc.speed_kmh === null) continue; // zero regeneration: the regulation check itself
      const match = matchingCheck(checks, rc.rule, st.id);
      if (!match) continue;
      const passed = missing ? null : rc.passed;
      out.push({
        passed,
        advisory: match.advisory,
        ...(missing ? { missing } : {}),
        ref: () => ({
          kind: 'regeneration',
          rule: rc.rule,
          title: rc.title,
          source: match.source,
          status: rc.status,
          load_state: st.id,
          load_state_label: label,
          scenario: 'with_regeneration',
          scenario_label: `with ${fixed(rc.regen_force_n, 0)} N regeneration at ${rc.speed_kmh} km/h`,
          speed_kmh: rc.speed_kmh,
          regen_force_n: rc.regen_force_n,
          regen_limit_n: limit,
          regen_limit_motor_nm: motor,
          passed,
          margin: passed === null ? null : rc.worst_margin,
          margin_unit: 'adhesion',
          description:
            `${label}, ${rc.speed_kmh} km/h with ${fixed(rc.regen_force_n, 0)} N regeneration: ${rc.title}: ` +
            (passed === null
              ? `not checked: needs ${missing!().missing.join('; ')}`
              : `${outcomeWords(passed, rc.worst_margin, 'adhesion')}${passed ? '' : limitWords()}`) +
            (match.advisory ? ' (for information)' : ''),
          anchor: checkAnchor(rc.rule, st.id, 'regen', rc.speed_kmh),
        }),
      });
    }
  }
}

function items(r: VerdictInput): Item[] {
  const labels = new Map(r.load_states.map((s) => [s.id, s.label]));
  const out: Item[] = [];
  for (const c of r.checks) {
    if (!c.applies) continue;
    out.push({
      passed: c.passed,
      advisory: c.advisory,
      ref: () => checkRef(c, labels),
      ...(c.passed === null ? { missing: () => ({ missing: missingWords(c), missing_inputs: c.missing_inputs ?? [] }) } : {}),
    });
  }
  for (const f of r.failure_modes) out.push({ passed: f.passed, advisory: false, ref: () => failureModeRef(f, labels) });
  if (r.regen) regenItems(r.regen, r.checks, labels, out);
  return out;
}

/** Every item the verdict is made of, in order: checks, failed-valve cases, regeneration cases (for tables). */
export function verdictItems(r: VerdictInput): { ref: CheckRef; advisory: boolean }[] {
  return items(r).map((it) => ({ ref: it.ref(), advisory: it.advisory }));
}

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

export function buildVerdict(r: VerdictInput): Verdict {
  const failed: CheckRef[] = [];
  const notChecked: NotCheckedRef[] = [];
  const advisories: CheckRef[] = [];
  let checked = 0;
  let passedCount = 0;
  for (const it of items(r)) {
    if (it.advisory) {
      if (it.passed !== true) advisories.push(it.ref());
      continue;
    }
    if (it.passed === null) notChecked.push({ ...it.ref(), ...(it.missing?.() ?? { missing: [], missing_inputs: [] }) });
    else {
      checked++;
      if (it.passed) passedCount++;
      else failed.push(it.ref());
    }
  }
  // Nothing checked at all (every selected rule is not applicable) is no pass either.
  const overall: VerdictOverall = failed.length > 0 ? 'fail' : notChecked.length > 0 || checked === 0 ? 'incomplete' : 'pass';
  const parts = [`${plural(checked, 'check', 'checks')} made`, `${failed.length} failed`];
  if (notChecked.length) parts.push(`${plural(notChecked.length, 'check', 'checks')} could not be made (inputs missing)`);
  const head =
    overall === 'pass'
      ? 'PASS: every check that applies passes'
      : overall === 'fail'
        ? 'FAIL: at least one check fails'
        : checked === 0 && notChecked.length === 0
          ? 'INCOMPLETE: no check that applies to this design was selected'
          : 'INCOMPLETE: nothing fails, but not everything could be checked';
  return {
    overall,
    summary: `${head} (${parts.join(', ')}).`,
    counts: { checked, passed: passedCount, failed: failed.length, not_checked: notChecked.length, advisories: advisories.length },
    failed,
    not_checked: notChecked,
    advisories,
  };
}
