/**
 * Chart A (braking-force diagram), chart B (adhesion utilisation) and chart C (pedal force and line
 * pressures), built from the engine's curves. Load states differ by colour and marker; front/rear and
 * ideal/installed differ by line style, so the charts read in grey print too.
 */
import { DEFAULT_AT, type LoadStateResult } from '../../core/index.ts';
import { frontLockLine, idealPointPerWeight, rearLockLine } from '../../core/chart-lines.ts';
import * as F from '../../report/format.ts';
import { baseLayout, chartBlock, type ChartSpec, plotText, seriesStyle, simplifyLine } from '../chart.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel, ResultContext } from './panel.ts';

/** Chart coordinates: dimensionless ones to the decimals of a braking rate (0.001 of an axis is below a pixel). */
const r4 = (v: number | null) => F.plot('braking_rate', v, 'metric');
/**
 * x and y of a line trace: straight runs reduced to their end points (views/chart.ts simplifyLine; the installed
 * curves, pressures and pedal force are piecewise linear in z), then rounded for plotting.
 */
function xy(x: ReadonlyArray<number | null>, y: ReadonlyArray<number | null>, rx: (v: number | null) => number | null = r4, ry: (v: number | null) => number | null = r4): { x: (number | null)[]; y: (number | null)[] } {
  const s = simplifyLine(x, y);
  return { x: s.x.map(rx), y: s.y.map(ry) };
}

/** Sparse markers at z = 0.1 … 1.0 on a curve, so each load state keeps its symbol in print. */
function markerTrace(i: number, x: (number | null)[], y: (number | null)[], group: string, yaxis?: string): unknown {
  const st = seriesStyle(i);
  return {
    type: 'scatter', mode: 'markers', x, y, legendgroup: group, showlegend: false, hoverinfo: 'skip',
    marker: { symbol: st.symbol, size: 7, color: st.colour, line: { width: 1, color: '#000' } },
    ...(yaxis ? { yaxis } : {}),
  };
}

function atGrid(s: LoadStateResult): number[] {
  const c = s.curves!;
  return DEFAULT_AT.map((z) => c.braking_rate.findIndex((b) => Math.abs(b - z) < 1e-9)).filter((k) => k >= 0);
}

/** The state whose adhesion lines are drawn: the first laden one, else the first. */
export function focusState(states: readonly LoadStateResult[]): number {
  const i = states.findIndex((s) => s.kind === 'laden');
  return i >= 0 ? i : 0;
}

