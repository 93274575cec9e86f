/**
 * Inputs of the optional `test_results` block (core/test-results-schema.ts): what the physical brake test
 * measured, entered after the test. The evidence packet prints them against the prediction and the requirement
 * (docs/evidence-packet.md). Rows are added empty by the list buttons (EMPTYABLE_LISTS in form/design-form.ts); an empty row is refused until filled in or removed.
 */
import { type InputContext, blockMessage, listButton, listIndicesOf, numberField, prefixLabels, selectField, textField } from '../fields.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel } from './panel.ts';

const T = 'test_results';

function loadStateOptions(ctx: InputContext): [string, string][] {
  return listIndicesOf(ctx.values, 'load_states').map((i) => {
    const id = ctx.values[`load_states[${i}].id`] ?? '';
    return [id, ctx.values[`load_states[${i}].label`] || id];
  });
}

function roadTable(ctx: InputContext): SafeHtml {
  const path = `${T}.road`;
  const idx = listIndicesOf(ctx.values, path);
  const rows = idx.map((i) => {
    const p = `${path}[${i}]`;
    const n = i + 1;
    const row = html`<tr><td>${selectField(ctx, `${p}.load_state`, `Road test ${n}: load state`, [['', '— choose —'], ...loadStateOptions(ctx)], { compact: true })}</td>
<td>${selectField(ctx, `${p}.test`, `Road test ${n}: test`, [['', '— choose —'], ['service', 'service brake'], ['secondary', 'secondary (one circuit)']], { compact: true })}</td>
<td>${numberField(ctx, `${p}.speed_kmh`, `Road test ${n}: speed`, { compact: true, width: 's', optional: true })}</td>
<td>${numberField(ctx, `${p}.pedal_force_n`, `Road test ${n}: pedal force`, { compact: true, width: 's', optional: true })}</td>
<td>${numberField(ctx, `${p}.mfdd_ms2`, `Road test ${n}: mean fully developed deceleration`, { compact: true, width: 's', optional: true })}</td>
<td>${numberField(ctx, `${p}.stopping_distance_m`, `Road test ${n}: stopping distance`, { compact: true, width: 's', optional: true })}</td>
<td>${selectField(ctx, `${p}.wheel_lock`, `Road test ${n}: wheel lock`, [['', '—'], ['none', 'none'], ['front', 'front'], ['rear', 'rear'], ['both', 'both']], { compact: true })}</td>
<td>${listButton(`remove:${p}`, '×', `Remove road test ${n}`)}</td></tr>`;
    prefixLabels(ctx, `${p}.`, `Road test ${n}: `);
    return row;
  });
  return html`<fieldset class="table-field"><legend>Road tests</legend>
${idx.length ? html`<div class="scroll"><table class="inputs-table"><thead><tr><th scope="col">Load state</th><th scope="col">Test</th><th scope="col">Speed</th><th scope="col">Pedal force</th><th scope="col">MFDD</th><th scope="col">Stopping distance</th><th scope="col">Wheel lock</th><th scope="col"><span class="sr">Actions</span></th></tr></thead><tbody>
${rows}
</tbody></table></div>` : html`<p class="hint">None entered.</p>`}
${listButton(`add:${path}`, '+ road test', 'Add an empty row to fill in', idx.length >= 16)}
${blockMessage(ctx, path)}</fieldset>`;
}

function rollerTable(ctx: InputContext): SafeHtml {
  const path = `${T}.roller`;
  const idx = listIndicesOf(ctx.values, path);
  const rows = idx.map((i) => {
    const p = `${path}[${i}]`;
    const n = i + 1;
    const row = html`<tr><td>${selectField(ctx, `${p}.axle`, `Roller reading ${n}: axle`, [['', '— choose —'], ['front', 'front'], ['rear', 'rear']], { compact: true })}</td>
<td>${numberField(ctx, `${p}.left_n`, `Roller reading ${n}: left wheel`, { compact: true, width: 's' })}</td>
<td>${numberField(ctx, `${p}.right_n`, `Roller reading ${n}: right wheel`, { compact: true, width: 's' })}</td>
<td>${numberField(ctx, `${p}.pedal_force_n`, `Roller reading ${n}: pedal force`, { compact: true, width: 's', optional: true })}</td>
<td>${listButton(`remove:${p}`, '×', `Remove roller reading ${n}`)}</td></tr>`;
    prefixLabels(ctx, `${p}.`, `Roller reading ${n}: `);
    return row;
  });
  return html`<fieldset class="table-field"><legend>Roller brake tester</legend>
${idx.length ? html`<div class="scroll"><table class="inputs-table"><thead><tr><th scope="col">Axle</th><th scope="col">Left</th><th scope="col">Right</th><th scope="col">Pedal force</th><th scope="col"><span class="sr">Actions</span></th></tr></thead><tbody>
${rows}
</tbody></table></div>` : html`<p class="hint">None entered.</p>`}
${listButton(`add:${path}`, '+ roller reading', 'Add an empty row to fill in', idx.length >= 4)}
${blockMessage(ctx, path)}</fieldset>`;
}

export const testResultsPanel: Panel = {
  id: 'test-results-inputs',
  title: 'Brake test results (after the physical test)',
  inputs: (ctx) => html`<p class="hint">What the road test and the roller brake tester measured. The evidence packet prints each against the prediction and the requirement.</p>
${textField(ctx, `${T}.date`, 'Test date', { optional: true, maxLength: 40, width: 'm' })}
${textField(ctx, `${T}.place`, 'Test place', { optional: true })}
${textField(ctx, `${T}.tested_by`, 'Tested by', { optional: true })}
${roadTable(ctx)}
${rollerTable(ctx)}
${blockMessage(ctx, T)}`,
};
