/**
 * The workbench page and the fragments htmx swaps into it, kept together (one view, its parts).
 * - #design-inputs: the input panels (re-rendered only when the structure changes: type switch, list
 *   operation, unit system, upload, restore); otherwise inputs are never replaced, so typed text stays.
 * - #status: current / not current, with every problem listed (primary target of every update).
 * - #results: verdict, charts, table of the last valid design; #results-note marks it "not current".
 * - .msg slots under each field, updated out of band.
 */
import { CAUTION, type DesignFile, type EvaluationResult, type FieldIssue, type UnitSystem, type Verdict, type Warning } from '../../core/index.ts';
import { formProvenance, type FormValues } from '../../form/design-form.ts';
import { activeBlocksLine } from '../../report/design-blocks.ts';
import { fieldId, fieldMessage, type InputContext, sourceField } from '../fields.ts';
import { html, type SafeHtml } from '../html.ts';
import { type AssetUrls, layout } from '../layout.ts';
import { panels, type ResultContext } from '../panels/index.ts';
import { DESIGN_FILE_MAX_BYTES, DESIGN_FILE_MAX_TEXT } from '../../core/file-limits.ts';
import { overallVerdict, verdictBar } from '../panels/verdict.ts';

export interface ValidView {
  design: DesignFile;
  result: EvaluationResult;
  warnings: Warning[];
}

export function errorMap(errors: readonly FieldIssue[]): Map<string, string[]> {
  const m = new Map<string, string[]>();
  for (const e of errors) {
    const list = m.get(e.path) ?? [];
    list.push(e.message);
    m.set(e.path, list);
  }
  return m;
}

/** The shape the inputs were rendered with: units plus every structural field (see server/app.ts). */
export function shapeOf(ctx: InputContext): string {
  const p = new URLSearchParams();
  p.set('_units', ctx.units);
  for (const n of [...ctx.structural].sort()) p.set(n, ctx.values[n] ?? '');
  return p.toString();
}

/**
 * Sections are grouped so that related input and result sections sit side by side (desktop) or one after the
 * other (phone): an input panel `<x>-inputs` pairs with the result panel `<x>`; every other panel is in the
 * main group (the design's core inputs beside the verdict, charts and checks). See static/css/workbench.css.
 */
export function groupOf(panelId: string): string {
  if (panelId.endsWith('-inputs')) {
    const base = panelId.slice(0, -'-inputs'.length);
    if (panels.some((p) => p.id === base && p.results)) return base;
    return 'main';
  }
  return panels.some((p) => p.id === `${panelId}-inputs` && p.inputs) ? panelId : 'main';
}
/** Groups in page order; the index gives the grid row class (gr-2 … on desktop, order on a phone). */
export const GROUPS: readonly string[] = ['main', ...new Set(panels.map((p) => groupOf(p.id)).filter((g) => g !== 'main'))];
const groupClass = (g: string) => `group g-${g} gr-${GROUPS.indexOf(g) + 2}`;

/** A panel's section; its body folds (<details>, open by default; static/js/workbench.js keeps it folded). */
function foldSection(id: string, title: string, body: SafeHtml): SafeHtml {
  return html`<section class="panel" id="${id}" aria-labelledby="${id}-h"><details class="fold" open data-fold="${id}"><summary><h2 id="${id}-h">${title}</h2></summary>
<div class="panel-body">${body}</div></details></section>`;
}

/** The id of a panel's input section: a panel with inputs and results has two sections (ids stay unique). */
const inputSectionId = (p: { id: string; results?: unknown }) => (p.results ? `panel-${p.id}-inputs` : `panel-${p.id}`);

function renderInputs(
  values: FormValues,
  units: UnitSystem,
  errors: readonly FieldIssue[],
  sources?: InputContext['sources'],
): { ctx: InputContext; sections: SafeHtml[] } {
  const ctx: InputContext = { values, units, errors: errorMap(errors), structural: new Set(), rendered: new Set(), labels: new Map(), ...(sources ? { sources } : {}) };
  const inputPanels = panels.filter((p) => p.inputs);
  const rendered = inputPanels.map((p) => ({ group: groupOf(p.id), html: foldSection(inputSectionId(p), p.title, p.inputs!(ctx)) }));
  const sections = GROUPS.flatMap((g) => {
    const inGroup = rendered.filter((r) => r.group === g).map((r) => r.html);
    return inGroup.length ? [html`<div class="${groupClass(g)} in-group">${inGroup}</div>`] : [];
  });
  return { ctx, sections };
}

