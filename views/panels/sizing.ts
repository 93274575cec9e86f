/**
 * The sizing assistant (core/sizing, issue 5) on the workbench: the band of fixed front shares per rule and
 * load state, the parts that give the recommended share (each with an "Apply" button), the master-cylinder
 * bore, the rear-valve margin map when no fixed split works, the balance-bar setting, and the robustness
 * histogram. "Apply" posts the form with `_op = size:apply:<path>=<value>` (form/sizing-apply.ts);
 * the inputs panel then offers "Undo", which applies the replaced value again.
 * Deferred (computed when in view). The page runs the Monte Carlo with PAGE_SAMPLES samples, only when the
 * "Run robustness analysis" button asks for it; `lockstep size` defaults to 100 000.
 */
import { CAUTION, rearValveFamily, type SizingResult, sizeDesign, type UnitSystem, valveSettings, VERIFY_NOTE } from '../../core/index.ts';
import { sizingOp, SIZING_UNDO_FIELD } from '../../form/sizing-apply.ts';
import { baseLayout, chartBlock, type ChartSpec, plotText } from '../chart.ts';
import { numberField, selectField } from '../fields.ts';
import * as F from '../../report/format.ts';
import { ruleLabel, valveTypeLabel } from '../../report/labels.ts';
import { partChangeText } from '../../report/part-change.ts';
import { html, type SafeHtml } from '../html.ts';
import type { InputContext, Panel, ResultContext } from './panel.ts';

export const PAGE_SAMPLES = 1000;
export const PAGE_SEED = 1;

const pct = (x: number | null | undefined) => F.percentOfRatio(x);
/** A margin in adhesion units, signed. */
const signed = F.adhesionMargin;

function applyButton(path: string, value: unknown, label: string): SafeHtml {
  return html`<button type="button" class="op apply" name="_op" value="${sizingOp(path, value)}" form="design-form" hx-post="/workbench/update" hx-include="#design-form" hx-target="#status" hx-swap="outerHTML" title="${`Write this into the design (${path}); Undo appears under the tolerances`}">${label}</button>`;
}

function bandChart(r: SizingResult, stateLabel: (id: string) => string): ChartSpec {
  const names = r.per_rule.map((p) => `${ruleLabel(p.rule)} · ${stateLabel(p.load_state)}`);
  const data: unknown[] = [];
  r.per_rule.forEach((p, i) => {
    for (const [lo, hi] of p.intervals) {
      data.push({ type: 'bar', orientation: 'h', y: [plotText(names[i]!)], x: [hi - lo], base: [lo], marker: { color: '#56B4E9' }, showlegend: false, hovertemplate: `${pct(lo)} – ${pct(hi)}<extra></extra>` });
    }
  });
  const shapes: unknown[] = [];
  if (r.band) shapes.push({ type: 'rect', xref: 'x', yref: 'paper', x0: r.band.min_front_share, x1: r.band.max_front_share, y0: 0, y1: 1, fillcolor: '#009E73', opacity: 0.15, line: { width: 0 } });
  const line = (x: number | null, colour: string, dash: string) => (x === null ? null : { type: 'line', xref: 'x', yref: 'paper', x0: x, x1: x, y0: 0, y1: 1, line: { color: colour, width: 2, dash } });
  for (const s of [line(r.current_front_share, '#D55E00', 'dash'), line(r.recommended_front_share, '#000000', 'solid')]) if (s) shapes.push(s);
  const layout = baseLayout('Front shares that pass, per rule and load state', 'front share of the braking force, fixed split (%)', '');
  layout.xaxis = { ...(layout.xaxis as object), range: [0, 1], tickformat: '.0%' };
  layout.yaxis = { ...(layout.yaxis as object), automargin: true, title: { text: '' } };
  layout.barmode = 'overlay';
  layout.shapes = shapes;
  layout.height = 120 + 28 * names.length;
  return { data, layout };
}

function valveMap(r: SizingResult, units: UnitSystem): ChartSpec | null {
  const vs = r.valve_search;
  if (!vs) return null;
  const m = vs.map;
  // the knee axis in the page's pressure unit (plotly then picks round tick steps in that unit)
  const pu = { label: F.unitOf('pressure', units) };
  const knee = m.knee_bar.map((k) => F.plot('pressure', k, units, 'bar'));
  const layout = baseLayout('Proportioning valve: smallest margin over rules and load states', `knee (${pu.label})`, 'ratio above the knee (–)');
  return {
    data: [
      { type: 'heatmap', x: knee, y: m.ratio, z: m.smallest_margin, zmid: 0, colorscale: 'RdBu', colorbar: { title: { text: 'margin' } }, hovertemplate: `knee %{x} ${pu.label}, ratio %{y}: %{z:.3f}<extra></extra>` },
      { type: 'contour', x: knee, y: m.ratio, z: m.smallest_margin, showscale: false, contours: { start: 0, end: 0, size: 1, coloring: 'lines' }, line: { color: '#000', width: 2 }, hoverinfo: 'skip', name: 'margin 0 (edge of the passing region)' },
      { type: 'scatter', mode: 'markers', x: [F.plot('pressure', m.chosen.knee_bar, units, 'bar')], y: [m.chosen.ratio], marker: { symbol: 'star', size: 14, color: '#E69F00', line: { color: '#000', width: 1 } }, name: 'chosen setting' },
    ],
    layout,
  };
}

