/**
 * Before/after: two designs (the base vehicle and the converted one, or two options) evaluated side by side.
 * Gives the curves of both overlaid as a plotly spec, the per-load-state figures and the check verdicts
 * next to each other, and the field-level differences of the inputs.
 */
import { type DesignFile, designDiff, type EvaluationResult } from '../core/index.ts';
import type { CompareCheckRow, CompareRow, Comparison } from '../report/compare.ts';

export type { CompareCheckRow, CompareRow, Comparison };
import * as F from '../report/format.ts';
import { FIRST_AXLE_LABELS } from '../report/labels.ts';
import { checkRows } from './packet-content.ts';

export interface CompareSide {
  label: string;
  revision: string;
  design: DesignFile;
  result: EvaluationResult;
}

/** Plotly reads a few HTML-like tags in labels: write < > & as entities. */
function plotText(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

const STATE_COLOURS = ['#0072B2', '#D55E00', '#009E73', '#CC79A7', '#E69F00', '#56B4E9', '#000000', '#999999'];

export function compareChart(a: CompareSide, b: CompareSide): Comparison['chart'] {
  const data: unknown[] = [];
  const ids = [...new Set([...a.result.load_states.map((s) => s.id), ...b.result.load_states.map((s) => s.id)])];
  for (const [side, dash] of [[a, 'solid'], [b, 'dash']] as const) {
    for (const s of side.result.load_states) {
      const c = s.curves;
      if (!c) continue;
      const colour = STATE_COLOURS[ids.indexOf(s.id) % STATE_COLOURS.length];
      for (const [axle, ys, width] of [['front', c.front_utilisation, 2], ['rear', c.rear_utilisation, 1.2]] as const) {
        data.push({
          type: 'scatter',
          mode: 'lines',
          name: plotText(`${side.label}: ${s.id} ${axle}`),
          x: c.braking_rate,
          y: ys,
          line: { color: colour, dash, width },
        });
      }
    }
  }
  data.push({ type: 'scatter', mode: 'lines', name: 'ideal f = z', x: [0, 1], y: [0, 1], line: { color: '#444', dash: 'dot', width: 1 } });
  return {
    data,
    layout: {
      title: { text: plotText(`Adhesion utilisation: ${a.label} (solid) and ${b.label} (dashed)`) },
      xaxis: { title: { text: 'braking rate z' }, range: [0, 1] },
      yaxis: { title: { text: 'adhesion utilised f' }, range: [0, 1.2] },
      legend: { orientation: 'h' },
      margin: { t: 40, r: 10, b: 40, l: 50 },
    },
  };
}

export function compare(a: CompareSide, b: CompareSide): Comparison {
  const states: CompareRow[] = [];
  const ids = [...new Set([...a.result.load_states.map((s) => s.id), ...b.result.load_states.map((s) => s.id)])];
  for (const id of ids) {
    const sa = a.result.load_states.find((s) => s.id === id);
    const sb = b.result.load_states.find((s) => s.id === id);
    const rows: [string, (s: NonNullable<typeof sa>) => string][] = [
      ['mass', (s) => F.mass(s.mass_kg, 'metric')],
      ['front axle load', (s) => F.mass(s.front_axle_kg, 'metric')],
      ['CG height', (s) => F.length(s.cg_height_m, 'metric')],
      ['critical braking rate', (s) => (s.critical_braking_rate === null ? 'none' : F.brakingRate(s.critical_braking_rate))],
      ['lowest braking efficiency', (s) => (s.lowest_efficiency ? `${F.efficiency(s.lowest_efficiency.efficiency)} at k = ${F.adhesion(s.lowest_efficiency.adhesion)}` : F.DASH)],
      ['axle locking first (per k)', (s) => s.lock.map((l) => `${F.adhesion(l.adhesion)}: ${FIRST_AXLE_LABELS[l.first_axle]}`).join(', ')],
      ['installed front share at low pressure', (s) => F.percentOfRatio(s.front_share_low_pressure)],
    ];
    for (const [q, f] of rows) {
      const va = sa ? f(sa) : '(no such load state)';
      const vb = sb ? f(sb) : '(no such load state)';
      states.push({ load_state: id, quantity: q, a: va, b: vb, changed: va !== vb });
    }
  }
  const ca = checkRows(a.result);
  const cb = checkRows(b.result);
  const key = (r: { requirement: string; where: string }) => `${r.requirement}\u0000${r.where}`;
  const keys = [...new Set([...ca.map(key), ...cb.map(key)])];
  const checks = keys.map((k) => {
    const ra = ca.find((r) => key(r) === k);
    const rb = cb.find((r) => key(r) === k);
    const any = (ra ?? rb)!;
    const row: CompareCheckRow = {
      rule: any.requirement,
      load_state: any.where,
      a_verdict: ra?.verdict ?? '(not checked)',
      a_margin: ra?.margin ?? '',
      b_verdict: rb?.verdict ?? '(not checked)',
      b_margin: rb?.margin ?? '',
      changed: false,
    };
    row.changed = row.a_verdict !== row.b_verdict;
    return row;
  });
  return {
    a: { label: a.label, revision: a.revision, design_name: a.design.name },
    b: { label: b.label, revision: b.revision, design_name: b.design.name },
    states,
    checks,
    diff: designDiff(a.design, b.design),
    chart: compareChart(a, b),
  };
}