/** The fields the input panels render with a message slot for these values, with their labels. */
export function fieldsWithMessages(values: FormValues, units: UnitSystem): { names: ReadonlySet<string>; labels: ReadonlyMap<string, string> } {
  // which fields exist depends on the names present and the type switches, not on the numbers: cache by those
  const names = Object.keys(values).sort();
  const key = `${units}|${names.join(',')}|${names.filter((n) => /(^|\.)type$/.test(n)).map((n) => values[n]).join(',')}`;
  let entry = slotCache.get(key);
  if (!entry) {
    const { ctx } = renderInputs(values, units, []);
    entry = { names: ctx.rendered, labels: ctx.labels ?? new Map() };
    if (slotCache.size >= 64) slotCache.delete(slotCache.keys().next().value!);
    slotCache.set(key, entry);
  }
  return entry;
}
const slotCache = new Map<string, { names: ReadonlySet<string>; labels: ReadonlyMap<string, string> }>();

export function inputsSection(values: FormValues, units: UnitSystem, errors: readonly FieldIssue[], oob = false): SafeHtml {
  const prov = formProvenance(values, units);
  const { ctx, sections } = renderInputs(values, units, errors, prov.sources);
  // values no panel shows (format, blocks added by other tools) travel along unchanged
  const carried = Object.entries(values).filter(([n]) => !ctx.rendered.has(n) && !n.startsWith('_'));
  return html`<div id="design-inputs"${oob ? html` hx-swap-oob="true"` : ''}>
<div class="units-switch" id="design-top"><label for="units">Units</label> <select id="units" name="_units">
<option value="metric"${units === 'metric' ? html` selected` : ''}>metric (kg, m, mm, bar, N)</option>
<option value="us"${units === 'us' ? html` selected` : ''}>US customary (lb, in, psi, lbf)</option></select>
<small class="hint">Any field also accepts a value with its unit, e.g. “58 in”, “1450 lb”, “90 psi”, “2.2 t”.</small></div>
${sections}
${carried.map(([n, v]) => html`<input type="hidden" name="${n}" value="${v}">`)}
${provenanceInput(prov.json, false)}
${values._exact !== undefined ? html`<input type="hidden" name="_exact" value="${values._exact}">` : ''}
${values._stash !== undefined ? html`<input type="hidden" name="_stash" value="${values._stash}">` : ''}
<input type="hidden" name="_shape" value="${shapeOf(ctx)}">
</div>`;
}

export function resultsSection(v: ValidView, units: UnitSystem, oob = false): SafeHtml {
  const ctx: ResultContext = { design: v.design, result: v.result, units, warnings: v.warnings };
  const resultPanels = panels.filter((p) => p.results);
  const groups = GROUPS.map((g) => {
    const inGroup = resultPanels.filter((p) => groupOf(p.id) === g);
    const head = g === 'main' ? html`${staleNote(null)}${overallVerdict(v.result)}${isDemo(v.design) ? INTRO : ''}<p class="for">Results for <strong>${v.design.name}</strong></p><p class="hint active-blocks">${activeBlocksLine(v.design)}</p>` : '';
    return inGroup.length || head ? html`<div class="${groupClass(g)} out-group">${head}${inGroup.map((p) => foldSection(`panel-${p.id}`, p.title, p.deferred ? deferredSlot(p.id) : p.results!(ctx)))}</div>` : '';
  });
  return html`<div id="results"${oob ? html` hx-swap-oob="true"` : ''}>
<div class="result-body">${groups}</div></div>${oob ? verdictBar(v.result.verdict, true) : ''}`;
}

/**
 * The results when a restored draft or an upload cannot be evaluated: the page's earlier results belong to
 * another design (the demo the page opened with), so they are removed rather than shown as "not current".
 */
export function noResultsSection(problems: number, oob = false): SafeHtml {
  return html`<div id="results" class="no-results"${oob ? html` hx-swap-oob="true"` : ''}>${staleNote(problems)}</div>${oob ? verdictBar(null, true) : ''}`;
}

/**
 * Placeholder of a deferred panel: loads its results for the current form when it is in view, at once when it
 * already is (every recompute re-sends the placeholders, so a visible deferred panel follows each change).
 * While it computes, static/js/workbench.js keeps the panel's previous results inside it, dimmed and marked
 * "not current".
 */
export function deferredSlot(id: string): SafeHtml {
  return html`<div class="deferred" id="deferred-${id}" hx-post="/workbench/panel/${id}" hx-trigger="intersect once" hx-include="#design-form" hx-target="this" hx-swap="outerHTML" aria-busy="true"><p class="hint computing" role="status">computing… <small>(this section is computed when it is in view)</small></p></div>`;
}

/**
 * Empty when the results are current; says why not otherwise. The words depend on whether results are shown
 * (CSS: .when-results / .when-none), since after a restore or an upload that cannot be read there are none.
 */