function histogram(r: SizingResult): ChartSpec {
  const h = r.robustness.histogram;
  const centres = h.counts.map((_, i) => 0.5 * (h.edges[i]! + h.edges[i + 1]!));
  const width = h.edges.length > 1 ? h.edges[1]! - h.edges[0]! : 0;
  const shapes: unknown[] = [{ type: 'line', xref: 'x', yref: 'paper', x0: 0, x1: 0, y0: 0, y1: 1, line: { color: '#D55E00', width: 2 } }];
  if (r.robustness.p05_margin !== null) shapes.push({ type: 'line', xref: 'x', yref: 'paper', x0: r.robustness.p05_margin, x1: r.robustness.p05_margin, y0: 0, y1: 1, line: { color: '#000', width: 1, dash: 'dot' } });
  const layout = baseLayout('Smallest margin of the perturbed vehicles', 'smallest margin (adhesion units)', 'samples (number)');
  layout.shapes = shapes;
  return { data: [{ type: 'bar', x: centres, y: h.counts, width: width, marker: { color: '#0072B2' }, hovertemplate: '%{x:.4f}: %{y}<extra></extra>' }], layout };
}

function optionsTable(r: SizingResult, units: UnitSystem): SafeHtml {
  if (r.options.length === 0) return html`<p class="hint">No part change found: the recommended share cannot be reached by resizing one axle within the allowed diameters.</p>`;
  return html`<div class="scroll"><table class="sizing-options data">
<caption>Parts that move the split to ${pct(r.recommended_front_share)} (the other axle kept), each checked with the full model</caption>
<thead><tr><th scope="col">Change</th><th scope="col">Series and source</th><th scope="col">Front share</th><th scope="col">Smallest margin</th><th scope="col">Verdict</th><th scope="col"></th></tr></thead>
<tbody>${r.options.map(
    (o) => html`<tr class="${o.passes ? 'check-ok' : 'check-fail'}"><th scope="row">${partChangeText(o, units)}</th><td>${o.series}<br><small>${o.source}</small></td><td>${pct(o.front_share)}</td><td>${signed(o.smallest_margin)}</td><td class="verdict-word">${o.passes ? 'passes' : 'fails'}</td><td>${applyButton(o.path, o.value, 'Apply')}</td></tr>`,
  )}</tbody></table></div>`;
}

function boreSection(r: SizingResult, units: UnitSystem): SafeHtml {
  const b = r.master_cylinder;
  if (!b) return html``;
  const ok = b.candidates.filter((c) => c.meets);
  return html`<h3>Master-cylinder bore</h3>
<p>${ruleLabel(b.rule)}: ${F.deceleration(b.required_deceleration_ms2, units)} needs ${F.pressure(b.pressure_for_required_bar, units, 'bar')}. Bores from ${F.shortLength(b.min_bore_mm, units)} to ${F.shortLength(b.max_bore_mm, units)} keep the pedal force at most ${F.pedalForce(b.pedal_force_target_n, units)} (limit ${F.pedalForce(b.pedal_force_limit_n, units)}) and the line pressure at the limit at most ${F.pressure(b.max_line_pressure_bar, units, 'bar')} (common practice, no source). Now ${F.shortLength(b.current_bore_mm, units)}.</p>
${b.notes.map((n) => html`<p class="hint">${n}</p>`)}
${ok.length ? html`<div class="scroll"><table class="data"><thead><tr><th scope="col">Bore</th><th scope="col">Pedal force (${F.unitOf('pedal_force', units)})</th><th scope="col">Pressure at the limit (${F.unitOf('pressure', units)})</th><th scope="col"></th></tr></thead><tbody>${ok.map((c) => html`<tr><th scope="row">${c.label}</th><td>${F.format('pedal_force', c.pedal_force_n, units, { unit: false })}</td><td>${F.format('pressure', c.pressure_at_limit_bar, units, { from: 'bar', unit: false })}</td><td>${applyButton(b.path, Math.round(c.bore_mm * 1000) / 1000, 'Apply')}</td></tr>`)}</tbody></table></div>` : ''}`;
}

