/**
 * Limits (issue 7): traction limits with a chart of limit acceleration against adhesion for the three drive
 * layouts (the design's own highlighted), regenerative braking (force against speed, utilisation with and
 * without it, the largest force that keeps the lock order allowed), stopping distances, the roller-tester
 * prediction and brake heat. Inputs for the optional blocks sit in a collapsed group. Every figure is an estimate.
 */
import type { EvaluationResult, LoadStateResult, UnitSystem } from '../../core/index.ts';
import { baseLayout, chartBlock, type ChartSpec, plotText, seriesStyle } from '../chart.ts';
import { type InputContext, numberField, selectField } from '../fields.ts';
import { buildDocument, type ReportDocument, sectionOf } from '../../report/document.ts';
import * as F from '../../report/format.ts';
import { DRIVE_LABELS } from '../../report/labels.ts';
import { html, type SafeHtml } from '../html.ts';
import { blocksHtml } from './document.ts';
import type { Panel, ResultContext } from './panel.ts';

const DRIVES = ['front', 'rear', 'all'] as const;
const section = (doc: ReportDocument, id: string): SafeHtml => {
  const s = sectionOf(doc, id);
  return s ? blocksHtml(s.blocks) : html``;
};

/** Chart: largest acceleration (g) against adhesion, per load state and drive layout. */
export function tractionChart(result: EvaluationResult): ChartSpec {
  const data: unknown[] = [];
  result.load_states.forEach((s, i) => {
    const st = seriesStyle(i);
    for (const drive of DRIVES) {
      const rows = s.traction.filter((t) => t.drive === drive);
      if (rows.length === 0) continue;
      const own = rows[0]!.is_design_drive;
      data.push({
        type: 'scatter',
        mode: own ? 'lines+markers' : 'lines',
        name: plotText(`${DRIVE_LABELS[drive]}${own ? ' (this design)' : ''} – ${s.label}`),
        legendgroup: `s${i}`,
        x: rows.map((t) => F.plot('adhesion', t.adhesion, 'metric')),
        y: rows.map((t) => F.plot('utilisation', t.max_acceleration_g, 'metric')),
        line: { color: st.colour, width: own ? 3 : 1.2, dash: own ? 'solid' : drive === 'all' ? 'dot' : 'dash' },
        marker: { symbol: st.symbol, size: 6 },
        hovertemplate: `k %{x:.2f}: %{y:.3f} g<extra></extra>`,
      });
    }
  });
  const layout = baseLayout('L1  Traction limit against adhesion', 'adhesion k (–)', 'largest acceleration (g)');
  return { data, layout };
}

/** Chart: regenerative force against speed. */
export function regenForceChart(result: EvaluationResult, units: UnitSystem): ChartSpec | null {
  const g = result.regen;
  if (!g) return null;
  const fu = F.unitOf('force', units);
  const su = F.unitOf('speed', units);
  const data = [
    {
      type: 'scatter',
      mode: 'lines',
      name: 'largest regenerative force',
      x: g.force_curve.speed_kmh.map((v) => F.plot('speed', v, units, 'km/h')),
      y: g.force_curve.force_n.map((v) => F.plot('force', v, units)),
      line: { color: seriesStyle(0).colour, width: 2.5 },
      hovertemplate: `%{x} ${su}: %{y} ${fu}<extra></extra>`,
    },
  ];
  return { data, layout: baseLayout('L2  Regenerative braking force against speed', `speed (${su})`, `regenerative force (${fu})`) };
}

/** Chart: adhesion utilisation with zero regeneration (thin) and at the largest force analysed (thick). */
export function regenUtilisationChart(result: EvaluationResult, units: UnitSystem = 'metric'): ChartSpec | null {
  const g = result.regen;
  if (!g) return null;
  const data: unknown[] = [];
  g.load_states.forEach((st, i) => {
    const style = seriesStyle(i);
    const label = result.load_states.find((s) => s.id === st.id)?.label ?? st.id;
    const strongest = st.at_speeds.reduce<(typeof st.at_speeds)[number] | null>((a, b) => (a === null || b.regen_force_n > a.regen_force_n ? b : a), null);
    const series: [string, typeof st.zero_regen.utilisation, number][] = [['no regeneration', st.zero_regen.utilisation, 1.2]];
    if (strongest) series.push([`${F.force(strongest.regen_force_n, units)} at ${F.speed(strongest.speed_kmh, units)}`, strongest.utilisation, 2.5]);
    for (const [what, u, width] of series) {
      for (const axle of ['front', 'rear'] as const) {
        data.push({
          type: 'scatter',
          mode: 'lines',
          name: plotText(`${axle}, ${what} – ${label}`),
          legendgroup: `r${i}`,
          x: u.map((p) => F.plot('braking_rate', p.braking_rate, units)),
          y: u.map((p) => F.plot('utilisation', axle === 'front' ? p.front_utilisation : p.rear_utilisation, units)),
          line: { color: style.colour, width, dash: axle === 'front' ? 'solid' : 'dash' },
          hovertemplate: `z %{x:.3f}: f %{y:.3f}<extra></extra>`,
        });
      }
    }
  });
  data.push({ type: 'scatter', mode: 'lines', name: 'k = z', x: [0, 1], y: [0, 1], line: { color: '#000000', width: 1, dash: 'dot' }, hoverinfo: 'skip' });
  const layout = baseLayout('L3  Adhesion utilisation with and without regeneration', 'braking rate z (–)', 'adhesion utilisation f (–)');
  (layout.xaxis as Record<string, unknown>).range = [0, 1];
  (layout.yaxis as Record<string, unknown>).range = [0, 1.2];
  return { data, layout };
}

