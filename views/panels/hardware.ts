/**
 * Hardware sanity (issue 9): pitfall warnings beside the verdict, and a panel with the failed
 * distribution valve cases and the pedal-travel margin with its chart (pedal travel against braking rate).
 */
import type { EvaluationResult } from '../../core/index.ts';
import { baseLayout, chartBlock, type ChartSpec, plotText, seriesStyle } from '../chart.ts';
import { type InputContext, numberField, selectField, triStateField } from '../fields.ts';
import { fixed, shownUnit } from '../format.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel, ResultContext } from './panel.ts';

const travelUnit = (ctx: ResultContext) => shownUnit('short_length', ctx.units, ctx.units === 'us' ? 'in' : 'mm');
const pressureUnit = (ctx: ResultContext) => shownUnit('pressure', ctx.units);

export function pitfallList(r: Pick<EvaluationResult, 'pitfalls'>): SafeHtml {
  if (r.pitfalls.length === 0) {
    return html`<p class="hint">None of the listed pitfalls applies to the facts this design states (base vehicle and conversion blocks).</p>`;
  }
  return html`<ul class="warnings pitfalls">${r.pitfalls.map(
    (p) => html`<li><code>${p.code}</code> <span class="path">${p.path}</span>: ${p.message}<br><small>Source: ${p.source}</small></li>`,
  )}</ul>`;
}

export function failedValveTable(ctx: ResultContext): SafeHtml {
  const fm = ctx.result.failure_modes;
  if (fm.length === 0) return html`<p class="hint">No rear valve is fitted, so there is no distribution device whose failure needs checking.</p>`;
  const first = fm[0]!;
  return html`<p>Deceleration at the ${fixed(first.pedal_force_limit_n, 0)} N pedal-force limit, not above the first wheel lock on adhesion ${fixed(first.test_adhesion, 2)},
against the secondary-braking figure. <small>${first.source} — ${first.verify_note}.</small></p>
<div class="scroll"><table class="failure-modes data">
<caption class="sr">Failed distribution valve per mode and load state</caption>
<tr><th scope="col">Failed state</th><th scope="col">Load state</th><th scope="col">Reached (m/s²)</th><th scope="col">Required (m/s²)</th><th scope="col">Verdict</th><th scope="col">Limited by</th><th scope="col">Rear locks first on k (0.2–0.8)</th></tr>
${fm.map(
  (f) => html`<tr><td>${f.description}</td><td>${f.load_state}</td><td>${fixed(f.max_deceleration_ms2, 2)}</td><td>${fixed(f.required_ms2, 1)}</td>
<td class="${f.passed ? 'ok' : 'fail'}">${f.passed ? 'pass' : 'FAIL'}</td><td>${f.limited_by.replace(/_/g, ' ')}</td><td>${f.rear_first_on.length ? f.rear_first_on.join(', ') : 'none'}</td></tr>`,
)}
</table></div>`;
}

export function pedalTravelChart(ctx: ResultContext): ChartSpec {
  const tu = travelUnit(ctx);
  const t = ctx.result.pedal_travel;
  const data: unknown[] = [];
  const dash: Record<string, string> = { service: 'solid' };
  t.states.forEach((s, i) => {
    const st = seriesStyle(i);
    for (const sr of s.series) {
      data.push({
        type: 'scatter', mode: 'lines', name: plotText(`${sr.case.replace(/_/g, ' ')} – ${s.load_state}`), legendgroup: `p${i}`,
        x: sr.braking_rate.map((z) => Math.round(z * 1e4) / 1e4),
        y: sr.pedal_travel_mm.map((v) => Math.round(tu.from(v * 1e-3) * 1e3) / 1e3),
        line: { color: st.colour, width: sr.case === 'service' ? 2.5 : 1.5, dash: dash[sr.case] ?? (sr.case.startsWith(t.circuits[0] ?? '') ? 'dash' : 'dot') },
        hovertemplate: `z %{x:.2f}: %{y:.1f} ${tu.label}<extra></extra>`,
      });
    }
  });
  const avail = tu.from(t.pedal_travel_available_mm * 1e-3);
  const warn = (avail * t.warn_pct) / 100;
  data.push({ type: 'scatter', mode: 'lines', name: 'travel available', x: [0, 1], y: [avail, avail], line: { color: '#000000', width: 1 }, hoverinfo: 'skip' });
  data.push({ type: 'scatter', mode: 'lines', name: `warning share (${t.warn_pct} %)`, x: [0, 1], y: [warn, warn], line: { color: '#777777', width: 1, dash: 'dash' }, hoverinfo: 'skip' });
  const layout = baseLayout('D  Pedal travel', 'braking rate z', `pedal travel (${tu.label})`);
  (layout.xaxis as Record<string, unknown>).range = [0, 1];
  return { data, layout };
}

