/**
 * Inputs of the conversion: the optional `build_up` block (base vehicle as weighed, items removed and added,
 * occupant mass, seats, payload, tanks) and the optional `ratings` block (docs/build-up.md). Every field is
 * optional here: a block left empty stays out of the design (form/design-form.ts prunes empty blocks).
 * Lists may be emptied and started again (EMPTYABLE_LISTS in form/design-form.ts).
 */
import { CG_HEIGHT_SOURCES, OCCUPANT_MASSES, type UnitSystem } from '../../core/index.ts';
import type { FormValues } from '../../form/design-form.ts';
import {
  type InputContext,
  blockMessage,
  checkField,
  listButton,
  listIndicesOf,
  numberField,
  prefixLabels,
  selectField,
  textField,
} from '../fields.ts';
import { unitOf } from '../../report/format.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel } from './panel.ts';

const B = 'build_up';
const SOURCE_WORDS: Record<(typeof CG_HEIGHT_SOURCES)[number], string> = {
  measured: 'measured (e.g. axle lift)',
  maker: "chassis maker's figure",
  estimated: 'estimated',
  assumed: 'assumed',
};

function itemTable(ctx: InputContext, list: 'removed' | 'added', title: string, hint: string): SafeHtml {
  const path = `${B}.${list}`;
  const idx = listIndicesOf(ctx.values, path);
  const word = list === 'removed' ? 'Removed' : 'Added';
  const rows = idx.map((i) => {
    const p = `${path}[${i}]`;
    const n = i + 1;
    const row = html`<tr><td>${textField(ctx, `${p}.name`, `${word} item ${n}: name`, { compact: true, width: 's' })}</td>
<td>${numberField(ctx, `${p}.mass_kg`, `${word} item ${n}: mass`, { compact: true, width: 's' })}</td>
<td>${numberField(ctx, `${p}.x_m`, `${word} item ${n}: position behind the front axle`, { compact: true, width: 's' })}</td>
<td>${numberField(ctx, `${p}.cg_height_m`, `${word} item ${n}: height of its CG`, { compact: true, width: 's' })}</td>
<td>${numberField(ctx, `${p}.y_m`, `${word} item ${n}: lateral offset`, { compact: true, width: 's', optional: true })}</td>
<td>${textField(ctx, `${p}.group`, `${word} item ${n}: group`, { compact: true, width: 's', optional: true, maxLength: 100 })}</td>
<td>${listButton(`remove:${p}`, '×', `Remove ${list} item ${n}`)}</td></tr>`;
    prefixLabels(ctx, `${p}.`, `Build-up ${list} ${n}: `);
    return row;
  });
  const m = (q: 'mass' | 'length') => html`<span class="unit">(${unitOf(q, ctx.units)})</span>`;
  return html`<fieldset class="table-field"><legend>${title}</legend>
<p class="hint">${hint} x: behind the front axle centre; height: of the item's CG above the ground; y: lateral offset, right positive.</p>
${idx.length ? html`<div class="scroll"><table class="inputs-table items"><thead><tr><th scope="col">Name</th><th scope="col">Mass ${m('mass')}</th><th scope="col">x ${m('length')}</th><th scope="col">Height ${m('length')}</th><th scope="col">y ${m('length')} <span class="opt">opt.</span></th><th scope="col">Group <span class="opt">opt.</span></th><th scope="col"><span class="sr">Actions</span></th></tr></thead><tbody>
${rows}
</tbody></table></div>` : html`<p class="hint">None listed.</p>`}
${listButton(`add:${path}`, '+ item', 'Add an empty row (a draft: it counts once filled in)', idx.length >= 200)}
${blockMessage(ctx, path)}</fieldset>`;
}

