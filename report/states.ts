/** Document sections: the overall verdict, warnings, and one section per load state (facts, lock order, operating points). */
import { type LoadStateResult, overallWord, type UnitSystem, type Verdict, type Warning } from '../core/index.ts';
import * as F from './format.ts';
import { DERIVED_FROM_LABELS, FIRST_AXLE_LABELS, LOAD_KIND_LABELS, pathLabel, warningLabel } from './labels.ts';
import { col, type Item, type Items, type Section, type Table, text, type Text, type Tone } from './model.ts';

const OVERALL_TONE: Record<Verdict['overall'], Tone> = { pass: 'ok', fail: 'fail', incomplete: 'nc' };

/** The overall verdict: the word and summary, then one line per failing, not-checked and advisory item. */
export function verdictSection(v: Verdict): Section {
  const items: Item[] = [
    ...v.failed.map((f): Item => ({ word: 'FAIL', text: f.description, anchor: f.anchor, tone: 'fail', code: f.rule })),
    ...v.not_checked.map((n): Item => ({ word: 'NOT CHECKED', text: n.description, anchor: n.anchor, tone: 'nc', code: n.rule })),
  ];
  const info: Item[] = v.advisories.map((a) => ({ word: 'for information (does not decide)', text: a.description, anchor: a.anchor, tone: 'info', code: a.rule }));
  const blocks: Section['blocks'] = [text(v.summary, { tone: OVERALL_TONE[v.overall] })];
  if (items.length) blocks.push({ kind: 'items', id: 'verdict-items', items });
  if (info.length) blocks.push({ kind: 'items', id: 'verdict-advisories', title: `For information, not deciding (${info.length})`, items: info });
  if (v.overall !== 'pass') blocks.push(text(`The design is not shown to comply (${overallWord(v)}); details in the tables below.`));
  return { id: 'verdict', title: `VERDICT ${overallWord(v)}`, blocks };
}

/** Warnings in words: the message, where (a design path in words), the code only in a tooltip. */
export function warningItems(ws: readonly Warning[], stateLabels: readonly string[], id: string, title?: string): Items {
  return {
    kind: 'items',
    id,
    ...(title !== undefined ? { title } : {}),
    items: ws.map((w) => ({
      word: 'Warning',
      text: `${warningLabel(w.code)}: ${w.message}`,
      ...(w.path ? { detail: pathLabel(w.path, stateLabels) } : {}),
      code: w.code,
      tone: 'warn' as const,
    })),
  };
}

export function warningsSection(ws: readonly Warning[], stateLabels: readonly string[], id: string, title: string): Section | null {
  if (ws.length === 0) return null;
  return { id, title, blocks: [warningItems(ws, stateLabels, `${id}-items`)] };
}

/** The words of a load state: '"Laden to 3500 kg" (laden)'. */
export function stateName(s: Pick<LoadStateResult, 'label' | 'kind'>): string {
  const kind = Object.hasOwn(LOAD_KIND_LABELS, s.kind) ? LOAD_KIND_LABELS[s.kind as keyof typeof LOAD_KIND_LABELS] : s.kind;
  return s.label.toLowerCase() === kind.toLowerCase() ? `"${s.label}"` : `"${s.label}" (${kind})`;
}

/** The lock order per surface: adhesion, first axle, z at first lock, efficiency. */
export function lockTable(s: LoadStateResult, i: number): Table {
  return {
    kind: 'table',
    id: `lock-${i}`,
    title: `First axle to lock per surface, ${s.label} (braking efficiency = z at first lock / adhesion)`,
    columns: [col('Adhesion k'), col('Locks first'), col('z at first lock'), col('Efficiency', '%')],
    rows: s.lock.map((l) => ({
      cells: [
        F.adhesion(l.adhesion),
        { text: FIRST_AXLE_LABELS[l.first_axle], tone: l.first_axle === 'front' || l.first_axle === 'both' ? 'ok' : 'warn' },
        F.brakingRate(l.braking_rate),
        F.format('efficiency', l.efficiency, 'metric', { from: 'ratio', unit: false }),
      ],
    })),
  };
}

/** The operating points at the braking rates asked for: loads, forces, utilisation, pressures, pedal force. */
export function operatingTable(s: LoadStateResult, i: number, units: UnitSystem): Table {
  const f = F.unitOf('force', units);
  const n = (kind: F.Kind, v: number | null, from?: F.FromUnit) => F.format(kind, v, units, { unit: false, ...(from ? { from } : {}) });
  return {
    kind: 'table',
    id: `points-${i}`,
    title: `Operating points, ${s.label} (utilisation f = braking force / axle load)`,
    columns: [
      col('Braking rate z'),
      col('Front axle load N1', f),
      col('Rear axle load N2', f),
      col('Ideal front force', f),
      col('Ideal rear force', f),
      col('Front force T1', f),
      col('Rear force T2', f),
      col('Utilisation f1'),
      col('Utilisation f2'),
      col('Front pressure', F.unitOf('pressure', units)),
      col('Rear pressure', F.unitOf('pressure', units)),
      col('Pedal force', F.unitOf('pedal_force', units)),
    ],
    rows: s.at.map((a) => ({
      cells: [
        F.brakingRate(a.braking_rate),
        n('force', a.front_axle_load_n),
        n('force', a.rear_axle_load_n),
        n('force', a.ideal_front_force_n),
        n('force', a.ideal_rear_force_n),
        n('force', a.front_force_n),
        n('force', a.rear_force_n),
        F.utilisation(a.front_utilisation),
        F.utilisation(a.rear_utilisation),
        n('pressure', a.front_pressure_bar, 'bar'),
        n('pressure', a.rear_pressure_bar, 'bar'),
        n('pedal_force', a.pedal_force_n),
      ],
    })),
  };
}

