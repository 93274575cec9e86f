/**
 * The axle-lift tool of the conversion panel: a form for the workshop readings (fields named `lift.<file path>`,
 * form/axle-lift-form.ts) that posts to POST /workbench/cg-lift, and the block that answers it: the form
 * again with every typed value and the problems marked, then the result (CG height, standard uncertainty, budget
 * with the largest contributor, warnings) and one "Apply to load state" button per load state of the design.
 * The block (#cg-lift) is kept across recomputes of the results by static/js/workbench.js, so what was typed here
 * survives a change in the design form. Pasting a `lockstep-axle-lift/1` file is offered as a second way.
 */
import { type AxleLiftResultFile, BUDGET_SOURCE_WORDS, CAUTION, type FieldIssue, type UnitSystem } from '../core/index.ts';
import { cgLiftOp, LIFT_MASS_TOLERANCE, LIFT_UNITS_FIELD, MAX_LIFTS } from '../form/axle-lift-form.ts';
import { displayUnitOf, type FormValues, listIndices, unitLabel } from '../form/design-form.ts';
import { type InputContext, numberField, selectField } from './fields.ts';
import * as F from '../report/format.ts';
import { html, type SafeHtml } from './html.ts';
import { formErrors } from '../form/errors.ts';

const AXLES = [['front', 'front'], ['rear', 'rear']] as const;

export interface AxleLiftBlock {
  /** The page's unit system: fields and results are shown in it. */
  units: UnitSystem;
  /** The `lift.*` fields as typed. */
  values: FormValues;
  errors?: readonly FieldIssue[];
  /** A problem with the request as a whole (paste not JSON, file invalid, nothing entered). */
  problem?: { message: string; code: string; errors?: readonly FieldIssue[] };
  result?: AxleLiftResultFile;
  /** Load states of the design form, for the "Apply" buttons (mass in kg when known, for the mass check). */
  loadStates?: ReadonlyArray<{ id: string; label: string; massKg?: number | null }>;
  /** The figures taken from the design (field name -> text); the page lets untouched fields follow the design. */
  designDefaults?: FormValues;
  /** Text of the paste box (kept as typed). */
  pasted?: string;
}

function liftOp(op: string, text: string, title: string, disabled = false): SafeHtml {
  return html`<button type="button" class="op" name="_lift_op" value="${op}" title="${title}" hx-post="/workbench/cg-lift" hx-include="#design-form" hx-target="#cg-lift" hx-swap="outerHTML"${disabled ? html` disabled` : ''}>${text}</button>`;
}

