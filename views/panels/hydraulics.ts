/** Master cylinder, pedal, booster, circuit split and the rear pressure valve (with the load-sensing table). */
import { fieldMeta, type UnitSystem, VALVE_FAMILIES, type ValveFamily, type ValveInput, valveFamily } from '../../core/index.ts';
import { type FormValues, formatFieldNumber } from '../../form/design-form.ts';
import { type InputContext, blockMessage, listButton, listIndicesOf, numberField, selectField, triStateField } from '../fields.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel } from './panel.ts';

const V = 'hydraulics.rear_valve';
/** The valve types offered, from the registry of valve types (core/valves/). */
const VALVE_CHOICES: ReadonlyArray<readonly [string, string]> = VALVE_FAMILIES.map((f) => [f.type, f.description]);

/** The family of the valve type in the form; a type no module declares (typed by hand) is kept and reported by validation. */
function familyIn(values: FormValues): ValveFamily | undefined {
  const t = values[`${V}.type`];
  return t === undefined || t === '' ? valveFamily('none') : valveFamily(t);
}

/** Form keys of a valve type: `type` and its inputs (a table's keys are its rows' pairs). */
function belongsTo(f: ValveFamily, key: string): boolean {
  if (key === 'type') return true;
  return f.inputs.some((i) => (i.kind === 'table' ? new RegExp(`^${i.key}\\[\\d+\\]\\[[01]\\]$`).test(key) : key === i.key));
}

function normalise(values: FormValues, units: UnitSystem): FormValues {
  const family = familyIn(values);
  if (!family) return values;
  const out: FormValues = {};
  const prefix = `${V}.`;
  for (const [n, v] of Object.entries(values)) if (!n.startsWith(prefix) || belongsTo(family, n.slice(prefix.length))) out[n] = v;
  out[`${V}.type`] = family.type;
  const tables = family.inputs.filter((i) => i.kind === 'table').map((i) => i.key);
  const hasTable = (k: string) => tables.some((t) => k.startsWith(`${t}[`) && Object.keys(out).some((n) => n.startsWith(`${prefix}${t}[`)));
  for (const [k, v] of Object.entries(family.start)) {
    const name = `${prefix}${k}`;
    if (hasTable(k)) continue;
    if (out[name] === undefined) out[name] = formatFieldNumber(name, v, units);
  }
  return out;
}

/** A field's label from the quantity table (core/field-meta.ts), lower case after a row number. */
const labelOf = (path: string): string => fieldMeta(path)?.label ?? path;
const lower = (s: string): string => s.charAt(0).toLowerCase() + s.slice(1);

function valveInput(ctx: InputContext, i: ValveInput): SafeHtml {
  const name = `${V}.${i.key}`;
  if (i.kind === 'number') {
    const plain = fieldMeta(name)?.unit === '1';
    return numberField(ctx, name, labelOf(name), plain ? { unitText: '–', hint: i.hint } : { hint: i.hint });
  }
  if (i.kind === 'choice') return selectField(ctx, name, i.label, i.options, { optional: true, hint: i.hint });
  const rows = listIndicesOf(ctx.values, name);
  const [first, second] = [labelOf(`${name}[0][0]`), labelOf(`${name}[0][1]`)];
  return html`<fieldset class="table-field"><legend>${i.legend}</legend>
<p class="hint">${i.hint}</p>
<table class="inputs-table"><thead><tr><th scope="col">${first}</th><th scope="col">${second}</th><th scope="col"><span class="sr">Actions</span></th></tr></thead><tbody>
${rows.map((r) => html`<tr><td>${numberField(ctx, `${name}[${r}][0]`, `Row ${r + 1}: ${lower(first)}`, { compact: true, width: 's' })}</td><td>${numberField(ctx, `${name}[${r}][1]`, `Row ${r + 1}: ${lower(second)}`, { compact: true, width: 's' })}</td><td>${listButton(`remove:${name}[${r}]`, '×', 'Remove this row', rows.length <= 1)}</td></tr>`)}
</tbody></table>
${listButton(`add:${name}`, '+ row', 'Add a row (copy of the last)', rows.length >= i.maxRows)}
${blockMessage(ctx, name)}</fieldset>`;
}

function valveInputs(ctx: InputContext): SafeHtml {
  const family = familyIn(ctx.values);
  if (!family) return html``;
  return html`${family.inputs.map((i, n) => html`${n > 0 ? '\n' : ''}${valveInput(ctx, i)}`)}`;
}

const BAR = 'hydraulics.balance_bar';

/** Two master cylinders on a balance bar (optional; all empty = none). The bore above is then the front one. */
function balanceBarInputs(ctx: InputContext): SafeHtml {
  return html`<fieldset class="valve"><legend>Balance bar <span class="opt">optional</span></legend>
<p class="hint">Two master cylinders worked by one bar: the bore above is then the front cylinder's. Leave empty for a single tandem master cylinder. A balance bar needs the front / rear split.</p>
<div class="grid">
${numberField(ctx, `${BAR}.rear_bore_mm`, 'Rear master cylinder bore', { width: 's', optional: true })}
${numberField(ctx, `${BAR}.setting_front_share`, 'Share of pushrod force to the front', { width: 's', optional: true, unitText: '0–1', hint: 'bar setting; 0.5 = centred' })}
${triStateField(ctx, `${BAR}.driver_adjustable`, 'Driver can adjust it')}
</div>${blockMessage(ctx, BAR)}</fieldset>`;
}

export const hydraulicsPanel: Panel = {
  id: 'hydraulics',
  title: 'Hydraulics and rear valve',
  inputs: (ctx) => html`<div class="grid">
${numberField(ctx, 'hydraulics.master_cylinder_bore_mm', 'Master cylinder bore')}
${numberField(ctx, 'hydraulics.pedal_ratio', 'Pedal ratio', { unitText: '–' })}
${numberField(ctx, 'hydraulics.booster_ratio', 'Booster ratio', { unitText: '–', hint: '1 = no booster' })}
${numberField(ctx, 'hydraulics.booster_runout_bar', 'Booster runout pressure', { optional: true, hint: 'assist stops growing above this; empty = never' })}
${selectField(ctx, 'hydraulics.circuit_split', 'Circuit split', [['front_rear', 'front / rear'], ['diagonal', 'diagonal']])}
</div>
<fieldset class="valve"><legend>Rear pressure valve</legend>
${selectField(ctx, `${V}.type`, 'Valve type', VALVE_CHOICES, { structural: true })}
${valveInputs(ctx)}
${blockMessage(ctx, V)}
</fieldset>
${balanceBarInputs(ctx)}`,
  normalise,
};
