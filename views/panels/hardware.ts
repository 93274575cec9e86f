/**
 * Hardware sanity (issue 9): pitfall warnings beside the verdict, and a panel with the failed
 * distribution valve cases and the pedal-travel margin with its chart (pedal travel against braking rate).
 */
import type { EvaluationResult, UnitSystem } from '../../core/index.ts';
import { buildDocument, sectionOf } from '../../report/document.ts';
import * as F from '../../report/format.ts';
import { travelCaseLabel } from '../../report/labels.ts';
import { baseLayout, chartBlock, type ChartSpec, plotText, seriesStyle } from '../chart.ts';
import { type InputContext, numberField, selectField, triStateField } from '../fields.ts';
import { html, type SafeHtml } from '../html.ts';
import { blockHtml, blocksHtml, itemsHtml } from './document.ts';
import type { Panel, ResultContext } from './panel.ts';

const docOf = (ctx: ResultContext) => buildDocument(ctx.result, { units: ctx.units });

export function pitfallList(r: EvaluationResult, units: UnitSystem = 'metric'): SafeHtml {
  const s = sectionOf(buildDocument(r, { units }), 'pitfalls');
  if (!s) {
    return html`<p class="hint">None of the listed pitfalls applies to the facts this design states (base vehicle and conversion blocks).</p>`;
  }
  return html`${s.blocks.map((b) => (b.kind === 'items' ? itemsHtml(b, 'warnings pitfalls') : blockHtml(b)))}`;
}

export function failedValveTable(ctx: ResultContext): SafeHtml {
  const s = sectionOf(docOf(ctx), 'valve-failure');
  return s ? blocksHtml(s.blocks, { cls: 'failure-modes data' }) : html``;
}

export function pedalTravelChart(ctx: ResultContext): ChartSpec {
  const u = ctx.units;
  const t = ctx.result.pedal_travel;
  const tu = F.unitOf('short_length', u);
  const travel = (mm: number) => F.plot('short_length', mm, u, 'mm');
  const data: unknown[] = [];
  const dash: Record<string, string> = { service: 'solid' };
  const stateLabel = (id: string) => ctx.result.load_states.find((s) => s.id === id)?.label ?? id;
  t.states.forEach((s, i) => {
    const st = seriesStyle(i);
    for (const sr of s.series) {
      data.push({
        type: 'scatter', mode: 'lines', name: plotText(`${travelCaseLabel(sr.case)} – ${stateLabel(s.load_state)}`), legendgroup: `p${i}`,
        x: sr.braking_rate.map((z) => F.plot('braking_rate', z, u)),
        y: sr.pedal_travel_mm.map(travel),
        line: { color: st.colour, width: sr.case === 'service' ? 2.5 : 1.5, dash: dash[sr.case] ?? (sr.case.startsWith(t.circuits[0] ?? '') ? 'dash' : 'dot') },
        hovertemplate: `z %{x:.3f}: %{y} ${tu}<extra></extra>`,
      });
    }
  });
  const avail = travel(t.pedal_travel_available_mm) ?? 0;
  const warn = travel((t.pedal_travel_available_mm * t.warn_pct) / 100) ?? 0;
  data.push({ type: 'scatter', mode: 'lines', name: 'travel available', x: [0, 1], y: [avail, avail], line: { color: '#000000', width: 1 }, hoverinfo: 'skip' });
  data.push({ type: 'scatter', mode: 'lines', name: `warning share (${F.percent(t.warn_pct)})`, x: [0, 1], y: [warn, warn], line: { color: '#777777', width: 1, dash: 'dash' }, hoverinfo: 'skip' });
  const layout = baseLayout('D  Pedal travel', 'braking rate z (–)', `pedal travel (${tu})`);
  (layout.xaxis as Record<string, unknown>).range = [0, 1];
  return { data, layout };
}

export function pedalTravelBlock(ctx: ResultContext): SafeHtml {
  const s = sectionOf(docOf(ctx), 'pedal-travel');
  return html`${s ? blocksHtml(s.blocks, { cls: 'pedal-travel data' }) : ''}
${chartBlock('chart-d', pedalTravelChart(ctx), html`Pedal travel against braking rate per load state: thick line service brake, dashed and dotted lines with one circuit failed. Black: travel available; grey dashed: the warning share.`, 'Pedal travel against braking rate')}`;
}

export const pitfallsPanel: Panel = { id: 'pitfalls', title: 'Pitfalls', results: (ctx) => pitfallList(ctx.result, ctx.units) };

const NOT_STATED = ['', 'not stated'] as const;

/**
 * Optional inputs (an empty field leaves the key out, so a design nobody filled in here keeps its meaning).
 * The yes/no facts of `base_vehicle` and `conversion` are three-way selects (not stated / yes / no,
 * `triStateField`): "not stated" must stay possible, and the pitfall checks read only what is stated.
 */
