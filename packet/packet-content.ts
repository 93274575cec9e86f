/**
 * The evidence packet as a list of blocks (headings, paragraphs, tables, charts, fill-in fields), built
 * from a design, its evaluation result and the revision id. The PDF (packet-pdf.ts) and the HTML print view
 * (packet-html.ts) render the same blocks, so they carry the same numbers. User text is kept literally
 * here; each renderer handles it for its medium.
 *
 * Optional result sections written by other features (checks, build-up, traction, failure modes, heat,
 * tester, sizing ...) are printed when present and skipped when not, without assuming their exact shape.
 */
import {
  CAUTION,
  type DesignFile,
  diffPath,
  type EvaluationResult,
  type LoadStateResult,
  LOCKSTEP_VERSION,
  overallWord,
  unitOfDiffPath,
  VERIFY_NOTE,
  verdictItems,
} from '../core/index.ts';
import { type ChartSeries, chartSvg } from './chart-svg.ts';

export type Block =
  | { kind: 'title'; text: string }
  | { kind: 'h1'; text: string }
  | { kind: 'h2'; text: string }
  | { kind: 'p'; text: string; style?: 'caution' | 'small' | 'mono' | 'bold' }
  | { kind: 'kv'; rows: [string, string][] }
  | { kind: 'table'; columns: string[]; rows: string[][]; widths?: number[] }
  | { kind: 'chart'; svg: string; width: number; height: number }
  | { kind: 'fields'; labels: string[] }
  | { kind: 'page_break' };

export interface PacketInput {
  design: DesignFile;
  /** evaluate(design, { curves: true }) plus whatever later features add. */
  result: EvaluationResult;
  revisionId: string;
  /** Date printed on the packet (injectable so tests are reproducible). */
  date: Date;
  version?: string;
}

export interface PacketContent {
  title: string;
  revisionId: string;
  blocks: Block[];
}

// ---------------------------------------------------------------- formatting

export function fmtNum(v: unknown, decimals = 3): string {
  if (v === null || v === undefined) return '—';
  if (typeof v !== 'number') return String(v);
  if (!Number.isFinite(v)) return String(v);
  if (v !== 0 && (Math.abs(v) >= 1e7 || Math.abs(v) < 1e-4)) return v.toExponential(3);
  const s = v.toFixed(decimals);
  return s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
}

/** Longer lists of numbers are plot series: named, not printed. */
const MAX_LISTED = 24;

// Generic result sections: titles in words with the unit in brackets, read from the key's suffix
// (e.g. max_deceleration_ms2 -> "Max deceleration [m/s²]"), and numbers at a sensible precision.

/** Unit suffixes of result keys, longest first (a key ending in one names that unit). */
const UNIT_SUFFIXES: readonly [string, string][] = [
  ['_j_per_kg_k', 'J/(kg·K)'],
  ['_per_s', '1/s'],
  ['_ms2', 'm/s²'],
  ['_mm3', 'mm³'],
  ['_pct', '%'],
  ['_deg', '°'],
  ['_kmh', 'km/h'],
  ['_bar', 'bar'],
  ['_kw', 'kW'],
  ['_nm', 'N·m'],
  ['_kj', 'kJ'],
  ['_kg', 'kg'],
  ['_mm', 'mm'],
  ['_ft', 'ft'],
  ['_m', 'm'],
  ['_n', 'N'],
  ['_g', 'g'],
  ['_j', 'J'],
  ['_k', 'K'],
  ['_c', '°C'],
  ['_s', 's'],
];

/** Keys whose words read badly when derived (the unit is still taken from the suffix). */
const TITLE_OVERRIDES: Record<string, string> = {
  id: 'ID',
  k_from: 'Adhesion k from',
  k_to: 'Adhesion k to',
  z_from: 'Braking rate z from',
  z_to: 'Braking rate z to',
  v1_kmh: 'Initial speed v1',
  v2_kmh: 'Final speed v2',
  pct_when_rear_slips: 'Share when rear slips [%]',
  failing_without_regen: 'Fails without regeneration',
  zero_regen: 'Zero regeneration',
};

/** Words always written in capitals or otherwise fixed. */
const WORD_FIXES: Record<string, string> = { cg: 'CG', abs: 'ABS', pct: '%', regen: 'regeneration', nm: 'N·m' };

/** Words and unit of a result key: max_deceleration_ms2 -> { words: "Max deceleration", unit: "m/s²" }. */
export function keyParts(key: string): { words: string; unit: string } {
  let base = key;
  let unit = '';
  for (const [suf, u] of UNIT_SUFFIXES) {
    if (key.length > suf.length && key.endsWith(suf)) {
      base = key.slice(0, -suf.length);
      unit = u;
      break;
    }
  }
  const override = TITLE_OVERRIDES[key] ?? TITLE_OVERRIDES[base];
  if (override) return { words: override, unit: override.includes('[') ? '' : unit };
  const words = base.split('_').filter((w) => w !== '').map((w) => WORD_FIXES[w] ?? w).join(' ');
  return { words: words.charAt(0).toUpperCase() + words.slice(1), unit };
}

