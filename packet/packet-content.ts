/**
 * The evidence packet as a document for its reader, the inspector or sign-off engineer (issue 14): the
 * document model of report/packet-document.ts, built from a design, its evaluation result and — only for a
 * saved revision — the revision id. Every number goes through report/format.ts and every code through
 * report/labels.ts; the verdict is the result's one verdict object (core/verdict.ts), printed in its own words.
 *
 *   page 1        identification, the verdict, one line per load state, the caution
 *   1 Checks      requirement, document and paragraph, status of the text, value reached, required, margin, verdict
 *   2 Diagrams    adhesion utilisation per load state with the limit lines of the applied rules; braking forces
 *                 over weight with the ideal curves; line pressures
 *   3 Inputs      every input with the source that belongs to its value (core/provenance.ts)
 *   4 Hardware    parts list, rating plate, base vehicle; the valve check for gauge tests
 *   5 Before/after (when the design has base-vehicle data)
 *   6 Method, sources, assumptions, sign-off
 *   Test sheet    predicted roller-tester readings, required values beside the blanks, MFDD fields; measured
 *                 results against predicted and required when the design has them
 * The full result is attached to the PDF as a JSON file, not printed.
 */
import {
  CAUTION,
  type CheckRef,
  type CheckResult,
  diffPath,
  type DesignFile,
  type EvaluationResult,
  type FailureModeResult,
  inputSource,
  limitSeries,
  type LoadStateResult,
  LOCKSTEP_VERSION,
  overallWord,
  testResultsOutcome,
  unitOfDiffPath,
  valveGauge,
  VERIFY_NOTE,
  verdictItems,
} from '../core/index.ts';
import * as F from '../report/format.ts';
import {
  BRAKE_TYPE_LABELS,
  CALIPER_LABELS,
  CATEGORY_LABELS,
  CIRCUIT_SPLIT_LABELS,
  DRIVE_LABELS,
  FIRST_AXLE_LABELS,
  LOAD_KIND_LABELS,
  pathLabel,
  PARKING_CONTROL_LABELS,
  PROVENANCE_LABELS,
  REGEN_BLENDING_LABELS,
  RULE_STATUS_LABELS,
  SHOE_ARRANGEMENT_LABELS,
  VALVE_SENSES_LABELS,
  valveTypeLabel,
} from '../report/labels.ts';
import { activeBlocksLine } from '../report/design-blocks.ts';
import { type Block, DRAFT_MARK, type PacketContent } from '../report/packet-document.ts';
import { type ChartSeries, type ChartSpec, chartSvg } from './chart-svg.ts';

export type { Block, PacketContent };

export interface PacketInput {
  design: DesignFile;
  /** evaluate(design, { curves: true }). */
  result: EvaluationResult;
  /** The revision id when the packet is of a saved revision; null (or absent): a draft of unsaved work. */
  revisionId?: string | null;
  /** Date printed on the packet (injectable so tests are reproducible). */
  date: Date;
  version?: string;
  units?: F.UnitSystem;
}

const isRecord = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v);

