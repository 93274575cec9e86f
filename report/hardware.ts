/** Document sections of the hardware sanity checks: pitfalls, the failed distribution valve, pedal travel and fluid volume. */
import type { EvaluationResult, UnitSystem } from '../core/index.ts';
import * as F from './format.ts';
import { circuitLabel, defaultLabel, FAILURE_MODE_LABELS, limitedByLabel, pathLabel, pitfallLabel, travelCaseLabel } from './labels.ts';
import { col, type Section, text } from './model.ts';
import { warningItems } from './states.ts';

const stateLabelOf = (r: Pick<EvaluationResult, 'load_states'>, id: string): string => r.load_states.find((s) => s.id === id)?.label ?? id;

/** Section `pitfalls`; null when none applies. */
export function pitfallSection(r: Pick<EvaluationResult, 'pitfalls'>, stateLabels: readonly string[]): Section | null {
  if (r.pitfalls.length === 0) return null;
  return {
    id: 'pitfalls',
    title: `Pitfalls (${r.pitfalls.length})`,
    blocks: [
      {
        kind: 'items',
        id: 'pitfall-items',
        items: r.pitfalls.map((p) => ({
          word: pitfallLabel(p.code),
          text: p.message,
          detail: `${pathLabel(p.path, stateLabels)}; source: ${p.source}`,
          code: p.code,
          tone: 'warn' as const,
        })),
      },
    ],
  };
}

/** Section `valve-failure`: deceleration per failed state and load state against the secondary-braking figure. */
export function valveFailureSection(r: Pick<EvaluationResult, 'failure_modes' | 'load_states'>, units: UnitSystem): Section {
  const fm = r.failure_modes;
  const title = 'Failure of the distribution valve';
  if (fm.length === 0) return { id: 'valve-failure', title, blocks: [text('No rear valve is fitted: no distribution device whose failure needs checking.', { hint: true })] };
  const first = fm[0]!;
  const d = F.unitOf('deceleration', units);
  return {
    id: 'valve-failure',
    title,
    blocks: [
      text(
        `Deceleration at the ${F.pedalForce(first.pedal_force_limit_n, units)} pedal-force limit, not above the first wheel lock on adhesion ${F.adhesion(first.test_adhesion)}, ` +
          `against the secondary-braking figure.`,
      ),
      text(`${first.source}; ${first.verify_note}.`, { hint: true }),
      {
        kind: 'table',
        id: 'failure-modes',
        title: 'Failed distribution valve per mode and load state',
        columns: [col('Failed state'), col('Load state'), col('Reached', d), col('Required', d), col('Verdict'), col('Limited by'), col('Rear locks first on k (0.2–0.8)'), col('First lock')],
        rows: fm.map((f) => {
          const axles = new Set(f.first_axle_on.map((l) => l.first_axle));
          const order = axles.size === 1 ? `${[...axles][0]} axle on every surface` : f.first_axle_on.map((l) => `k ${F.adhesion(l.adhesion)} ${l.first_axle}`).join(', ');
          return {
            tone: f.passed ? ('ok' as const) : ('fail' as const),
            cells: [
              { text: FAILURE_MODE_LABELS[f.mode], code: f.mode },
              stateLabelOf(r, f.load_state),
              F.format('deceleration', f.max_deceleration_ms2, units, { unit: false }),
              F.format('deceleration', f.required_ms2, units, { unit: false }),
              { text: f.passed ? 'pass' : 'FAIL', tone: f.passed ? 'ok' : 'fail' },
              limitedByLabel(f.limited_by),
              f.rear_first_on.length ? F.list('adhesion', f.rear_first_on) : 'none',
              order,
            ],
          };
        }),
      },
    ],
  };
}

/** Section `pedal-travel`: travel and fluid volume per load state, service brake and each circuit failed. */
export function pedalTravelSection(r: Pick<EvaluationResult, 'pedal_travel' | 'load_states'>, units: UnitSystem, stateLabels: readonly string[]): Section {
  const t = r.pedal_travel;
  const sl = (v: number | null) => F.shortLength(v, units);
  const blocks: Section['blocks'] = [
    text(
      `Travel available ${sl(t.pedal_travel_available_mm)}, warning above ${F.percent(t.warn_pct)} of it; master-cylinder stroke ${sl(t.master_cylinder_total_stroke_mm)}; ` +
        `circuits: ${t.circuits.map(circuitLabel).join(' and ')}.`,
    ),
    {
      kind: 'table',
      id: 'pedal-travel',
      title: 'Pedal travel per load state, service brake and one circuit failed',
      columns: [
        col('Load state'),
        col('Case'),
        col('At', F.unitOf('deceleration', units)),
        col('Master pressure', F.unitOf('pressure', units)),
        col('Fluid volume per circuit', F.unitOf('volume', units)),
        col('Pedal travel', F.unitOf('short_length', units)),
        col('Share used', '%'),
        col('Margin', F.unitOf('short_length', units)),
        col('Pedal force', F.unitOf('pedal_force', units)),
        col('Master cylinder bottoms'),
      ],
      rows: t.states.flatMap((s) =>
        s.cases.map((c) => {
          const p = c.point;
          const over = p !== null && (p.bottomed || p.margin_mm < 0 || (c.case === 'service' && p.share_of_available_pct > t.warn_pct));
          const n = (kind: F.Kind, v: number | null, from?: F.FromUnit) => F.format(kind, v, units, { unit: false, ...(from ? { from } : {}) });
          return {
            tone: over ? ('fail' as const) : ('neutral' as const),
            cells: [
              stateLabelOf(r, s.load_state),
              travelCaseLabel(c.case),
              n('deceleration', c.target_ms2),
              p ? n('pressure', p.master_pressure_bar, 'bar') : F.DASH,
              p ? Object.values(p.circuit_volume_mm3).map((v) => n('volume', v, 'mm3')).join(' / ') : F.DASH,
              p ? { text: n('short_length', p.pedal_travel_mm, 'mm'), ...(over ? { tone: 'fail' as const, sub: ['too much travel'] } : {}) } : 'not reached',
              p ? F.format('percent', p.share_of_available_pct, units, { from: 'pct', unit: false }) : F.DASH,
              p ? n('short_length', p.margin_mm, 'mm') : F.DASH,
              p ? `${n('pedal_force', p.pedal_force_n)}${p.pedal_force_n > c.pedal_force_limit_n ? ` (above ${F.pedalForce(c.pedal_force_limit_n, units)})` : ''}` : F.DASH,
              p?.bottomed ? 'yes' : 'no',
            ],
          };
        }),
      ),
    },
  ];
  if (t.warnings.length) blocks.push(warningItems(t.warnings, stateLabels, 'pedal-travel-warnings'));
  if (t.defaults_used.length) blocks.push(text(`Defaults used (${t.defaults_note}): ${t.defaults_used.map(defaultLabel).join(', ')}.`, { hint: true }));
  blocks.push(text(t.method, { hint: true }));
  return { id: 'pedal-travel', title: 'Pedal travel and fluid volume', blocks };
}
