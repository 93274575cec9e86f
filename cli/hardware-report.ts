/** Text sections of `lockstep evaluate` for issue 9: pitfalls, failed distribution valve, pedal travel. */
import type { EvaluationResult } from '../core/index.ts';
import { fmt, textTable } from './table.ts';

/** Pitfall warnings, shown right after the verdicts; nothing when none applies. */
export function pitfallSection(r: Pick<EvaluationResult, 'pitfalls'>): string[] {
  if (r.pitfalls.length === 0) return [];
  const out = [`Pitfalls (${r.pitfalls.length}):`];
  for (const p of r.pitfalls) {
    out.push(`  ${p.code} (${p.path}): ${p.message}`);
    out.push(`    source: ${p.source}`);
  }
  return out;
}

export function valveFailureSection(r: Pick<EvaluationResult, 'failure_modes'>): string[] {
  const fm = r.failure_modes;
  if (fm.length === 0) {
    return ['Failure of the distribution valve: no rear valve fitted, no failed-valve case to check.'];
  }
  const first = fm[0]!;
  const out = [
    `Failure of the distribution valve (${first.source}; ${first.verify_note}):`,
    `  deceleration at the ${fmt(first.pedal_force_limit_n, 0)} N pedal-force limit, not above the first wheel lock on adhesion ${fmt(first.test_adhesion, 2)}`,
  ];
  out.push(
    textTable(
      ['mode', 'load state', 'max m/s²', 'required', 'verdict', 'limited by', 'rear locks first on k'],
      fm.map((f) => [
        f.mode,
        f.load_state,
        fmt(f.max_deceleration_ms2, 2),
        fmt(f.required_ms2, 1),
        f.passed ? 'pass' : 'FAIL',
        f.limited_by,
        f.rear_first_on.length ? f.rear_first_on.map((k) => fmt(k, 2)).join(' ') : 'none (0.2-0.8)',
      ]),
      '    ',
    ),
  );
  for (const f of fm) {
    const axles = new Set(f.first_axle_on.map((l) => l.first_axle));
    const order =
      axles.size === 1
        ? `${[...axles][0]} axle first on every surface analysed`
        : f.first_axle_on.map((l) => `k ${fmt(l.adhesion, 2)} ${l.first_axle}`).join(', ');
    out.push(`  ${f.mode}, ${f.load_state}: ${f.description}; first lock: ${order}`);
  }
  return out;
}

export function pedalTravelSection(r: Pick<EvaluationResult, 'pedal_travel'>): string[] {
  const t = r.pedal_travel;
  const out = [
    `Pedal travel and fluid volume (travel available ${fmt(t.pedal_travel_available_mm, 0)} mm, warning above ${fmt(t.warn_pct, 0)} %, ` +
      `master-cylinder stroke ${fmt(t.master_cylinder_total_stroke_mm, 1)} mm, circuits ${t.circuits.join(' + ')}):`,
  ];
  const rows: string[][] = [];
  for (const s of t.states) {
    for (const c of s.cases) {
      const p = c.point;
      rows.push([
        s.load_state,
        c.case,
        `${fmt(c.target_ms2, 1)}`,
        p ? fmt(p.master_pressure_bar, 1) : '—',
        p ? Object.values(p.circuit_volume_mm3).map((v) => fmt(v, 0)).join(' / ') : '—',
        p ? fmt(p.pedal_travel_mm, 1) : 'not reached',
        p ? fmt(p.share_of_available_pct, 0) : '—',
        p ? fmt(p.margin_mm, 1) : '—',
        p ? `${fmt(p.pedal_force_n, 0)}${p.pedal_force_n > c.pedal_force_limit_n ? ` (> ${fmt(c.pedal_force_limit_n, 0)})` : ''}` : '—',
        p?.bottomed ? 'yes' : 'no',
      ]);
    }
  }
  out.push(
    textTable(
      ['load state', 'case', 'at m/s²', 'p bar', `volume mm³ (${t.circuits.join(' / ')})`, 'pedal mm', '% used', 'margin mm', 'pedal N', 'bottoms'],
      rows,
      '    ',
    ),
  );
  if (t.defaults_used.length) out.push(`  Defaults used (${t.defaults_note}): ${t.defaults_used.join(', ')}`);
  out.push(`  Method: ${t.method}`);
  for (const w of t.warnings) out.push(`  Warning: ${w.path}: ${w.message}`);
  return out;
}
