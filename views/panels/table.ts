/** The operating points at z = 0.1 … 1.0 per load state, as a table and as CSV. */
import type { EvaluationResult, OperatingPoint, UnitSystem } from '../../core/index.ts';
import { PA_PER_BAR } from '../../core/index.ts';
import { fixed, pedalUnit, shownUnit } from '../format.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel, ResultContext } from './panel.ts';

interface Column {
  head: string;
  unit: string;
  value: (p: OperatingPoint) => number | null;
  digits: number;
}

export function tableColumns(units: UnitSystem): Column[] {
  const f = shownUnit('force', units);
  const pr = shownUnit('pressure', units);
  const pd = pedalUnit(units);
  const d = units === 'us' ? 0 : 2;
  return [
    { head: 'Braking rate z', unit: '', value: (p) => p.braking_rate, digits: 2 },
    { head: 'Front axle load N1', unit: f.label, value: (p) => f.from(p.front_axle_load_n), digits: d },
    { head: 'Rear axle load N2', unit: f.label, value: (p) => f.from(p.rear_axle_load_n), digits: d },
    { head: 'Ideal front force', unit: f.label, value: (p) => f.from(p.ideal_front_force_n), digits: d },
    { head: 'Ideal rear force', unit: f.label, value: (p) => f.from(p.ideal_rear_force_n), digits: d },
    { head: 'Front force T1', unit: f.label, value: (p) => f.from(p.front_force_n), digits: d },
    { head: 'Rear force T2', unit: f.label, value: (p) => f.from(p.rear_force_n), digits: d },
    { head: 'Utilisation f1', unit: '', value: (p) => p.front_utilisation, digits: 3 },
    { head: 'Utilisation f2', unit: '', value: (p) => p.rear_utilisation, digits: 3 },
    { head: 'Front pressure', unit: pr.label, value: (p) => pr.from(p.front_pressure_bar * PA_PER_BAR), digits: 1 },
    { head: 'Rear pressure', unit: pr.label, value: (p) => pr.from(p.rear_pressure_bar * PA_PER_BAR), digits: 1 },
    { head: 'Pedal force', unit: pd.label, value: (p) => pd.from(p.pedal_force_n), digits: 0 },
  ];
}

/** CSV (RFC 4180): one row per load state and braking rate, units in the header. Text fields quoted. */
export function resultCsv(result: EvaluationResult, units: UnitSystem): string {
  const cols = tableColumns(units);
  const q = (s: string) => `"${s.replace(/"/g, '""')}"`;
  // a leading = + - @ would be read as a formula by spreadsheets; prefix such text with an apostrophe
  const text = (s: string) => q(/^[=+\-@\t\r]/.test(s) ? `'${s}` : s);
  const head = ['load_state_id', 'load_state', ...cols.map((c) => (c.unit ? `${c.head} (${c.unit})` : c.head))].map(q).join(',');
  const rows = result.load_states.flatMap((s) =>
    s.at.map((p) => [text(s.id), text(s.label), ...cols.map((c) => { const v = c.value(p); return v === null ? '' : String(Number(v.toFixed(c.digits + 2))); })].join(',')),
  );
  return `${[head, ...rows].join('\r\n')}\r\n`;
}

export function resultTable(ctx: ResultContext): SafeHtml {
  const cols = tableColumns(ctx.units);
  return html`<div class="tables">${ctx.result.load_states.map((s, i) => html`<details${i === 0 ? html` open` : ''}><summary>${s.label}</summary>
<div class="scroll"><table class="numbers"><thead><tr>${cols.map((c) => html`<th scope="col">${c.head}${c.unit ? html`<br><span class="unit">${c.unit}</span>` : ''}</th>`)}</tr></thead>
<tbody>${s.at.map((p) => html`<tr>${cols.map((c) => html`<td>${fixed(c.value(p), c.digits)}</td>`)}</tr>`)}</tbody></table></div></details>`)}
</div>
<p><button type="button" class="download" data-download="/workbench/table.csv" data-filename="lockstep-table.csv">Download table (CSV)</button></p>`;
}

export const tablePanel: Panel = { id: 'table', title: 'Operating points', results: resultTable };
