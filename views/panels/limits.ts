/**
 * Limits (issue 7): traction limits with a chart of limit acceleration against adhesion for the three drive
 * layouts (the design's own highlighted), regenerative braking (force against speed, utilisation with and
 * without it, the largest force that keeps the lock order allowed), stopping distances, the roller-tester
 * prediction and brake heat. Inputs for the optional blocks sit in a collapsed group. Every figure is an estimate.
 */
import type { EvaluationResult, LoadStateResult, UnitSystem } from '../../core/index.ts';
import { baseLayout, chartBlock, type ChartSpec, plotText, seriesStyle } from '../chart.ts';
import { type InputContext, numberField, selectField } from '../fields.ts';
import { fixed, pedalUnit, shownUnit } from '../format.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel, ResultContext } from './panel.ts';

const DRIVES = ['front', 'rear', 'all'] as const;
const speedUnit = (u: UnitSystem) => shownUnit('speed', u, u === 'us' ? 'mph' : 'km/h');
const distUnit = (u: UnitSystem) => shownUnit('distance', u, u === 'us' ? 'ft' : 'm');
const accUnit = (u: UnitSystem) => shownUnit('acceleration', u, u === 'us' ? 'ft/s2' : 'm/s2');
const r4 = (v: number | null) => (v === null || !Number.isFinite(v) ? null : Math.round(v * 1e4) / 1e4);

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
        name: plotText(`${drive} drive${own ? ' (this design)' : ''} – ${s.label}`),
        legendgroup: `s${i}`,
        x: rows.map((t) => t.adhesion),
        y: rows.map((t) => r4(t.max_acceleration_g)),
        line: { color: st.colour, width: own ? 3 : 1.2, dash: own ? 'solid' : drive === 'all' ? 'dot' : 'dash' },
        marker: { symbol: st.symbol, size: 6 },
        hovertemplate: `k %{x:.2f}: %{y:.3f} g<extra></extra>`,
      });
    }
  });
  const layout = baseLayout('L1  Traction limit against adhesion', 'adhesion k', 'largest acceleration (g)');
  return { data, layout };
}

function tractionTable(s: LoadStateResult, units: UnitSystem): SafeHtml {
  const acc = accUnit(units);
  const f = shownUnit('force', units);
  const ks = [...new Set(s.traction.map((t) => t.adhesion))];
  const own = s.traction.find((t) => t.is_design_drive)!.drive;
  const at = (d: string, k: number) => s.traction.find((t) => t.drive === d && t.adhesion === k);
  return html`<table class="numbers data"><caption>${s.label}: largest acceleration (g) per drive layout; start gradient and drive-axle load for this design's ${own} drive</caption>
<tr><th scope="col">Adhesion k</th>${DRIVES.map((d) => html`<th scope="col">${d} drive${d === own ? ' *' : ''}</th>`)}<th scope="col">* in ${acc.label}</th><th scope="col">* start gradient (%)</th><th scope="col">* drive axle load (${f.label})</th><th scope="col">* limited by</th></tr>
${ks.map((k) => {
  const o = at(own, k);
  return html`<tr><td>${fixed(k, 2)}</td>${DRIVES.map((d) => html`<td>${fixed(at(d, k)?.max_acceleration_g, 3)}</td>`)}<td>${fixed(o ? acc.from(o.max_acceleration_ms2) : null, 2)}</td>
<td>${fixed(o?.max_gradient_pct, 1)}</td><td>${fixed(o ? f.from(o.drive_axle_load_on_gradient_n) : null, 2)}</td><td>${o?.limited_by.replace(/_/g, ' ') ?? '–'}</td></tr>`;
})}</table>`;
}

