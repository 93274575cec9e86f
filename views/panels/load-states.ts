/** Load states: one row each (mass, front axle load, CG height); add, duplicate, remove. */
import { blockMessage, listButton, listIndicesOf, numberField, prefixLabels, selectField, textField } from '../fields.ts';
import { html } from '../html.ts';
import type { Panel } from './panel.ts';

const MAX_STATES = 8;

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
${numberField(ctx, `${p}.mass_kg`, 'Vehicle mass', { width: 's' })}
${numberField(ctx, `${p}.front_axle_kg`, 'Front axle load', { width: 's', hint: 'static, on the scale' })}
${numberField(ctx, `${p}.cg_height_m`, 'CG height', { width: 's', hint: 'above the ground' })}
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
};