export function chartA(ctx: ResultContext): ChartSpec {
  const E = ctx.design.vehicle.wheelbase_m;
  const data: unknown[] = [];
  let xMax = 0.1;
  let yMax = 0.1;
  ctx.result.load_states.forEach((s, i) => {
    const c = s.curves!;
    const st = seriesStyle(i);
    const g = `a${i}`;
    const name = plotText(s.label);
    data.push({ type: 'scatter', mode: 'lines', name: `Ideal – ${name}`, legendgroup: g, ...xy(c.ideal_front_per_weight, c.ideal_rear_per_weight), line: { color: st.colour, width: 2, dash: 'dot' }, hovertemplate: 'ideal: front %{x:.3f}, rear %{y:.3f}<extra></extra>' });
    data.push({ type: 'scatter', mode: 'lines', name: `Installed – ${name}`, legendgroup: g, ...xy(c.front_force_per_weight, c.rear_force_per_weight), line: { color: st.colour, width: 2.5 }, hovertemplate: 'installed: front %{x:.3f}, rear %{y:.3f}<extra></extra>' });
    const k = atGrid(s);
    data.push(markerTrace(i, k.map((j) => r4(c.front_force_per_weight[j]!)), k.map((j) => r4(c.rear_force_per_weight[j]!)), g));
    for (const v of [...c.ideal_front_per_weight, ...c.front_force_per_weight]) xMax = Math.max(xMax, v);
    for (const v of [...c.ideal_rear_per_weight, ...c.rear_force_per_weight]) yMax = Math.max(yMax, v);
    if (s.critical_braking_rate !== null) {
      const z = s.critical_braking_rate;
      const p = idealPointPerWeight(s.static_front_share, s.cg_height_m / E, z);
      data.push({
        type: 'scatter', mode: 'markers+text', name: `Critical point – ${name}`, legendgroup: g, showlegend: false,
        x: [r4(p.x)], y: [r4(p.y)],
        text: [F.zText(z)], textposition: 'top left',
        marker: { symbol: 'star', size: 14, color: st.colour, line: { width: 1, color: '#000' } },
        hovertemplate: `critical braking rate ${F.zText(z)}<extra></extra>`,
      });
    }
  });
  xMax = Math.min(1.5, xMax * 1.08);
  yMax = Math.min(1, yMax * 1.25);
  // lines of constant braking rate: front + rear force = z · weight
  const zx: (number | null)[] = [];
  const zy: (number | null)[] = [];
  const ann: unknown[] = [];
  for (let z = 0.1; z <= 1.0001; z += 0.1) {
    zx.push(0, r4(z), null);
    zy.push(r4(z), 0, null);
    if (z <= xMax) ann.push({ x: r4(z), y: 0, text: F.adhesion(z), showarrow: false, yanchor: 'bottom', xanchor: 'right', font: { size: 9, color: '#666' } });
  }
  data.push({ type: 'scatter', mode: 'lines', name: 'constant braking rate z', x: zx, y: zy, line: { color: '#aaaaaa', width: 1 }, hoverinfo: 'skip' });
  // front-lock and rear-lock lines of the focus state, per adhesion
  const fi = focusState(ctx.result.load_states);
  const fs = ctx.result.load_states[fi];
  if (fs) {
    const psi = fs.static_front_share;
    const chi = fs.cg_height_m / E;
    const fx: (number | null)[] = [];
    const fy: (number | null)[] = [];
    const rx: (number | null)[] = [];
    const ry: (number | null)[] = [];
    for (const k of ctx.result.adhesion_coefficients) {
      // the lines where the front and the rear axle lock at adhesion k (core/chart-lines.ts)
      const front = frontLockLine(psi, chi, k, yMax);
      if (front) {
        fx.push(r4(front.x[0]), r4(front.x[1]), null);
        fy.push(0, r4(yMax), null);
      }
      const rear = rearLockLine(psi, chi, k, xMax);
      ry.push(r4(rear.y[0]), r4(rear.y[1]), null);
      rx.push(0, r4(xMax), null);
      ann.push({ x: 0, y: r4(rear.y[0]), text: `k = ${F.adhesion(k)}`, showarrow: false, xanchor: 'left', yanchor: 'bottom', font: { size: 9, color: '#444' } });
    }
    const label = plotText(fs.label);
    data.push({ type: 'scatter', mode: 'lines', name: `front locks at k (${label})`, x: fx, y: fy, line: { color: '#555555', width: 1, dash: 'dash' }, hoverinfo: 'skip' });
    data.push({ type: 'scatter', mode: 'lines', name: `rear locks at k (${label})`, x: rx, y: ry, line: { color: '#555555', width: 1, dash: 'dashdot' }, hoverinfo: 'skip' });
  }
  const layout = baseLayout('A  Braking forces over weight', 'front braking force / vehicle weight (–)', 'rear braking force / vehicle weight (–)');
  (layout.xaxis as Record<string, unknown>).range = [0, xMax];
  (layout.yaxis as Record<string, unknown>).range = [0, yMax];
  layout.annotations = ann;
  layout.height = 400;
  return { data, layout };
}

export function chartB(ctx: ResultContext): ChartSpec {
  const data: unknown[] = [];
  ctx.result.load_states.forEach((s, i) => {
    const c = s.curves!;
    const st = seriesStyle(i);
    const g = `b${i}`;
    const name = plotText(s.label);
    data.push({ type: 'scatter', mode: 'lines', name: `f1 front – ${name}`, legendgroup: g, ...xy(c.braking_rate, c.front_utilisation), line: { color: st.colour, width: 2.5 }, hovertemplate: 'z %{x:.3f}: f1 = %{y:.3f}<extra></extra>' });
    data.push({ type: 'scatter', mode: 'lines', name: `f2 rear – ${name}`, legendgroup: g, ...xy(c.braking_rate, c.rear_utilisation), line: { color: st.colour, width: 2, dash: 'dash' }, hovertemplate: 'z %{x:.3f}: f2 = %{y:.3f}<extra></extra>' });
    const k = atGrid(s);
    data.push(markerTrace(i, k.map((j) => c.braking_rate[j]!), k.map((j) => r4(c.front_utilisation[j] ?? null)), g));
  });
  data.push({ type: 'scatter', mode: 'lines', name: 'k = z (ideal)', x: [0, 1], y: [0, 1], line: { color: '#000000', width: 1, dash: 'dot' }, hoverinfo: 'skip' });
  const layout = baseLayout('B  Adhesion utilisation', 'braking rate z (–)', 'adhesion utilised f (–)');
  (layout.xaxis as Record<string, unknown>).range = [0, 1];
  (layout.yaxis as Record<string, unknown>).range = [0, 1.3];
  return { data, layout };
}