function stoppingTable(s: LoadStateResult, units: UnitSystem): SafeHtml {
  const st = s.stopping;
  const du = distUnit(units);
  const su = speedUnit(units);
  const speeds = [...new Set(st.rows.map((r) => r.speed_kmh))];
  const ks = [...new Set(st.rows.map((r) => r.adhesion))];
  const cell = (v: number, k: number, mode: 'no_abs' | 'abs') => st.rows.find((r) => r.speed_kmh === v && r.adhesion === k && r.mode === mode);
  return html`<table class="numbers data"><caption>${s.label}: stopping distance (${du.label}), without ABS / with ABS</caption>
<tr><th scope="col">Adhesion k</th><th scope="col">z at first lock</th>${speeds.map((v) => html`<th scope="col">from ${fixed(su.from(v / 3.6), 0)} ${su.label}</th>`)}</tr>
${ks.map((k) => {
  const lock = cell(speeds[0]!, k, 'no_abs');
  return html`<tr><td>${fixed(k, 2)}</td><td>${fixed(lock?.braking_rate, 3)} ${lock?.first_axle ?? ''}</td>${speeds.map((v) => {
    const a = cell(v, k, 'no_abs');
    const b = cell(v, k, 'abs');
    return html`<td>${fixed(a ? du.from(a.total_m) : null, 1)} / ${fixed(b ? du.from(b.total_m) : null, 1)}</td>`;
  })}</tr>`;
})}</table>
<p class="hint">${st.design_has_abs ? 'ABS is fitted: the second figure applies; the first is the failed-ABS case.' : 'No ABS is fitted: the first figure applies; the second shows what ABS would give.'} ${st.notes.join(' ')}</p>`;
}

function testerBlock(s: LoadStateResult, units: UnitSystem): SafeHtml {
  const t = s.tester;
  const f = shownUnit('force', units);
  const pu = shownUnit('pressure', units);
  const pd = pedalUnit(units);
  return html`<table class="numbers data"><caption>${s.label}: roller tester (roller adhesion ${fixed(t.roller_adhesion, 2)}, test mass ${fixed(shownUnit('mass', units).from(t.test_mass_kg), 0)} ${shownUnit('mass', units).label})</caption>
<tr><th scope="col">Axle</th><th scope="col">Static load (${f.label})</th><th scope="col">Slip force (${f.label})</th><th scope="col">Slips at (${pu.label})</th><th scope="col">Slips at pedal (${pd.label})</th><th scope="col">Recorded (${f.label})</th><th scope="col">Limited by</th></tr>
${t.axles.map(
  (a) => html`<tr><td>${a.axle}</td><td>${fixed(f.from(a.static_load_n), 2)}</td><td>${fixed(f.from(a.slip_force_n), 2)}</td><td>${fixed(a.slip_pressure_bar === null ? null : pu.from(a.slip_pressure_bar * 1e5), 1)}</td>
<td>${fixed(a.slip_pedal_force_n === null ? null : pd.from(a.slip_pedal_force_n), 0)}</td><td>${fixed(f.from(a.recorded_force_n), 2)}</td><td>${a.limited_by === 'slip' ? 'wheel slip' : 'pedal limit'}</td></tr>`,
)}</table>
<p class="${t.predicted_pct < t.required_pct ? 'fail' : 'ok'}">Tester reading ${fixed(t.predicted_pct, 1)} % of the test mass (required ${fixed(t.required_pct, 0)} %).${t.flag ? html` <strong>${t.flag}</strong>` : ''}</p>`;
}

/** Chart: regenerative force against speed. */
export function regenForceChart(result: EvaluationResult, units: UnitSystem): ChartSpec | null {
  const g = result.regen;
  if (!g) return null;
  const f = shownUnit('force', units);
  const su = speedUnit(units);
  const data = [
    {
      type: 'scatter',
      mode: 'lines',
      name: 'largest regenerative force',
      x: g.force_curve.speed_kmh.map((v) => r4(su.from(v / 3.6))),
      y: g.force_curve.force_n.map((v) => r4(f.from(v))),
      line: { color: seriesStyle(0).colour, width: 2.5 },
      hovertemplate: `%{x:.0f} ${su.label}: %{y:.2f} ${f.label}<extra></extra>`,
    },
  ];
  return { data, layout: baseLayout('L2  Regenerative braking force against speed', `speed (${su.label})`, `force (${f.label})`) };
}