export function axleLiftBlock(b: AxleLiftBlock): SafeHtml {
  const errors = new Map<string, string[]>();
  for (const e of b.errors ?? []) errors.set(e.path, [...(errors.get(e.path) ?? []), e.message]);
  const ctx: InputContext = { values: b.values, units: b.units, errors, structural: new Set(), rendered: new Set() };
  const rows = listIndices(b.values, 'lift.lifts');
  const unit = (name: string) => unitLabel(displayUnitOf(name, b.units));
  const form = html`<form class="cg-lift-form" hx-post="/workbench/cg-lift" hx-include="#design-form" hx-target="#cg-lift" hx-swap="outerHTML" aria-label="CG height by axle lift" novalidate autocomplete="off">
<input type="hidden" name="${LIFT_UNITS_FIELD}" value="${b.units}">
<fieldset><legend>Vehicle, weighed level</legend><div class="grid">
${numberField(ctx, 'lift.wheelbase_m', 'Wheelbase')}
${numberField(ctx, 'lift.wheel_centre_height_m', 'Wheel-centre height', { hint: 'above the ground: the loaded tyre radius' })}
${numberField(ctx, 'lift.level.front_axle_kg', 'Front axle, level', { hint: 'scale reading; starts at the design’s unladen figure' })}
${numberField(ctx, 'lift.level.rear_axle_kg', 'Rear axle, level', { hint: 'scale reading; starts at the design’s unladen figure' })}
</div></fieldset>
<fieldset><legend>Lifts</legend>
<p class="hint">Per lift: which axle was raised, how far (wheel-centre rise) or the body angle, and what the scales read under the axle on them (normally the axle that stays down).</p>
<div class="scroll"><table class="inputs-table lift-rows"><thead><tr><th scope="col">#</th><th scope="col">Raised axle</th><th scope="col">Lift height <span class="unit">(${unit('lift.lifts[0].lift_height_m')})</span></th><th scope="col">or angle <span class="unit">(°)</span></th><th scope="col">Scale reading <span class="unit">(${unit('lift.lifts[0].reading_kg')})</span></th><th scope="col">Axle on the scales</th><th scope="col"><span class="sr">Remove</span></th></tr></thead>
<tbody>${rows.map((i) => {
    const p = `lift.lifts[${i}]`;
    const n = i + 1;
    return html`<tr><td>${n}</td>
<td>${selectField(ctx, `${p}.raised_axle`, `Lift ${n}: raised axle`, AXLES, { compact: true })}</td>
<td>${numberField(ctx, `${p}.lift_height_m`, `Lift ${n}: lift height`, { compact: true, width: 's' })}</td>
<td>${numberField(ctx, `${p}.lift_angle_deg`, `Lift ${n}: or lift angle`, { compact: true, width: 's' })}</td>
<td>${numberField(ctx, `${p}.reading_kg`, `Lift ${n}: scale reading`, { compact: true, width: 's' })}</td>
<td>${selectField(ctx, `${p}.read_axle`, `Lift ${n}: axle on the scales`, AXLES, { compact: true })}</td>
<td class="acts">${liftOp(`remove:${i}`, 'Remove', `Remove lift ${n}`, rows.length <= 1)}</td></tr>`;
  })}</tbody></table></div>
${liftOp('add', '+ Add lift', 'Add a lift (same axles as the last one)', rows.length >= MAX_LIFTS)}
</fieldset>
<fieldset><legend>Measurement uncertainty</legend><div class="grid">
${numberField(ctx, 'lift.scale_resolution_kg', 'Scale resolution', { hint: 'smallest step the scales show' })}
${numberField(ctx, 'lift.lift_height_uncertainty_m', 'Lift height uncertainty', { hint: 'one standard deviation' })}
${numberField(ctx, 'lift.wheelbase_uncertainty_m', 'Wheelbase uncertainty', { hint: 'one standard deviation' })}
${numberField(ctx, 'lift.wheel_centre_height_uncertainty_m', 'Wheel-centre height uncertainty', { optional: true })}
${numberField(ctx, 'lift.lift_angle_uncertainty_deg', 'Lift angle uncertainty', { optional: true, hint: 'when angles are entered' })}
</div></fieldset>
<p><button type="submit" name="_lift_op" value="compute">Compute CG height</button></p>
<details class="paste"${b.pasted ? html` open` : ''}><summary>Or paste a <code>lockstep-axle-lift/1</code> file</summary>
<label for="cg-lift-input">File text (JSON; lengths in m, masses in kg, angles in degrees; docs/axle-lift.md). It fills the form above.</label>
<textarea id="cg-lift-input" name="axle_lift" rows="6" spellcheck="false">${b.pasted ?? ''}</textarea>
<p>${liftOp('paste', 'Read the pasted file', 'Fill the form from the pasted file and compute')}</p>
</details>
</form>`;
  const loose = (b.errors ?? []).filter((e) => !ctx.rendered.has(e.path)); // problems with no field of their own
  const invalid = b.errors?.length ? formErrors.axleLiftInvalid(b.errors.length, 'form') : null;
  const problem = b.problem ?? (invalid ? { message: invalid.message, code: invalid.code, errors: loose } : undefined);
  return html`<div id="cg-lift" class="cg-lift" data-units="${b.units}" data-design="${JSON.stringify(b.designDefaults ?? {})}">
${form}
<div id="cg-lift-result" aria-live="polite">${problem ? axleLiftErrors(problem.message, problem.code, problem.errors) : ''}${b.result ? axleLiftFragment(b.result, b.units, b.loadStates ?? []) : ''}</div>
</div>`;
}

export function axleLiftErrors(message: string, code: string, errors: readonly FieldIssue[] = []): SafeHtml {
  return html`<div class="status invalid" role="status"><p><strong>Check input</strong> ${message} <code>${code}</code></p>
${errors.length ? html`<ul class="problems">${errors.map((e) => html`<li>${e.path ? html`<code>${e.path}</code>: ` : ''}${e.message}</li>`)}</ul>` : ''}</div>`;
}

/** The words and the question of an "Apply" button whose load state is not at the weighed mass (over 1 %). */
function massMismatch(weighedKg: number, stateKg: number | null | undefined, units: UnitSystem): string | null {
  if (stateKg === null || stateKg === undefined || !(weighedKg > 0)) return null;
  const share = (stateKg - weighedKg) / weighedKg;
  if (Math.abs(share) <= LIFT_MASS_TOLERANCE) return null;
  return `This load state's mass (${F.mass(stateKg, units)}) differs from the weighed mass (${F.mass(weighedKg, units)}) by ${F.percentOfRatio(Math.abs(share))}: the CG height measured at one load does not carry over to another. Weigh and lift the vehicle in this load state, or derive its CG height from the mass build-up.`;
}