export function staleNote(problems: number | null, oob = false): SafeHtml {
  const fix = problems === 1 ? 'marked input' : `${problems} marked inputs`;
  return html`<div id="results-note" class="stale-note${problems ? ' on' : ''}"${oob ? html` hx-swap-oob="true"` : ''}>${problems ? html`<span class="when-results"><strong>Not current.</strong> These results are for the last valid design; fix the ${fix} to update them.</span><span class="when-none"><strong>No results yet for this design.</strong> Fix the ${fix} to see them; everything you typed is kept.</span>` : ''}</div>`;
}

export type StatusKind = 'current' | 'invalid' | 'upload-error' | 'error';

export function statusBlock(
  kind: StatusKind,
  opts: { errors?: readonly FieldIssue[]; message?: string; code?: string; labels?: ReadonlyMap<string, string> } = {},
): SafeHtml {
  const errors = opts.errors ?? [];
  const text =
    kind === 'current'
      ? 'Results are current.'
      : kind === 'invalid'
        ? `${errors.length} input${errors.length === 1 ? ' needs' : 's need'} attention. Nothing you typed is lost.`
        : (opts.message ?? 'Something went wrong.');
  return html`<div id="status" class="status ${kind}" role="status" aria-live="polite"${opts.code ? html` data-code="${opts.code}"` : ''}>
<p>${kind === 'current' ? html`<span class="dot" aria-hidden="true"></span>` : html`<strong>${kind === 'invalid' ? 'Check input' : 'Not loaded'}</strong> `}${text}${opts.code ? html` <code>${opts.code}</code>` : ''}</p>
${errors.length ? html`<ul class="problems">${errors.map((e) => html`<li>${problemLabel(e.path, opts.labels)}${e.message}</li>`)}</ul>` : ''}
</div>`;
}

/** "Wheelbase vehicle.wheelbase_m: " linked to the field when it is on the page, else the path alone. */
function problemLabel(path: string, labels: ReadonlyMap<string, string> | undefined): SafeHtml | string {
  if (!path) return '';
  const label = labels?.get(path);
  return label ? html`<a href="#${fieldId(path)}">${label}</a> <code>${path}</code>: ` : html`<code>${path}</code>: `;
}

/**
 * Out-of-band message slots for every field the panels render with a slot: filled for fields with problems,
 * emptied for the rest. Problems on other paths are listed in the status block only.
 */
export function fieldMessagesOob(values: FormValues, units: UnitSystem, errors: readonly FieldIssue[]): SafeHtml {
  const m = errorMap(errors);
  // control fields (names starting with "_") have no message line
  const fields = fieldsWithMessages(values, units);
  // the source beside each input with a provenance entry, as it stands for the value now (flagged once changed)
  const { json, sources } = formProvenance(values, units);
  const ctx: InputContext = { values, units, errors: new Map(), structural: new Set(), rendered: new Set(), sources };
  const src = [...sources.keys()].filter((n) => fields.names.has(n)).map((n) => sourceField(ctx, n, fields.labels.get(n) ?? n, true));
  return html`${[...fields.names].filter((n) => !n.startsWith('_')).map((n) => fieldMessage(n, m.get(n), true))}${src}${provenanceInput(json, true)}`;
}

/** The provenance entries carried by the form (each with the value it was recorded for), kept current after every post. */
function provenanceInput(json: string | undefined, oob: boolean): SafeHtml {
  return html`<input type="hidden" id="f-provenance" name="_provenance" value="${json ?? '{}'}"${oob ? html` hx-swap-oob="true"` : ''}>`;
}

/** The intro is shown while the page holds the demo (its name starts "Demo:"). */
const isDemo = (d: DesignFile) => d.name.startsWith('Demo:');

const INTRO = html`<details class="intro" open><summary>What you are looking at</summary>
<p>This is an invented example: a 3.5 t panel van converted to battery-electric drive and fitted out as a camper.
The left column holds the design: vehicle, load states, brakes, hydraulics with a load-sensing rear valve, and the
surfaces to analyse. The right column answers, for each load state, which axle locks first on each surface and at
what braking rate, with the curves behind it.</p>
<p>The verdict at the top reads FAIL on purpose: the regenerative braking of the rear motor, as set in its controller,
makes the rear axle lock first at the lower speeds, unladen and laden. Each line links to its check, and names the
largest regenerative force that keeps the checks passing.</p>
<p>Change any value and the results follow within a moment. A good design has the front axle lock first on every
surface (the installed curve below the ideal curve in chart A, f1 above f2 in chart B). Start your own vehicle by
overwriting the numbers, or upload a design file.</p></details>`;