/** Words inside a sentence: first letter small unless the first word is an abbreviation (CG, ABS, ID). */
function lowerFirst(words: string): string {
  const first = words.split(' ')[0] ?? '';
  return first.length > 1 && first === first.toUpperCase() ? words : words.charAt(0).toLowerCase() + words.slice(1);
}

/** A column or row title for a result key, unit in brackets: "Max gradient [%]". */
export function columnTitle(key: string): string {
  const { words, unit } = keyParts(key);
  return unit ? `${words} [${unit}]` : words;
}

/** Dimensionless rates and ratios (braking rate, utilisation, efficiency, adhesion, shares): 3 decimals. */
const RATIO_KEY = /(^|_)(braking_rate|braking_rates|utilisation|efficiency|adhesion|adhesion_needed|share|z|k)(_|$)/;

function noNegativeZero(s: string): string {
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s;
}

function trimZeros(s: string): string {
  return s.includes('.') && !s.includes('e') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
}

/** A number to `sig` significant digits (integer digits are never dropped); exponent only beyond 1e12 or below 1e-4. */
export function fmtSig(v: number, sig = 4): string {
  if (!Number.isFinite(v)) return String(v);
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e12 || a < 1e-4) return v.toExponential(sig - 1);
  const decimals = Math.max(0, Math.min(8, sig - 1 - Math.floor(Math.log10(a))));
  return noNegativeZero(trimZeros(v.toFixed(decimals)));
}

/** A number of a generic result section, precision chosen by its key. */
export function fmtKeyed(v: number, key?: string): string {
  if (!Number.isFinite(v)) return String(v);
  if (key !== undefined && keyParts(key).unit === '' && RATIO_KEY.test(key) && Math.abs(v) < 100) return noNegativeZero(trimZeros(v.toFixed(3)));
  return fmtSig(v, 4);
}

/** A compact one-line text for any JSON value; `key` (the value's key) chooses precision and unit words. */
export function textOf(v: unknown, depth = 0, key?: string): string {
  if (v === null || v === undefined) return '—';
  if (typeof v === 'number') return fmtKeyed(v, key);
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'string') return v;
  if (Array.isArray(v)) {
    if (v.length > MAX_LISTED && v.every((x) => typeof x === 'number' || x === null)) return `series of ${v.length} values (plotted in the page; see the CSV export)`;
    if (v.length > MAX_LISTED && v.every(isRecord)) return `${v.length} entries (not listed here; see the JSON result)`;
    if (depth > 2 || (depth >= 2 && v.some(isRecord))) return `${v.length} entries`;
    return v.map((x) => textOf(x, depth + 1, key)).join(', ');
  }
  if (typeof v === 'object') {
    if (depth > 2) return '…';
    return Object.entries(v as Record<string, unknown>)
      .map(([k, x]) => {
        const { words, unit } = keyParts(k);
        const t = textOf(x, depth + 1, k);
        return `${lowerFirst(words)}: ${t}${unit && typeof x === 'number' ? ` ${unit}` : ''}`;
      })
      .join('; ');
  }
  return String(v);
}

function humanise(key: string): string {
  return columnTitle(key);
}

const isRecord = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v);
const isScalar = (v: unknown): boolean => v === null || ['number', 'string', 'boolean'].includes(typeof v);

// ---------------------------------------------------------------- generic sections

/** Blocks for a result section of unknown shape: scalars as key/value rows, lists of records as tables. */
export function genericBlocks(title: string, value: unknown, depth = 0): Block[] {
  const out: Block[] = [];
  if (depth === 0) out.push({ kind: 'h2', text: title });
  else out.push({ kind: 'p', text: title, style: 'bold' });
  if (value === null || value === undefined) {
    out.push({ kind: 'p', text: 'none' });
    return out;
  }
  if (isScalar(value)) {
    out.push({ kind: 'p', text: textOf(value) });
    return out;
  }
  if (Array.isArray(value)) {
    if (value.length === 0) {
      out.push({ kind: 'p', text: 'none' });
      return out;
    }
    if (value.every(isRecord)) {
      out.push(...recordTables(value as Record<string, unknown>[]));
      return out;
    }
    out.push({ kind: 'p', text: textOf(value) });
    return out;
  }
  const rec = value as Record<string, unknown>;
  const rows: [string, string][] = [];
  const nested: [string, unknown][] = [];
  for (const [k, v] of Object.entries(rec)) {
    if (isScalar(v) || (Array.isArray(v) && v.every(isScalar))) rows.push([humanise(k), textOf(v, 0, k)]);
    else nested.push([k, v]);
  }
  if (rows.length) out.push({ kind: 'kv', rows });
  for (const [k, v] of nested) {
    if (depth >= 3) out.push({ kind: 'p', text: `${humanise(k)}: ${textOf(v, 0, k)}` });
    else out.push(...genericBlocks(humanise(k), v, depth + 1));
  }
  return out;
}