export function axleLiftFragment(r: AxleLiftResultFile, units: UnitSystem = 'metric', loadStates: ReadonlyArray<{ id: string; label: string; massKg?: number | null }> = []): SafeHtml {
  const len = { label: F.unitOf('length', units) };
  const m = { label: F.unitOf('mass', units) };
  const lv = (v: number | null | undefined) => F.format('length', v, units, { unit: false });
  const snippet = JSON.stringify({
    cg_height_m: Number(r.cg_height_m.toFixed(3)),
    cg_height_uncertainty_m: Number(r.standard_uncertainty_m.toFixed(3)),
    cg_height_derived_from: 'measured',
    overrides: ['cg_height_m'],
  });
  const largest = r.budget.largest_source;
  return html`<h4>Result</h4>
<table class="numbers data cg-lift-result"><tbody>
<tr><th scope="row">CG height above ground</th><td>${F.length(r.cg_height_m, units)}</td></tr>
<tr><th scope="row">Standard uncertainty (k = 1)</th><td>${F.length(r.standard_uncertainty_m, units)}</td></tr>
<tr><th scope="row">CG behind the front axle</th><td>${F.length(r.cg_to_front_axle_m, units)}</td></tr>
<tr><th scope="row">Vehicle mass (level)</th><td>${F.mass(r.mass_kg, units)}</td></tr>
${r.scatter_uncertainty_m !== null ? html`<tr><th scope="row">Scatter of the lifts about the fit</th><td>${F.length(r.scatter_uncertainty_m, units)}</td></tr>` : ''}
</tbody></table>
${largest ? html`<p class="largest"><strong>Largest contribution: ${BUDGET_SOURCE_WORDS[largest] ?? largest}</strong> (single input: ${r.budget.largest_input}). Improve that measurement first to narrow the result.</p>` : ''}
${r.warnings.length ? html`<ul class="warnings">${r.warnings.map((w) => html`<li><code>${w.code}</code> ${w.message}</li>`)}</ul>` : ''}
${loadStates.length
    ? html`<div class="apply-lift"><p>Write this CG height and its uncertainty into a load state (marked as measured; the results follow):</p>
${loadStates.map((s) => {
      const warn = massMismatch(r.mass_kg, s.massKg, units);
      return html`<p><button type="button" class="apply" name="_op" value="${cgLiftOp(s.id, r.cg_height_m, r.standard_uncertainty_m)}" form="design-form" hx-post="/workbench/update" hx-include="#design-form" hx-target="#status" hx-swap="outerHTML"${warn ? html` hx-confirm="${warn} Apply it anyway?"` : ''}>Apply to load state “${s.label}”</button>${warn ? html`<br><span class="mass-warn" role="note"><strong>Mass differs:</strong> ${warn}</span>` : ''}</p>`;
    })}</div>`
    : ''}
<h4>Each lift alone</h4>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">Lift</th><th scope="col">Raised</th><th scope="col">Axle read</th><th scope="col">Angle<br><span class="unit">°</span></th><th scope="col">Change<br><span class="unit">${m.label}</span></th><th scope="col">h<br><span class="unit">${len.label}</span></th><th scope="col">u(h)<br><span class="unit">${len.label}</span></th></tr></thead>
<tbody>${r.lifts.map((l) => html`<tr><td>${l.index + 1}</td><td>${l.raised_axle}</td><td>${l.read_axle}</td><td>${F.format('angle', l.lift_angle_deg, units, { from: 'deg', unit: false })}</td><td>${F.format('mass', l.reading_change_kg, units, { unit: false })}</td><td>${lv(l.cg_height_m)}</td><td>${lv(l.standard_uncertainty_m)}</td></tr>`)}</tbody></table></div>
<h4>Uncertainty budget</h4>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">Source</th><th scope="col">Contribution<br><span class="unit">${len.label}</span></th><th scope="col">Share of variance<br><span class="unit">%</span></th></tr></thead>
<tbody>${r.budget.by_source.map((b) => html`<tr${b.source === largest ? html` class="largest"` : ''}><td>${BUDGET_SOURCE_WORDS[b.source] ?? b.source}${b.source === largest ? html` <strong>(largest)</strong>` : ''}</td><td>${lv(b.contribution_m)}</td><td>${F.format('percent', b.variance_share, units, { from: 'ratio', unit: false })}</td></tr>`)}</tbody></table></div>
<p class="hint">In a design file, the same is written into the load state as <code>${snippet}</code>.</p>
<p class="hint">${CAUTION}</p>`;
}
