/**
 * The document model (report/document.ts) as HTML: tables with a caption, titled columns and their unit, row ids
 * and tones; text as paragraphs; items as lists. Every number and word arrives formatted from report/; codes
 * behind the words go only into title attributes (tooltips).
 */
import type { Block, Cell, CellLike, Items, Row, Table, Text, Tone } from '../../report/document.ts';
import { html, type SafeHtml } from '../html.ts';

const asCell = (c: CellLike): Cell => (typeof c === 'string' ? { text: c } : c);

const TONE_CLASS: Record<Tone, string> = { ok: 'ok', fail: 'fail', nc: 'nc', na: 'na', info: 'info', warn: 'warn', neutral: '' };

export function cellInner(c: CellLike): SafeHtml {
  const x = asCell(c);
  return html`${x.text}${(x.sub ?? []).map((s) => html`<br><small>${s}</small>`)}${x.verify ? html`<br><small class="verify">${x.verify}</small>` : ''}${
    x.more?.length ? html`<details class="cell-more"><summary>How it was found</summary>${x.more.map((m) => html`<small>${m}</small>`)}</details>` : ''
  }`;
}

function cellHtml(c: CellLike, head: string, first: boolean): SafeHtml {
  const x = asCell(c);
  const cls = x.tone ? TONE_CLASS[x.tone] : '';
  const attrs = html`${cls ? html` class="${cls}"` : ''}${x.code ? html` title="${x.code}"` : ''} data-label="${head}"`;
  return first ? html`<th scope="row"${attrs}>${cellInner(x)}</th>` : html`<td${attrs}>${cellInner(x)}</td>`;
}

export interface TableOptions {
  /** Class of the table element (default "numbers data"). */
  cls?: string;
  /** Row class from its tone (default: the tone's class). */
  rowClass?: (r: Row) => string;
  /** Caption shown (default) or only for screen readers. */
  caption?: 'shown' | 'sr';
}

export function tableHtml(t: Table, opts: TableOptions = {}): SafeHtml {
  const rowClass = opts.rowClass ?? ((r: Row) => (r.tone ? TONE_CLASS[r.tone] : ''));
  const heads = t.columns.map((c) => (c.unit ? `${c.head} (${c.unit})` : c.head));
  return html`<div class="scroll"><table class="${opts.cls ?? 'numbers data'}" id="${t.id}">
<caption${opts.caption === 'sr' ? html` class="sr"` : ''}>${t.title}</caption>
<thead><tr>${t.columns.map((c) => html`<th scope="col">${c.head}${c.unit ? html`<br><span class="unit">${c.unit}</span>` : ''}</th>`)}</tr></thead>
<tbody>${t.rows.map((r) => {
  const cls = rowClass(r);
  return html`<tr${cls ? html` class="${cls}"` : ''}${r.id ? html` id="${r.id}"` : ''}>${r.cells.map((c, i) => cellHtml(c, heads[i] ?? '', i === 0))}</tr>`;
})}</tbody>
</table></div>`;
}

export function textHtml(t: Text): SafeHtml {
  const cls = [t.hint ? 'hint' : '', t.tone ? TONE_CLASS[t.tone] : ''].filter(Boolean).join(' ');
  return html`<p${cls ? html` class="${cls}"` : ''}>${t.text}</p>`;
}

export function itemsHtml(b: Items, cls = 'warnings'): SafeHtml {
  return html`${b.title ? html`<p>${b.title}</p>` : ''}<ul class="${cls}">${b.items.map(
    (it) => html`<li${it.code ? html` title="${it.code}"` : ''}>${it.word ? html`<strong>${it.word}</strong> ` : ''}${it.text}${it.detail ? html`<br><small>${it.detail}</small>` : ''}</li>`,
  )}</ul>`;
}

export function blockHtml(b: Block, opts: TableOptions = {}): SafeHtml {
  if (b.kind === 'text') return textHtml(b);
  if (b.kind === 'items') return itemsHtml(b);
  return tableHtml(b, opts);
}

export function blocksHtml(bs: readonly Block[], opts: TableOptions = {}): SafeHtml {
  return html`${bs.map((b) => blockHtml(b, opts))}`;
}
