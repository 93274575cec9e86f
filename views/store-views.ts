/**
 * HTML fragments of the design store, the before/after comparison and the packet print view. Every value a
 * person typed (design and load-state names, messages, identification fields) goes through the escaping
 * html`` tag; chart specs travel as JSON data blocks (views/chart.ts).
 */
import { CAUTION, type DiffEntry } from '../core/index.ts';
import type { Comparison } from '../report/compare.ts';
import { type Block, DRAFT_MARK, type PacketContent } from '../report/packet-document.ts';
import type { DesignSummary, HistoryEntry, SaveResult } from '../store/design-store.ts';
import { chartBlock } from './chart.ts';
import { html, ownSvg, type SafeHtml } from './html.ts';

const short = (rev: string) => rev.slice(0, 12);

/**
 * A design's name as listed: when another saved design has the same name, the two are told apart by their
 * creation time and the start of their id (the list never shows the same name twice without that).
 */
export function designLabel(d: DesignSummary, list: readonly DesignSummary[]): string {
  const same = list.filter((o) => o.name.trim().toLowerCase() === d.name.trim().toLowerCase());
  return same.length > 1 ? `${d.name} (created ${d.created_at.replace('T', ' ').slice(0, 16)}, design ${d.id.slice(0, 8)})` : d.name;
}

/** Options of the upload question "a new revision of which design?" (views/pages/workbench.ts uploadDialog). */
export function designChoicesView(list: DesignSummary[]): SafeHtml {
  return html`${list.map((d) => html`<option value="${d.id}">${designLabel(d, list)} – ${d.revision_count} revision${d.revision_count === 1 ? '' : 's'}, last saved ${d.updated_at.replace('T', ' ').slice(0, 16)} UTC</option>`)}`;
}

export function designsListView(list: DesignSummary[]): SafeHtml {
  if (list.length === 0) return html`<section id="designs" class="designs"><h2>Saved designs</h2><p>No saved designs yet.</p></section>`;
  return html`<section id="designs" class="designs"><h2>Saved designs</h2>
<table class="designs-list data"><thead><tr><th scope="col">Name</th><th scope="col">Revisions</th><th scope="col">Latest revision</th><th scope="col">Changed (UTC)</th><th scope="col"></th></tr></thead><tbody>
${list.map(
  (d) => html`<tr id="design-${d.id}"><td>${d.name}${designLabel(d, list) !== d.name ? html`<br><small class="twin">created ${d.created_at.replace('T', ' ').slice(0, 16)} · design ${d.id.slice(0, 8)}</small>` : ''}</td><td>${d.revision_count}</td><td><code title="${d.head_revision}">${short(d.head_revision)}</code></td><td>${d.updated_at}</td>
<td><a href="/designs/${d.id}/history" hx-get="/designs/${d.id}/history" hx-target="#designs" hx-swap="outerHTML">history</a>
· <a href="/api/designs/${d.id}">JSON</a>
· <a href="/revisions/${d.head_revision}/packet.pdf">packet PDF</a>
<form class="inline" hx-post="/designs/${d.id}/rename" hx-target="#designs" hx-swap="outerHTML"><label class="sr" for="rename-${d.id}">New name</label><input id="rename-${d.id}" name="name" value="${d.name}" maxlength="200" required><button type="submit" class="secondary">rename</button></form>
<button type="button" class="secondary" hx-post="/designs/${d.id}/duplicate" hx-target="#designs" hx-swap="outerHTML">duplicate</button>
<form class="inline" hx-post="/designs/${d.id}/delete" hx-target="#designs" hx-swap="outerHTML" hx-confirm="Delete this design and its whole history? This cannot be undone."><input type="hidden" name="confirm" value="${d.id}"><button type="submit" class="danger">delete</button></form></td></tr>`,
)}
</tbody></table>
${list.length > 1 ? html`<form class="compare-pick" action="/compare" method="get" hx-get="/compare" hx-target="#compare-result">
<label for="cmp-a">Before</label> <select id="cmp-a" name="a">${list.map((d, i) => html`<option value="${d.id}"${i === 1 ? html` selected` : ''}>${designLabel(d, list)}</option>`)}</select>
<label for="cmp-b">After</label> <select id="cmp-b" name="b">${list.map((d, i) => html`<option value="${d.id}"${i === 0 ? html` selected` : ''}>${designLabel(d, list)}</option>`)}</select>
<button type="submit">Compare</button></form>
<div id="compare-result" aria-live="polite"></div>` : ''}
</section>`;
}