/** Chart: adhesion utilisation with zero regeneration (thin) and at the largest force analysed (thick). */
export function regenUtilisationChart(result: EvaluationResult): ChartSpec | null {
  const g = result.regen;
  if (!g) return null;
  const data: unknown[] = [];
  g.load_states.forEach((st, i) => {
    const style = seriesStyle(i);
    const label = result.load_states.find((s) => s.id === st.id)?.label ?? st.id;
    const strongest = st.at_speeds.reduce<(typeof st.at_speeds)[number] | null>((a, b) => (a === null || b.regen_force_n > a.regen_force_n ? b : a), null);
    const series: [string, typeof st.zero_regen.utilisation, number][] = [['no regeneration', st.zero_regen.utilisation, 1.2]];
    if (strongest) series.push([`${Math.round(strongest.regen_force_n)} N at ${strongest.speed_kmh} km/h`, strongest.utilisation, 2.5]);
    for (const [what, u, width] of series) {
      for (const axle of ['front', 'rear'] as const) {
        data.push({
          type: 'scatter',
          mode: 'lines',
          name: plotText(`${axle}, ${what} – ${label}`),
          legendgroup: `r${i}`,
          x: u.map((p) => p.braking_rate),
          y: u.map((p) => r4(axle === 'front' ? p.front_utilisation : p.rear_utilisation)),
          line: { color: style.colour, width, dash: axle === 'front' ? 'solid' : 'dash' },
          hovertemplate: `z %{x:.2f}: f %{y:.3f}<extra></extra>`,
        });
      }
    }
  });
  data.push({ type: 'scatter', mode: 'lines', name: 'k = z', x: [0, 1], y: [0, 1], line: { color: '#000000', width: 1, dash: 'dot' }, hoverinfo: 'skip' });
  const layout = baseLayout('L3  Adhesion utilisation with and without regeneration', 'braking rate z', 'adhesion utilisation f');
  (layout.xaxis as Record<string, unknown>).range = [0, 1];
  (layout.yaxis as Record<string, unknown>).range = [0, 1.2];
  return { data, layout };
}

/** Surface-lock flags grouped per load state and speed (the curve-check flags are in the table above). */
function flagList(flags: NonNullable<EvaluationResult['regen']>['flags']): SafeHtml {
  const groups = new Map<string, number[]>();
  for (const f of flags) {
    if (f.kind !== 'surface_lock' || f.adhesion === null) continue;
    const key = `${f.load_state} at ${f.speed_kmh} km/h`;
    groups.set(key, [...(groups.get(key) ?? []), f.adhesion]);
  }
  if (groups.size === 0) return html`<p class="ok">Regeneration does not make the driven axle lock first inside the lock-order range at the speeds analysed.</p>`;
  return html`<p>Regeneration makes the driven axle lock first inside the lock-order range (the front locks first without it):</p>
<ul class="warnings">${[...groups].map(([key, ks]) => html`<li>${key}: on adhesion ${ks.map((k) => k.toFixed(2)).join(', ')}</li>`)}</ul>`;
}

