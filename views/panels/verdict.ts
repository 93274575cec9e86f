/**
 * The verdict: first the one overall verdict of the design (core/verdict.ts: every check, the failed-valve and the
 * regeneration cases), green only when it is "pass", each failing or not-checked item linked to its row in the checks
 * table; then per load state the lock order on every surface, critical braking rate, lowest efficiency, warnings.
 */
import { type CheckRef, type EvaluationResult, type LoadStateResult, overallWord, type UnitSystem, type Verdict } from '../../core/index.ts';
import { buildDocument, sectionOf, type Text } from '../../report/document.ts';
import * as F from '../../report/format.ts';
import { lockSummary, lockTable, stateFacts, warningItems } from '../../report/states.ts';
import { blockHtml, itemsHtml } from './document.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel, ResultContext } from './panel.ts';

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

function stateVerdict(s: LoadStateResult, i: number, overallPass: boolean, units: UnitSystem, warnings: SafeHtml): SafeHtml {
  const sum = lockSummary(s);
  // green only when the whole design passes (a load state whose lock order is right can still fail a check)
  const tone = sum.tone === 'ok' ? (overallPass ? 'ok' : 'neutral') : 'warn';
  const facts: Text[] = stateFacts(s, units);
  return html`<article class="verdict ${tone}" id="verdict-${i}" aria-labelledby="verdict-${i}-h">
<h3 id="verdict-${i}-h"><span class="swatch s${i % 8}" aria-hidden="true"></span>${s.label} <small>(${s.kind})</small></h3>
<p class="sum"><strong>${sum.tone === 'ok' ? 'Front first' : 'Check'}</strong> ${sum.text}${sum.tone === 'ok' && !overallPass ? ' Lock order only: see the verdict above.' : ''}</p>
<dl class="facts">
<div><dt>Critical braking rate</dt><dd>${s.critical_braking_rate === null ? 'none' : F.zText(s.critical_braking_rate)}</dd></div>
<div><dt>Lowest braking efficiency</dt><dd>${s.lowest_efficiency ? `${F.efficiency(s.lowest_efficiency.efficiency)} on k = ${F.adhesion(s.lowest_efficiency.adhesion)}` : F.DASH}</dd></div>
<div><dt>Rear lift-off at</dt><dd>${F.zText(s.rear_lift_off_braking_rate)}</dd></div>
</dl>
${blockHtml(lockTable(s, i), { cls: 'lock', caption: 'sr' })}
<details class="state-facts"><summary>More figures of this load state</summary>${facts.map((f) => html`<p>${f.text}</p>`)}</details>
${warnings}
</article>`;
}

export function verdicts(ctx: ResultContext): SafeHtml {
  const pass = ctx.result.verdict.overall === 'pass';
  const doc = buildDocument(ctx.result, { units: ctx.units });
  const stateWarnings = (i: number) => {
    const b = sectionOf(doc, `state-${i}`)?.blocks.find((x) => x.kind === 'items');
    return b && b.kind === 'items' ? itemsHtml(b) : html``;
  };
  const labels = ctx.result.load_states.map((s) => s.label);
  return html`<div class="verdicts">${ctx.result.load_states.map((s, i) => stateVerdict(s, i, pass, ctx.units, stateWarnings(i)))}</div>
${ctx.warnings.length ? itemsHtml(warningItems(ctx.warnings, labels, 'design-warnings'), 'warnings design-warnings') : ''}`;
}

export const verdictPanel: Panel = { id: 'verdict', title: 'Lock order per load state', results: verdicts };