/** The section index of the jump bar: every input and result section, grouped, in page order. */
function sectionIndex(): SafeHtml {
  const inputs = panels.filter((p) => p.inputs).map((p) => [inputSectionId(p), p.title] as const);
  const results = panels.filter((p) => p.results).map((p) => [`panel-${p.id}`, p.title] as const);
  const list = (items: ReadonlyArray<readonly [string, string]>) => html`<ul>${items.map(([id, t]) => html`<li><a href="#${id}">${t}</a></li>`)}</ul>`;
  return html`<details class="jb-index" id="section-index"><summary>Sections</summary><div class="jb-menu">
<div><h2>Design inputs</h2>${list(inputs)}</div><div><h2>Results</h2>${list(results)}</div></div></details>`;
}

/**
 * The jump bar: stays at the top of the screen. One tap to the results (the verdict heads them) or back to the
 * inputs, the section index, the state of the answer (computing… / current / inputs to fix, kept up to date by
 * static/js/workbench.js from #status) and a slot for a compact verdict (#verdict-bar).
 */
function jumpBar(verdict: Verdict | null): SafeHtml {
  return html`<nav class="jumpbar" aria-label="Sections">
<a class="jb-link jb-results" href="#results-top">Results</a>
<a class="jb-link" href="#design-top">Inputs</a>
${sectionIndex()}
<span class="jb-live" id="jb-live" aria-hidden="true"></span>
${verdictBar(verdict)}
</nav>`;
}

export const START_AGAIN_CONFIRM = 'Start again from the demo? The design on this page and its draft in this browser are replaced by the demo. Download the design first to keep it.';

export function workbenchPage(
  assets: AssetUrls,
  values: FormValues,
  units: UnitSystem,
  valid: ValidView | null,
  errors: readonly FieldIssue[],
): SafeHtml {
  const body = html`<header class="top">
<div class="brand"><span class="logo" aria-hidden="true"></span><h1>Lockstep <span>brake proportioning workbench</span></h1></div>
<nav class="file" aria-label="Design file">
<button type="button" class="download" data-download="/workbench/design.json" data-filename="lockstep-design.json">Download design</button>
<label class="upload button">Upload design<input type="file" id="upload" accept="application/json,.json" class="sr-file" data-max-bytes="${DESIGN_FILE_MAX_BYTES}" data-max-text="${DESIGN_FILE_MAX_TEXT}"></label>
<button type="button" name="_op" value="demo" form="design-form" hx-post="/workbench/update" hx-include="#design-form" hx-target="#status" hx-swap="outerHTML" hx-confirm="${START_AGAIN_CONFIRM}" class="secondary" data-reset-draft="1">Start again from the demo</button>
</nav>
</header>
${jumpBar(valid ? valid.result.verdict : null)}
${uploadDialog()}
<main class="wb">
<form id="design-form" class="inputs-col" hx-post="/workbench/update" hx-trigger="input delay:400ms, submit" hx-target="#status" hx-swap="outerHTML" hx-sync="this:replace" aria-label="Design" autocomplete="off" novalidate>
${inputsSection(values, units, errors)}
</form>
<div class="results-col" id="results-col">
<div class="results-head" id="results-top">
<aside class="caution" role="note"><strong>CAUTION</strong> ${CAUTION}</aside>
${valid ? statusBlock(errors.length ? 'invalid' : 'current', { errors }) : statusBlock('invalid', { errors })}
</div>
${valid ? resultsSection(valid, units) : noResultsSection(errors.length || 1)}
</div>
</main>`;
  return layout('Lockstep workbench', assets, body, { charts: true });
}

/**
 * Asked when a file is uploaded while designs are saved: is it a new design, or a new revision of a saved one?
 * The choice becomes the form's `_design_id` (the store panel's "Save revision" then adds to that design).
 * static/js/workbench.js opens it and fills the list from GET /designs/choices.
 */
function uploadDialog(): SafeHtml {
  return html`<dialog id="upload-ask" aria-labelledby="upload-ask-h"><form method="dialog" class="upload-ask">
<h2 id="upload-ask-h">Load this file as</h2>
<p><label><input type="radio" name="upload_as" value="new" checked> a new design</label></p>
<p><label><input type="radio" name="upload_as" value="revision"> a new revision of a saved design:</label></p>
<p><label class="sr" for="upload-ask-design">Saved design</label><select id="upload-ask-design" name="design"></select></p>
<p class="hint">Saving later adds a revision to the design chosen here; nothing is saved until you press “Save revision”.</p>
<p class="acts"><button type="submit" value="load">Load the file</button> <button type="submit" value="cancel" class="secondary">Cancel</button></p>
</form></dialog>`;
}

export function messagePage(assets: AssetUrls, title: string, message: string, code: string): SafeHtml {
  return layout(
    `${title} – Lockstep`,
    assets,
    html`<main class="plain"><h1>${title}</h1><p>${message}</p><p><code>${code}</code></p><p><a href="/">Open the workbench</a></p></main>`,
  );
}