const MAX_TABLE_COLUMNS = 8;
/** Characters of table text across the printable width (A4, 7.5 pt, roughly), and the longest word kept whole. */
const LINE_CHARS = 110;
const LONG_WORD_CHARS = 24;

/** A list of flat records given in a cell: keys once in the header, values per record. */
function compactRecords(v: unknown): { keys: string[]; text: string } | null {
  if (!Array.isArray(v) || v.length === 0 || !v.every(isRecord)) return null;
  const keys: string[] = [];
  for (const r of v as Record<string, unknown>[]) for (const k of Object.keys(r)) if (!keys.includes(k)) keys.push(k);
  return { keys, text: (v as Record<string, unknown>[]).map((r) => keys.map((k) => textOf(r[k], 2, k)).join(' ')).join('; ') };
}

/** Tables for a list of records; wide ones are split, repeating the first column. */
export function recordTables(list: Record<string, unknown>[]): Block[] {
  const columns: string[] = [];
  for (const r of list) for (const k of Object.keys(r)) if (!columns.includes(k)) columns.push(k);
  const headers = columns.map((c) => {
    const inner = list.map((r) => compactRecords(r[c])).find((x) => x !== null);
    return inner ? `${humanise(c)} (${inner.keys.map((k) => lowerFirst(columnTitle(k))).join(', ')})` : humanise(c);
  });
  const cells = list.map((r) => columns.map((c) => compactRecords(r[c])?.text ?? textOf(r[c], 0, c)));
  // Each column needs at least its longest word (in characters, long tokens capped); columns are grouped so
  // that these fit across the page and no word has to be broken, the first column repeated in every group.
  const longest = (t: string) => Math.min(LONG_WORD_CHARS, Math.max(0, ...t.split(/\s+/).map((w) => w.length)));
  const need = columns.map((_, i) => Math.max(4, longest(headers[i]!) * 1.1, ...cells.map((r) => longest(r[i]!))) + 2);
  const total = need.reduce((a, b) => a + b, 0);
  if (columns.length <= MAX_TABLE_COLUMNS && total <= LINE_CHARS) return [{ kind: 'table', columns: headers, rows: cells }];
  const groups: number[][] = [];
  let cur: number[] = [];
  let used = need[0]!;
  for (let i = 1; i < columns.length; i++) {
    if (cur.length > 0 && (cur.length >= MAX_TABLE_COLUMNS - 1 || used + need[i]! > LINE_CHARS)) {
      groups.push(cur);
      cur = [];
      used = need[0]!;
    }
    cur.push(i);
    used += need[i]!;
  }
  if (cur.length > 0) groups.push(cur);
  return groups.map((g) => {
    const idx = [0, ...g];
    return { kind: 'table', columns: idx.map((i) => headers[i]!), rows: cells.map((row) => idx.map((i) => row[i]!)) } satisfies Block;
  });
}

/** Result keys printed by dedicated sections; everything else is printed generically. */
const BASE_RESULT_KEYS = new Set([
  'format', 'lockstep_version', 'design_name', 'verdict', 'adhesion_coefficients', 'load_states', 'checks', 'warnings', 'caution',
]);
const BASE_STATE_KEYS = new Set([
  'id', 'label', 'kind', 'mass_kg', 'front_axle_kg', 'cg_height_m', 'front_axle_static_n', 'rear_axle_static_n',
  'static_front_share', 'front_share_low_pressure', 'rear_lift_off_braking_rate', 'critical_braking_rate',
  'critical_braking_rates', 'lock', 'lowest_efficiency', 'at', 'warnings', 'curves',
]);

/** Titles and order of the optional sections other features add (unknown keys follow, titled from the key). */
const SECTION_TITLES: [string, string][] = [
  ['build_up', 'Mass and CG derivation (build-up)'],
  ['mass_build_up', 'Mass and CG derivation (build-up)'],
  ['axle_lift', 'CG height by axle lift'],
  ['cg_lift', 'CG height by axle lift'],
  ['ratings', 'Axle and mass ratings'],
  ['derived_from', 'Where the load-state figures come from'],
  ['performance', 'Performance'],
  ['failure_modes', 'Failure modes'],
  ['pedal_travel', 'Pedal travel and fluid volume'],
  ['traction', 'Traction limits'],
  ['regen', 'Regenerative braking'],
  ['heat', 'Brake heat'],
  ['stopping_distance', 'Stopping distance'],
  ['tester', 'Roller brake tester prediction'],
  ['pitfalls', 'Pitfalls found'],
  ['sizing', 'Sizing recommendation'],
];

function sectionOrder(keys: string[]): [string, string][] {
  const known = SECTION_TITLES.filter(([k]) => keys.includes(k));
  const rest = keys.filter((k) => !SECTION_TITLES.some(([s]) => s === k)).sort().map((k): [string, string] => [k, humanise(k)]);
  return [...known, ...rest];
}

// ---------------------------------------------------------------- inputs with provenance