function regenBlock(ctx: ResultContext): SafeHtml {
  const g = ctx.result.regen;
  if (!g) return html`<p class="hint">No <code>regen</code> block in the design: regenerative braking is not analysed.</p>`;
  const f = shownUnit('force', ctx.units);
  const su = speedUnit(ctx.units);
  const force = regenForceChart(ctx.result, ctx.units)!;
  const util = regenUtilisationChart(ctx.result)!;
  const code = (l: { first_axle: string; braking_rate: number; allowed: boolean }) =>
    html`<span class="${l.allowed ? '' : 'fail'}">${l.first_axle} ${fixed(l.braking_rate, 2)}${l.allowed ? '' : ' ✗'}</span>`;
  return html`<p>${g.blending === 'regen_first' ? 'Regeneration first, friction fills in' : `Fixed proportion ${g.proportion} of the friction force added`};
${fixed(g.front_share * 100, 0)} % on the front axle. Largest force ${fixed(f.from(g.max_force_n), 2)} ${f.label} up to ${fixed(su.from(g.base_speed_kmh / 3.6), 0)} ${su.label}, then ${fixed(g.max_power_kw, 0)} kW constant power.</p>
<p class="hint">Lock order per surface judged against ${g.rule.source} [${g.rule.status}] for ${g.rule.category}: the rear may not lock first for z ${g.rule.z_from}–${g.rule.z_to} on k ${g.rule.k_from}–${g.rule.k_to}; ${g.rule.note}.</p>
${g.load_states.map((st) => {
  const label = ctx.result.load_states.find((s) => s.id === st.id)?.label ?? st.id;
  const F = st.max_force_passing_checks_n;
  return html`<table class="numbers data"><caption>${label}: axle that locks first and at which z (✗ = not allowed), and the largest regenerative force that keeps the lock allowed</caption>
<tr><th scope="col">k</th><th scope="col">No regeneration</th>${st.at_speeds.map((c) => html`<th scope="col">${fixed(su.from(c.speed_kmh / 3.6), 0)} ${su.label} (${fixed(f.from(c.regen_force_n), 2)} ${f.label})</th>`)}<th scope="col">Largest allowed (${f.label})</th><th scope="col">Motor torque (N·m)</th></tr>
${st.zero_regen.lock.map((l, i) => {
  const lim = st.limits[i]!;
  return html`<tr><td>${fixed(l.adhesion, 2)}</td><td>${code(l)}</td>${st.at_speeds.map((c) => html`<td>${code(c.lock[i]!)}</td>`)}
<td>${lim.in_rule_range ? (lim.max_force_n === null ? 'no limit' : fixed(f.from(lim.max_force_n), 2)) : 'outside range'}</td><td>${lim.in_rule_range ? fixed(lim.max_motor_torque_nm, 1) : ''}</td></tr>`;
})}</table>
${st.checks.length ? html`<table class="numbers data"><caption>${label}: regulation curve checks with regeneration (margin in adhesion units)</caption>
<tr><th scope="col">Rule</th><th scope="col">No regeneration</th>${st.at_speeds.map((c) => html`<th scope="col">${fixed(su.from(c.speed_kmh / 3.6), 0)} ${su.label}</th>`)}</tr>
${[...new Set(st.checks.map((c) => c.rule))].map((id) => html`<tr><td>${id}${st.checks.find((c) => c.rule === id)?.verify_note ? html` <small>(${st.checks.find((c) => c.rule === id)!.verify_note})</small>` : ''}</td>
${[null, ...st.at_speeds.map((c) => c.speed_kmh)].map((v) => {
  const c = st.checks.find((x) => x.rule === id && x.speed_kmh === v);
  return html`<td class="${c?.passed ? 'ok' : 'fail'}">${c ? `${c.passed ? 'pass' : 'FAIL'} ${fixed(c.worst_margin, 3)}` : '–'}</td>`;
})}</tr>`)}</table>
${st.max_force_basis === 'no_rule_to_keep'
  ? html`<p>Every curve check fails without regeneration already: there is no regenerative force to find.</p>`
  : html`<p>Largest regenerative force keeping the passing curve checks passing${st.failing_without_regen.length ? ` (${st.failing_without_regen.join(', ')} fails without regeneration already and is left out)` : ''}: <strong>${F === null ? `the full ${fixed(f.from(g.max_force_n), 2)} ${f.label}` : `${fixed(f.from(F), 2)} ${f.label} (${fixed((F * g.tyre_radius_m) / g.gear_ratio, 1)} N·m at the motor)`}</strong>.</p>`}` : ''}`;
})}
${flagList(g.flags)}
<p class="hint">${g.notes.join(' ')}</p>
${chartBlock('chart-l2', force, 'Largest regenerative braking force against speed: constant torque, constant power, fade-out at low speed.', 'Regenerative braking force against speed')}
${chartBlock('chart-l3', util, 'Front (solid) and rear (dashed) adhesion utilisation per load state: thin without regeneration, thick with the largest regenerative force analysed. Dotted: k = z.', 'Adhesion utilisation with and without regeneration')}`;
}

/** Chart: rotor peak temperature per Type-I cycle, this vehicle and the base vehicle. */
export function heatChart(result: EvaluationResult): ChartSpec | null {
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
        name: plotText(`${axle} rotor – ${i === 0 ? `this vehicle (${run.mass_kg} kg)` : `base vehicle (${run.mass_kg} kg)`}`),
        x: y.map((_, n) => n + 1),
        y: y.map((v) => Math.round(v * 10) / 10),
        line: { color: st.colour, width: i === 0 ? 2.5 : 1.5, dash: axle === 'front' ? 'solid' : 'dash' },
        marker: { symbol: st.symbol, size: 5 },
        hovertemplate: `cycle %{x}: %{y:.0f} °C<extra></extra>`,
      });
    }
  });
  return { data, layout: baseLayout('L4  Rotor temperature in a Type-I-like sequence (estimate)', 'braking cycle', 'rotor temperature (°C)') };
}

