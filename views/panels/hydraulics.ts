/** Master cylinder, pedal, booster, circuit split and the rear pressure valve (with the load-sensing table). */
import type { UnitSystem } from '../../core/index.ts';
import { type FormValues, formatFieldNumber } from '../../form/design-form.ts';
import { type InputContext, blockMessage, listButton, listIndicesOf, numberField, selectField, triStateField } from '../fields.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel } from './panel.ts';

const V = 'hydraulics.rear_valve';
type ValveType = 'none' | 'limiting' | 'proportioning' | 'load_sensing';
const VALVE_TYPES: ReadonlyArray<readonly [ValveType, string]> = [
  ['none', 'none (rear gets master-cylinder pressure)'],
  ['limiting', 'limiting (rear pressure capped at the knee)'],
  ['proportioning', 'proportioning (reduced above the knee)'],
  ['load_sensing', 'load-sensing (knee follows rear axle load)'],
];
const KEYS: Record<ValveType, RegExp> = {
  none: /^type$/,
  limiting: /^(type|knee_bar)$/,
  proportioning: /^(type|knee_bar|ratio)$/,
  load_sensing: /^(type|ratio|senses|knee_bar_at_rear_axle_kg\[\d+\]\[[01]\])$/,
};
const START: Record<ValveType, Record<string, number>> = {
  none: {},
  limiting: { knee_bar: 35 },
  proportioning: { knee_bar: 28, ratio: 0.3 },
  load_sensing: { ratio: 0.3, 'knee_bar_at_rear_axle_kg[0][0]': 1100, 'knee_bar_at_rear_axle_kg[0][1]': 18, 'knee_bar_at_rear_axle_kg[1][0]': 1900, 'knee_bar_at_rear_axle_kg[1][1]': 42 },
};

function valveType(values: FormValues): ValveType {
  const t = values[`${V}.type`];
  return VALVE_TYPES.some(([v]) => v === t) ? (t as ValveType) : 'none';
}

function normalise(values: FormValues, units: UnitSystem): FormValues {
  const type = valveType(values);
  const out: FormValues = {};
  const prefix = `${V}.`;
  for (const [n, v] of Object.entries(values)) if (!n.startsWith(prefix) || KEYS[type].test(n.slice(prefix.length))) out[n] = v;
  out[`${V}.type`] = type;
  const hasTable = Object.keys(out).some((n) => n.startsWith(`${V}.knee_bar_at_rear_axle_kg[`));
  for (const [k, v] of Object.entries(START[type])) {
    const name = `${prefix}${k}`;
    if (k.startsWith('knee_bar_at') && hasTable) continue;
    if (out[name] === undefined) out[name] = formatFieldNumber(name, v, units);
  }
  return out;
}

function valveInputs(ctx: InputContext): SafeHtml {
  const type = valveType(ctx.values);
  const knee = () => numberField(ctx, `${V}.knee_bar`, 'Knee pressure', { hint: 'master-cylinder pressure where the valve starts to act' });
  const ratio = () => numberField(ctx, `${V}.ratio`, 'Ratio above the knee', { unitText: '–', hint: 'rise of rear pressure per unit rise of master-cylinder pressure' });
  if (type === 'limiting') return knee();
  if (type === 'proportioning') return html`${knee()}${ratio()}`;
  if (type !== 'load_sensing') return html``;
  const rows = listIndicesOf(ctx.values, `${V}.knee_bar_at_rear_axle_kg`);
  const t = `${V}.knee_bar_at_rear_axle_kg`;
  return html`${ratio()}
${selectField(ctx, `${V}.senses`, 'Valve follows', [['', 'suspension travel while braking (default)'], ['dynamic', 'suspension travel while braking'], ['static', 'the rear axle load at rest']], { optional: true, hint: 'a linkage to the axle follows the load transfer while braking; the knee then falls as the rear unloads' })}
<fieldset class="table-field"><legend>Knee pressure by rear axle load</legend>
<p class="hint">Read from the valve's setting chart; linear between rows, held flat outside. Rows ascending by load.</p>
<table class="inputs-table"><thead><tr><th scope="col">Rear axle load</th><th scope="col">Knee pressure</th><th scope="col"><span class="sr">Actions</span></th></tr></thead><tbody>
${rows.map((i) => html`<tr><td>${numberField(ctx, `${t}[${i}][0]`, `Row ${i + 1}: rear axle load`, { compact: true, width: 's' })}</td><td>${numberField(ctx, `${t}[${i}][1]`, `Row ${i + 1}: knee pressure`, { compact: true, width: 's' })}</td><td>${listButton(`remove:${t}[${i}]`, '×', 'Remove this row', rows.length <= 1)}</td></tr>`)}
</tbody></table>
${listButton(`add:${t}`, '+ row', 'Add a row (copy of the last)', rows.length >= 20)}
${blockMessage(ctx, t)}</fieldset>`;
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
${selectField(ctx, `${V}.type`, 'Valve type', VALVE_TYPES, { structural: true })}
${valveInputs(ctx)}
${blockMessage(ctx, V)}
</fieldset>
${balanceBarInputs(ctx)}`,
  normalise,
};
