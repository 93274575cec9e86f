/** Surfaces to analyse: the adhesion coefficients k at which the lock order is reported. */
import { blockMessage, listButton, listIndicesOf, numberField } from '../fields.ts';
import { html } from '../html.ts';
import type { Panel } from './panel.ts';

const L = 'adhesion_coefficients';

export const surfacesPanel: Panel = {
  id: 'surfaces',
  title: 'Surfaces',
  inputs: (ctx) => {
    const idx = listIndicesOf(ctx.values, L);
    return html`<p class="hint">Tyre–road adhesion coefficients k to analyse: about 0.2 for ice or packed snow, 0.5 for wet asphalt, 0.8 to 1.0 for dry asphalt.</p>
<div class="surfaces">${idx.map((i) => html`<span class="piston">${numberField(ctx, `${L}[${i}]`, `Adhesion ${i + 1}`, { compact: true, width: 's', unitText: '–' })}${listButton(`remove:${L}[${i}]`, '×', 'Remove this surface', idx.length <= 1)}</span>`)}
${listButton(`add:${L}`, '+ surface', 'Add a surface', idx.length >= 20)}</div>
${blockMessage(ctx, L)}`;
  },
};