function valveSection(r: SizingResult, units: UnitSystem): SafeHtml {
  if (!r.valve || !r.valve_search) return html``;
  const v = r.valve.valve;
  // the valve in words, from its type's module and the quantity table (core/valves/, core/field-meta.ts)
  const settings = valveSettings(v).map((st) => `${st.meta.label.charAt(0).toLowerCase()}${st.meta.label.slice(1)} ${F.fieldValue(st.meta, st.value, units)}`);
  const text = `${rearValveFamily(v).name}${settings.length ? `, ${settings.join(', ')}` : ''}`;
  const map = valveMap(r, units);
  return html`<h3>Rear valve</h3>
<p><strong>${text}</strong>: smallest margin ${signed(r.valve.smallest_margin)} (${r.valve.passes ? 'passes every rule in every load state' : 'still fails'}). ${applyButton(r.valve_search.path, v, 'Apply')}</p>
${map ? chartBlock('chart-sizing-valve', map, html`Colour: smallest margin of a proportioning valve with that knee and ratio (blue passes, red fails); black line: margin 0, the edge of the passing region; star: the chosen setting. ${r.valve_search.map.feasible_cells} cells pass.`, 'Heat map of the smallest margin over valve knee and ratio') : ''}`;
}

function barSection(r: SizingResult): SafeHtml {
  const b = r.balance_bar;
  if (!b) return html``;
  return html`<h3>Balance bar</h3>
<p>Lock the bar at <strong>${pct(b.recommended_setting_front_share)}</strong> of the pushrod force to the front master cylinder (now ${pct(b.current_setting_front_share)}); settings in the band: ${b.setting_range ? `${pct(b.setting_range.min)} – ${pct(b.setting_range.max)}` : 'none'}. Locked there the design ${b.with_recommended.passes ? 'passes' : 'still fails'} (smallest margin ${signed(b.with_recommended.smallest_margin)}). ${applyButton(b.path, b.recommended_setting_front_share, 'Apply')}</p>
<p class="warn">${b.warning}</p>`;
}

/** Control posted by the "Run robustness analysis" button (views/panels/panel.ts `controls`). */
export const ROBUST_CONTROL = '_robust';

/**
 * The robustness part: the Monte Carlo runs only when asked for with the button (a deferred request of this panel
 * with `_robust=1`); each change of the design renders the panel again without it, so no old figures stay.
 */
function robustnessSection(r: SizingResult, asked: boolean): SafeHtml {
  if (!asked) {
    return html`<h3>Robustness</h3>
<p>How often a rule fails when pad friction, CG height, axle load, tyre radius, the rear valve's knee and ratio and the threshold pressures stray within their tolerances: ${PAGE_SAMPLES} perturbed vehicles, worst corner and sensitivity. Computed on request for the design as it is now.</p>
<p><button type="button" class="secondary run-robust" hx-post="/workbench/panel/sizing" hx-include="#design-form" hx-vals='{"${ROBUST_CONTROL}": "1"}' hx-target="#deferred-sizing" hx-swap="outerHTML">Run robustness analysis</button></p>`;
  }
  const rb = r.robustness;
  return html`<h3>Robustness</h3>
<p>For ${rb.applies_to}: ${rb.samples} perturbed vehicles (seed ${rb.seed}, ${rb.distribution}; ± limits as 2 standard deviations): a rule fails in some load state in <strong>${F.percentOfRatio(rb.probability_of_failure)}</strong> of them; 5th-percentile smallest margin ${signed(rb.p05_margin)}; worst corner ${signed(rb.worst_corner.smallest_margin)} (${rb.failing_corners} of ${rb.corners} corners fail). Matters most: <strong>${rb.most_influential ? rb.sensitivity[0]!.label : F.DASH}</strong>. Tolerances: ${rb.tolerances_source}. The command line runs 100 000 samples.</p>
${chartBlock('chart-sizing-histogram', histogram(r), html`Red line: margin 0 (below it a rule fails); dotted: 5th percentile.`, 'Histogram of the smallest margin over the perturbed vehicles')}
<div class="scroll"><table class="data"><caption>Sensitivity: each input alone at its ± limit</caption><thead><tr><th scope="col">Input</th><th scope="col">± limit</th><th scope="col">Margin at −</th><th scope="col">Margin at +</th></tr></thead>
<tbody>${rb.sensitivity.map((s) => html`<tr><th scope="row">${s.label}</th><td>${s.tolerance}</td><td>${signed(s.margin_at_minus)}</td><td>${signed(s.margin_at_plus)}</td></tr>`)}</tbody></table></div>`;
}