const SI_OF_UNIT: Record<string, [number, string]> = {
  mm: [1e-3, 'm'],
  m: [1, 'm'],
  kg: [1, 'kg'],
  bar: [1e5, 'Pa'],
  N: [1, 'N'],
  '°': [Math.PI / 180, 'rad'],
  's': [1, 's'],
  'm/s²': [1, 'm/s²'],
  'km/h': [1 / 3.6, 'm/s'],
  '%': [0.01, '1'],
};

export interface InputRow {
  path: string;
  entered: string;
  si: string;
  provenance: string;
}

const NOT_INPUTS = new Set(['format', 'name', 'notes', 'provenance', 'identification']);

export function inputRows(design: DesignFile): InputRow[] {
  const prov = (design.provenance ?? {}) as Record<string, { source: string; note?: string }>;
  const rows: InputRow[] = [];
  const walk = (v: unknown, path: (string | number)[]) => {
    if (Array.isArray(v)) {
      v.forEach((x, i) => walk(x, [...path, i]));
      return;
    }
    if (isRecord(v)) {
      for (const [k, x] of Object.entries(v)) {
        if (path.length === 0 && NOT_INPUTS.has(k)) continue;
        walk(x, [...path, k]);
      }
      return;
    }
    const p = diffPath(path);
    const unit = unitOfDiffPath(path);
    let entered = textOf(v);
    let si = '—';
    if (typeof v === 'number') {
      entered = `${fmtNum(v, 6)}${unit ? ` ${unit}` : ''}`;
      const conv = SI_OF_UNIT[unit];
      si = conv ? `${fmtNum(v * conv[0], 6)} ${conv[1]}` : unit === '' ? fmtNum(v, 6) : '—';
    }
    const pr = prov[p];
    rows.push({ path: p, entered, si, provenance: pr ? `${pr.source}${pr.note ? `: ${pr.note}` : ''}` : 'not stated' });
  };
  walk(design, []);
  return rows;
}

// ---------------------------------------------------------------- checks

export interface CheckRow {
  rule: string;
  loadState: string;
  verdict: string;
  margin: string;
  at: string;
  failing: string;
  source: string;
  status: string;
  note: string;
}

const STATUS_WORDS: Record<string, string> = {
  verified: 'verified', v: 'verified', V: 'verified',
  partial: 'partly verified', p: 'partly verified', P: 'partly verified',
  memory: 'from memory', m: 'from memory', M: 'from memory',
};

export function needsVerifyNote(status: unknown): boolean {
  return typeof status === 'string' && /^(partial|memory|p|m)$/i.test(status.trim());
}

function sourceText(s: unknown): string {
  if (s === null || s === undefined) return '—';
  if (typeof s === 'string') return s;
  if (isRecord(s)) {
    const doc = s.document ?? s.doc ?? s.title ?? '';
    const para = s.paragraph ?? s.para ?? s.clause ?? '';
    const t = [doc, para].filter((x) => x !== '').map(String).join(', ');
    return t || textOf(s);
  }
  return textOf(s);
}

export function verdictOf(c: Record<string, unknown>): string {
  if (c.applies === false || c.applicable === false) return 'NOT APPLICABLE';
  if (c.applies === true && c.passed === null) return 'NOT CHECKED';
  if (c.passed === true) return 'PASS';
  if (c.passed === false) return 'FAIL';
  if (typeof c.verdict === 'string') return c.verdict.toUpperCase();
  return 'NO VERDICT';
}

export function checkRows(checks: readonly unknown[]): CheckRow[] {
  return checks.filter(isRecord).map((c) => {
    const status = typeof c.status === 'string' ? c.status : '';
    const margin = c.worst_margin ?? c.margin;
    const ranges = Array.isArray(c.failing_ranges)
      ? (c.failing_ranges as unknown[]).map((r) => (Array.isArray(r) ? `${fmtNum(r[0], 3)}–${fmtNum(r[1], 3)}` : textOf(r))).join(', ')
      : '';
    const notes = [c.title, typeof c.branch === 'string' ? `branch: ${c.branch}` : null, c.message, c.note, c.reason, c.label].filter(
      (x) => typeof x === 'string' && x !== '',
    ) as string[];
    const scenario = typeof c.scenario === 'string' && c.scenario !== 'as_designed' ? ` (${c.scenario.replace(/_/g, ' ')})` : '';
    if (needsVerifyNote(status)) notes.push(VERIFY_NOTE);
    return {
      rule: String(c.rule ?? c.id ?? '—'),
      loadState: `${String(c.load_state ?? c.load_state_id ?? 'whole design')}${scenario}`,
      verdict: `${verdictOf(c)}${c.advisory === true ? ' (advisory)' : ''}`,
      margin: typeof margin === 'number' ? `${margin >= 0 ? '+' : ''}${fmtNum(margin, 4)}${typeof c.margin_unit === 'string' ? ` ${c.margin_unit}` : ''}` : textOf(margin),
      at: typeof c.worst_at_braking_rate === 'number' ? fmtNum(c.worst_at_braking_rate, 3) : '—',
      failing: ranges || 'none',
      source: sourceText(c.source),
      status: STATUS_WORDS[status] ?? (status || '—'),
      note: [...new Set(notes)].join('; '),
    };
  });
}