function heatBlock(ctx: ResultContext): SafeHtml {
  const h = ctx.result.heat;
  if (!h) return html`<p class="hint">No <code>heat</code> block in the design (rotor masses): brake heat is not estimated.</p>`;
  const su = speedUnit(ctx.units);
  const ti = h.type_i;
  return html`<table class="numbers data"><caption>One stop from ${fixed(su.from(h.single_stop.speed_kmh / 3.6), 0)} ${su.label} at ${fixed(h.single_stop.deceleration_ms2, 1)} m/s² (estimate)</caption>
<tr><th scope="col">Case</th><th scope="col">Mass (kg)</th><th scope="col">Energy (kJ)</th><th scope="col">Front share</th><th scope="col">Per front brake (kJ)</th><th scope="col">Per rear brake (kJ)</th><th scope="col">Front rotor rise (K)</th><th scope="col">Rear rotor rise (K)</th></tr>
${h.single_stop.rows.map(
  (r) => html`<tr><td>${r.case === 'base_vehicle' ? 'base vehicle' : r.case}</td><td>${fixed(r.mass_kg, 0)}</td><td>${fixed(r.energy_j / 1e3, 1)}</td><td>${fixed(r.front_share, 3)}</td>
<td>${fixed(r.front_brake_energy_j / 1e3, 1)}</td><td>${fixed(r.rear_brake_energy_j / 1e3, 1)}</td><td>${fixed(r.front_rotor_rise_k, 1)}</td><td>${fixed(r.rear_rotor_rise_k, 1)}</td></tr>`,
)}</table>
<p>Type-I-like sequence (load state ${ti.load_state}): ${ti.cycles} brakings from ${fixed(su.from(ti.v1_kmh / 3.6), 0)} to ${fixed(su.from(ti.v2_kmh / 3.6), 0)} ${su.label} at ${ti.deceleration_ms2} m/s², one every ${ti.interval_s} s.
Last peak: front ${fixed(ti.vehicle.front_final_peak_c, 0)} °C, rear ${fixed(ti.vehicle.rear_final_peak_c, 0)} °C${ti.base_vehicle ? html`; the same brakes on the base vehicle (${fixed(ti.base_vehicle.mass_kg, 0)} kg): front ${fixed(ti.base_vehicle.front_final_peak_c, 0)} °C, rear ${fixed(ti.base_vehicle.rear_final_peak_c, 0)} °C` : ''}.</p>
<p class="hint">${h.notes.join(' ')}</p>
${chartBlock('chart-l4', heatChart(ctx.result)!, 'Rotor temperature after each braking of the sequence: thick this vehicle, thin the base vehicle; solid front, dashed rear. Lumped estimate.', 'Rotor temperature per braking cycle')}`;
}

export function limitsResults(ctx: ResultContext): SafeHtml {
  const r = ctx.result;
  return html`<p class="hint">Engineering estimates: verify by physical brake testing; local regulations and a licensed inspector decide.</p>
<h3>Traction</h3>
${chartBlock('chart-l1', tractionChart(r), 'Largest acceleration the tyres can transmit against adhesion, with load transfer: thick line this design’s drive, dashed and dotted the other layouts; one colour per load state.', 'Traction limit against adhesion for front, rear and all-wheel drive')}
${r.load_states.map((s, i) => html`<details${i === 0 ? html` open` : ''}><summary>${s.label}</summary><div class="scroll">${tractionTable(s, ctx.units)}</div></details>`)}
<h3>Regenerative braking</h3>
<div class="scroll">${regenBlock(ctx)}</div>
<h3>Stopping distance</h3>
${r.load_states.map((s, i) => html`<details${i === 0 ? html` open` : ''}><summary>${s.label}</summary><div class="scroll">${stoppingTable(s, ctx.units)}</div></details>`)}
<h3>Roller brake tester</h3>
${r.load_states.map((s) => html`<div class="scroll">${testerBlock(s, ctx.units)}</div>`)}
<h3>Brake heat</h3>
<div class="scroll">${heatBlock(ctx)}</div>`;
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