export function sizingResults(ctx: ResultContext): SafeHtml {
  const asked = ctx.controls?.[ROBUST_CONTROL] === '1';
  const r = sizeDesign(ctx.design, { samples: asked ? PAGE_SAMPLES : 0, seed: PAGE_SEED });
  return html`<p class="sum"><strong>${r.band ? `Fixed splits from ${pct(r.band.min_front_share)} to ${pct(r.band.max_front_share)} pass every rule in every load state.` : 'No fixed split passes every rule in every load state: the band is empty.'}</strong>
Now ${pct(r.current_front_share)} at low pressure (${r.current.passes ? 'passes' : 'fails'}, smallest margin ${signed(r.current.smallest_margin)}); recommended ${pct(r.recommended_front_share)}.</p>
${chartBlock('chart-sizing-band', bandChart(r, (id) => ctx.result.load_states.find((x) => x.id === id)?.label ?? id), html`Blue bars: front shares that pass each rule in each load state (fixed split, thresholds and valves left out). Green: the common band. Dashed: this design's share at low pressure; solid black: the recommended share (largest smallest margin).`, 'Bars of passing front shares per rule and load state with the common band')}
${optionsTable(r, ctx.units)}
${boreSection(r, ctx.units)}
${valveSection(r, ctx.units)}
${barSection(r)}
${robustnessSection(r, asked)}
${r.messages.map((m) => html`<p class="hint">${m}</p>`)}
${r.verify_note ? html`<p class="verify">Rules partly verified or from memory: ${VERIFY_NOTE}.</p>` : ''}
<p class="caution">${CAUTION}</p>`;
}

function sizingInputs(ctx: InputContext): SafeHtml {
  const T = 'tolerances';
  const undo = ctx.values[SIZING_UNDO_FIELD];
  let undoButton: SafeHtml = html``;
  if (undo) {
    const eq = undo.indexOf('=');
    const path = undo.slice(0, eq);
    let value: unknown = null;
    try {
      value = JSON.parse(undo.slice(eq + 1));
    } catch {
      value = null;
    }
    if (eq > 0 && value !== null) {
      undoButton = html`<input type="hidden" name="${SIZING_UNDO_FIELD}" value="${undo}"><p>Last sizing change: <code>${path}</code>. <button type="button" class="op" name="_op" value="${sizingOp(path, value)}" hx-post="/workbench/update" hx-target="#status" hx-swap="outerHTML" hx-sync="closest form:replace">Undo (restore ${JSON.stringify(value)})</button></p>`;
    }
  }
  return html`${undoButton}
<p class="hint">How well the inputs are known, for the robustness analysis; empty fields take the defaults (pad friction ±15 %, CG height ±0.05 m, front axle ±20 kg, tyre radius ±2 %, rear valve knee ±10 % and ratio ±5 %, threshold pressure ±0.3 bar front and ±0.5 bar rear; the valve and threshold defaults are from memory).</p>
${numberField(ctx, `${T}.pad_friction_front_pct`, 'Pad friction, front ±', { optional: true, unitText: '%', width: 's' })}
${numberField(ctx, `${T}.pad_friction_rear_pct`, 'Pad friction, rear ±', { optional: true, unitText: '%', width: 's' })}
${numberField(ctx, `${T}.cg_height_m`, 'CG height ±', { optional: true, width: 's' })}
${numberField(ctx, `${T}.front_axle_kg`, 'Front axle load ±', { optional: true, width: 's' })}
${numberField(ctx, `${T}.tyre_radius_pct`, 'Tyre radius ±', { optional: true, unitText: '%', width: 's' })}
${numberField(ctx, `${T}.valve_knee_pct`, 'Rear valve knee pressure ±', { optional: true, unitText: '%', width: 's', hint: 'limiting, proportioning and load-sensing valves; a load-sensing valve\'s whole knee table moves together' })}
${numberField(ctx, `${T}.valve_ratio_pct`, 'Rear valve ratio above the knee ±', { optional: true, unitText: '%', width: 's', hint: 'proportioning and load-sensing valves' })}
${numberField(ctx, `${T}.threshold_front_bar`, 'Threshold pressure, front brakes ±', { optional: true, width: 's' })}
${numberField(ctx, `${T}.threshold_rear_bar`, 'Threshold pressure, rear brakes ±', { optional: true, width: 's' })}
${selectField(ctx, `${T}.distribution`, 'Distribution inside the ± limits', [
  ['', 'normal (default)'],
  ['normal', 'normal, ± = 2 standard deviations'],
  ['uniform', 'uniform between the limits'],
])}`;
}

export const sizingInputsPanel: Panel = { id: 'sizing-inputs', title: 'Sizing: tolerances', inputs: sizingInputs };
export const sizingPanel: Panel = { id: 'sizing', title: 'Sizing assistant', results: sizingResults, deferred: true };