/**
 * A design's history. `designs` gives the design file of each revision, for the "open in the page" buttons
 * (a hidden form posts it to the workbench as an upload; the JSON sits escaped in a quoted attribute).
 */
export function historyView(d: DesignSummary, history: HistoryEntry[], designs: ReadonlyMap<string, unknown> = new Map()): SafeHtml {
  const latestFirst = [...history].reverse();
  const openForms = latestFirst.filter((h) => designs.has(h.revision_id)).map((h) => ({ seq: h.seq, json: JSON.stringify(designs.get(h.revision_id)) }));
  return html`<section id="designs" class="designs"><h2>History of “${d.name}” <small>(design ${d.id})</small></h2>
<form hx-get="/diff" hx-target="#diff-result" action="/diff" method="get">
<table class="history data"><thead><tr><th scope="col">From</th><th scope="col">To</th><th scope="col">#</th><th scope="col">Saved (UTC)</th><th scope="col">Revision</th><th scope="col">Message</th><th scope="col">Downloads</th></tr></thead><tbody>
${latestFirst.map(
  (h, i) => html`<tr><td><input type="radio" name="a" value="${h.revision_id}" aria-label="compare from revision ${h.seq}"${i === 1 || latestFirst.length === 1 ? html` checked` : ''}></td>
<td><input type="radio" name="b" value="${h.revision_id}" aria-label="compare to revision ${h.seq}"${i === 0 ? html` checked` : ''}></td>
<td>${h.seq}</td><td>${h.saved_at}</td><td><code title="${h.revision_id}">${short(h.revision_id)}</code></td><td>${h.message ?? ''}</td>
<td><button type="submit" form="open-${h.seq}">open in the page</button> · <a href="/revisions/${h.revision_id}/packet.pdf">packet PDF</a> · <a href="/revisions/${h.revision_id}/packet.html">print view</a> · <a href="/revisions/${h.revision_id}/export/design.json">JSON</a> · <a href="/revisions/${h.revision_id}/export/curves.csv">curves CSV</a> · <a href="/revisions/${h.revision_id}/export/checks.csv">checks CSV</a></td></tr>`,
)}
</tbody></table>
<button type="submit">Show changes</button>
<button type="submit" formaction="/compare" hx-get="/compare" hx-include="closest form" hx-target="#diff-result">Compare before/after</button>
</form>
<div id="diff-result" aria-live="polite"></div>
${openForms.map((f) => html`<form id="open-${f.seq}" hx-post="/workbench/update" hx-include="#units" hx-target="#status" hx-swap="outerHTML" hidden><input type="hidden" name="_upload" value="${f.json}"><input type="hidden" name="_design_id" value="${d.id}"></form>`)}
<p class="hint">“Open in the page” loads that revision; “Save revision” then adds a new revision to this design (its history is kept).</p>
<p><a href="/designs" hx-get="/designs" hx-target="#designs" hx-swap="outerHTML">All designs</a></p>
</section>`;
}

export function diffView(from: string, to: string, entries: DiffEntry[]): SafeHtml {
  return html`<section class="diff" id="diff"><h3>Changes from <code>${short(from)}</code> to <code>${short(to)}</code></h3>
${entries.length === 0 ? html`<p>No differences: the two revisions have the same content.</p>` : html`<ul class="diff-list">${entries.map((e) => html`<li class="diff-${e.kind}"><code>${e.text}</code></li>`)}</ul>`}
</section>`;
}

export function saveResultView(r: SaveResult): SafeHtml {
  return html`<p class="saved" role="status">${r.changed ? (r.design.revision_count === 1 ? 'Saved as a new design' : 'Saved as a new revision') : 'Unchanged'}: “${r.design.name}”, revision <code title="${r.revision_id}">${short(r.revision_id)}</code>
(${r.design.revision_count} revision${r.design.revision_count === 1 ? '' : 's'}).
<a href="/designs/${r.design.id}/history" hx-get="/designs/${r.design.id}/history" hx-target="#store-browser">history</a> ·
<a href="/revisions/${r.revision_id}/packet.pdf">packet PDF</a></p>
<input type="hidden" id="store-design-id" name="_design_id" value="${r.design.id}" hx-swap-oob="true">`;
}

export function errorView(code: string, message: string, details: string[] = []): SafeHtml {
  return html`<div class="error" role="alert"><p>${message} <small>[${code}]</small></p>${details.length ? html`<ul>${details.map((d) => html`<li>${d}</li>`)}</ul>` : ''}</div>`;
}