function regenBlock(ctx: ResultContext, doc: ReportDocument): SafeHtml {
  const g = ctx.result.regen;
  if (!g) return html`<p class="hint">No regenerative braking is entered: it is not analysed.</p>`;
  const force = regenForceChart(ctx.result, ctx.units)!;
  const util = regenUtilisationChart(ctx.result, ctx.units)!;
  return html`${section(doc, 'regen')}
${chartBlock('chart-l2', force, 'Largest regenerative braking force against speed: constant torque, constant power, fade-out at low speed.', 'Regenerative braking force against speed')}
${chartBlock('chart-l3', util, 'Front (solid) and rear (dashed) adhesion utilisation per load state: thin without regeneration, thick with the largest regenerative force analysed. Dotted: k = z.', 'Adhesion utilisation with and without regeneration')}`;
}

/** Chart: rotor peak temperature per Type-I cycle, this vehicle and the base vehicle. */
export function heatChart(result: EvaluationResult, units: UnitSystem = 'metric'): ChartSpec | null {
  const h = result.heat;
  if (!h) return null;
  const runs = [h.type_i.vehicle, ...(h.type_i.base_vehicle ? [h.type_i.base_vehicle] : [])];
  const data: unknown[] = [];
  runs.forEach((run, i) => {
    const st = seriesStyle(i);
    for (const axle of ['front', 'rear'] as const) {
      const y = axle === 'front' ? run.front_peak_c : run.rear_peak_c;
      data.push({
        type: 'scatter',
        mode: 'lines+markers',
        name: plotText(`${axle} rotor – ${i === 0 ? 'this vehicle' : 'base vehicle'} (${F.mass(run.mass_kg, units)})`),
        x: y.map((_, n) => n + 1),
        y: y.map((v) => F.plot('temperature', v, units, 'C')),
        line: { color: st.colour, width: i === 0 ? 2.5 : 1.5, dash: axle === 'front' ? 'solid' : 'dash' },
        marker: { symbol: st.symbol, size: 5 },
        hovertemplate: `cycle %{x}: %{y} ${F.unitOf('temperature', units)}<extra></extra>`,
      });
    }
  });
  return { data, layout: baseLayout('L4  Rotor temperature in a Type-I-like sequence (estimate)', 'braking cycle (number)', `rotor temperature (${F.unitOf('temperature', units)})`) };
}

function heatBlock(ctx: ResultContext, doc: ReportDocument): SafeHtml {
  if (!ctx.result.heat) return html`<p class="hint">No rotor masses are entered: brake heat is not estimated.</p>`;
  return html`${section(doc, 'heat')}
${chartBlock('chart-l4', heatChart(ctx.result, ctx.units)!, 'Rotor temperature after each braking of the sequence: thick this vehicle, thin the base vehicle; solid front, dashed rear. Lumped estimate.', 'Rotor temperature per braking cycle')}`;
}

export function limitsResults(ctx: ResultContext): SafeHtml {
  const r = ctx.result;
  const doc = buildDocument(r, { units: ctx.units });
  return html`<p class="hint">Engineering estimates: verify by physical brake testing; local regulations and a licensed inspector decide.</p>
<h3>Traction</h3>
${chartBlock('chart-l1', tractionChart(r), 'Largest acceleration the tyres can transmit against adhesion, with load transfer: thick line this design’s drive, dashed and dotted the other layouts; one colour per load state.', 'Traction limit against adhesion for front, rear and all-wheel drive')}
${r.load_states.map((s, i) => html`<details${i === 0 ? html` open` : ''}><summary>${s.label}</summary>${section(doc, `traction-${i}`)}</details>`)}
<h3>Regenerative braking</h3>
${regenBlock(ctx, doc)}
<h3>Stopping distance</h3>
${r.load_states.map((s, i) => html`<details${i === 0 ? html` open` : ''}><summary>${s.label}</summary>${section(doc, `stopping-${i}`)}</details>`)}
<h3>Roller brake tester</h3>
${r.load_states.map((_, i) => section(doc, `tester-${i}`))}
<h3>Brake heat</h3>
${heatBlock(ctx, doc)}`;
}

