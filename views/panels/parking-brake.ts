/**
 * Parking brake (the design file's optional `parking_brake` block, core/design.ts): the braked axle, the control,
 * and either the holding force at the tyres or the mechanism (lever ratio, efficiency, brake factor, effective
 * radius), with the control force. Left empty, the block is absent and the parking checks are "not checked".
 */
import { blockMessage, numberField, selectField } from '../fields.ts';
import { html } from '../html.ts';
import type { Panel } from './panel.ts';

const P = 'parking_brake';

export const parkingBrakePanel: Panel = {
  id: 'parking-brake',
  title: 'Parking brake',
  inputs: (ctx) => html`<p class="hint">The parking checks hold the laden vehicle on the rule's gradient. Leave everything empty and they are reported as not checked.</p>
<div class="grid">
${selectField(ctx, `${P}.axle`, 'Braked axle', [['', 'not described'], ['rear', 'rear'], ['front', 'front']], { optional: true })}
${selectField(ctx, `${P}.control`, 'Control', [['', 'not described'], ['hand', 'hand lever'], ['foot', 'foot pedal']], { optional: true })}
${numberField(ctx, `${P}.control_force_n`, 'Control force applied', { optional: true, hint: 'empty = the rule’s limit for the control (held to it)' })}
</div>
<fieldset class="valve"><legend>Holding force, or the mechanism below</legend>
${numberField(ctx, `${P}.holding_force_n`, 'Holding force at the tyres', { optional: true, hint: 'declared by the maker or measured' })}
</fieldset>
<fieldset class="valve"><legend>Mechanism: all four, or the holding force above</legend>
<p class="hint">Control force × lever ratio × efficiency = the actuating force into the axle’s two brakes; × brake factor × effective radius ÷ tyre radius = the force at the tyres.</p>
<div class="grid">
${numberField(ctx, `${P}.lever_ratio`, 'Lever ratio (control to brakes)', { optional: true, unitText: '–' })}
${numberField(ctx, `${P}.efficiency`, 'Cable and linkage efficiency', { optional: true, unitText: '0–1' })}
${numberField(ctx, `${P}.brake_factor`, 'Brake factor', { optional: true, unitText: '–', hint: 'output over actuating force of the parking brake' })}
${numberField(ctx, `${P}.effective_radius_m`, 'Effective radius', { optional: true, hint: 'where the parking brake’s friction acts' })}
</div></fieldset>
${blockMessage(ctx, P)}`,
};
