/** Load states: one row each (mass, front axle load, CG height); add, duplicate, remove. */
import type { UnitSystem } from '../../core/index.ts';
import type { FormValues } from '../../form/design-form.ts';
import { type InputContext, blockMessage, listButton, listIndicesOf, numberField, prefixLabels, selectField, textField } from '../fields.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel } from './panel.ts';

const MAX_STATES = 8;

/** `from_build_up`: "" (entered here) or a state of the build-up (docs/build-up.md). */
const FROM_BUILD_UP = [['', 'entered'], ['unladen', 'build-up unladen'], ['laden', 'build-up laden']] as const;
const FIGURES = ['mass_kg', 'front_axle_kg', 'cg_height_m'] as const;

function overridesOf(values: FormValues, p: string): string[] {
  return listIndicesOf(values, `${p}.overrides`).map((j) => values[`${p}.overrides[${j}]`] ?? '');
}

/** The entered figures; a state taken from the build-up shows only the figures it overrides. */
function figureFields(ctx: InputContext, p: string): SafeHtml {
  const from = ctx.values[`${p}.from_build_up`] ?? '';
  const kept = from ? overridesOf(ctx.values, p) : [...FIGURES];
  return html`${kept.includes('mass_kg') ? numberField(ctx, `${p}.mass_kg`, 'Vehicle mass', { width: 's' }) : ''}
${kept.includes('front_axle_kg') ? numberField(ctx, `${p}.front_axle_kg`, 'Front axle load', { width: 's', hint: 'static, on the scale' }) : ''}
${kept.includes('cg_height_m') ? numberField(ctx, `${p}.cg_height_m`, 'CG height', { width: 's', hint: from ? 'kept as entered (override)' : 'above the ground' }) : ''}
${from ? html`<p class="hint">${kept.length ? 'Other figures' : 'Mass, front axle load and CG height'} from the ${from} state of the mass build-up (see the conversion results).</p>` : ''}`;
}

/** A state switched to the build-up drops the figures it does not override (they would be replaced anyway). */
function normalise(values: FormValues, _units: UnitSystem): FormValues {
  let out: FormValues | null = null;
  for (const i of listIndicesOf(values, 'load_states')) {
    const p = `load_states[${i}]`;
    // derived_from is filled again when the design is read; a carried "entered" / "build_up" would contradict a switch
    const d = values[`${p}.derived_from`];
    if (d !== undefined && d !== 'measured') {
      out ??= { ...values };
      delete out[`${p}.derived_from`];
    }
    if (!(values[`${p}.from_build_up`] ?? '')) continue;
    const kept = overridesOf(values, p);
    for (const f of FIGURES) {
      if (kept.includes(f) || values[`${p}.${f}`] === undefined) continue;
      out ??= { ...values };
      delete out[`${p}.${f}`];
    }
  }
  return out ?? values;
}

export const loadStatesPanel: Panel = {
  id: 'load-states',
  title: 'Load states',
  inputs: (ctx) => {
    const idx = listIndicesOf(ctx.values, 'load_states');
    const rows = idx.map((i) => {
      const p = `load_states[${i}]`;
      const n = i + 1;
      const row = html`<fieldset class="state"><legend><span class="swatch s${i % 8}" aria-hidden="true"></span> Load state ${n}</legend>
<div class="state-grid">
${textField(ctx, `${p}.label`, 'Description', { width: 'l' })}
${selectField(ctx, `${p}.kind`, 'Kind', [['unladen', 'unladen'], ['laden', 'laden'], ['other', 'other']])}
${textField(ctx, `${p}.id`, 'Short id', { width: 'm', hint: 'letters, digits, _ or -' })}
${selectField(ctx, `${p}.from_build_up`, 'Figures from', FROM_BUILD_UP, { structural: true, hint: 'build-up: mass, axle load and CG height from the conversion inputs' })}
${figureFields(ctx, p)}
</div>
<p class="acts">${listButton(`dup:load_states[${i}]`, 'Duplicate', `Duplicate load state ${n}`, idx.length >= MAX_STATES)} ${listButton(`remove:load_states[${i}]`, 'Remove', `Remove load state ${n}`, idx.length <= 1)}</p>
</fieldset>`;
      prefixLabels(ctx, `${p}.`, `Load state ${n}: `);
      return row;
    });
    return html`<p class="hint">Weigh each axle on a weighbridge for every load state you want checked. The regulation checks need one <em>unladen</em> and one <em>laden</em> state.</p>
${rows}
${blockMessage(ctx, 'load_states')}
${listButton('add:load_states', '+ Add load state', 'Add a load state (copy of the last one)', idx.length >= MAX_STATES)}`;
  },
  normalise,
};
