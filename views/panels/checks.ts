/**
 * Regulation checks per load state: the checks section of the document model (report/checks.ts) as tables: check,
 * verdict, margin in the unit system, where it fails, source and how sure its text is, with "verify against the
 * current official text" beside every partly verified or from-memory rule. The failed-valve and regeneration cases
 * of the verdict are rows of the same tables. Every row keeps the id the overall verdict links to.
 */
import { buildDocument, sectionOf } from '../../report/document.ts';
import { html, type SafeHtml } from '../html.ts';
import { blockHtml } from './document.ts';
import type { Panel, ResultContext } from './panel.ts';

export function checksTables(ctx: ResultContext): SafeHtml {
  const s = sectionOf(buildDocument(ctx.result, { units: ctx.units }), 'checks');
  if (!s) return html`<p class="hint">No rule set selected.</p>`;
  const [hint, ...rest] = s.blocks;
  const verdict = rest.pop();
  return html`<p class="sum"><strong>${verdict?.kind === 'text' ? verdict.text : ''}</strong>
${hint?.kind === 'text' ? hint.text : ''}</p>
${rest.map((b) => blockHtml(b, { cls: 'checks', rowClass: (r) => (r.tone ? `check-${r.tone}` : '') }))}`;
}

export const checksPanel: Panel = { id: 'checks', title: 'Regulation checks', results: checksTables };