export function compareView(c: Comparison): SafeHtml {
  return html`<section class="compare" id="compare"><h3>Before/after: ${c.a.label} “${c.a.design_name}” and ${c.b.label} “${c.b.design_name}”</h3>
<p>Revisions <code>${short(c.a.revision)}</code> (solid lines) and <code>${short(c.b.revision)}</code> (dashed lines).</p>
${chartBlock('compare-chart', c.chart, 'Adhesion utilisation of both designs', 'Front and rear adhesion utilisation against braking rate for every load state of both designs; solid lines the first, dashed the second.')}
<h4>Per load state</h4>
<table class="compare-states data"><thead><tr><th scope="col">Load state</th><th scope="col">Quantity</th><th scope="col">${c.a.label}</th><th scope="col">${c.b.label}</th></tr></thead><tbody>
${c.states.map((r) => html`<tr class="${r.changed ? 'changed' : ''}"><td>${r.load_state}</td><td>${r.quantity}</td><td>${r.a}</td><td>${r.b}</td></tr>`)}
</tbody></table>
<h4>Verdicts</h4>
${c.checks.length === 0 ? html`<p>No regulation checks selected in either design.</p>` : html`<table class="compare-checks data"><thead><tr><th scope="col">Rule</th><th scope="col">Load state</th><th scope="col">${c.a.label}</th><th scope="col">margin</th><th scope="col">${c.b.label}</th><th scope="col">margin</th></tr></thead><tbody>
${c.checks.map((r) => html`<tr class="${r.changed ? 'changed' : ''}"><td>${r.rule}</td><td>${r.load_state}</td><td>${r.a_verdict}</td><td>${r.a_margin}</td><td>${r.b_verdict}</td><td>${r.b_margin}</td></tr>`)}
</tbody></table>`}
<h4>Input changes</h4>
${c.diff.length === 0 ? html`<p>No differences in the inputs.</p>` : html`<ul class="diff-list">${c.diff.map((e) => html`<li><code>${e.text}</code></li>`)}</ul>`}
<p class="caution">${CAUTION}</p>
</section>`;
}

function blockHtml(b: Block): SafeHtml {
  switch (b.kind) {
    case 'title':
      return html`<h1>${b.text}</h1>`;
    case 'h1':
      return html`<h2>${b.text}</h2>`;
    case 'h2':
      return html`<h3>${b.text}</h3>`;
    case 'p':
      return html`<p class="${b.style ?? ''}">${b.text}</p>`;
    case 'kv':
      return html`<dl class="kv">${b.rows.map(([k, v]) => html`<div><dt>${k}</dt><dd>${v === '' ? html`&nbsp;` : v}</dd></div>`)}</dl>`;
    case 'table':
      return html`<table><thead><tr>${b.columns.map((c) => html`<th scope="col">${c}</th>`)}</tr></thead><tbody>${b.rows.map(
        (r) => html`<tr>${b.columns.map((_, i) => html`<td>${r[i] ?? ''}</td>`)}</tr>`,
      )}</tbody></table>`;
    case 'chart':
      // The SVG is generated by packet/chart-svg.ts, which escapes every label.
      return html`<figure class="chart">${ownSvg(b.svg)}</figure>`;
    case 'fields':
      return html`<div class="fields">${b.labels.map((l) => html`<p class="field">${l}</p>`)}</div>`;
    case 'page_break':
      return html`<hr class="page-break">`;
  }
}

/** The packet as a printable HTML page with the same content as the PDF. */
export function packetHtml(content: PacketContent): SafeHtml {
  return html`<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${content.title}</title>
<style>
body{font:10pt/1.35 system-ui,sans-serif;max-width:60rem;margin:1rem auto;padding:0 1rem;color:#000}
table{border-collapse:collapse;margin:.4rem 0 1rem;font-size:8.5pt}td,th{border:1px solid #999;padding:2px 4px;vertical-align:top}th{background:#eee}
dl.kv div{display:flex;gap:1rem}dl.kv dt{font-weight:bold;min-width:18rem}dl.kv dd{margin:0;word-break:break-all}
.caution{color:#8a1c1c;font-weight:bold}.small{font-size:8.5pt}.bold{font-weight:bold}
.field{border-bottom:1px solid #000;padding-top:1.6rem}
hr.page-break{border:0;page-break-after:always;break-after:page}
@media print{body{margin:0}}
.draft{color:#b3261e;font-weight:bold}
@media print{.draft-mark{position:fixed;top:0;right:0}}
</style></head><body>
${content.draft ? html`<p class="draft draft-mark">${DRAFT_MARK}</p>` : ''}
${content.blocks.map(blockHtml)}
</body></html>`;
}