const NOT_STATED = ['', 'not stated'] as const;

/** Optional inputs for the limits blocks; an empty field leaves its key out (defaults in docs/limits.md). */
export function limitsInputs(ctx: InputContext): SafeHtml {
  return html`<details class="limits-inputs"><summary>Traction, regeneration, stopping, heat and roller tester (optional; empty fields use the defaults)</summary>
<fieldset><legend>Traction</legend><div class="grid">
${numberField(ctx, 'traction.all_wheel_front_share', 'All-wheel drive: front share of drive force', { optional: true, unitText: '–', hint: 'empty: ideal split', width: 's' })}
${numberField(ctx, 'traction.rolling_resistance', 'Rolling-resistance coefficient', { optional: true, unitText: '–', width: 's' })}
</div></fieldset>
<fieldset><legend>Regenerative braking</legend><div class="grid">
${numberField(ctx, 'regen.max_motor_torque_nm', 'Largest regenerative motor torque', { optional: true, unitText: 'N·m' })}
${numberField(ctx, 'regen.gear_ratio', 'Motor-to-wheel ratio', { optional: true, unitText: '–', hint: '1 if the torque is at the wheels', width: 's' })}
${numberField(ctx, 'regen.max_power_kw', 'Regenerative power limit', { optional: true, unitText: 'kW' })}
${numberField(ctx, 'regen.fade_start_kmh', 'Fades out below', { optional: true })}
${numberField(ctx, 'regen.cutoff_kmh', 'None below', { optional: true })}
${selectField(ctx, 'regen.blending.type', 'Blending', [NOT_STATED, ['regen_first', 'regeneration first, friction fills in'], ['fixed_proportion', 'fixed proportion added to friction']], { optional: true })}
${numberField(ctx, 'regen.blending.proportion', 'Fixed proportion (regen / friction)', { optional: true, unitText: '–', width: 's' })}
${numberField(ctx, 'regen.front_share', 'All-wheel drive: front share of regeneration', { optional: true, unitText: '–', width: 's' })}
</div></fieldset>
<fieldset><legend>Stopping</legend><div class="grid">
${numberField(ctx, 'stopping.reaction_time_s', 'Reaction time', { optional: true, hint: '0.67, 1.5 and 2.5 s are all in use' })}
${numberField(ctx, 'stopping.build_up_time_s', 'Brake build-up time', { optional: true })}
${numberField(ctx, 'stopping.abs_adhesion_factor', 'ABS: share of adhesion used', { optional: true, unitText: '–', width: 's' })}
</div></fieldset>
<fieldset><legend>Brake heat</legend><div class="grid">
${numberField(ctx, 'heat.front_rotor_kg', 'Front disc or drum, one', { optional: true })}
${numberField(ctx, 'heat.rear_rotor_kg', 'Rear disc or drum, one', { optional: true })}
${numberField(ctx, 'heat.specific_heat_j_per_kg_k', 'Specific heat', { optional: true, unitText: 'J/(kg·K)' })}
${numberField(ctx, 'heat.heat_to_rotor_share', 'Share of heat into the rotor', { optional: true, unitText: '–', width: 's' })}
${numberField(ctx, 'heat.cooling_coefficient_per_s', 'Cooling coefficient', { optional: true, unitText: '1/s', width: 's' })}
${numberField(ctx, 'heat.ambient_c', 'Ambient', { optional: true, unitText: '°C', width: 's' })}
${numberField(ctx, 'heat.max_speed_kmh', 'Vehicle maximum speed', { optional: true })}
${numberField(ctx, 'heat.base_vehicle_mass_kg', 'Base vehicle mass', { optional: true })}
${numberField(ctx, 'heat.base_vehicle_front_axle_kg', 'Base vehicle front axle', { optional: true })}
</div></fieldset>
<fieldset><legend>Roller brake tester</legend><div class="grid">
${numberField(ctx, 'tester.roller_adhesion', 'Roller adhesion', { optional: true, unitText: '–', width: 's' })}
${numberField(ctx, 'tester.test_mass_kg', 'Test mass', { optional: true })}
${numberField(ctx, 'tester.required_pct', 'Required service-brake reading', { optional: true, unitText: '%', width: 's' })}
${numberField(ctx, 'tester.pedal_force_limit_n', 'Pedal force applied at most', { optional: true })}
</div></fieldset>
</details>`;
}

/** Results beside the verdict; the inputs are a panel of their own so that each section id stays unique. */
export const limitsPanel: Panel = { id: 'limits', title: 'Limits: traction, regeneration, stopping, tester, heat', results: limitsResults, deferred: true };
export const limitsInputsPanel: Panel = { id: 'limits-inputs', title: 'Limits: optional inputs', inputs: limitsInputs };
