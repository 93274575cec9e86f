/**
 * Exports as text: the design file (JSON), the curves per load state (CSV) and the check results (CSV).
 * Pure functions of their inputs. CSV follows RFC 4180 (comma, CRLF, fields with comma, quote or line
 * break quoted, quotes doubled); cells a spreadsheet would run as a formula (=, +, -, @ first) get a
 * leading apostrophe when they are text, not numbers.
 */
import { type DesignFile, type EvaluationResult, VERIFY_NOTE } from '../core/index.ts';

export function csvCell(v: unknown): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '';
  let s = typeof v === 'string' ? v : typeof v === 'boolean' ? String(v) : JSON.stringify(v);
  if (/^[=+\-@\t\r]/.test(s) && !/^[-+]?\d/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function csv(header: readonly string[], rows: readonly (readonly unknown[])[]): string {
  return [header, ...rows].map((r) => r.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

/** The design file as saved: two-space JSON with a final newline. */
export function designJson(design: DesignFile): string {
  return `${JSON.stringify(design, null, 2)}\n`;
}

export const CURVE_COLUMNS = [
  'load_state', 'braking_rate', 'front_utilisation', 'rear_utilisation', 'front_force_per_weight', 'rear_force_per_weight',
  'ideal_front_per_weight', 'ideal_rear_per_weight', 'front_pressure_bar', 'rear_pressure_bar', 'pedal_force_n',
] as const;

/** Curves of every load state, one row per braking rate; needs evaluate(design, { curves: true }). */
export function curvesCsv(result: EvaluationResult): string {
  const rows: unknown[][] = [];
  for (const s of result.load_states) {
    const c = s.curves;
    if (!c) continue;
    c.braking_rate.forEach((z, i) => {
      rows.push([
        s.id, z, c.front_utilisation[i], c.rear_utilisation[i], c.front_force_per_weight[i], c.rear_force_per_weight[i],
        c.ideal_front_per_weight[i], c.ideal_rear_per_weight[i], c.front_pressure_bar[i], c.rear_pressure_bar[i], c.pedal_force_n[i],
      ]);
    });
  }
  return csv(CURVE_COLUMNS, rows);
}

export const CHECK_COLUMNS = [
  'rule', 'load_state', 'passed', 'worst_margin', 'worst_at_braking_rate', 'failing_ranges', 'source', 'status', 'note',
] as const;

/** The check results, one row per check; [P]/[M] rows carry the verify note. */
export function checksCsv(result: EvaluationResult): string {
  const rows = (Array.isArray(result.checks) ? result.checks : []).map((raw) => {
    const c = (raw ?? {}) as unknown as Record<string, unknown>;
    const status = typeof c.status === 'string' ? c.status : '';
    const ranges = Array.isArray(c.failing_ranges)
      ? (c.failing_ranges as unknown[]).map((r) => (Array.isArray(r) ? `${r[0]}-${r[1]}` : String(r))).join(' ')
      : '';
    const src = c.source;
    const source = typeof src === 'string' ? src : src && typeof src === 'object' ? Object.values(src).join(', ') : '';
    return [
      c.rule ?? c.id, c.load_state, c.passed, c.worst_margin, c.worst_at_braking_rate, ranges, source, status,
      /^(partial|memory|p|m)$/i.test(status) ? VERIFY_NOTE : '',
    ];
  });
  return csv(CHECK_COLUMNS, rows);
}