/** One sentence on the lock order of a load state. */
export function lockSummary(s: LoadStateResult): { tone: 'ok' | 'warn'; text: string } {
  const rear = s.lock.filter((l) => l.first_axle === 'rear');
  const none = s.lock.filter((l) => l.first_axle === 'none');
  const ks = (ls: typeof s.lock) => F.list('adhesion', ls.map((l) => l.adhesion));
  if (rear.length === 0 && none.length === 0) {
    const both = s.lock.filter((l) => l.first_axle === 'both');
    return { tone: 'ok', text: `The front axle locks first on every surface analysed${both.length ? ` (both together on k = ${ks(both)})` : ''}.` };
  }
  const parts: string[] = [];
  if (rear.length) parts.push(`the rear axle locks first on k = ${ks(rear)}`);
  if (none.length) parts.push(`the rear wheels lift off before any lock on k = ${ks(none)}`);
  return { tone: 'warn', text: `Attention: ${parts.join('; ')}.` };
}

/** The facts of a load state, one line each (the page shows them as a list, the command line as lines). */
export function stateFacts(s: LoadStateResult, units: UnitSystem): Text[] {
  const out: Text[] = [];
  out.push(text(`${F.mass(s.mass_kg, units)}, front axle ${F.mass(s.front_axle_kg, units)}, CG height ${F.length(s.cg_height_m, units)}`));
  if (s.derived_from !== undefined) {
    const src = (c: string | undefined) => (c !== undefined && Object.hasOwn(DERIVED_FROM_LABELS, c) ? DERIVED_FROM_LABELS[c as keyof typeof DERIVED_FROM_LABELS] : 'entered');
    const u = s.cg_height_uncertainty_m;
    out.push(
      text(
        `Figures from: ${src(s.derived_from)}${s.from_build_up ? ` (${s.from_build_up} state)` : ''}; CG height from ${src(s.cg_height_derived_from ?? s.derived_from)}` +
          `${u !== null && u !== undefined ? `, standard uncertainty ${F.length(u, units)}` : ''}`,
      ),
    );
  }
  const r = s.ratings;
  if (r) {
    const part = (name: string, m: number | null) => (m === null ? null : `${name} ${F.massMargin(m, units)}${m < 0 ? ' (OVER)' : ''}`);
    const parts = [part('mass', r.mass_margin_kg), part('front axle', r.front_axle_margin_kg), part('rear axle', r.rear_axle_margin_kg)].filter((p) => p !== null);
    if (r.front_share_margin_pct !== null) parts.push(`front share ${F.percent(r.front_axle_share_pct)} (${F.percentPoints(r.front_share_margin_pct)} on the minimum)`);
    out.push(text(`Rating margins: ${parts.join(', ')}`, { tone: [r.mass_margin_kg, r.front_axle_margin_kg, r.rear_axle_margin_kg, r.front_share_margin_pct].some((m) => m !== null && m < 0) ? 'fail' : 'neutral' }));
  }
  out.push(text(`Static axle loads: front ${F.force(s.front_axle_static_n, units)}, rear ${F.force(s.rear_axle_static_n, units)} (front share ${F.percentOfRatio(s.static_front_share)})`));
  if (s.front_share_low_pressure !== null) out.push(text(`Installed front share of braking force at low pressure: ${F.percentOfRatio(s.front_share_low_pressure)}`));
  out.push(
    text(
      s.critical_braking_rate === null
        ? 'Critical braking rate: none (the rear axle never uses more adhesion than the front below z = 1.5 and below lift-off)'
        : `Critical braking rate: ${F.zText(s.critical_braking_rate)} (above it the rear axle locks first)`,
    ),
  );
  if (s.critical_braking_rates.length > 1 || (s.critical_braking_rates.length === 1 && s.critical_braking_rate === null)) {
    out.push(text(`The installed curve crosses the ideal at z = ${F.list('braking_rate', s.critical_braking_rates)}`));
  }
  out.push(text(`Lowest braking efficiency: ${s.lowest_efficiency ? `${F.efficiency(s.lowest_efficiency.efficiency)} on k = ${F.adhesion(s.lowest_efficiency.adhesion)}` : F.DASH}`));
  out.push(text(`Rear-axle lift-off at ${F.zText(s.rear_lift_off_braking_rate)}`));
  return out;
}

/** A load state: facts, lock order, operating points, warnings. Id `state-<i>`. */
export function stateSection(s: LoadStateResult, i: number, units: UnitSystem, stateLabels: readonly string[]): Section {
  const sum = lockSummary(s);
  const blocks: Section['blocks'] = [...stateFacts(s, units), text(sum.text, { tone: sum.tone }), lockTable(s, i), operatingTable(s, i, units)];
  if (s.warnings.length) blocks.push(warningItems(s.warnings, stateLabels, `state-${i}-warnings`));
  return { id: `state-${i}`, title: `Load state ${stateName(s)}`, blocks };
}
