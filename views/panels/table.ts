/** The operating points at z = 0.1 … 1.0 per load state, as a table (the document model's) and as CSV. */
import type { EvaluationResult, OperatingPoint, UnitSystem } from '../../core/index.ts';
import { buildDocument, sectionOf } from '../../report/document.ts';
import * as F from '../../report/format.ts';
import { html, type SafeHtml } from '../html.ts';
import { tableHtml } from './document.ts';
import type { Panel, ResultContext } from './panel.ts';

interface Column {
  head: string;
  kind: F.Kind;
  value: (p: OperatingPoint) => number | null;
  from?: F.FromUnit;
}

/** The columns of the CSV: the quantities of the operating-points table, numbers in the unit system. */
export function tableColumns(): Column[] {
  return [
    { head: 'Braking rate z', kind: 'braking_rate', value: (p) => p.braking_rate },
    { head: 'Front axle load N1', kind: 'force', value: (p) => p.front_axle_load_n },
    { head: 'Rear axle load N2', kind: 'force', value: (p) => p.rear_axle_load_n },
    { head: 'Ideal front force', kind: 'force', value: (p) => p.ideal_front_force_n },
    { head: 'Ideal rear force', kind: 'force', value: (p) => p.ideal_rear_force_n },
    { head: 'Front force T1', kind: 'force', value: (p) => p.front_force_n },
    { head: 'Rear force T2', kind: 'force', value: (p) => p.rear_force_n },
    { head: 'Utilisation f1', kind: 'utilisation', value: (p) => p.front_utilisation },
    { head: 'Utilisation f2', kind: 'utilisation', value: (p) => p.rear_utilisation },
    { head: 'Front pressure', kind: 'pressure', value: (p) => p.front_pressure_bar, from: 'bar' },
    { head: 'Rear pressure', kind: 'pressure', value: (p) => p.rear_pressure_bar, from: 'bar' },
    { head: 'Pedal force', kind: 'pedal_force', value: (p) => p.pedal_force_n },
  ];
}

/** CSV (RFC 4180): one row per load state and braking rate, units in the header. Text fields quoted. */
export function resultCsv(result: EvaluationResult, units: UnitSystem): string {
  const cols = tableColumns();
  const q = (s: string) => `"${s.replace(/"/g, '""')}"`;
  // a leading = + - @ would be read as a formula by spreadsheets; prefix such text with an apostrophe
  const text = (s: string) => q(/^[=+\-@\t\r]/.test(s) ? `'${s}` : s);
  const head = ['Load state id', 'Load state', ...cols.map((c) => F.headWithUnit(c.head, c.kind, units))].map(q).join(',');
  const rows = result.load_states.flatMap((s) =>
    s.at.map((p) => [text(s.id), text(s.label), ...cols.map((c) => { const v = F.convert(c.kind, c.value(p), units, c.from); return v === null ? '' : String(v); })].join(',')),
  );
  return `${[head, ...rows].join('\r\n')}\r\n`;
}

export function resultTable(ctx: ResultContext): SafeHtml {
  const doc = buildDocument(ctx.result, { units: ctx.units });
  return html`<div class="tables">${ctx.result.load_states.map((s, i) => {
    const t = sectionOf(doc, `state-${i}`)?.blocks.find((b) => b.kind === 'table' && b.id === `points-${i}`);
    return html`<details${i === 0 ? html` open` : ''}><summary>${s.label}</summary>${t && t.kind === 'table' ? tableHtml(t, { cls: 'numbers', caption: 'sr' }) : ''}</details>`;
  })}
</div>
<p><button type="button" class="download" data-download="/workbench/table.csv" data-filename="lockstep-table.csv">Download table (CSV)</button></p>`;
}

export const tablePanel: Panel = { id: 'table', title: 'Operating points', results: resultTable };
