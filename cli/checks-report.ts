/** The regulation-check section of `lockstep evaluate`'s text report: per load state, one entry per check. */
import { type CheckResult, type EvaluationResult, SCENARIO_LABELS, VERIFY_NOTE } from '../core/index.ts';
import { fmt } from './table.ts';


export function verdictWord(c: CheckResult): string {
  if (!c.applies) return 'n/a';
  if (c.passed === null) return 'NOT CHECKED';
  if (c.passed) return 'PASS';
  return c.advisory ? 'fail (info)' : 'FAIL';
}

function signed(v: number | null, digits: number): string {
  if (v === null || !Number.isFinite(v)) return '—';
  return `${v >= 0 ? '+' : '−'}${fmt(Math.abs(v), digits)}`;
}

/** Margin with its unit, e.g. "+0.084 (adhesion)" or "−0.27 m/s²". */
export function marginText(c: CheckResult): string {
  if (c.worst_margin === null) return '—';
  if (c.margin_unit === 'adhesion') return `${signed(c.worst_margin, 3)} (adhesion)`;
  return `${signed(c.worst_margin, c.margin_unit === 'N' ? 0 : 2)} ${c.margin_unit}`;
}

/** "z 0.312–0.420, 0.55–0.61" or "" when nothing fails. */
export function failingText(c: CheckResult): string {
  if (c.failing_ranges.length === 0) return '';
  return `fails for z ${c.failing_ranges.map(([a, b]) => `${fmt(a, 3)}–${fmt(b, 3)}`).join(', ')}`;
}

function entry(c: CheckResult): string[] {
  const scen = SCENARIO_LABELS[c.scenario];
  const head = [`${verdictWord(c).padEnd(11)} ${c.rule}${scen ? ` (${scen})` : ''}`];
  if (c.applies) {
    if (c.passed !== null) head.push(`margin ${marginText(c)}`);
    if (c.worst_at_braking_rate !== null) head.push(`worst at z = ${fmt(c.worst_at_braking_rate, 3)}`);
    const f = failingText(c);
    if (f) head.push(f);
    if (c.branch && c.branch !== 'primary' && c.branch !== 'efficiency-line') head.push(`met by: ${c.branch}`);
  }
  const lines = [`    ${head.join('; ')}`];
  const status = c.status === 'verified' ? 'verified' : `${c.status}: ${VERIFY_NOTE}`;
  lines.push(`                ${c.source.document}, ${c.source.paragraph} [${status}]`);
  if (c.note) lines.push(`                ${c.note}`);
  return lines;
}

export function checksSection(r: EvaluationResult): string[] {
  if (r.checks.length === 0) return [];
  const out = ['Regulation checks (margins: adhesion units for the curve rules, m/s² for decelerations):'];
  const general = r.checks.filter((c) => c.load_state === null);
  if (general.length) {
    out.push('  Whole design:');
    for (const c of general) out.push(...entry(c));
  }
  for (const s of r.load_states) {
    const mine = r.checks.filter((c) => c.load_state === s.id);
    if (mine.length === 0) continue;
    out.push(`  Load state "${s.id}" (${s.kind}):`);
    for (const c of mine) out.push(...entry(c));
  }
  const own = new Set(r.load_states.map((s) => s.id));
  for (const id of new Set(r.checks.map((c) => c.load_state).filter((x): x is string => x !== null && !own.has(x)))) {
    out.push(`  Derived load state "${id}" (made from the lightly loaded or towing inputs):`);
    for (const c of r.checks.filter((x) => x.load_state === id)) out.push(...entry(c));
  }
  // the one verdict (regeneration and failed-valve cases included), in the same words as at the top
  out.push(`  Verdict: ${r.verdict.summary}`);
  return out;
}