export function hardwareInputs(ctx: InputContext): SafeHtml {
  const axle = (a: 'front' | 'rear') => html`<fieldset><legend>${a === 'front' ? 'Front' : 'Rear'} axle (both wheels)</legend><div class="grid">
${numberField(ctx, `hardware.${a}.running_clearance_mm`, 'Disc: piston travel to clamp', { optional: true })}
${numberField(ctx, `hardware.${a}.knock_back_mm`, 'Disc: knock-back', { optional: true })}
${numberField(ctx, `hardware.${a}.shoe_travel_mm`, 'Drum: travel per wheel-cylinder piston', { optional: true })}
${numberField(ctx, `hardware.${a}.expansion_per_bar_mm3`, 'Hose and caliper expansion', { optional: true, unitText: 'mm³/bar' })}
${numberField(ctx, `hardware.${a}.fluid_volume_mm3`, 'Fluid under pressure', { optional: true, unitText: 'mm³' })}
</div></fieldset>`;
  return html`<details class="hardware-inputs"><summary>Pedal travel data, base vehicle and conversion (optional; empty fields use the listed defaults)</summary>
<div class="grid">
${numberField(ctx, 'hardware.pedal_travel_available_mm', 'Pedal travel available', { optional: true, hint: 'pedal pad, rest to floor or stop' })}
${numberField(ctx, 'hardware.pedal_travel_warn_pct', 'Warn above share of travel', { optional: true, unitText: '%', width: 's' })}
${numberField(ctx, 'hardware.master_cylinder.primary_stroke_mm', 'Master cylinder: primary stroke', { optional: true })}
${numberField(ctx, 'hardware.master_cylinder.secondary_stroke_mm', 'Master cylinder: secondary stroke', { optional: true })}
${numberField(ctx, 'hardware.master_cylinder.dead_travel_mm', 'Master cylinder: dead travel per piston', { optional: true })}
${selectField(ctx, 'hardware.master_cylinder.primary_feeds', 'Primary chamber feeds', [NOT_STATED, ['front', 'front axle'], ['rear', 'rear axle']], { optional: true })}
${numberField(ctx, 'hardware.fluid_bulk_modulus_bar', 'Fluid bulk modulus', { optional: true })}
</div>
${axle('front')}${axle('rear')}
<fieldset><legend>Base vehicle (before the conversion)</legend><div class="grid">
${numberField(ctx, 'base_vehicle.front_tyre_radius_m', 'Front tyre rolling radius', { optional: true })}
${numberField(ctx, 'base_vehicle.rear_tyre_radius_m', 'Rear tyre rolling radius', { optional: true })}
${selectField(ctx, 'base_vehicle.circuit_split', 'Circuit split', [NOT_STATED, ['front_rear', 'front/rear'], ['diagonal', 'diagonal']], { optional: true })}
${selectField(ctx, 'base_vehicle.front_brake_type', 'Front brakes', [NOT_STATED, ['disc', 'disc'], ['drum', 'drum']], { optional: true })}
${selectField(ctx, 'base_vehicle.rear_brake_type', 'Rear brakes', [NOT_STATED, ['disc', 'disc'], ['drum', 'drum']], { optional: true })}
${triStateField(ctx, 'base_vehicle.abs', 'Antilock (ABS) fitted')}
${triStateField(ctx, 'base_vehicle.stability_control', 'Stability control fitted')}
${triStateField(ctx, 'base_vehicle.booster', 'Brake booster fitted')}
</div></fieldset>
<fieldset><legend>Conversion</legend><div class="grid">
${selectField(ctx, 'conversion.bias_adjuster', 'Front/rear bias adjuster', [NOT_STATED, ['none', 'none fitted'], ['locked', 'fitted, locked or pinned'], ['driver_adjustable', 'driver can adjust it']], { optional: true })}
${selectField(ctx, 'conversion.booster_source', 'Booster powered by', [NOT_STATED, ['engine_vacuum', 'engine vacuum'], ['electric_vacuum_pump', 'electric vacuum pump'], ['hydraulic_pump', 'hydraulic pump'], ['electric_booster', 'electric booster'], ['none', 'nothing']], { optional: true })}
${triStateField(ctx, 'conversion.engine_removed', 'Combustion engine removed')}
${triStateField(ctx, 'conversion.suspension_modified', 'Suspension modified', { hint: 'helper springs, air assistance, lift or lowering' })}
${triStateField(ctx, 'conversion.stability_control_working', 'Stability control still works')}
${triStateField(ctx, 'conversion.master_cylinder_from_drum_system', 'Master cylinder from a drum-braked system')}
${triStateField(ctx, 'conversion.master_cylinder_replaced', 'Master cylinder replaced (drums to discs)')}
</div></fieldset>
</details>`;
}

export const hardwarePanel: Panel = {
  id: 'hardware',
  title: 'Hardware: failed valve and pedal travel',
  inputs: hardwareInputs,
  results: (ctx) => html`<h3>Failure of the distribution valve</h3>${failedValveTable(ctx)}<h3>Pedal travel and fluid volume</h3>${pedalTravelBlock(ctx)}`,
  deferred: true, // about 0.8 ms per render: computed when in view, not on every keystroke
};
