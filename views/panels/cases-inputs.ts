/**
 * Inputs of the inspection cases (docs/design-file.md, "Optional blocks for the inspection cases"): antilock,
 * stability control and brake-force distribution status, the R13-H regeneration category, the pad friction
 * when hot, the FMVSS 135 lightly loaded vehicle and the trailer. All optional: a block left empty stays out of
 * the design; a check that needs a missing input says "not checked" and names it.
 */
import { SYSTEM_STATUSES, type SystemStatus } from '../../core/cases-schema.ts';
import { type InputContext, blockMessage, listButton, listIndicesOf, numberField, selectField, textField, triStateField } from '../fields.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel } from './panel.ts';

const STATUS_WORDS: Record<SystemStatus, string> = {
  not_fitted: 'never fitted',
  fitted: 'fitted and working',
  retained: 'kept from the base vehicle, working',
  not_working: 'fitted but not working',
  removed: 'removed by the conversion',
};
const STATUS_OPTIONS: ReadonlyArray<readonly [string, string]> = [['', 'not stated'], ...SYSTEM_STATUSES.map((s) => [s, STATUS_WORDS[s]] as const)];

function frictionTable(ctx: InputContext): SafeHtml {
  const t = 'heat.hot_friction_factor_at_c';
  const rows = listIndicesOf(ctx.values, t);
  return html`<fieldset class="table-field"><legend>Pad friction when hot <span class="opt">optional</span></legend>
<p class="hint">Share of the cold pad friction against rotor temperature, from the pad maker's fade data; linear between rows, flat outside, rows ascending by temperature. None: a rough default from memory. Needs the rotor masses (limits inputs, brake heat).</p>
${rows.length ? html`<table class="inputs-table"><thead><tr><th scope="col">Rotor temperature (°C)</th><th scope="col">Friction factor (–)</th><th scope="col"><span class="sr">Actions</span></th></tr></thead><tbody>
${rows.map((i) => html`<tr><td>${numberField(ctx, `${t}[${i}][0]`, `Row ${i + 1}: rotor temperature`, { compact: true, width: 's', unitText: '°C' })}</td><td>${numberField(ctx, `${t}[${i}][1]`, `Row ${i + 1}: friction factor`, { compact: true, width: 's', unitText: '–' })}</td><td>${listButton(`remove:${t}[${i}]`, '×', 'Remove this row')}</td></tr>`)}
</tbody></table>` : html`<p class="hint">No table: the default is used.</p>`}
${listButton(`add:${t}`, '+ row', rows.length ? 'Add a row (copy of the last)' : 'Add a row', rows.length >= 12)}
${blockMessage(ctx, t)}</fieldset>`;
}

export function casesInputs(ctx: InputContext): SafeHtml {
  return html`<details class="cases-inputs"><summary>Inspection cases: braking aids, regeneration category, hot pads, lightly loaded vehicle, trailer (optional)</summary>
<fieldset><legend>Antilock, stability control, brake-force distribution</legend><div class="grid">
${selectField(ctx, 'systems.abs', 'Antilock (ABS)', STATUS_OPTIONS, { optional: true, hint: 'must agree with "ABS on every axle" of the vehicle' })}
${selectField(ctx, 'systems.esc', 'Stability control (ESC)', STATUS_OPTIONS, { optional: true })}
${selectField(ctx, 'systems.ebd', 'Electronic brake-force distribution (EBD)', STATUS_OPTIONS, { optional: true, hint: 'works through the antilock' })}
</div>${blockMessage(ctx, 'systems')}</fieldset>
<fieldset><legend>Regeneration under R13-H</legend><div class="grid">
${selectField(ctx, 'regen.category', 'Regeneration category', [['', 'not stated'], ['A', 'A: only on accelerator release'], ['B', 'B: part of service braking']], { optional: true, hint: 'needs the regenerative-braking inputs (limits inputs)' })}
${triStateField(ctx, 'regen.abs_controls_regen_axle', 'Antilock also controls the regenerative axle')}
${triStateField(ctx, 'regen.failure_warning', 'A regeneration failure that changes the distribution lights a warning')}
</div></fieldset>
${frictionTable(ctx)}
<fieldset><legend>Lightly loaded vehicle (FMVSS 135)</legend>
<p class="hint">The unloaded vehicle (no driver) and the driver and instruments added to it; checked whenever the FMVSS rules are selected.</p><div class="grid">
${numberField(ctx, 'lightly_loaded.unloaded_mass_kg', 'Unloaded vehicle mass', { optional: true })}
${numberField(ctx, 'lightly_loaded.unloaded_front_axle_kg', 'Unloaded front axle load', { optional: true })}
${numberField(ctx, 'lightly_loaded.unloaded_cg_height_m', 'Unloaded CG height', { optional: true })}
${numberField(ctx, 'lightly_loaded.added_mass_kg', 'Driver and instruments', { optional: true, hint: 'empty: 180 kg (from memory)' })}
${numberField(ctx, 'lightly_loaded.added_behind_front_axle_m', 'Their position behind the front axle', { optional: true })}
${numberField(ctx, 'lightly_loaded.added_height_m', 'Height of their centre of gravity', { optional: true })}
</div>${blockMessage(ctx, 'lightly_loaded')}</fieldset>
<fieldset><legend>Trailer</legend>
<p class="hint">For the towing checks: the combination's service braking with the nose load on the hitch, and the parking brake on the combination gradient.</p><div class="grid">
${numberField(ctx, 'towing.trailer_mass_kg', 'Trailer mass', { optional: true })}
${triStateField(ctx, 'towing.trailer_braked', 'Trailer has its own brakes')}
${numberField(ctx, 'towing.nose_load_kg', 'Nose load on the hitch', { optional: true })}
${numberField(ctx, 'towing.hitch_behind_rear_axle_m', 'Hitch behind the rear axle', { optional: true })}
${numberField(ctx, 'towing.hitch_height_m', 'Hitch height', { optional: true, hint: 'empty: the vehicle CG height' })}
${textField(ctx, 'towing.load_state', 'Load state it is added to (id)', { optional: true, width: 's', maxLength: 40, hint: 'empty: the heaviest laden one' })}
</div>${blockMessage(ctx, 'towing')}</fieldset>
</details>`;
}

export const casesInputsPanel: Panel = { id: 'cases-inputs', title: 'Inspection cases: optional inputs', inputs: casesInputs };
