/** Front and rear brakes: tyre radius, disc or drum, and that type's figures. */
import type { UnitSystem } from '../../core/index.ts';
import { type FormValues, formatFieldNumber } from '../../form/design-form.ts';
import { type InputContext, blockMessage, listButton, listIndicesOf, numberField, prefixLabels, selectField } from '../fields.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel } from './panel.ts';

/** Starting values when a brake type is switched on; labelled in the page as figures to replace. */
const START: Record<'disc' | 'drum', Record<string, string | number>> = {
  disc: { caliper: 'sliding', 'piston_diameters_mm[0]': 48, effective_radius_m: 0.12, pad_friction: 0.4, threshold_pressure_bar: 0.5 },
  drum: { wheel_cylinder_diameter_mm: 22.2, drum_radius_m: 0.127, brake_factor: 2, threshold_pressure_bar: 3 },
};
const KEYS: Record<'disc' | 'drum', RegExp> = {
  disc: /^(type|caliper|piston_diameters_mm\[\d+\]|effective_radius_m|pad_friction|threshold_pressure_bar)$/,
  drum: /^(type|wheel_cylinder_diameter_mm|drum_radius_m|brake_factor|shoe_arrangement|threshold_pressure_bar)$/,
};

function normaliseAxle(values: FormValues, axle: 'front' | 'rear', units: UnitSystem): FormValues {
  const p = `axles.${axle}.brake.`;
  const type = values[`${p}type`] === 'drum' ? 'drum' : 'disc';
  const out: FormValues = {};
  for (const [n, v] of Object.entries(values)) if (!n.startsWith(p) || KEYS[type].test(n.slice(p.length))) out[n] = v;
  out[`${p}type`] = type;
  const hasPiston = Object.keys(out).some((n) => n.startsWith(`${p}piston_diameters_mm[`));
  for (const [k, v] of Object.entries(START[type])) {
    const name = `${p}${k}`;
    if (k.startsWith('piston_diameters_mm') && hasPiston) continue;
    if (out[name] === undefined) out[name] = typeof v === 'number' ? formatFieldNumber(name, v, units) : v;
  }
  return out;
}

function axleInputs(ctx: InputContext, axle: 'front' | 'rear'): SafeHtml {
  const p = `axles.${axle}.brake`;
  const type = ctx.values[`${p}.type`] === 'drum' ? 'drum' : 'disc';
  let fields: SafeHtml;
  if (type === 'disc') {
    const pistons = listIndicesOf(ctx.values, `${p}.piston_diameters_mm`);
    fields = html`${selectField(ctx, `${p}.caliper`, 'Caliper', [['sliding', 'sliding (pistons on one side)'], ['fixed', 'fixed (opposed pistons)']], { hint: 'for a fixed caliper list every piston; half of them clamp each side' })}
<fieldset class="pistons"><legend>Piston diameters, one caliper</legend>
${pistons.map((i) => html`<span class="piston">${numberField(ctx, `${p}.piston_diameters_mm[${i}]`, `${axle} piston ${i + 1} diameter`, { compact: true, width: 's' })}${listButton(`remove:${p}.piston_diameters_mm[${i}]`, '×', 'Remove this piston', pistons.length <= 1)}</span>`)}
${listButton(`add:${p}.piston_diameters_mm`, '+ piston', 'Add a piston', pistons.length >= 8)}
${blockMessage(ctx, `${p}.piston_diameters_mm`)}</fieldset>
${numberField(ctx, `${p}.effective_radius_m`, 'Effective disc radius', { hint: 'disc centre to pad centroid' })}
${numberField(ctx, `${p}.pad_friction`, 'Pad friction coefficient', { unitText: '–' })}`;
  } else {
    fields = html`${numberField(ctx, `${p}.wheel_cylinder_diameter_mm`, 'Wheel cylinder diameter')}
${numberField(ctx, `${p}.drum_radius_m`, 'Drum radius')}
${numberField(ctx, `${p}.brake_factor`, 'Brake factor C*', { unitText: '–', hint: 'total shoe drag / actuating force; about 2 for leading–trailing shoes' })}
${selectField(ctx, `${p}.shoe_arrangement`, 'Shoe arrangement', [['', '— not stated —'], ['leading_trailing', 'leading–trailing'], ['two_leading', 'two leading shoes'], ['duo_servo', 'duo-servo']], { optional: true, hint: 'how the brake factor moves with lining friction in the robustness analysis' })}`;
  }
  const out = html`<fieldset class="axle"><legend>${axle === 'front' ? 'Front axle' : 'Rear axle'}</legend>
${numberField(ctx, `axles.${axle}.tyre_radius_m`, 'Tyre rolling radius', { hint: 'dynamic radius, loaded' })}
${selectField(ctx, `${p}.type`, 'Brake type', [['disc', 'disc'], ['drum', 'drum']], { structural: true })}
${fields}
${numberField(ctx, `${p}.threshold_pressure_bar`, 'Threshold pressure', { hint: 'line pressure before the brake makes torque' })}
${blockMessage(ctx, p)}
</fieldset>`;
  prefixLabels(ctx, `axles.${axle}.`, axle === 'front' ? 'Front axle: ' : 'Rear axle: ');
  return out;
}

export const brakesPanel: Panel = {
  id: 'brakes',
  title: 'Brakes',
  inputs: (ctx) => html`<div class="two">${axleInputs(ctx, 'front')}${axleInputs(ctx, 'rear')}</div>`,
  normalise: (values, units) => normaliseAxle(normaliseAxle(values, 'front', units), 'rear', units),
};
