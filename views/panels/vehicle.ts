/** The vehicle: name, category, wheelbase, antilock, driven axle. */
import { VEHICLE_CATEGORIES } from '../../core/index.ts';
import { checkField, numberField, selectField, textField } from '../fields.ts';
import { html } from '../html.ts';
import type { Panel } from './panel.ts';

export const vehiclePanel: Panel = {
  id: 'vehicle',
  title: 'Vehicle',
  inputs: (ctx) => html`<div class="grid">
${textField(ctx, 'name', 'Design name', { maxLength: 200 })}
${selectField(ctx, 'vehicle.category', 'Category', VEHICLE_CATEGORIES.map((c) => [c, c] as const), { width: 's', hint: 'UN/EU vehicle category' })}
${numberField(ctx, 'vehicle.wheelbase_m', 'Wheelbase', { hint: 'centre of front axle to centre of rear axle' })}
${selectField(ctx, 'vehicle.drive', 'Driven axle', [['front', 'front'], ['rear', 'rear'], ['all', 'all wheels']])}
${checkField(ctx, 'vehicle.abs', 'Antilock (ABS) fitted and working')}
${textField(ctx, 'notes', 'Notes', { maxLength: 20000, multiline: true, optional: true })}
</div>`,
};