export function pedalTravelBlock(ctx: ResultContext): SafeHtml {
  const t = ctx.result.pedal_travel;
  const tu = travelUnit(ctx);
  const pu = pressureUnit(ctx);
  const mm = (v: number) => fixed(tu.from(v * 1e-3), ctx.units === 'us' ? 2 : 1);
  return html`<p>Travel available ${mm(t.pedal_travel_available_mm)} ${tu.label}; warning when the service test deceleration takes more than ${fixed(t.warn_pct, 0)} %.
Master-cylinder stroke ${mm(t.master_cylinder_total_stroke_mm)} ${tu.label}; circuits ${t.circuits.join(' + ')}.</p>
<div class="scroll"><table class="pedal-travel data">
<caption class="sr">Pedal travel per load state, service and one circuit failed</caption>
<tr><th scope="col">Load state</th><th scope="col">Case</th><th scope="col">At (m/s²)</th><th scope="col">Master pressure (${pu.label})</th><th scope="col">Pedal travel (${tu.label})</th><th scope="col">Used</th><th scope="col">Margin (${tu.label})</th><th scope="col">Pedal force (N)</th></tr>
${t.states.flatMap((s) =>
  s.cases.map((c) => {
    const p = c.point;
    const over = p !== null && (p.bottomed || p.margin_mm < 0 || (c.case === 'service' && p.share_of_available_pct > t.warn_pct));
    return html`<tr class="${over ? 'fail' : ''}"><td>${s.load_state}</td><td>${c.case.replace(/_/g, ' ')}</td><td>${fixed(c.target_ms2, 1)}</td>
<td>${p ? fixed(pu.from(p.master_pressure_bar * 1e5), 1) : '–'}</td><td>${p ? mm(p.pedal_travel_mm) : 'not reached'}</td>
<td>${p ? `${fixed(p.share_of_available_pct, 0)} %` : '–'}${p?.bottomed ? ' (master cylinder bottoms)' : ''}${over ? html` <span class="flag">too much travel</span>` : ''}</td><td>${p ? mm(p.margin_mm) : '–'}</td>
<td>${p ? fixed(p.pedal_force_n, 0) : '–'}${p && p.pedal_force_n > c.pedal_force_limit_n ? ` (above ${c.pedal_force_limit_n})` : ''}</td></tr>`;
  }),
)}
</table></div>
${t.warnings.length ? html`<ul class="warnings">${t.warnings.map((w) => html`<li><code>${w.code}</code> <span class="path">${w.path}</span>: ${w.message}</li>`)}</ul>` : ''}
${t.defaults_used.length ? html`<p class="hint">Defaults used (${t.defaults_note}): ${t.defaults_used.join(', ')}.</p>` : ''}
<p class="hint">${t.method}</p>
${chartBlock('chart-d', pedalTravelChart(ctx), html`Pedal travel against braking rate per load state: thick line service brake, dashed and dotted lines with one circuit failed. Black: travel available; grey dashed: the warning share.`, 'Pedal travel against braking rate')}`;
}

export const pitfallsPanel: Panel = { id: 'pitfalls', title: 'Pitfalls', results: (ctx) => pitfallList(ctx.result) };

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