function seatsBlock(ctx: InputContext): SafeHtml {
  const path = `${B}.seats`;
  const idx = listIndicesOf(ctx.values, path);
  const rows = idx.map((i) => {
    const p = `${path}[${i}]`;
    const n = i + 1;
    const row = html`<div class="grid seat">${textField(ctx, `${p}.name`, `Seat ${n}: name`, { width: 'm' })}
${numberField(ctx, `${p}.x_m`, `Seat ${n}: position behind the front axle`, { width: 's' })}
${numberField(ctx, `${p}.cg_height_m`, `Seat ${n}: occupant CG height`, { width: 's' })}
${numberField(ctx, `${p}.y_m`, `Seat ${n}: lateral offset`, { width: 's', optional: true })}
${checkField(ctx, `${p}.driver`, `Seat ${n} is the driver seat`)}
<p class="acts">${listButton(`remove:${p}`, 'Remove', `Remove seat ${n}`)}</p></div>`;
    prefixLabels(ctx, `${p}.`, `Build-up seat ${n}: `);
    return row;
  });
  const basis = ctx.values[`${B}.occupant.basis`] ?? '';
  return html`<fieldset class="table-field"><legend>Occupants and seats</legend>
<p class="hint">The unladen state adds one occupant at the driver seat; the laden state adds one in every other seat. Choose the mass per occupant your regime uses.</p>
${selectField(ctx, `${B}.occupant.basis`, 'Mass per occupant', [['', '— none chosen —'], ...OCCUPANT_MASSES.map((o) => [o.id, `${o.id}: ${o.use}`] as const), ['custom', 'custom: your own figure']], { structural: true, optional: true })}
${basis === 'custom' ? numberField(ctx, `${B}.occupant.mass_kg`, 'Custom mass per occupant', { width: 's', hint: '20 to 200 kg' }) : ''}
${blockMessage(ctx, `${B}.occupant`)}
${rows}
${listButton(`add:${path}`, '+ seat', 'Add an empty seat (a draft: it counts once filled in)', idx.length >= 20)}
${blockMessage(ctx, path)}</fieldset>`;
}

function tanksBlock(ctx: InputContext): SafeHtml {
  const path = `${B}.tanks`;
  const idx = listIndicesOf(ctx.values, path);
  const rows = idx.map((i) => {
    const p = `${path}[${i}]`;
    const n = i + 1;
    const row = html`<div class="grid tank">${textField(ctx, `${p}.name`, `Tank ${n}: name`, { width: 'm' })}
${numberField(ctx, `${p}.full_kg`, `Tank ${n}: contents when full`, { width: 's', hint: 'water about 1 kg per litre' })}
${numberField(ctx, `${p}.x_m`, `Tank ${n}: position behind the front axle`, { width: 's' })}
${numberField(ctx, `${p}.cg_height_m`, `Tank ${n}: CG height`, { width: 's' })}
${numberField(ctx, `${p}.y_m`, `Tank ${n}: lateral offset`, { width: 's', optional: true })}
${numberField(ctx, `${p}.fill_weighed`, `Tank ${n}: fill when weighed`, { width: 's', unitText: '0–1', hint: '0 empty, 1 full' })}
${numberField(ctx, `${p}.fill_unladen`, `Tank ${n}: fill when unladen`, { width: 's', unitText: '0–1', optional: true, hint: 'default: as weighed; laden = full' })}
<p class="acts">${listButton(`remove:${p}`, 'Remove', `Remove tank ${n}`)}</p></div>`;
    prefixLabels(ctx, `${p}.`, `Build-up tank ${n}: `);
    return row;
  });
  return html`<fieldset class="table-field"><legend>Tanks</legend>
${rows}
${listButton(`add:${path}`, '+ tank', 'Add an empty tank (a draft: it counts once filled in)', idx.length >= 20)}
${blockMessage(ctx, path)}</fieldset>`;
}