// ---------------------------------------------------------------- charts

const COLOURS = { front: '#1f4e9c', rear: '#b3261e', ideal: '#333333', limit: '#2e7d32' };

export function stateCharts(s: LoadStateResult): { svg: string; width: number; height: number }[] {
  const c = s.curves;
  if (!c) return [];
  const z = c.braking_rate;
  const util: ChartSeries[] = [
    { name: 'front axle f1', x: z, y: c.front_utilisation, color: COLOURS.front },
    { name: 'rear axle f2', x: z, y: c.rear_utilisation, color: COLOURS.rear },
    { name: 'ideal f = z', x: [0, 1], y: [0, 1], color: COLOURS.ideal, dash: true, width: 0.8 },
  ];
  const markers = [];
  if (s.critical_braking_rate !== null) markers.push({ x: s.critical_braking_rate, label: `critical z = ${fmtNum(s.critical_braking_rate, 3)}`, color: '#6a1b9a' });
  if (s.rear_lift_off_braking_rate <= 1) markers.push({ x: s.rear_lift_off_braking_rate, label: 'rear lift-off', color: '#555' });
  const a = chartSvg({
    title: `Adhesion utilisation, load state "${s.id}" (${s.label})`,
    xLabel: 'braking rate z',
    yLabel: 'adhesion utilised f',
    x: [0, 1],
    y: [0, 1.2],
    series: util,
    markers,
    width: 480,
    height: 280,
  });
  const maxT = Math.max(0.1, ...c.front_force_per_weight, ...c.ideal_front_per_weight.filter((v) => v >= 0));
  const maxR = Math.max(0.1, ...c.rear_force_per_weight, ...c.ideal_rear_per_weight.filter((v) => v >= 0));
  const b = chartSvg({
    title: `Braking force per axle over weight, load state "${s.id}"`,
    xLabel: 'braking rate z',
    yLabel: 'T / P',
    x: [0, 1],
    y: [0, Math.ceil(Math.max(maxT, maxR) * 10) / 10],
    series: [
      { name: 'front installed T1/P', x: z, y: c.front_force_per_weight, color: COLOURS.front },
      { name: 'rear installed T2/P', x: z, y: c.rear_force_per_weight, color: COLOURS.rear },
      { name: 'front ideal z N1/P', x: z, y: c.ideal_front_per_weight, color: COLOURS.front, dash: true, width: 0.8 },
      { name: 'rear ideal z N2/P', x: z, y: c.ideal_rear_per_weight, color: COLOURS.rear, dash: true, width: 0.8 },
    ],
    width: 480,
    height: 280,
  });
  return [
    { svg: a, width: 480, height: 280 },
    { svg: b, width: 480, height: 280 },
  ];
}

// ---------------------------------------------------------------- fixed texts (our own words)

export const METHOD_LINES: readonly string[] = [
  'Weights: P = m·g with g = 9.80665 m/s² (standard gravity); static front axle load P1 = m_front·g; rear P2 = P − P1.',
  'Axle loads while braking at braking rate z = deceleration/g, with CG height h and wheelbase E: N1 = P1 + z·h·P/E and N2 = P2 − z·h·P/E. The rear axle lifts off where N2 reaches 0.',
  'Ideal distribution: both axles use the same adhesion when T1 = z·N1 and T2 = z·N2.',
  'Brake gain per axle (two brakes per axle, force at the tyre per unit line pressure): disc G = 4·μ·A·r_eff/R, where A is the summed piston area of one caliper (half of it for an opposed-piston caliper); drum G = 2·C*·A_wc·r_drum/R, with C* the brake factor.',
  'Line pressures: front p1 equals the master-cylinder pressure p; rear p2 follows the rear valve (none: p; limiting: min(p, knee); proportioning: p up to the knee, then knee + ratio·(p − knee); load-sensing: as proportioning with the knee read from the rear static axle load).',
  'Installed forces: Ti = Gi·max(0, pi − threshold_i). For a braking rate z the pressure p solves T1 + T2 = z·P; the relation is piecewise linear and increasing in p, so it is solved exactly piece by piece.',
  'Adhesion utilisation fi = Ti/Ni. On a surface of adhesion k the first lock is the smallest z at which f1 or f2 reaches k ("both" when the two rates differ by less than 0.001); braking efficiency = that z divided by k.',
  'Critical braking rate: the lowest z at which f1 − f2 changes from positive to negative, i.e. above which the rear axle would lock first. Every sign change below 1.5 and below rear lift-off is listed.',
  'Pedal force for a master-cylinder pressure p: F = p·A_mc/(pedal ratio × booster ratio) up to the booster run-out pressure; above it each further unit of pressure costs A_mc/pedal ratio of pedal force.',
];

