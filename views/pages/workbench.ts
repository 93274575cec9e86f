/**
 * The workbench page and the fragments htmx swaps into it, kept together (one view, its parts).
 * - #design-inputs: the input panels (re-rendered only when the structure changes: type switch, list
 *   operation, unit system, upload, restore); otherwise inputs are never replaced, so typed text stays.
 * - #status: current / not current, with every problem listed (primary target of every update).
 * - #results: verdict, charts, table of the last valid design; #results-note marks it "not current".
 * - .msg slots under each field, updated out of band.
 */
import { CAUTION, type DesignFile, type EvaluationResult, type FieldIssue, type UnitSystem, type Warning } from '../../core/index.ts';
import type { FormValues } from '../../server/forms/design-form.ts';
import { fieldId, fieldMessage, type InputContext } from '../fields.ts';
import { html, type SafeHtml } from '../html.ts';
import { type AssetUrls, layout } from '../layout.ts';
import { panels, type ResultContext } from '../panels/index.ts';
import { DESIGN_FILE_MAX_BYTES, DESIGN_FILE_MAX_TEXT } from '../../core/file-limits.ts';
import { overallVerdict } from '../panels/verdict.ts';

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

function renderInputs(values: FormValues, units: UnitSystem, errors: readonly FieldIssue[]): { ctx: InputContext; sections: SafeHtml[] } {
  const ctx: InputContext = { values, units, errors: errorMap(errors), structural: new Set(), rendered: new Set(), labels: new Map() };
  const sections = panels
    .filter((p) => p.inputs)
    .map((p) => {
      // a panel with inputs and results has two sections: the input one takes the suffix (ids stay unique)
      const id = p.results ? `panel-${p.id}-inputs` : `panel-${p.id}`;
      return html`<section class="panel" id="${id}" aria-labelledby="${id}-h"><h2 id="${id}-h">${p.title}</h2>${p.inputs!(ctx)}</section>`;
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
  const { ctx, sections } = renderInputs(values, units, errors);
  // values no panel shows (format, blocks added by other tools) travel along unchanged
  const carried = Object.entries(values).filter(([n]) => !ctx.rendered.has(n) && !n.startsWith('_'));
  return html`<div id="design-inputs"${oob ? html` hx-swap-oob="true"` : ''}>
<div class="units-switch"><label for="units">Units</label> <select id="units" name="_units">
<option value="metric"${units === 'metric' ? html` selected` : ''}>metric (kg, m, mm, bar, N)</option>
<option value="us"${units === 'us' ? html` selected` : ''}>US customary (lb, in, psi, lbf)</option></select>
<small class="hint">Any field also accepts a value with its unit, e.g. “58 in”, “1450 lb”, “90 psi”, “2.2 t”.</small></div>
${sections}
${carried.map(([n, v]) => html`<input type="hidden" name="${n}" value="${v}">`)}
${values._provenance !== undefined ? html`<input type="hidden" name="_provenance" value="${values._provenance}">` : ''}
${values._exact !== undefined ? html`<input type="hidden" name="_exact" value="${values._exact}">` : ''}
<input type="hidden" name="_shape" value="${shapeOf(ctx)}">
</div>`;
}

export function resultsSection(v: ValidView, units: UnitSystem, oob = false): SafeHtml {
  const ctx: ResultContext = { design: v.design, result: v.result, units, warnings: v.warnings };
  return html`<div id="results"${oob ? html` hx-swap-oob="true"` : ''}>
${staleNote(null)}
<div class="result-body">
${overallVerdict(v.result)}
${isDemo(v.design) ? INTRO : ''}
<p class="for">Results for <strong>${v.design.name}</strong></p>
${panels.filter((p) => p.results).map((p) => html`<section class="panel" id="panel-${p.id}" aria-labelledby="panel-${p.id}-h"><h2 id="panel-${p.id}-h">${p.title}</h2>${p.deferred ? deferredSlot(p.id) : p.results!(ctx)}</section>`)}
</div></div>`;
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

/** Empty when the results are current; says why not otherwise. */
export function staleNote(problems: number | null, oob = false): SafeHtml {
  return html`<div id="results-note" class="stale-note${problems ? ' on' : ''}"${oob ? html` hx-swap-oob="true"` : ''}>${problems ? html`<strong>Not current.</strong> These results are for the last valid design; fix the ${problems === 1 ? 'marked input' : `${problems} marked inputs`} to update them.` : ''}</div>`;
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
  return html`${[...fieldsWithMessages(values, units).names].filter((n) => !n.startsWith('_')).map((n) => fieldMessage(n, m.get(n), true))}`;
}

/** The intro is shown while the page holds the demo (its name starts "Demo:"). */
const isDemo = (d: DesignFile) => d.name.startsWith('Demo:');

const INTRO = html`<details class="intro" open><summary>What you are looking at</summary>
<p>This is an invented example: a 3.5 t panel van converted to battery-electric drive and fitted out as a camper.
The left column holds the design: vehicle, load states, brakes, hydraulics with a load-sensing rear valve, and the
surfaces to analyse. The right column answers, for each load state, which axle locks first on each surface and at
what braking rate, with the curves behind it.</p>
<p>The verdict at the top reads FAIL on purpose: the regenerative braking of the rear motor, as set in its controller,
makes the rear axle lock first when the van is unladen at 20 and 50 km/h. Each line links to its check, and names the
largest regenerative force that keeps the checks passing.</p>
<p>Change any value and the results follow within a moment. A good design has the front axle lock first on every
surface (the installed curve below the ideal curve in chart A, f1 above f2 in chart B). Start your own vehicle by
overwriting the numbers, or upload a design file.</p></details>`;

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
<a class="jump button" href="#results-col">Jump to results</a>
<button type="button" class="download" data-download="/workbench/design.json" data-filename="lockstep-design.json">Download design</button>
<label class="upload button">Upload design<input type="file" id="upload" accept="application/json,.json" class="sr-file" data-max-bytes="${DESIGN_FILE_MAX_BYTES}" data-max-text="${DESIGN_FILE_MAX_TEXT}"></label>
<button type="button" name="_op" value="demo" form="design-form" hx-post="/workbench/update" hx-include="#design-form" hx-target="#status" hx-swap="outerHTML" class="secondary" data-reset-draft="1">Start again from the demo</button>
</nav>
</header>
<main class="wb">
<form id="design-form" class="inputs-col" hx-post="/workbench/update" hx-trigger="input delay:400ms, submit" hx-target="#status" hx-swap="outerHTML" hx-sync="this:replace" aria-label="Design" autocomplete="off" novalidate>
${inputsSection(values, units, errors)}
</form>
<div class="results-col" id="results-col">
<aside class="caution" role="note"><strong>CAUTION</strong> ${CAUTION}</aside>
${valid ? statusBlock(errors.length ? 'invalid' : 'current', { errors }) : statusBlock('invalid', { errors })}
${valid ? resultsSection(valid, units) : html`<div id="results">${staleNote(errors.length || 1)}</div>`}
</div>
</main>`;
  return layout('Lockstep workbench', assets, body, { charts: true });
}

export function messagePage(assets: AssetUrls, title: string, message: string, code: string): SafeHtml {
  return layout(
    `${title} – Lockstep`,
    assets,
    html`<main class="plain"><h1>${title}</h1><p>${message}</p><p><code>${code}</code></p><p><a href="/">Open the workbench</a></p></main>`,
  );
}
