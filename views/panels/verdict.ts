/**
 * The verdict: first the one overall verdict of the design (core/verdict.ts: every check, the failed-valve and the
 * regeneration cases), green only when it is "pass", each failing or not-checked item linked to its row in the checks
 * table; then per load state the lock order on every surface, critical braking rate, lowest efficiency, warnings.
 */
import { type CheckRef, type EvaluationResult, type LoadStateResult, type LockResult, overallWord, type Verdict } from '../../core/index.ts';
import { fixed } from '../format.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel, ResultContext } from './panel.ts';

const AXLE_TEXT: Record<LockResult['first_axle'], string> = { front: 'front', rear: 'REAR', both: 'both', none: 'lift-off' };

/** One sentence on the lock order of a load state. */
export function lockSummary(s: LoadStateResult): { tone: 'ok' | 'warn'; text: string } {
  const rear = s.lock.filter((l) => l.first_axle === 'rear');
  const none = s.lock.filter((l) => l.first_axle === 'none');
  const ks = (ls: LockResult[]) => ls.map((l) => l.adhesion).join(', ');
  if (rear.length === 0 && none.length === 0) {
    const both = s.lock.filter((l) => l.first_axle === 'both');
    return { tone: 'ok', text: `The front axle locks first on every surface analysed${both.length ? ` (both together on k = ${ks(both)})` : ''}.` };
  }
  const parts: string[] = [];
  if (rear.length) parts.push(`the rear axle locks first on k = ${ks(rear)}`);
  if (none.length) parts.push(`the rear wheels lift off before any lock on k = ${ks(none)}`);
  return { tone: 'warn', text: `Attention: ${parts.join('; ')}.` };
}

function itemLine(ref: CheckRef, word: string, cls: string): SafeHtml {
  return html`<li class="ov-${cls}"><a href="#${ref.anchor}"><strong class="ov-word">${word}</strong> ${ref.description}</a></li>`;
}

/**
 * The overall verdict, shown above everything else in the results column: the summary, then one line per failing and
 * per not-checked item (each a link to its row in the checks table), then the results shown for information.
 */
/**
 * The compact verdict in the sticky bar (views/pages/workbench.ts jumpBar): the word and the counts, one tap to
 * the full verdict above the results. Null: the results on the page are not current (inputs to fix).
 */
export function verdictBar(v: Verdict | null, oob = false): SafeHtml {
  const swap = oob ? html` hx-swap-oob="true"` : '';
  if (!v) return html`<div id="verdict-bar" class="verdict-bar"${swap}><a class="vb vb-stale" href="#results-top">Verdict not current: fix the marked inputs</a></div>`;
  const c = v.counts;
  return html`<div id="verdict-bar" class="verdict-bar"${swap}><a class="vb vb-${v.overall}" href="#overall-verdict"><strong>${overallWord(v)}</strong> ${c.failed} failing · ${c.not_checked} not checked</a></div>`;
}

export function overallVerdict(result: EvaluationResult): SafeHtml {
  const v = result.verdict;
  return html`<section class="overall-verdict ov-is-${v.overall}" id="overall-verdict" aria-labelledby="overall-verdict-h">
<h2 id="overall-verdict-h"><span class="ov-badge">${overallWord(v)}</span> Verdict of the whole design</h2>
<p class="ov-summary">${v.summary}</p>
${v.failed.length || v.not_checked.length ? html`<ul class="ov-items">${v.failed.map((f) => itemLine(f, 'FAIL', 'fail'))}${v.not_checked.map((n) => itemLine(n, 'NOT CHECKED', 'nc'))}</ul>` : ''}
${v.advisories.length ? html`<details class="ov-info"><summary>For information, not deciding (${v.advisories.length})</summary><ul class="ov-items">${v.advisories.map((a) => itemLine(a, 'INFO', 'info'))}</ul></details>` : ''}
</section>`;
}

function stateVerdict(s: LoadStateResult, i: number, overallPass: boolean): SafeHtml {
  const sum = lockSummary(s);
  const crit = s.critical_braking_rate;
  // green only when the whole design passes (a load state whose lock order is right can still fail a check)
  const tone = sum.tone === 'ok' ? (overallPass ? 'ok' : 'neutral') : 'warn';
  return html`<article class="verdict ${tone}" id="verdict-${i}" aria-labelledby="verdict-${i}-h">
<h3 id="verdict-${i}-h"><span class="swatch s${i % 8}" aria-hidden="true"></span>${s.label} <small>(${s.kind}, id ${s.id})</small></h3>
<p class="sum"><strong>${sum.tone === 'ok' ? 'Front first' : 'Check'}</strong> ${sum.text}${sum.tone === 'ok' && !overallPass ? ' Lock order only: see the verdict above.' : ''}</p>
<dl class="facts">
<div><dt>Critical braking rate</dt><dd>${crit === null ? 'none' : `z = ${fixed(crit, 3)}`}</dd></div>
<div><dt>Lowest braking efficiency</dt><dd>${s.lowest_efficiency ? `${fixed(s.lowest_efficiency.efficiency * 100, 1)} % on k = ${s.lowest_efficiency.adhesion}` : '–'}</dd></div>
<div><dt>Rear lift-off at</dt><dd>z = ${fixed(s.rear_lift_off_braking_rate, 2)}</dd></div>
</dl>
<div class="scroll"><table class="lock">
<caption class="sr">First axle to lock per surface, ${s.label}</caption>
<tr><th scope="row">Adhesion k</th>${s.lock.map((l) => html`<td>${l.adhesion}</td>`)}</tr>
<tr><th scope="row">Locks first</th>${s.lock.map((l) => html`<td class="ax-${l.first_axle}">${AXLE_TEXT[l.first_axle]}</td>`)}</tr>
<tr><th scope="row">at z</th>${s.lock.map((l) => html`<td>${fixed(l.braking_rate, 3)}</td>`)}</tr>
<tr><th scope="row">Efficiency</th>${s.lock.map((l) => html`<td>${fixed(l.efficiency * 100, 0)} %</td>`)}</tr>
</table></div>
${s.critical_braking_rates.length > 1 ? html`<p class="hint">The installed curve crosses the ideal at z = ${s.critical_braking_rates.map((z) => fixed(z, 3)).join(', ')}.</p>` : ''}
${s.warnings.length ? html`<ul class="warnings">${s.warnings.map((w) => html`<li><code>${w.code}</code> ${w.message}</li>`)}</ul>` : ''}
</article>`;
}

export function verdicts(ctx: ResultContext): SafeHtml {
  const pass = ctx.result.verdict.overall === 'pass';
  return html`<div class="verdicts">${ctx.result.load_states.map((s, i) => stateVerdict(s, i, pass))}</div>
${ctx.warnings.length ? html`<ul class="warnings design-warnings">${ctx.warnings.map((w) => html`<li><code>${w.code}</code> ${w.path ? html`<span class="path">${w.path}</span>: ` : ''}${w.message}</li>`)}</ul>` : ''}`;
}

export const verdictPanel: Panel = { id: 'verdict', title: 'Lock order per load state', results: verdicts };
