/**
 * Saving and the evidence packet: the identification fields printed on the packet's cover (inputs), and the
 * save / packet / export / saved-designs controls (results). The design id of the last save is kept in the
 * form as the control field `_design_id`, so later saves add revisions to the same design.
 */
import { textField } from '../fields.ts';
import { html } from '../html.ts';
import type { Panel } from './panel.ts';

const SAVE_NEW = html`hx-vals='{"_design_id": ""}'`;

/** Inputs (left column): the identification printed on the packet's cover. */
export const storeInputsPanel: Panel = {
  id: 'packet-inputs',
  title: 'Evidence packet: identification',
  inputs: (ctx) => {
    ctx.rendered.add('_design_id');
    return html`<p class="hint">Printed on the cover of the evidence packet, exactly as typed.</p>
<div class="grid">
${textField(ctx, 'identification.vehicle_identification_number', 'Vehicle identification number', { maxLength: 40, optional: true })}
${textField(ctx, 'identification.owner', 'Owner', { optional: true })}
${textField(ctx, 'identification.modifier', 'Modifier (workshop)', { optional: true })}
${textField(ctx, 'identification.approval_regime', 'Approval regime', { optional: true, hint: 'e.g. individual approval, registration inspection' })}
${textField(ctx, 'identification.approval_code', 'Approval code or reference', { optional: true })}
</div>
<input type="hidden" id="store-design-id" name="_design_id" value="${ctx.values._design_id ?? ''}">`;
  },
};

/** Results (right column): save, saved designs, packet and exports. */
export const storePanel: Panel = {
  id: 'packet',
  title: 'Evidence packet and saved designs',
  results: () => html`<div class="store-actions">
<p><label for="store-message">Message for this revision</label> <input id="store-message" name="_message" maxlength="2000" class="w-l" placeholder="e.g. rear caliper 38 → 42 mm"></p>
<p><button type="button" hx-post="/designs/save" hx-include="#design-form, #store-message" hx-target="#store-status">Save revision</button>
<button type="button" class="secondary" hx-post="/designs/save" hx-include="#design-form, #store-message" ${SAVE_NEW} hx-target="#store-status">Save as a new design</button>
<button type="button" class="secondary" hx-get="/designs" hx-target="#store-browser">Saved designs</button></p>
<div id="store-status" aria-live="polite"></div>
<p><button type="button" class="download" data-download="/packet.pdf" data-filename="lockstep-packet.pdf">Evidence packet (PDF)</button>
<button type="button" class="download secondary" data-download="/export/curves.csv" data-filename="lockstep-curves.csv">Curves (CSV)</button>
<button type="button" class="download secondary" data-download="/export/checks.csv" data-filename="lockstep-checks.csv">Check results (CSV)</button></p>
<div id="store-browser"></div>
</div>`,
};