function dateText(d: Date): string {
  return `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

// ---------------------------------------------------------------- checks

export interface CheckRow {
  requirement: string;
  where: string;
  source: string;
  status: string;
  reached: string;
  required: string;
  margin: string;
  verdict: 'FAIL' | 'NOT CHECKED' | 'FOR INFORMATION' | 'PASS';
}

const VERDICT_ORDER: Record<CheckRow['verdict'], number> = { FAIL: 0, 'NOT CHECKED': 1, 'FOR INFORMATION': 2, PASS: 3 };

function statusText(status: string): string {
  const w = Object.hasOwn(RULE_STATUS_LABELS, status) ? RULE_STATUS_LABELS[status as keyof typeof RULE_STATUS_LABELS] : status;
  return status === 'verified' ? w : `${w}*`;
}

function num(v: unknown): number | null {
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
}

/** The figures a check reached and needed, in words with units. */
function reachedRequired(
  ref: CheckRef,
  c: CheckResult | undefined,
  fm: FailureModeResult | undefined,
  checks: readonly CheckResult[],
  regen: EvaluationResult['regen'],
  units: F.UnitSystem,
): [string, string] {
  if (fm) return [F.deceleration(fm.max_deceleration_ms2, units), `at least ${F.deceleration(fm.required_ms2, units)}`];
  const d = c?.details ?? {};
  const decel = num(d.deceleration_ms2) ?? num(d.hot_deceleration_ms2);
  const req = num(d.hot_required_ms2) ?? num(d.required_deceleration_ms2);
  if (decel !== null && req !== null) return [F.deceleration(decel, units), `at least ${F.deceleration(req, units)}`];
  const need = num(d.adhesion_needed);
  const test = num(d.test_adhesion);
  if (need !== null && test !== null) return [`adhesion needed ${F.adhesion(need)}`, `at most ${F.adhesion(test)} (test surface)`];
  if (ref.kind === 'regeneration' && regen) {
    const rc = regen.load_states.find((s) => s.id === ref.load_state)?.checks.find((x) => x.rule === ref.rule && x.speed_kmh === ref.speed_kmh);
    const base = checks.find((x) => x.rule === ref.rule && x.load_state === ref.load_state && x.scenario === 'as_designed');
    const label = base?.branches?.find((b) => b.id === rc?.branch)?.label ?? base?.branches?.[0]?.label;
    const at = rc?.worst_at_braking_rate ?? null;
    return [at === null ? F.DASH : `closest at ${F.zText(at)}`, label ?? ref.title];
  }
  const at = c?.worst_at_braking_rate ?? null;
  const branch = c?.branches?.find((b) => b.id === c.branch)?.label ?? c?.branches?.[0]?.label;
  if (c && c.margin_unit === 'adhesion') return [at === null ? F.DASH : `closest at ${F.zText(at)}`, branch ?? ref.title];
  return [F.DASH, F.DASH];
}

export function checkRows(result: EvaluationResult, units: F.UnitSystem = 'metric'): CheckRow[] {
  const rows: CheckRow[] = [];
  const notChecked = new Map(result.verdict.not_checked.map((n) => [n.anchor, n]));
  for (const { ref, advisory } of verdictItems(result)) {
    const c =
      ref.kind === 'check' ? result.checks.find((x) => x.rule === ref.rule && x.load_state === ref.load_state && x.scenario === ref.scenario) : undefined;
    const fm = ref.kind === 'failure_mode' ? result.failure_modes.find((f) => f.load_state === ref.load_state && f.mode === ref.scenario) : undefined;
    let [reached, required] = reachedRequired(ref, c, fm, result.checks, result.regen, units);
    const nc = notChecked.get(ref.anchor);
    if (ref.passed === null) {
      reached = F.DASH;
      required = nc && nc.missing.length ? `needs ${nc.missing.join('; ')}` : required;
    }
    const verdict: CheckRow['verdict'] =
      ref.passed === null ? 'NOT CHECKED' : ref.passed ? 'PASS' : advisory ? 'FOR INFORMATION' : 'FAIL';
    rows.push({
      requirement: ref.title,
      where: [ref.load_state_label ?? 'Whole design', ref.scenario_label].filter((x) => x !== '').join(', '),
      source: `${ref.source.document}, ${ref.source.paragraph}`,
      status: statusText(ref.status),
      reached,
      required,
      margin: ref.passed === null ? F.DASH : F.margin(ref.margin, ref.margin_unit === 'm/s²' ? 'm/s²' : ref.margin_unit, units),
      verdict,
    });
  }
  return rows.sort((a, b) => VERDICT_ORDER[a.verdict] - VERDICT_ORDER[b.verdict]);
}

// ---------------------------------------------------------------- inputs with their sources

export interface InputRow {
  path: string;
  field: string;
  value: string;
  source: string;
  note: string;
}

/** Top-level keys printed elsewhere or not inputs. */
const NOT_INPUTS = new Set(['format', 'name', 'notes', 'provenance', 'identification', 'test_results', 'rules']);

type Words = Readonly<Record<string, string>>;
/** Label tables for the coded text values of inputs, by the key that holds them (the last two parts of the path). */
const VALUE_LABELS: readonly [RegExp, Words | ((c: string) => string)][] = [
  [/(^|\.)rear_valve\.type$/, valveTypeLabel],
  [/(^|\.)brake\.type$|_brake_type$/, BRAKE_TYPE_LABELS],
  [/(^|\.)caliper$/, CALIPER_LABELS],
  [/(^|\.)shoe_arrangement$/, SHOE_ARRANGEMENT_LABELS],
  [/(^|\.)circuit_split$/, CIRCUIT_SPLIT_LABELS],
  [/(^|\.)blending\.type$/, REGEN_BLENDING_LABELS],
  [/(^|\.)drive$/, DRIVE_LABELS],
  [/(^|\.)category$/, CATEGORY_LABELS],
  [/(^|\.)senses$/, VALVE_SENSES_LABELS],
  [/(^|\.)control$/, PARKING_CONTROL_LABELS],
];

function valueText(v: unknown, unit: string, path: string): string {
  const u = unit ? ` ${F.unitText(unit)}` : '';
  if (typeof v === 'number') return `${String(v)}${u}`;
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (Array.isArray(v)) return v.map((x) => (Array.isArray(x) ? `(${x.join(', ')})` : String(x))).join(', ') + (v.every((x) => typeof x === 'number') ? u : '');
  const t = String(v);
  for (const [re, table] of VALUE_LABELS) {
    if (!re.test(path)) continue;
    if (typeof table === 'function') return table(t);
    if (Object.hasOwn(table, t)) return table[t]!;
  }
  // a code no table knows: its words (user text has no underscores to lose)
  return /^[a-z0-9]+(_[a-z0-9]+)+$/.test(t) ? t.replace(/_/g, ' ') : t;
}

/** Words for where a value came from, true for the value as it stands (core/provenance.ts). */
export function sourceWords(s: ReturnType<typeof inputSource>): string {
  switch (s.state) {
    case 'recorded':
      return PROVENANCE_LABELS[s.source!];
    case 'unconfirmed':
      return `${PROVENANCE_LABELS[s.source!]} (recorded without the value it was stated for: confirm)`;
    case 'changed':
      return `source not stated (a source was recorded for ${String(s.recorded_value)}; the value has changed since)`;
    case 'build_up':
      return 'calculated from the mass build-up';
    case 'axle_lift':
      return 'measured by axle-lift weighings';
    case 'not_stated':
      return 'not stated';
  }
}

export function inputRows(design: DesignFile, result?: EvaluationResult): InputRow[] {
  const prov = design.provenance;
  const states = result?.load_states ?? [];
  const labels = design.load_states.map((s) => s.label);
  const rows: InputRow[] = [];
  const walk = (v: unknown, path: (string | number)[]) => {
    if (Array.isArray(v) && !v.every((x) => typeof x === 'number' || (Array.isArray(x) && x.every((y) => typeof y === 'number')))) {
      v.forEach((x, i) => walk(x, [...path, i]));
      return;
    }
    if (isRecord(v)) {
      for (const [k, x] of Object.entries(v)) {
        if (path.length === 0 && NOT_INPUTS.has(k)) continue;
        // what the reading filled in, not inputs
        if (k === 'derived_from' || k === 'cg_height_derived_from' || k === 'id' || k === 'label' || k === 'kind') continue;
        walk(x, [...path, k]);
      }
      return;
    }
    const p = diffPath(path);
    const src = inputSource(prov, p, v, states);
    rows.push({ path: p, field: pathLabel(p, labels), value: valueText(v, unitOfDiffPath(path), p), source: sourceWords(src), note: src.note });
  };
  walk(design, []);
  return rows;
}

// ---------------------------------------------------------------- diagrams

const COLOURS = { front: '#1f4e9c', rear: '#b3261e', ideal: '#333333', limit: '#2e7d32', band: '#2e7d32', regen: '#e08a00' };
const STATE_COLOURS = ['#1f4e9c', '#b3261e', '#2e7d32', '#6a1b9a', '#e08a00', '#00838f', '#555555', '#8d6e63'];
export const CHART = { width: 495, height: 300 };

/** The category whose curve requirement was applied (an N1 vehicle may be held to the M1 requirement). */
function appliedCategory(result: EvaluationResult, design: DesignFile): DesignFile['vehicle']['category'] {
  const lock = result.checks.find((c) => c.rule === 'eu-appendix/lock-order' && c.applies);
  const applied = lock?.details?.requirement_applied;
  return typeof applied === 'string' && ['M1', 'M2', 'M3', 'N1', 'N2', 'N3'].includes(applied) ? (applied as DesignFile['vehicle']['category']) : design.vehicle.category;
}

/** A limit line k = a + b·z in words: "k = z + 0.05", "k = 2.00·z − 0.42". */
function lineWords(l: { braking_rate: [number, number]; adhesion: [number, number] }): string {
  const [z0, z1] = l.braking_rate;
  const slope = (l.adhesion[1] - l.adhesion[0]) / (z1 - z0);
  const icpt = l.adhesion[0] - slope * z0;
  const head = Math.abs(slope - 1) < 1e-9 ? 'k = z' : `k = ${F.ratio(slope)}·z`;
  return Math.abs(icpt) < 1e-9 ? head : `${head} ${icpt > 0 ? '+' : '−'} ${F.ratio(Math.abs(icpt))}`;
}

function limitLines(result: EvaluationResult, design: DesignFile): { series: ChartSeries[]; bands: ChartSpec['bands'] } {
  const applied = new Set(result.checks.filter((c) => c.applies).map((c) => c.rule));
  const cat = appliedCategory(result, design);
  const seen = new Set<string>();
  const series: ChartSeries[] = [];
  for (const l of limitSeries(cat)) {
    if (!applied.has(l.rule)) continue;
    const key = `${l.braking_rate.join()}|${l.adhesion.join()}`;
    if (seen.has(key)) continue;
    seen.add(key);
    const eff = l.rule.endsWith('/efficiency');
    const z = `z ${F.zRange(l.braking_rate)}`;
    series.push({
      name: eff ? `efficiency limit, both axles (${z})` : `${l.axle} ${l.kind === 'upper' ? 'at most' : 'at least'} ${lineWords(l)} (${z})`,
      x: [...l.braking_rate],
      y: [...l.adhesion],
      color: eff ? COLOURS.limit : '#7b5e00',
      width: 1,
      dash: !eff,
    });
  }
  // the z range over which the lock-order rule wants the front curve above the rear one (its main branch)
  const bands: NonNullable<ChartSpec['bands']> = [];
  for (const c of result.checks) {
    if (c.rule !== 'eu-appendix/lock-order' || !c.applies) continue;
    const m = /z (\d\.\d+)[–-](\d\.\d+)/.exec(c.branches?.[0]?.label ?? '');
    if (m) {
      bands.push({ x0: Number(m[1]), x1: Number(m[2]), label: `front above rear required (${cat} rule, z ${m[1]}–${m[2]})`, color: COLOURS.band });
      break;
    }
  }
  return { series, bands };
}

function utilisationChart(s: LoadStateResult, result: EvaluationResult, design: DesignFile): Block | null {
  const c = s.curves;
  if (!c) return null;
  const z = c.braking_rate;
  const limits = limitLines(result, design);
  const series: ChartSeries[] = [
    { name: 'front axle f1', x: z, y: c.front_utilisation, color: COLOURS.front, width: 1.5 },
    { name: 'rear axle f2', x: z, y: c.rear_utilisation, color: COLOURS.rear, width: 1.5 },
    { name: 'ideal f = z', x: [0, 1], y: [0, 1], color: COLOURS.ideal, dash: true, width: 0.7 },
    ...limits.series,
  ];
  const rg = result.regen?.load_states.find((r) => r.id === s.id);
  const worst = rg?.at_speeds.reduce<(typeof rg.at_speeds)[number] | null>((a, b) => (a === null || b.regen_force_n > a.regen_force_n ? b : a), null);
  if (worst && worst.regen_force_n > 0) {
    const words = `with ${F.force(worst.regen_force_n, 'metric')} regeneration at ${F.speed(worst.speed_kmh, 'metric')}`;
    series.push(
      { name: `front f1 ${words}`, x: worst.utilisation.map((u) => u.braking_rate), y: worst.utilisation.map((u) => u.front_utilisation), color: COLOURS.front, dash: true, width: 1 },
      { name: `rear f2 ${words}`, x: worst.utilisation.map((u) => u.braking_rate), y: worst.utilisation.map((u) => u.rear_utilisation), color: COLOURS.regen, dash: true, width: 1.2 },
    );
  }
  const markers = [];
  if (s.critical_braking_rate !== null) markers.push({ x: s.critical_braking_rate, label: `rear locks first above ${F.zText(s.critical_braking_rate)}`, color: '#6a1b9a' });
  if (s.rear_lift_off_braking_rate <= 1) markers.push({ x: s.rear_lift_off_braking_rate, label: 'rear lift-off', color: '#555' });
  const spec: ChartSpec = {
    title: `Adhesion utilisation: ${s.label}`,
    xLabel: 'braking rate z (deceleration / g)',
    yLabel: 'adhesion utilised f = T / N',
    x: [0, 1],
    y: [0, 1.2],
    series,
    markers,
    ...(limits.bands?.length ? { bands: limits.bands } : {}),
    width: CHART.width,
    height: CHART.height,
  };
  return { kind: 'chart', svg: chartSvg(spec), width: CHART.width, height: CHART.height };
}

function forcesChart(result: EvaluationResult): Block | null {
  const series: ChartSeries[] = [];
  let max = 0.1;
  result.load_states.forEach((s, i) => {
    const c = s.curves;
    if (!c) return;
    const col = STATE_COLOURS[i % STATE_COLOURS.length]!;
    series.push({ name: `ideal, ${s.label}`, x: c.ideal_front_per_weight, y: c.ideal_rear_per_weight.map((v) => (v >= 0 ? v : null)), color: col, dash: true, width: 0.9 });
    series.push({ name: `installed, ${s.label}`, x: c.front_force_per_weight, y: c.rear_force_per_weight, color: col, width: 1.5 });
    max = Math.max(max, ...c.ideal_rear_per_weight.filter((v) => v >= 0));
  });
  if (series.length === 0) return null;
  const spec: ChartSpec = {
    title: 'Braking forces over weight: installed line and ideal curve per load state',
    xLabel: 'front braking force over vehicle weight T1 / P',
    yLabel: 'rear braking force over weight T2 / P',
    x: [0, 1],
    y: [0, Math.min(1, Math.ceil(max * 10) / 10)],
    series,
    width: CHART.width,
    height: CHART.height,
  };
  return { kind: 'chart', svg: chartSvg(spec), width: CHART.width, height: CHART.height };
}

function pressureChart(result: EvaluationResult, units: F.UnitSystem): Block | null {
  const series: ChartSeries[] = [];
  let max = 10;
  result.load_states.forEach((s, i) => {
    const c = s.curves;
    if (!c) return;
    const p1 = c.front_pressure_bar.map((v) => F.convertRaw('pressure', v, units, 'bar'));
    const p2 = c.rear_pressure_bar.map((v) => F.convertRaw('pressure', v, units, 'bar'));
    max = Math.max(max, ...p1.filter((v) => v <= F.convertRaw('pressure', 160, units, 'bar')));
    series.push({ name: `rear line, ${s.label}`, x: p1, y: p2, color: STATE_COLOURS[i % STATE_COLOURS.length]!, width: 1.5 });
  });
  if (series.length === 0) return null;
  const top = Math.ceil(max / 10) * 10;
  series.push({ name: 'rear = front (no valve)', x: [0, top], y: [0, top], color: COLOURS.ideal, dash: true, width: 0.7 });
  const spec: ChartSpec = {
    title: 'Line pressures: rear line over front line (master cylinder) pressure',
    xLabel: F.headWithUnit('front line pressure', 'pressure', units),
    yLabel: F.headWithUnit('rear line pressure', 'pressure', units),
    x: [0, top],
    y: [0, top],
    series,
    width: CHART.width,
    height: 260,
  };
  return { kind: 'chart', svg: chartSvg(spec), width: CHART.width, height: 260 };
}

// ---------------------------------------------------------------- hardware

function brakeRows(design: DesignFile, units: F.UnitSystem): string[][] {
  const f = design.axles.front;
  const r = design.axles.rear;
  const cell = (a: typeof f, what: string): string => {
    const b = a.brake as Record<string, unknown>;
    switch (what) {
      case 'type':
        return BRAKE_TYPE_LABELS[a.brake.type];
      case 'caliper':
        return typeof b.caliper === 'string' && Object.hasOwn(CALIPER_LABELS, b.caliper) ? CALIPER_LABELS[b.caliper as 'sliding' | 'fixed'] : F.DASH;
      case 'pistons':
        return Array.isArray(b.piston_diameters_mm) ? b.piston_diameters_mm.map((d) => F.shortLength(d as number, units)).join(' + ') : F.DASH;
      case 'wheel_cylinder':
        return num(b.wheel_cylinder_diameter_mm) !== null ? F.shortLength(b.wheel_cylinder_diameter_mm as number, units) : F.DASH;
      case 'radius':
        return num(b.effective_radius_m) !== null ? F.length(b.effective_radius_m as number, units) : num(b.drum_diameter_mm) !== null ? `drum ${F.shortLength(b.drum_diameter_mm as number, units)}` : F.DASH;
      case 'friction':
        return num(b.pad_friction) !== null ? `pad ${F.ratio(b.pad_friction as number)}` : num(b.lining_friction) !== null ? `lining ${F.ratio(b.lining_friction as number)}` : F.DASH;
      case 'shoes':
        return typeof b.shoe_arrangement === 'string' && Object.hasOwn(SHOE_ARRANGEMENT_LABELS, b.shoe_arrangement)
          ? SHOE_ARRANGEMENT_LABELS[b.shoe_arrangement as keyof typeof SHOE_ARRANGEMENT_LABELS]
          : num(b.brake_factor) !== null
            ? `brake factor ${F.ratio(b.brake_factor as number)}`
            : F.DASH;
      case 'threshold':
        return F.pressure(a.brake.threshold_pressure_bar, units, 'bar');
      case 'tyre':
        return F.length(a.tyre_radius_m, units);
    }
    return F.DASH;
  };
  const items: [string, string][] = [
    ['Brake', 'type'],
    ['Caliper', 'caliper'],
    ['Piston diameters (one caliper)', 'pistons'],
    ['Wheel cylinder', 'wheel_cylinder'],
    ['Effective radius (disc) / drum diameter', 'radius'],
    ['Friction coefficient', 'friction'],
    ['Drum shoes', 'shoes'],
    ['Threshold pressure', 'threshold'],
    ['Tyre rolling radius', 'tyre'],
  ];
  return items.map(([k, w]) => [k, cell(f, w), cell(r, w)]).filter((row) => row[1] !== F.DASH || row[2] !== F.DASH);
}

function valveWords(design: DesignFile, units: F.UnitSystem): string {
  const v = design.hydraulics.rear_valve;
  const name = valveTypeLabel(v.type);
  switch (v.type) {
    case 'none':
      return name;
    case 'limiting':
      return `${name}, limits at ${F.pressure(v.knee_bar, units, 'bar')}`;
    case 'proportioning':
      return `${name}, knee ${F.pressure(v.knee_bar, units, 'bar')}, ratio ${F.ratio(v.ratio)} above it`;
    case 'load_sensing':
      return `${name}, ratio ${F.ratio(v.ratio)} above the knee; knee ${v.knee_bar_at_rear_axle_kg.map(([kg, bar]) => `${F.pressure(bar, units, 'bar')} at ${F.mass(kg, units)}`).join(', ')} rear axle load`;
  }
}

// ---------------------------------------------------------------- fixed texts (our own words)

export const METHOD_LINES: readonly string[] = [
  'Axle loads while braking at braking rate z = deceleration/g, with CG height h and wheelbase E: N1 = P1 + z·h·P/E, N2 = P2 − z·h·P/E (P = m·g, g = 9.80665 m/s²).',
  'Installed forces Ti = Gi·max(0, pi − pt,i), with the brake gain Gi of the calipers or drums, the threshold pressure pt,i and the rear line pressure from the rear valve; ideal forces z·N1, z·N2.',
  'Adhesion utilisation fi = Ti/Ni; on a surface of adhesion k the first lock is the smallest z at which f1 or f2 reaches k; braking efficiency = that z / k.',
  'Pedal force for a master-cylinder pressure p: F = p·A_mc/(pedal ratio × booster ratio) up to the booster run-out pressure; above it each further unit of pressure costs A_mc/pedal ratio.',
];

export const ASSUMPTIONS: readonly string[] = [
  'Rigid vehicle on a level road; suspension pitch, aerodynamic drag and rolling resistance neglected; both axles on a surface of the same adhesion.',
  'Friction, brake factors and threshold pressures constant (no dependence on temperature, speed or wear); hysteresis and fluid compliance ignored.',
  'The figures are only as good as the inputs: the inputs table says where each came from; "assumed" and "not stated" values deserve a measurement.',
];

// ---------------------------------------------------------------- the packet

export function packetContent(input: PacketInput): PacketContent {
  const { design, result } = input;
  const units = input.units ?? 'metric';
  const saved = input.revisionId ?? null;
  const version = input.version ?? LOCKSTEP_VERSION;
  const ident = (design.identification ?? {}) as Record<string, string | undefined>;
  const filled = (k: string) => (ident[k] !== undefined && ident[k] !== '' ? ident[k]! : '(not filled in)');
  const b: Block[] = [];
  const v = result.verdict;
  const rows = checkRows(result, units);

  // ---- page 1
  b.push({ kind: 'title', text: 'Brake distribution evidence packet' });
  if (!saved) b.push({ kind: 'p', text: `${DRAFT_MARK}: made from work on the page or a design file, not from a revision saved in the design store.`, style: 'draft' });
  b.push({ kind: 'p', text: design.name, style: 'bold' });
  const idRows: [string, string][] = [
    ['Owner', filled('owner')],
    ['Vehicle identification number', filled('vehicle_identification_number')],
    ['Base vehicle (make and model)', filled('base_vehicle_make_model')],
    ['Conversion', filled('conversion_description')],
    ['Workshop', filled('modifier')],
    ['Approval regime and code', [ident.approval_regime, ident.approval_code].filter((x) => x).join(', ') || '(not filled in)'],
    ['Vehicle category', CATEGORY_LABELS[design.vehicle.category]],
    ['Date', dateText(input.date)],
    ['Lockstep version', version],
  ];
  if (saved) idRows.push(['Revision (SHA-256 of the canonical design JSON)', saved]);
  else idRows.push(['Revision', 'none: a draft is not a saved revision']);
  b.push({ kind: 'kv', rows: idRows });
  b.push({ kind: 'h2', text: `Verdict: ${overallWord(v)}` });
  b.push({ kind: 'p', text: v.summary, style: 'bold' });
  for (const f of v.failed) b.push({ kind: 'p', text: `FAIL  ${f.description}`, style: 'small' });
  for (const n of v.not_checked) b.push({ kind: 'p', text: `NOT CHECKED  ${n.description}`, style: 'small' });
  for (const a of v.advisories) b.push({ kind: 'p', text: `For information (does not decide): ${a.description}`, style: 'small' });
  const measured = testResultsOutcome(design, result.load_states);
  if (measured && measured.meets !== null) {
    b.push({ kind: 'p', text: `Measured brake test: ${measured.meets ? 'the measured values meet the requirement' : 'the measured values do NOT meet the requirement'} (test sheet).`, style: 'bold' });
  } else if (measured) b.push({ kind: 'p', text: 'Measured brake test: results entered without a measured deceleration; nothing to compare yet.' });
  b.push({ kind: 'h2', text: 'Load states' });
  for (const s of result.load_states) {
    const fails = rows.filter((r) => r.verdict === 'FAIL' && r.where.startsWith(s.label)).length;
    const crit = s.critical_braking_rate === null ? 'front locks first up to rear lift-off' : `rear locks first above ${F.zText(s.critical_braking_rate)}`;
    const eff = s.lowest_efficiency ? `lowest braking efficiency ${F.efficiency(s.lowest_efficiency.efficiency)} at k = ${F.adhesion(s.lowest_efficiency.adhesion)}` : '';
    b.push({
      kind: 'p',
      text: `${s.label} (${LOAD_KIND_LABELS[s.kind as keyof typeof LOAD_KIND_LABELS] ?? s.kind}): ${F.mass(s.mass_kg, units)}, front axle ${F.mass(s.front_axle_kg, units)}, CG height ${F.length(s.cg_height_m, units)}; ${crit}; ${eff}; ${fails === 0 ? 'no check fails' : `${fails} check${fails === 1 ? '' : 's'} fail`}.`,
    });
  }
  b.push({ kind: 'p', text: `CAUTION: ${CAUTION}`, style: 'caution' });
  b.push({ kind: 'page_break' });

  // ---- 1 checks
  b.push({ kind: 'h1', text: '1. Checks' });
  if (result.checks.length === 0) b.push({ kind: 'p', text: 'No regulation checks selected: this packet reports the braking distribution only, without verdicts against a rule.' });
  if (rows.length > 0) {
    b.push({ kind: 'p', text: 'Failing and not-checked rows first. Margin: how far the value is inside (+) or outside (−) the requirement.', style: 'small' });
    b.push({
      kind: 'table',
      columns: ['Verdict', 'Requirement', 'Load state and case', 'Document and paragraph', 'Text', 'Reached', 'Required', 'Margin'],
      rows: rows.map((r) => [r.verdict, r.requirement, r.where, r.source, r.status, r.reached, r.required, r.margin]),
      widths: [0.62, 1.2, 1.45, 1.95, 0.62, 0.78, 1.5, 0.72],
    });
    if (rows.some((r) => r.status.endsWith('*'))) b.push({ kind: 'p', text: `* The text of this requirement is only partly verified or from memory: ${VERIFY_NOTE}.`, style: 'small' });
  }

  // ---- 2 diagrams
  b.push({ kind: 'page_break' });
  b.push({ kind: 'h1', text: '2. Diagrams' });
  for (const s of result.load_states) {
    const ch = utilisationChart(s, result, design);
    if (ch) b.push(ch);
  }
  for (const ch of [forcesChart(result), pressureChart(result, units)]) if (ch) b.push(ch);
  b.push({ kind: 'h2', text: 'Lock order per surface' });
  b.push({
    kind: 'table',
    columns: ['Load state', ...result.adhesion_coefficients.map((k) => `k = ${F.adhesion(k)}`)],
    rows: result.load_states.map((s) => [s.label, ...s.lock.map((l) => `${FIRST_AXLE_LABELS[l.first_axle]} at ${F.brakingRate(l.braking_rate)}`)]),
  });

  // ---- 3 inputs
  b.push({ kind: 'h1', text: '3. Inputs and where they came from' });
  b.push({ kind: 'p', text: activeBlocksLine(design) });
  if (design.notes) b.push({ kind: 'p', text: `Notes in the design: ${design.notes}`, style: 'small' });
  b.push({
    kind: 'table',
    columns: ['Input', 'Value as entered', 'Source', 'Note'],
    rows: inputRows(design, result).map((r) => [r.field, r.value, r.source, r.note]),
    widths: [2.2, 1.2, 1.6, 1.6],
  });

  // ---- 4 hardware
  b.push({ kind: 'h1', text: '4. Hardware' });
  b.push({ kind: 'table', columns: ['Part', 'Front axle', 'Rear axle'], rows: brakeRows(design, units), widths: [2, 1.5, 1.5] });
  const h = design.hydraulics;
  const hw: [string, string][] = [
    ['Master cylinder bore', F.shortLength(h.master_cylinder_bore_mm, units)],
    ['Pedal ratio; booster ratio', `${F.ratio(h.pedal_ratio)}; ${F.ratio(h.booster_ratio)}`],
    ['Booster run-out pressure', h.booster_runout_bar === undefined ? 'not given' : F.pressure(h.booster_runout_bar, units, 'bar')],
    ['Circuit split', CIRCUIT_SPLIT_LABELS[h.circuit_split]],
    ['Rear valve and its setting', valveWords(design, units)],
  ];
  if (h.balance_bar) hw.push(['Balance bar', `front share ${F.percentOfRatio((h.balance_bar as { front_share?: number }).front_share ?? null)}`]);
  hw.push(['Antilock (ABS)', design.vehicle.abs ? 'fitted' : 'not fitted']);
  b.push({ kind: 'kv', rows: hw });
  if (design.ratings) {
    const r = design.ratings;
    b.push({ kind: 'h2', text: 'Rating plate values' });
    b.push({
      kind: 'kv',
      rows: [
        ['Maximum mass', r.max_mass_kg === undefined ? 'not given' : F.mass(r.max_mass_kg, units)],
        ['Maximum front axle load', r.max_front_axle_kg === undefined ? 'not given' : F.mass(r.max_front_axle_kg, units)],
        ['Maximum rear axle load', r.max_rear_axle_kg === undefined ? 'not given' : F.mass(r.max_rear_axle_kg, units)],
      ],
    });
  } else b.push({ kind: 'p', text: 'Rating plate values: not given in the design.', style: 'small' });
  const gauge = valveGauge(design);
  b.push({ kind: 'h2', text: 'Valve check for gauge tests' });
  b.push({ kind: 'p', text: `Gauges on a front and a rear line, vehicle standing in the load state: expected rear line pressure at each front line pressure (${valveTypeLabel(gauge.valve_type)}).`, style: 'small' });
  b.push({
    kind: 'table',
    columns: ['Load state', 'Knee', ...gauge.front_pa.map((p) => `front ${F.pressure(p, units)}`)],
    rows: gauge.rows.map((r) => [
      design.load_states.find((s) => s.id === r.load_state)?.label ?? r.load_state,
      Number.isFinite(r.knee_pa) ? F.pressure(r.knee_pa, units) : 'none',
      ...r.rear_pa.map((p) => F.pressure(p, units)),
    ]),
  });

  // ---- 5 before / after
  const base = baseVehicleRows(design, result, units);
  if (base.length > 0) {
    b.push({ kind: 'h1', text: '5. Before and after the conversion' });
    b.push({ kind: 'table', columns: ['Quantity', 'Base vehicle', 'Converted (heaviest load state)'], rows: base, widths: [2, 1.5, 1.5] });
  }

  // ---- method, sources, sign-off
  const n = base.length > 0 ? 6 : 5;
  b.push({ kind: 'h1', text: `${n}. Method, sources and assumptions` });
  for (const m of METHOD_LINES) b.push({ kind: 'p', text: `• ${m}`, style: 'small' });
  const sources = new Map<string, string>();
  sources.set('71/320/EEC Annex II Appendix, point 2 (symbols) and point 3.1 (line of ideal adhesion utilisation k = z)', 'verified');
  sources.set('NIST SP 811 (2008) appendix B: unit conversion factors and standard gravity', 'verified');
  for (const { ref } of verdictItems(result)) {
    const s = `${ref.source.document}, ${ref.source.paragraph}`;
    if (!sources.has(s)) sources.set(s, ref.status);
  }
  b.push({
    kind: 'table',
    columns: ['Source and paragraph', 'Text'],
    rows: [...sources].map(([s, st]) => [s, st === 'verified' ? RULE_STATUS_LABELS.verified : `${RULE_STATUS_LABELS[st as 'partial']}: ${VERIFY_NOTE}`]),
    widths: [3, 2],
  });
  for (const a of ASSUMPTIONS) b.push({ kind: 'p', text: `• ${a}`, style: 'small' });
  for (const w of result.warnings ?? []) b.push({ kind: 'p', text: `• Warning: ${w.message}`, style: 'small' });
  b.push({ kind: 'p', text: `CAUTION: ${CAUTION}`, style: 'caution' });
  b.push({ kind: 'h2', text: 'Sign-off' });
  b.push({ kind: 'fields', labels: ['Prepared by (name, signature, date)', 'Checked by (name, signature, date)', 'Inspector / technical service (name, stamp, date)'] });

  // ---- test sheet
  b.push({ kind: 'page_break' });
  testSheet(b, design, result, saved, units, filled, measured);

  const attachment = { name: 'lockstep-result.json', json: `${JSON.stringify({ design, result }, null, 1)}\n` };
  return { title: `Lockstep evidence packet: ${design.name}`, revisionId: saved, draft: !saved, blocks: b, attachment };
}

function baseVehicleRows(design: DesignFile, result: EvaluationResult, units: F.UnitSystem): string[][] {
  const bv = design.base_vehicle;
  const heat = design.heat;
  if (!bv && heat?.base_vehicle_mass_kg === undefined) return [];
  const heaviest = result.load_states.reduce((a, s) => (s.mass_kg > a.mass_kg ? s : a), result.load_states[0]!);
  const rows: string[][] = [];
  const m = heat?.base_vehicle_mass_kg;
  const f = heat?.base_vehicle_front_axle_kg;
  if (m !== undefined) {
    rows.push(['Mass', F.mass(m, units), F.mass(heaviest.mass_kg, units)]);
    if (f !== undefined) {
      rows.push(['Front axle load', F.mass(f, units), F.mass(heaviest.front_axle_kg, units)]);
      rows.push(['Rear axle load', F.mass(m - f, units), F.mass(heaviest.mass_kg - heaviest.front_axle_kg, units)]);
      rows.push(['Static front share', F.percentOfRatio(f / m), F.percentOfRatio(heaviest.static_front_share)]);
    }
  }
  if (bv) {
    const both = (k: string, base: string | undefined, now: string) => {
      if (base !== undefined) rows.push([k, base, now]);
    };
    both('Front tyre radius', bv.front_tyre_radius_m === undefined ? undefined : F.length(bv.front_tyre_radius_m, units), F.length(design.axles.front.tyre_radius_m, units));
    both('Rear tyre radius', bv.rear_tyre_radius_m === undefined ? undefined : F.length(bv.rear_tyre_radius_m, units), F.length(design.axles.rear.tyre_radius_m, units));
    both('Circuit split', bv.circuit_split === undefined ? undefined : CIRCUIT_SPLIT_LABELS[bv.circuit_split], CIRCUIT_SPLIT_LABELS[design.hydraulics.circuit_split]);
    both('Front brake', bv.front_brake_type === undefined ? undefined : BRAKE_TYPE_LABELS[bv.front_brake_type], BRAKE_TYPE_LABELS[design.axles.front.brake.type]);
    both('Rear brake', bv.rear_brake_type === undefined ? undefined : BRAKE_TYPE_LABELS[bv.rear_brake_type], BRAKE_TYPE_LABELS[design.axles.rear.brake.type]);
    both('Antilock (ABS)', bv.abs === undefined ? undefined : bv.abs ? 'fitted' : 'not fitted', design.vehicle.abs ? 'fitted' : 'not fitted');
  }
  return rows;
}

function testSheet(
  b: Block[],
  design: DesignFile,
  result: EvaluationResult,
  saved: string | null,
  units: F.UnitSystem,
  filled: (k: string) => string,
  measured: ReturnType<typeof testResultsOutcome>,
): void {
  b.push({ kind: 'h1', text: 'Brake test sheet' });
  b.push({
    kind: 'kv',
    rows: [
      ['Vehicle identification number', filled('vehicle_identification_number')],
      ['Design revision', saved ?? DRAFT_MARK],
      ['Test date and place', [design.test_results?.date, design.test_results?.place].filter((x) => x).join(', ')],
      ['Surface and weather (road) / tester and serial (roller)', ''],
    ],
  });
  b.push({ kind: 'p', text: 'Road test, per load state: the required values beside the blanks (predicted: the engine\'s estimate).', style: 'bold' });
  const road: string[][] = [];
  for (const s of result.load_states) {
    for (const [rule, test] of [['performance/service', 'service'], ['performance/secondary', 'secondary']] as const) {
      const cs = result.checks.filter((c) => c.rule === rule && c.load_state === s.id && c.applies && c.details);
      if (cs.length === 0) continue;
      // the secondary case that reaches least (one circuit failed)
      const c = cs.reduce((a, x) => ((num(x.details!.deceleration_ms2) ?? Infinity) < (num(a.details!.deceleration_ms2) ?? Infinity) ? x : a));
      const d = c.details!;
      road.push([
        `${s.label}, ${test}`,
        F.speed(num(d.test_speed_kmh), units),
        `≤ ${F.pedalForce(num(d.pedal_force_limit_n), units)}`,
        `≥ ${F.deceleration(num(d.required_deceleration_ms2), units)}`,
        F.deceleration(num(d.deceleration_ms2), units),
        `≤ ${F.distance(num(d.stopping_distance_limit_m), units)}`,
        '',
        '',
        '',
        '',
      ]);
    }
  }
  b.push({
    kind: 'table',
    columns: [
      'Load state, test',
      F.headWithUnit('Speed', 'speed', units),
      'Pedal force allowed',
      'Deceleration required',
      'Deceleration predicted',
      'Stopping distance allowed',
      F.headWithUnit('Pedal force used', 'pedal_force', units),
      F.headWithUnit('Measured MFDD', 'deceleration', units),
      F.headWithUnit('Stopping distance', 'distance', units),
      'Wheel lock (F/R/none)',
    ],
    rows: road,
  });
  b.push({ kind: 'p', text: 'Mean fully developed deceleration (MFDD) from speed readings: d = (vb² − ve²) / (25.92·(se − sb)), v in km/h, s in m; vb = 0.8·v0, ve = 0.1·v0 (UN R13 Annex 4, from memory).', style: 'small' });
  b.push({
    kind: 'table',
    columns: ['Load state, test', 'v0 (km/h)', 'vb (km/h)', 've (km/h)', 'sb (m)', 'se (m)', 'MFDD (m/s²)'],
    rows: road.map((r) => [r[0]!, '', '', '', '', '', '']),
  });
  b.push({ kind: 'p', text: 'Roller brake tester, per axle: predicted reading (the force the tester records before the wheels slip or the pedal limit is reached) beside the blanks.', style: 'bold' });
  const roller: string[][] = [];
  for (const s of result.load_states) {
    const t = s.tester;
    if (!t) continue;
    for (const a of t.axles) {
      roller.push([
        `${s.label}, ${a.axle}`,
        F.force(a.static_load_n, units),
        F.force(a.recorded_force_n, units),
        a.limited_by === 'slip' ? `wheels slip at ${F.pedalForce(a.slip_pedal_force_n, units)} pedal` : `pedal limit ${F.pedalForce(t.pedal_force_limit_n, units)}`,
        '',
        '',
        '',
      ]);
    }
    roller.push([`${s.label}, service brake total`, F.mass(t.test_mass_kg, units), `${F.percent(t.predicted_pct)} of test weight`, `required ≥ ${F.percent(t.required_pct)}`, '', '', '']);
  }
  b.push({
    kind: 'table',
    columns: ['Axle', 'Static axle load', 'Predicted reading', 'Limited by', F.headWithUnit('Left', 'force', units), F.headWithUnit('Right', 'force', units), 'Imbalance (%)'],
    rows: roller,
  });
  if (measured && (measured.road.length > 0 || measured.roller.length > 0)) {
    b.push({ kind: 'h2', text: 'Measured against predicted and required' });
    const label = (id: string) => design.load_states.find((s) => s.id === id)?.label ?? id;
    if (measured.road.length)
      b.push({
        kind: 'table',
        columns: ['Load state, test', 'Measured', 'Predicted', 'Difference', 'Required', 'Meets the requirement'],
        rows: measured.road.map((r) => [
          `${label(r.load_state)}, ${r.test}`,
          F.deceleration(r.measured_ms2, units),
          F.deceleration(r.predicted_ms2, units),
          r.difference_ms2 === null ? F.DASH : F.format('deceleration', r.difference_ms2, units, { signed: true }),
          `≥ ${F.deceleration(r.required_ms2, units)}`,
          r.meets === null ? 'not measured' : r.meets ? 'yes' : 'NO',
        ]),
      });
    if (measured.roller.length)
      b.push({
        kind: 'table',
        columns: ['Axle (roller tester)', 'Measured left + right', 'Predicted', 'Difference', 'Imbalance'],
        rows: measured.roller.map((r) => [
          r.axle,
          F.force(r.measured_n, units),
          F.force(r.predicted_n, units),
          r.difference_n === null ? F.DASH : F.format('force', r.difference_n, units, { signed: true }),
          F.percent(r.imbalance_pct),
        ]),
      });
  }
  b.push({ kind: 'p', text: 'Instruments:', style: 'bold' });
  b.push({
    kind: 'table',
    columns: ['Instrument', 'Make / serial', 'Calibration date', 'Calibration due'],
    rows: [['Decelerometer', '', '', ''], ['Pedal force gauge', '', '', ''], ['Speed source (GPS / fifth wheel / other)', '', '', ''], ['Weighbridge / axle scales', '', '', ''], ['Roller brake tester', '', '', '']],
  });
  b.push({ kind: 'fields', labels: ['Tested by and witnessed by (names, signatures, date)'] });
}