export const ASSUMPTIONS: readonly string[] = [
  'The vehicle is treated as a rigid body on a level road; suspension pitch, aerodynamic drag and rolling resistance are neglected.',
  'Pad and lining friction, brake factors and threshold pressures are constant (no dependence on temperature, speed, pressure or wear); brake hysteresis and fluid compliance are ignored.',
  'Both axles run on a surface of the same adhesion; left and right wheels of an axle share the load equally.',
  'The engine uses g = 9.80665 m/s²; the distribution Appendix of 71/320/EEC takes g as 10 m/s². Braking rates are ratios and are not affected; decelerations in m/s² are.',
  'Load-sensing valve knees are read from the static rear axle load of each load state (no dynamic valve response).',
  'The figures are only as good as the inputs: the provenance column says where each came from; "assumed" and "not stated" values deserve a measurement.',
];

function sourceStatusText(status: string): string {
  const word = STATUS_WORDS[status] ?? status;
  return needsVerifyNote(status) ? `${word} — ${VERIFY_NOTE}` : word;
}

// ---------------------------------------------------------------- the packet

function dateText(d: Date): string {
  return `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

export function packetContent(input: PacketInput): PacketContent {
  const { design, result, revisionId } = input;
  const version = input.version ?? LOCKSTEP_VERSION;
  const ident = (design.identification ?? {}) as Record<string, string | undefined>;
  const filled = (k: string) => (ident[k] !== undefined && ident[k] !== '' ? ident[k]! : '(not filled in)');
  const b: Block[] = [];

  // Cover
  b.push({ kind: 'title', text: 'Brake distribution evidence packet' });
  b.push({ kind: 'p', text: design.name, style: 'bold' });
  // The one verdict (core/verdict.ts), in the words the command line and the workbench print
  const v = result.verdict;
  b.push({ kind: 'h2', text: `Verdict: ${overallWord(v)}` });
  b.push({ kind: 'p', text: v.summary, style: 'bold' });
  for (const f of v.failed) b.push({ kind: 'p', text: `FAIL  ${f.description}` });
  for (const n of v.not_checked) b.push({ kind: 'p', text: `NOT CHECKED  ${n.description}` });
  for (const a of v.advisories) b.push({ kind: 'p', text: `For information (does not decide): ${a.description}`, style: 'small' });
  b.push({
    kind: 'kv',
    rows: [
      ['Vehicle identification number', filled('vehicle_identification_number')],
      ['Owner', filled('owner')],
      ['Modifier', filled('modifier')],
      ['Approval regime', filled('approval_regime')],
      ['Approval code', filled('approval_code')],
      ['Design name', design.name],
      ['Vehicle category', design.vehicle.category],
      ['Revision (SHA-256 of the canonical design JSON)', revisionId],
      ['Lockstep version', version],
      ['Date', dateText(input.date)],
    ],
  });
  b.push({ kind: 'p', text: `CAUTION: ${CAUTION}`, style: 'caution' });
  if (design.notes) {
    b.push({ kind: 'h2', text: 'Notes' });
    b.push({ kind: 'p', text: design.notes });
  }
  b.push({ kind: 'page_break' });

  // Summary of verdicts
  b.push({ kind: 'h1', text: '1. Summary of verdicts' });
  // the failed-valve and regeneration cases of the verdict are rows like the checks
  const cases = verdictItems(result)
    .filter((it) => it.ref.kind !== 'check')
    .map((it) => ({ ...it.ref, applies: true, advisory: it.advisory, worst_margin: it.ref.margin, note: it.ref.description }));
  const regulation = Array.isArray(result.checks) ? result.checks : [];
  const checks = [...regulation, ...cases];
  b.push({ kind: 'p', text: `Verdict: ${v.summary}`, style: 'bold' });
  if (regulation.length === 0) {
    b.push({ kind: 'p', text: 'No regulation checks selected: this packet reports the braking distribution only, without verdicts against a rule.' });
  }
  if (checks.length > 0) {
    const rows = checkRows(checks);
    const failed = rows.filter((r) => r.verdict === 'FAIL').length;
    b.push({ kind: 'p', text: `${rows.length} check result${rows.length === 1 ? '' : 's'}; ${failed} fail${failed === 1 ? 's' : ''}.`, style: 'bold' });
    b.push({
      kind: 'table',
      columns: ['Rule', 'Load state', 'Verdict', 'Worst margin', 'at z', 'Failing z ranges', 'Source', 'Status', 'Notes'],
      rows: rows.map((r) => [r.rule, r.loadState, r.verdict, r.margin, r.at, r.failing, r.source, r.status, r.note]),
      widths: [1.2, 0.9, 1.05, 0.8, 0.45, 0.8, 1.5, 0.75, 2.25],
    });
  }
  b.push({ kind: 'h2', text: 'Braking distribution per load state' });
  b.push({
    kind: 'table',
    columns: ['Load state', 'Kind', 'Mass kg', 'Front axle kg', 'CG height m', 'Critical z', 'All crossings z', 'Rear lift-off z', 'Lowest efficiency'],
    rows: result.load_states.map((s) => [
      `${s.id} (${s.label})`,
      s.kind,
      fmtNum(s.mass_kg, 1),
      fmtNum(s.front_axle_kg, 1),
      fmtNum(s.cg_height_m, 3),
      s.critical_braking_rate === null ? 'none' : fmtNum(s.critical_braking_rate, 4),
      s.critical_braking_rates.length ? s.critical_braking_rates.map((z) => fmtNum(z, 4)).join(', ') : 'none',
      fmtNum(s.rear_lift_off_braking_rate, 3),
      s.lowest_efficiency ? `${fmtNum(s.lowest_efficiency.efficiency, 3)} at k = ${fmtNum(s.lowest_efficiency.adhesion, 2)}` : '—',
    ]),
  });

  // Inputs
  b.push({ kind: 'h1', text: '2. Inputs and where they came from' });
  b.push({ kind: 'p', text: 'Each input as entered (unit named in the design file key), in SI units, and its provenance (measured, maker, donor, assumed; "not stated" where the file gives none).', style: 'small' });
  b.push({
    kind: 'table',
    columns: ['Field', 'As entered', 'SI', 'Provenance'],
    rows: inputRows(design).map((r) => [r.path, r.entered, r.si, r.provenance]),
    widths: [2.2, 1.1, 1.1, 2],
  });

  // Per load state: lock order, operating points, charts
  b.push({ kind: 'h1', text: '3. Results per load state' });
  for (const s of result.load_states) {
    b.push({ kind: 'h2', text: `Load state "${s.id}": ${s.label} (${s.kind})` });
    b.push({
      kind: 'kv',
      rows: [
        ['Mass; front axle; CG height', `${fmtNum(s.mass_kg, 1)} kg; ${fmtNum(s.front_axle_kg, 1)} kg; ${fmtNum(s.cg_height_m, 3)} m`],
        ['Static axle loads P1, P2', `${fmtNum(s.front_axle_static_n, 1)} N, ${fmtNum(s.rear_axle_static_n, 1)} N (front share ${fmtNum(s.static_front_share * 100, 1)} %)`],
        ['Installed front share at low pressure', s.front_share_low_pressure === null ? '—' : `${fmtNum(s.front_share_low_pressure * 100, 1)} %`],
        ['Critical braking rate', s.critical_braking_rate === null ? 'none' : fmtNum(s.critical_braking_rate, 4)],
        ['Rear-axle lift-off at z', fmtNum(s.rear_lift_off_braking_rate, 3)],
      ],
    });
    b.push({ kind: 'p', text: 'Lock order per surface (braking efficiency = z at first lock / adhesion k):', style: 'bold' });
    b.push({
      kind: 'table',
      columns: ['Adhesion k', 'Locks first', 'z at first lock', 'Efficiency', 'z front alone', 'z rear alone'],
      rows: s.lock.map((l) => [
        fmtNum(l.adhesion, 2),
        l.first_axle,
        fmtNum(l.braking_rate, 4),
        fmtNum(l.efficiency, 3),
        fmtNum(l.front_lock_braking_rate, 4),
        fmtNum(l.rear_lock_braking_rate, 4),
      ]),
    });
    b.push({ kind: 'p', text: 'Operating points (forces in N, utilisation f = T/N, pressures in bar, pedal force in N):', style: 'bold' });
    b.push({
      kind: 'table',
      columns: ['z', 'N1', 'N2', 'T1', 'T2', 'T1 ideal', 'T2 ideal', 'f1', 'f2', 'p front', 'p rear', 'Pedal'],
      rows: s.at.map((a) => [
        fmtNum(a.braking_rate, 3),
        fmtNum(a.front_axle_load_n, 0),
        fmtNum(a.rear_axle_load_n, 0),
        fmtNum(a.front_force_n, 0),
        fmtNum(a.rear_force_n, 0),
        fmtNum(a.ideal_front_force_n, 0),
        fmtNum(a.ideal_rear_force_n, 0),
        fmtNum(a.front_utilisation, 3),
        fmtNum(a.rear_utilisation, 3),
        fmtNum(a.front_pressure_bar, 1),
        fmtNum(a.rear_pressure_bar, 1),
        fmtNum(a.pedal_force_n, 0),
      ]),
    });
    for (const ch of stateCharts(s)) b.push({ kind: 'chart', ...ch });
    const extraState = Object.keys(s).filter((k) => !BASE_STATE_KEYS.has(k));
    for (const [k, title] of sectionOrder(extraState)) b.push(...genericBlocks(`${title} ("${s.id}")`, (s as unknown as Record<string, unknown>)[k], 1));
    for (const w of s.warnings) b.push({ kind: 'p', text: `Warning: ${w.message}`, style: 'small' });
  }

  // Optional sections from other features
  const extra = Object.keys(result).filter((k) => !BASE_RESULT_KEYS.has(k));
  if (extra.length > 0) {
    b.push({ kind: 'h1', text: '4. Further analyses' });
    for (const [k, title] of sectionOrder(extra)) b.push(...genericBlocks(title, (result as unknown as Record<string, unknown>)[k]));
  }

  // Method, sources, assumptions
  b.push({ kind: 'h1', text: `${extra.length > 0 ? 5 : 4}. Method` });
  for (const m of METHOD_LINES) b.push({ kind: 'p', text: `• ${m}` });
  b.push({ kind: 'h2', text: 'Sources' });
  const sources = new Map<string, string>();
  sources.set('71/320/EEC Annex II Appendix, point 2 (symbols: P_i, N_i, T_i, f_i, z, h, E, k)', 'verified');
  sources.set('71/320/EEC Annex II Appendix, point 3.1 (line of ideal adhesion utilisation k = z)', 'verified');
  sources.set('Axle loads while braking, as printed in 71/320/EEC Annex II Appendix 3.1.3 (derived here from the symbols)', 'memory');
  sources.set('NIST SP 811 (2008) appendix B: unit conversion factors and standard gravity', 'verified');
  for (const c of checks.filter(isRecord)) {
    const s = sourceText(c.source);
    if (s !== '—' && !sources.has(s)) sources.set(s, typeof c.status === 'string' ? c.status : '');
  }
  b.push({ kind: 'table', columns: ['Source and paragraph', 'Status'], rows: [...sources].map(([s, st]) => [s, sourceStatusText(st) || '—']), widths: [3, 2] });
  b.push({ kind: 'h2', text: 'Assumptions and limitations' });
  for (const a of ASSUMPTIONS) b.push({ kind: 'p', text: `• ${a}` });
  for (const w of result.warnings ?? []) b.push({ kind: 'p', text: `• Warning (${w.path || 'design'}): ${w.message}` });
  b.push({ kind: 'h2', text: 'Caution' });
  b.push({ kind: 'p', text: CAUTION, style: 'caution' });
  b.push({
    kind: 'p',
    text: 'This packet is an engineering estimate prepared to support, not replace, the physical brake test and the inspection. The rules that apply to the vehicle are those of the jurisdiction where it is registered, in their current official text.',
  });

  // Sign-off
  b.push({ kind: 'h2', text: 'Sign-off' });
  b.push({
    kind: 'fields',
    labels: [
      'Prepared by (name, signature, date)',
      'Checked by (name, signature, date)',
      'Inspector / technical service (name, stamp, date)',
      'Remarks',
    ],
  });

  // Test sheet
  b.push({ kind: 'page_break' });
  b.push({ kind: 'h1', text: 'Road / roller brake test sheet' });
  b.push({
    kind: 'kv',
    rows: [
      ['Vehicle identification number', filled('vehicle_identification_number')],
      ['Design revision', revisionId],
      ['Test date and place', ''],
      ['Surface and weather (road) / tester model and serial (roller)', ''],
    ],
  });
  b.push({ kind: 'p', text: 'Service and secondary braking, per load state (fill in on the road or roller tester):', style: 'bold' });
  const blankRows: string[][] = [];
  for (const s of result.load_states) {
    for (const test of ['service', 'secondary']) blankRows.push([`${s.id} (${s.label})`, test, '', '', '', '', '', '', '', '']);
  }
  b.push({
    kind: 'table',
    columns: ['Load state', 'Test', 'Test mass kg', 'Front axle kg', 'Speed km/h', 'Speed source', 'Pedal force N', 'Measured deceleration m/s²', 'Stopping distance m', 'Wheel lock (F/R/none)'],
    rows: blankRows,
    // room to write in every column; headers wrap at spaces (weights in points of the A4 text width)
    widths: [46, 52, 64, 46, 38, 40, 46, 62, 47, 54],
  });
  b.push({ kind: 'p', text: 'Roller tester, per axle and wheel (left / right braking force in N, imbalance in %):', style: 'bold' });
  b.push({
    kind: 'table',
    columns: ['Axle', 'Axle load kg', 'Left N', 'Right N', 'Imbalance %', 'Pedal force N', 'Remarks'],
    rows: [['front', '', '', '', '', '', ''], ['rear', '', '', '', '', '', ''], ['parking', '', '', '', '', '', '']],
  });
  b.push({ kind: 'p', text: 'Instruments:', style: 'bold' });
  b.push({
    kind: 'table',
    columns: ['Instrument', 'Make / serial', 'Calibration date', 'Calibration due'],
    rows: [['Decelerometer', '', '', ''], ['Pedal force gauge', '', '', ''], ['Speed source (GPS / fifth wheel / other)', '', '', ''], ['Weighbridge / axle scales', '', '', ''], ['Roller brake tester', '', '', '']],
  });
  b.push({ kind: 'fields', labels: ['Tested by (name, signature, date)', 'Witnessed by (name, signature, date)'] });
  b.push({ kind: 'p', text: `CAUTION: ${CAUTION}`, style: 'caution' });

  return { title: `Lockstep evidence packet: ${design.name}`, revisionId, blocks: b };
}