export function conversionInputs(ctx: InputContext): SafeHtml {
  const base = `${B}.baseline`;
  const buildUp = html`<fieldset class="valve"><legend>Mass build-up <span class="opt">optional</span></legend>
<p class="hint">Start from the base vehicle as weighed, then list what was taken out and put in. Positions x from the front axle centre, rearward positive (ahead of the front axle negative); heights of each item's CG above the ground; lateral y positive to the right (needs the track). Leave everything empty to use the load states as entered. A load state takes its figures from the build-up with its "Figures from" choice.</p>
<div class="grid">
${textField(ctx, `${base}.label`, 'Base vehicle', { optional: true, hint: 'e.g. van as delivered, weighbridge ticket' })}
${numberField(ctx, `${base}.front_axle_kg`, 'Front axle as weighed', { width: 's' })}
${numberField(ctx, `${base}.rear_axle_kg`, 'Rear axle as weighed', { width: 's' })}
${numberField(ctx, `${base}.cg_height_m`, 'CG height of the base vehicle', { width: 's', hint: 'above the ground' })}
${selectField(ctx, `${base}.cg_height_source`, 'CG height from', [['', '— choose —'], ...CG_HEIGHT_SOURCES.map((s) => [s, SOURCE_WORDS[s]] as const)])}
${numberField(ctx, `${base}.cg_height_uncertainty_m`, 'Its standard uncertainty', { width: 's', optional: true })}
${numberField(ctx, `${B}.track_m`, 'Track width', { width: 's', optional: true, hint: 'needed for lateral offsets and corner weights' })}
</div>
<fieldset class="table-field"><legend>Corner weights <span class="opt">optional</span></legend>
<p class="hint">Each wheel on its own scale: they give the base vehicle's left/right split (with the track width). The axle masses above are used for everything else.</p>
<div class="grid">
${numberField(ctx, `${base}.wheels_kg.front_left`, 'Front left wheel', { width: 's', optional: true })}
${numberField(ctx, `${base}.wheels_kg.front_right`, 'Front right wheel', { width: 's', optional: true })}
${numberField(ctx, `${base}.wheels_kg.rear_left`, 'Rear left wheel', { width: 's', optional: true })}
${numberField(ctx, `${base}.wheels_kg.rear_right`, 'Rear right wheel', { width: 's', optional: true })}
</div>${blockMessage(ctx, `${base}.wheels_kg`)}</fieldset>
${blockMessage(ctx, base)}
${itemTable(ctx, 'removed', 'Items removed', 'Engine, fuel tank, seats … (their masses are subtracted).')}
${itemTable(ctx, 'added', 'Items added', 'Battery modules, motor, furniture, water tank shell …')}
${seatsBlock(ctx)}
<fieldset class="table-field"><legend>Payload <span class="opt">optional</span></legend>
<div class="grid">
${numberField(ctx, `${B}.payload.mass_kg`, 'Payload mass', { width: 's', optional: true, hint: 'laden state only' })}
${numberField(ctx, `${B}.payload.x_m`, 'Payload centroid behind the front axle', { width: 's', optional: true })}
${numberField(ctx, `${B}.payload.cg_height_m`, 'Payload centroid height', { width: 's', optional: true })}
${numberField(ctx, `${B}.payload.y_m`, 'Payload lateral offset', { width: 's', optional: true })}
</div>${blockMessage(ctx, `${B}.payload`)}</fieldset>
${tanksBlock(ctx)}
${blockMessage(ctx, B)}
</fieldset>`;
  const ratings = html`<fieldset class="valve"><legend>Ratings <span class="opt">optional</span></legend>
<p class="hint">From the plate or the registration document; the results show the margin of every load state.</p>
<div class="grid">
${numberField(ctx, 'ratings.max_mass_kg', 'Maximum permitted mass', { width: 's', optional: true })}
${numberField(ctx, 'ratings.max_front_axle_kg', 'Maximum front axle mass', { width: 's', optional: true })}
${numberField(ctx, 'ratings.max_rear_axle_kg', 'Maximum rear axle mass', { width: 's', optional: true })}
${numberField(ctx, 'ratings.min_front_axle_share_pct', 'Least front-axle share', { width: 's', optional: true, unitText: '%' })}
</div>${blockMessage(ctx, 'ratings')}</fieldset>`;
  return html`${buildUp}${ratings}`;
}

/** Drops the custom occupant mass unless the basis is "custom" (the core refuses it with another basis). */
export function normaliseConversion(values: FormValues, _units: UnitSystem): FormValues {
  if ((values[`${B}.occupant.basis`] ?? '') === 'custom') return values;
  if (values[`${B}.occupant.mass_kg`] === undefined) return values;
  const out = { ...values };
  delete out[`${B}.occupant.mass_kg`];
  return out;
}

export const conversionInputsPanel: Panel = {
  id: 'conversion-inputs',
  title: 'Conversion: mass build-up and ratings',
  inputs: conversionInputs,
  normalise: normaliseConversion,
};