export function chartC(ctx: ResultContext): ChartSpec {
  const u = ctx.units;
  const pu = { label: F.unitOf('pressure', u) };
  const fu = { label: F.unitOf('pedal_force', u) };
  const bar = (v: number | null) => F.plot('pressure', v, u, 'bar');
  const pedal = (v: number | null) => F.plot('pedal_force', v, u);
  const data: unknown[] = [];
  ctx.result.load_states.forEach((s, i) => {
    const c = s.curves!;
    const st = seriesStyle(i);
    const g = `c${i}`;
    const name = plotText(s.label);
    data.push({ type: 'scatter', mode: 'lines', name: `front pressure – ${name}`, legendgroup: g, ...xy(c.braking_rate, c.front_pressure_bar, r4, bar), line: { color: st.colour, width: 2.5 }, hovertemplate: `z %{x:.3f}: %{y} ${pu.label}<extra></extra>` });
    data.push({ type: 'scatter', mode: 'lines', name: `rear pressure – ${name}`, legendgroup: g, ...xy(c.braking_rate, c.rear_pressure_bar, r4, bar), line: { color: st.colour, width: 2, dash: 'dash' }, hovertemplate: `z %{x:.3f}: %{y} ${pu.label}<extra></extra>` });
    data.push({ type: 'scatter', mode: 'lines', name: `pedal force – ${name}`, legendgroup: g, ...xy(c.braking_rate, c.pedal_force_n, r4, pedal), yaxis: 'y2', line: { color: st.colour, width: 1.5, dash: 'dot' }, hovertemplate: `z %{x:.3f}: %{y} ${fu.label}<extra></extra>` });
    const k = atGrid(s);
    data.push(markerTrace(i, k.map((j) => c.braking_rate[j]!), k.map((j) => bar(c.front_pressure_bar[j]!)), g));
  });
  const layout = baseLayout('C  Line pressures and pedal force', 'braking rate z (–)', `line pressure (${pu.label})`);
  (layout.xaxis as Record<string, unknown>).range = [0, 1];
  layout.yaxis2 = { title: { text: `pedal force (${fu.label})`, standoff: 8 }, automargin: true, overlaying: 'y', side: 'right', zeroline: false, showgrid: false, tickmode: 'auto' }; // own round steps, not synced to the pressure ticks
  layout.margin = { l: 60, r: 60, t: 40, b: 50 };
  return { data, layout };
}


export function charts(ctx: ResultContext): SafeHtml {
  const fs = ctx.result.load_states[focusState(ctx.result.load_states)];
  return html`<div class="charts">
${chartBlock('chart-a', chartA(ctx), html`Dotted: ideal distribution (both axles at the same adhesion) per load state; solid: installed brakes; grey: constant braking rate. Dashed and dash-dot grey lines: front and rear axle lock at adhesion k, for “${fs?.label ?? ''}”. Above the ideal curve the rear axle is over-braked. Star: critical braking rate.`, 'Braking-force diagram: rear braking force over weight against front braking force over weight')}
${chartBlock('chart-b', chartB(ctx), html`Solid: front axle f1; dashed: rear axle f2. Where f2 is above f1 the rear axle would lock first. Dotted: k = z.`, 'Adhesion utilisation of each axle against braking rate')}
${chartBlock('chart-c', chartC(ctx), html`Solid: front line pressure; dashed: rear line pressure after the valve; dotted (right axis): pedal force.`, 'Line pressures and pedal force against braking rate')}
</div>`;
}

export const chartsPanel: Panel = { id: 'charts', title: 'Charts', results: charts };
