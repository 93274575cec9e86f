/**
 * Regulation checks per load state (core/checks): rule, verdict, margin, where it fails, source and
 * status, with "verify against the current official text" beside every partly verified or
 * from-memory verdict. Results of the whole design (a rule that does not apply) come first. The failed-valve and
 * regeneration cases of the verdict follow each load state's checks. Every row has a stable id (core/verdict.ts
 * checkAnchor) that the overall verdict links to.
 */
import { type CheckRef, checkAnchor, type CheckResult, SCENARIO_LABELS, VERIFY_NOTE, verdictItems } from '../../core/index.ts';
import { fixed } from '../format.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel, ResultContext } from './panel.ts';


function verdict(c: Pick<CheckResult, 'applies' | 'passed' | 'advisory'>): { cls: string; text: string } {
  if (!c.applies) return { cls: 'na', text: 'not applicable' };
  if (c.passed === null) return { cls: 'nc', text: 'NOT CHECKED' };
  if (c.passed) return { cls: 'ok', text: 'pass' };
  return c.advisory ? { cls: 'info', text: 'fails (information)' } : { cls: 'fail', text: 'FAIL' };
}

function margin(c: Pick<CheckResult, 'worst_margin' | 'margin_unit' | 'worst_at_braking_rate'>): string {
  if (c.worst_margin === null) return '–';
  const digits = c.margin_unit === 'adhesion' ? 3 : c.margin_unit === 'N' ? 0 : 2;
  const v = `${c.worst_margin >= 0 ? '+' : '−'}${fixed(Math.abs(c.worst_margin), digits)}`;
  const unit = c.margin_unit === 'adhesion' ? ' (adhesion)' : ` ${c.margin_unit}`;
  return `${v}${unit}${c.worst_at_braking_rate !== null ? ` at z = ${fixed(c.worst_at_braking_rate, 3)}` : ''}`;
}

function where(c: CheckResult): string {
  if (c.failing_ranges.length === 0) return '–';
  return `z ${c.failing_ranges.map(([a, b]) => `${fixed(a, 3)}–${fixed(b, 3)}`).join(', ')}`;
}

function row(c: CheckResult): SafeHtml {
  const v = verdict(c);
  const scen = SCENARIO_LABELS[c.scenario];
  return html`<tr class="check-${v.cls}" id="${checkAnchor(c.rule, c.load_state, c.scenario)}">
<th scope="row"><code>${c.rule}</code>${scen ? html`<br><small>${scen}</small>` : ''}${c.branch && c.branch !== 'primary' && c.branch !== 'efficiency-line' ? html`<br><small>met by: ${c.branch}</small>` : ''}</th>
<td class="verdict-cell">${v.text}</td>
<td>${margin(c)}</td>
<td>${where(c)}</td>
<td>${c.source.document}, ${c.source.paragraph}${c.note ? html`<br><small>${c.note}</small>` : ''}</td>
<td>${c.status}${c.status === 'verified' ? '' : html`<br><small class="verify">${VERIFY_NOTE}</small>`}</td>
</tr>`;
}

/** A failed-valve or regeneration case of the verdict (core/verdict.ts) as a row like the checks'. */
function refRow(r: CheckRef, advisory: boolean): SafeHtml {
  const v = verdict({ applies: true, passed: r.passed, advisory });
  const limit =
    r.kind === 'regeneration' && r.passed === false && r.regen_limit_n !== undefined && r.regen_limit_n !== null
      ? html`<br><small>largest regenerative force keeping the checks passing: ${fixed(r.regen_limit_n, 0)} N (${fixed(r.regen_limit_motor_nm ?? 0, 1)} N·m at the motor)</small>`
      : '';
  return html`<tr class="check-${v.cls}" id="${r.anchor}">
<th scope="row"><code>${r.rule}</code><br><small>${r.scenario_label}</small></th>
<td class="verdict-cell">${v.text}</td>
<td>${margin({ worst_margin: r.margin, margin_unit: r.margin_unit, worst_at_braking_rate: null })}${limit}</td>
<td>–</td>
<td>${r.source.document}, ${r.source.paragraph}<br><small>${r.title}</small></td>
<td>${r.status}${r.status === 'verified' ? '' : html`<br><small class="verify">${VERIFY_NOTE}</small>`}</td>
</tr>`;
}

function table(caption: string, rows: CheckResult[], extra: SafeHtml[] = []): SafeHtml {
  return html`<div class="scroll"><table class="checks">
<caption>${caption}</caption>
<thead><tr><th scope="col">Rule</th><th scope="col">Verdict</th><th scope="col">Margin</th><th scope="col">Fails for</th><th scope="col">Source</th><th scope="col">Status</th></tr></thead>
<tbody>${rows.map(row)}${extra}</tbody>
</table></div>`;
}

export function checksTables(ctx: ResultContext): SafeHtml {
  const checks = ctx.result.checks;
  if (checks.length === 0) return html`<p class="hint">No rule set selected.</p>`;
  const general = checks.filter((c) => c.load_state === null);
  // the failed-valve and regeneration cases count in the verdict like the checks: rows of the same tables
  const cases = verdictItems(ctx.result).filter((it) => it.ref.kind !== 'check');
  return html`<p class="sum"><strong>Verdict: ${ctx.result.verdict.summary}</strong>
Margins: adhesion units for the curve rules, m/s² for decelerations, N for the parking-brake capacity.</p>
${general.length ? table('Whole design', general) : ''}
${ctx.result.load_states.map((s) => {
  const mine = checks.filter((c) => c.load_state === s.id);
  const extra = cases.filter((it) => it.ref.load_state === s.id).map((it) => refRow(it.ref, it.advisory));
  return mine.length || extra.length ? table(`${s.label} (${s.kind}, id ${s.id})`, mine, extra) : '';
})}
${derivedStateIds(ctx).map((id) => table(`Derived load state ${id} (lightly loaded vehicle or towing, made from the inputs)`, checks.filter((c) => c.load_state === id)))}`;
}

/** Load states the checks derived themselves (FMVSS lightly loaded vehicle, towing), in order of appearance. */
function derivedStateIds(ctx: ResultContext): string[] {
  const own = new Set(ctx.result.load_states.map((s) => s.id));
  return [...new Set(ctx.result.checks.map((c) => c.load_state).filter((id): id is string => id !== null && !own.has(id)))];
}

export const checksPanel: Panel = { id: 'checks', title: 'Regulation checks', results: checksTables };
