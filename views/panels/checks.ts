/**
 * Regulation checks per load state (core/checks): rule, verdict, margin, where it fails, source and
 * status, with "verify against the current official text" beside every partly verified or
 * from-memory verdict. Results of the whole design (a rule that does not apply) come first.
 */
import { type CheckResult, SCENARIO_LABELS, VERIFY_NOTE } from '../../core/index.ts';
import { fixed } from '../format.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel, ResultContext } from './panel.ts';


function verdict(c: CheckResult): { cls: string; text: string } {
  if (!c.applies) return { cls: 'na', text: 'not applicable' };
  if (c.passed === null) return { cls: 'na', text: 'not checked' };
  if (c.passed) return { cls: 'ok', text: 'pass' };
  return c.advisory ? { cls: 'info', text: 'fails (information)' } : { cls: 'fail', text: 'FAIL' };
}

function margin(c: CheckResult): string {
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
  return html`<tr class="check-${v.cls}">
<th scope="row"><code>${c.rule}</code>${scen ? html`<br><small>${scen}</small>` : ''}${c.branch && c.branch !== 'primary' && c.branch !== 'efficiency-line' ? html`<br><small>met by: ${c.branch}</small>` : ''}</th>
<td class="verdict-cell">${v.text}</td>
<td>${margin(c)}</td>
<td>${where(c)}</td>
<td>${c.source.document}, ${c.source.paragraph}${c.note ? html`<br><small>${c.note}</small>` : ''}</td>
<td>${c.status}${c.status === 'verified' ? '' : html`<br><small class="verify">${VERIFY_NOTE}</small>`}</td>
</tr>`;
}

function table(caption: string, rows: CheckResult[]): SafeHtml {
  return html`<div class="scroll"><table class="checks">
<caption>${caption}</caption>
<thead><tr><th scope="col">Rule</th><th scope="col">Verdict</th><th scope="col">Margin</th><th scope="col">Fails for</th><th scope="col">Source</th><th scope="col">Status</th></tr></thead>
<tbody>${rows.map(row)}</tbody>
</table></div>`;
}

export function checksTables(ctx: ResultContext): SafeHtml {
  const checks = ctx.result.checks;
  if (checks.length === 0) return html`<p class="hint">No rule set selected.</p>`;
  const general = checks.filter((c) => c.load_state === null);
  const failed = checks.filter((c) => c.applies && !c.advisory && c.passed === false).length;
  return html`<p class="sum"><strong>${failed === 0 ? 'Every applicable check passes.' : `${failed} check${failed === 1 ? '' : 's'} failed.`}</strong>
Margins: adhesion units for the curve rules, m/s² for decelerations, N for the parking-brake capacity.</p>
${general.length ? table('Whole design', general) : ''}
${ctx.result.load_states.map((s) => {
  const mine = checks.filter((c) => c.load_state === s.id);
  return mine.length ? table(`${s.label} (${s.kind}, id ${s.id})`, mine) : '';
})}
${derivedStateIds(ctx).map((id) => table(`Derived load state ${id} (lightly loaded vehicle or towing, made from the inputs)`, checks.filter((c) => c.load_state === id)))}`;
}

/** Load states the checks derived themselves (FMVSS lightly loaded vehicle, towing), in order of appearance. */
function derivedStateIds(ctx: ResultContext): string[] {
  const own = new Set(ctx.result.load_states.map((s) => s.id));
  return [...new Set(ctx.result.checks.map((c) => c.load_state).filter((id): id is string => id !== null && !own.has(id)))];
}

export const checksPanel: Panel = { id: 'checks', title: 'Regulation checks', results: checksTables };
