/**
 * The workbench form and the design file, both ways. A form field's name IS its design-file path
 * (`vehicle.wheelbase_m`, `load_states[1].mass_kg`, `axles.front.brake.piston_diameters_mm[0]`), so a panel
 * can add inputs for a new optional block without touching this module. Names starting with "_" are
 * controls of the page (units, operations) and never reach the design.
 *
 * Conventions (also in DEVELOPERS.md, "Adding inputs to the workbench"):
 * - numbers: the quantity table of the schema (core/field-meta.ts: quantity, file unit, label of every numeric
 *   field) says how a field is shown and typed in the user's unit system; any field also takes a typed unit
 *   ("58 in"). Fields of quantity "ratio" are plain numbers. Names under `lift.` are fields of the axle-lift file.
 *   An empty number field leaves the key out.
 * - booleans (schema z.boolean()): a hidden input "false" followed by a checkbox "true"; the last value wins.
 *   Optional facts where "not stated" differs from "no" use a three-way select (views/fields.ts triStateField):
 *   "" (not stated) leaves the key out, "true" / "false" set it. Other text is reported on the field.
 * - everything else is text, sent as typed (enums are <select>s); empty text leaves the key out. White space is
 *   kept as typed, as in the design file (a label of spaces is valid in both; the form never refuses a file's value).
 * - names are checked first (form/field-names.ts): prototype words, odd names and list positions beyond
 *   the schema's list limits are refused.
 * - objects that end up without keys are left out (an optional block nobody filled in stays absent).
 */
import {
  axleLiftFieldMeta,
  DesignFile,
  DISPLAY_UNITS,
  type FieldIssue,
  type FieldMeta,
  fieldMeta,
  type Quantity,
  schemaAt,
  TO_SI,
  type Unit,
  unitLabel,
  type UnitSystem,
  type Warning,
  formatPath,
  type InputSource,
  inputSource,
  parseQuantity,
  PROVENANCE_SOURCES,
  type ProvenanceEntry,
  readDesign,
} from '../core/index.ts';
import { FORBIDDEN_KEYS, fieldNameProblem } from './field-names.ts';

/** Field name -> text as shown or typed. */
export type FormValues = Record<string, string>;
export type PathKey = string | number;

export { unitLabel };

/**
 * Fields of the axle-lift form that are no key of the axle-lift file: the reading of the axle on the scales (the
 * form asks for one reading per lift and stores it as front_axle_kg or rear_axle_kg).
 */
const FORM_ONLY_FIELDS: ReadonlyArray<{ pattern: RegExp; meta: FieldMeta }> = [
  { pattern: /^lift\.lifts\[\d+\]\.reading_kg$/, meta: { quantity: 'mass', unit: 'kg', label: 'Axle reading' } },
];

/** Quantity, file unit and label of a form field: a design-file path, or `lift.` and an axle-lift file path. */
export function fieldMetaOfName(name: string): FieldMeta | null {
  if (name.startsWith('lift.')) {
    for (const f of FORM_ONLY_FIELDS) if (f.pattern.test(name)) return f.meta;
    return axleLiftFieldMeta(name.slice('lift.'.length));
  }
  return fieldMeta(name);
}

export function parseFieldPath(name: string): PathKey[] {
  const out: PathKey[] = [];
  const re = /([^.[\]]+)|\[(\d+)\]/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(name)) !== null) out.push(m[2] !== undefined ? Number(m[2]) : m[1]!);
  return out;
}

export const fieldPath = formatPath as (path: ReadonlyArray<PathKey>) => string;

export interface FieldUnit {
  quantity: Quantity;
  /** Unit of the value in the design file. */
  fileUnit: Unit;
}

/** Quantity and file unit of a numeric field, or null for a plain number (quantity "ratio") or no number. */
export function unitOfField(name: string): FieldUnit | null {
  const m = fieldMetaOfName(name);
  return m && m.unit !== '1' ? { quantity: m.quantity, fileUnit: m.unit } : null;
}

/** The unit a field is shown in for a unit system (null for plain numbers). */
export function displayUnitOf(name: string, units: UnitSystem): Unit | null {
  const u = unitOfField(name);
  return u ? DISPLAY_UNITS[u.quantity][units] : null;
}

// ---- what the schema says a leaf is --------------------------------------------------------------

export type FieldKind = 'number' | 'boolean' | 'text';

/** Kind of a field from the design schema (including blocks added later). */
const kindCache = new Map<string, FieldKind>();

export function kindOfField(name: string): FieldKind {
  let k = kindCache.get(name);
  if (k === undefined) {
    k = findKind(name);
    if (kindCache.size >= 5000) kindCache.clear();
    kindCache.set(name, k);
  }
  return k;
}

type Def = { type: string; [k: string]: unknown };

function findKind(name: string): FieldKind {
  if (fieldMetaOfName(name)) return 'number';
  const leaf = schemaAt(DesignFile, parseFieldPath(name));
  if (!leaf) return 'text';
  const d = (leaf as unknown as { _zod: { def: Def } })._zod.def;
  if (d.type === 'number' || d.type === 'int' || d.type === 'float') return 'number';
  if (d.type === 'boolean') return 'boolean';
  if (d.type === 'literal' && (d.values as unknown[]).every((v) => typeof v === 'number')) return 'number';
  return 'text';
}

// ---- numbers for display -------------------------------------------------------------------------

/**
 * Decimals a converted value is shown with, per quantity and unit: about the resolution a workshop measures
 * with (0.1 lb, 0.01 in on a wheelbase, 0.001 in on a bore, 0.1 psi). Common practice, no source.
 */
const SHOWN_DECIMALS: Partial<Record<`${Quantity}:${Unit}`, number>> = {
  'mass:lb': 1, 'mass:kg': 1,
  'length:in': 2, 'length:m': 3,
  'short_length:in': 3, 'short_length:mm': 2,
  'pressure:psi': 1, 'pressure:bar': 2,
  'force:lbf': 1, 'force:N': 0,
  'speed:mph': 1, 'speed:km/h': 1,
  'acceleration:ft/s2': 2, 'acceleration:m/s2': 2,
  'distance:ft': 1, 'distance:m': 2,
};

/**
 * A design-file number as text in the display unit: exact when no conversion, else rounded for its quantity
 * (SHOWN_DECIMALS, but never fewer than 3 significant digits nor more than 6). The exact number travels in
 * `_exact`, so the rounding never changes the design.
 */
export function formatFieldNumber(name: string, value: number, units: UnitSystem): string {
  const u = unitOfField(name);
  if (!u) return String(value);
  const shown = DISPLAY_UNITS[u.quantity][units];
  if (shown === u.fileUnit) return String(value);
  const v = Number(((value * TO_SI[u.fileUnit]) / TO_SI[shown]).toPrecision(6));
  const d = SHOWN_DECIMALS[`${u.quantity}:${shown}`];
  if (d === undefined || v === 0) return String(v);
  const mag = Math.floor(Math.log10(Math.abs(v)));
  const digits = Math.min(Math.max(d, 2 - mag), Math.max(0, 5 - mag));
  return String(Number(v.toFixed(Math.max(0, digits))));
}

/** Text typed in a field -> number in the design-file unit, or the reason it cannot be read. */
export function parseFieldNumber(name: string, text: string, units: UnitSystem): { ok: true; value: number } | { ok: false; reason: string } {
  const u = unitOfField(name);
  if (!u) {
    const r = parseQuantity(text, 'ratio', '1');
    return r.ok ? { ok: true, value: r.value } : { ok: false, reason: `${r.reason}; enter a plain number` };
  }
  const shown = DISPLAY_UNITS[u.quantity][units];
  const r = parseQuantity(text, u.quantity, shown);
  if (!r.ok) return { ok: false, reason: `${r.reason}; enter a number in ${unitLabel(shown)}` };
  if ((r.unit === null && shown === u.fileUnit) || r.unit === u.fileUnit) {
    // no conversion: keep the number exactly as typed
    const plain = Number(text.trim().replace(/\s*[^\d.,eE+-]+$/, '').replace(',', '.'));
    if (Number.isFinite(plain)) return { ok: true, value: plain };
  }
  return { ok: true, value: Number((r.value / TO_SI[u.fileUnit]).toPrecision(12)) };
}

// ---- design -> form ------------------------------------------------------------------------------

/**
 * Values shown rounded after a unit conversion, with the exact design-file number behind each text
 * (hidden field `_exact`): a value nobody retyped goes back into the design unchanged, so switching
 * units back and forth never alters a design.
 */
type ExactValues = Record<string, [shown: string, exact: number]>;

/** JSON.parse for the page's hidden fields: a reserved key (`__proto__`, ...) makes the text unreadable. */
export function parseHiddenJson(text: string): unknown {
  return JSON.parse(text, (k, v: unknown) => {
    if (FORBIDDEN_KEYS.has(k)) throw new SyntaxError(`reserved key "${k}"`);
    return v;
  });
}

function exactOf(values: FormValues): ExactValues {
  if (!values._exact) return {};
  try {
    const e = parseHiddenJson(values._exact);
    return e && typeof e === 'object' && !Array.isArray(e) ? (e as ExactValues) : {};
  } catch {
    return {};
  }
}

/** A numeric field's text -> design-file number, using the exact value when the text is the one shown. */
function readNumber(name: string, text: string, units: UnitSystem, exact: ExactValues): ReturnType<typeof parseFieldNumber> {
  const e = Object.hasOwn(exact, name) ? exact[name] : undefined;
  if (Array.isArray(e) && e[0] === text.trim() && typeof e[1] === 'number' && Number.isFinite(e[1])) return { ok: true, value: e[1] };
  return parseFieldNumber(name, text, units);
}

/** Every leaf of a design as form values in the given unit system. */
export function designToValues(design: unknown, units: UnitSystem): FormValues {
  const out: FormValues = {};
  const walk = (v: unknown, path: PathKey[]): void => {
    if (v === undefined || v === null) return;
    if (Array.isArray(v)) v.forEach((x, i) => walk(x, [...path, i]));
    else if (typeof v === 'object') {
      // provenance keys are paths themselves; the workbench does not edit them (kept in _provenance)
      for (const [k, x] of Object.entries(v)) if (!(path.length === 0 && k === 'provenance')) walk(x, [...path, k]);
    } else {
      const name = fieldPath(path);
      out[name] = typeof v === 'number' ? formatFieldNumber(name, v, units) : String(v);
      if (typeof v === 'number' && out[name] !== String(v)) exact[name] = [out[name]!, v];
    }
  };
  const exact: ExactValues = {};
  walk(design, []);
  if (Object.keys(exact).length > 0) out._exact = JSON.stringify(exact);
  const prov = (design as { provenance?: unknown }).provenance;
  if (prov !== undefined) {
    out._provenance = JSON.stringify(prov);
    // the source select of each input shows an entry only while it belongs to the value (core/provenance.ts)
    if (prov && typeof prov === 'object') {
      for (const [name, e] of Object.entries(prov as Record<string, ProvenanceEntry>)) {
        if (!Object.hasOwn(out, name) || fieldNameProblem(name) !== null) continue;
        const src = inputSource(prov as Record<string, ProvenanceEntry>, name, valueAt(design, pathOf(name)));
        if (src.state !== 'recorded' && src.state !== 'unconfirmed') continue;
        out[`${SOURCE_FIELD}${name}`] = e.source;
        if (e.note) out[`${NOTE_FIELD}${name}`] = e.note;
      }
    }
  }
  return out;
}

/** Form names of an input's source select and note: `_src:<field name>`, `_srcnote:<field name>`. */
export const SOURCE_FIELD = '_src:';
export const NOTE_FIELD = '_srcnote:';

function valueAt(root: unknown, path: readonly PathKey[]): unknown {
  let cur: unknown = root;
  for (const k of path) {
    if (cur === null || typeof cur !== 'object' || !Object.hasOwn(cur, k)) return undefined;
    cur = (cur as Record<PropertyKey, unknown>)[k];
  }
  return cur;
}

/**
 * The provenance block from the form: the entries carried in `_provenance` (each with the value it was
 * recorded for), changed by the source selects. A source chosen or changed now is recorded for the value the
 * field holds now; an unchanged select keeps its entry as recorded (so a value typed over since reads "source
 * not stated"); "not stated" drops the entry.
 */
function readProvenance(values: FormValues, input: Record<string, unknown>, errors: FieldIssue[]): Record<string, ProvenanceEntry> | undefined {
  const entries = new Map<string, ProvenanceEntry>();
  if (values._provenance) {
    try {
      const p = parseHiddenJson(values._provenance);
      if (p && typeof p === 'object' && !Array.isArray(p)) for (const [k, e] of Object.entries(p)) entries.set(k, e as ProvenanceEntry);
    } catch {
      /* a damaged hidden field only loses the provenance notes */
    }
  }
  for (const [key, sel] of Object.entries(values)) {
    if (!key.startsWith(SOURCE_FIELD)) continue;
    const name = key.slice(SOURCE_FIELD.length);
    if (fieldNameProblem(name) !== null) continue;
    const source = sel.trim();
    const note = (values[`${NOTE_FIELD}${name}`] ?? '').trim().slice(0, 2000);
    if (source === '') {
      entries.delete(name);
      continue;
    }
    if (!(PROVENANCE_SOURCES as readonly string[]).includes(source)) {
      errors.push({ path: name, message: `${JSON.stringify(source.slice(0, 40))} is not a source: choose measured, maker, donor, calculated, assumed or not stated` });
      continue;
    }
    const old = entries.get(name);
    if (old && old.source === source && (old.note ?? '') === note) continue;
    const v = valueAt(input, pathOf(name));
    if (typeof v !== 'number' && typeof v !== 'string' && typeof v !== 'boolean') continue;
    entries.set(name, { source: source as ProvenanceEntry['source'], value: v, ...(note ? { note } : {}) });
  }
  return entries.size ? Object.fromEntries(entries) : undefined;
}

/**
 * The provenance as it stands after this form post (carried on in `_provenance`) and the source of each
 * input that has an entry, as the workbench shows it beside the field (core/provenance.ts).
 */
export function formProvenance(values: FormValues, units: UnitSystem): { json: string | undefined; sources: Map<string, InputSource> } {
  const { input } = valuesToInput(values, units);
  const prov = input.provenance as Record<string, ProvenanceEntry> | undefined;
  const sources = new Map<string, InputSource>();
  if (!prov) return { json: undefined, sources };
  for (const name of Object.keys(prov)) sources.set(name, inputSource(prov, name, valueAt(input, pathOf(name))));
  return { json: JSON.stringify(prov), sources };
}

// ---- form -> design ------------------------------------------------------------------------------

function setAt(root: Record<string, unknown>, path: readonly PathKey[], value: unknown): void {
  let cur: Record<PropertyKey, unknown> = root;
  for (let i = 0; i < path.length - 1; i++) {
    const k = path[i]!;
    const nextIsIndex = typeof path[i + 1] === 'number';
    let next = Object.hasOwn(cur, k) ? cur[k] : undefined;
    if (next === undefined || next === null || typeof next !== 'object') {
      next = nextIsIndex ? [] : {};
      cur[k] = next;
    }
    cur = next as Record<PropertyKey, unknown>;
  }
  const last = path[path.length - 1]!;
  if (value === undefined) {
    // keep the slot so that an empty list entry is reported as missing, not silently dropped
    if (Array.isArray(cur) && typeof last === 'number' && cur.length <= last) cur.length = last + 1;
    return;
  }
  cur[last] = value;
}

function prune(v: unknown): unknown {
  if (Array.isArray(v)) return Array.from(v, (x) => prune(x));
  if (v && typeof v === 'object') {
    const o: Record<string, unknown> = {};
    for (const [k, x] of Object.entries(v)) {
      const p = prune(x);
      if (p !== undefined) o[k] = p;
    }
    return Object.keys(o).length === 0 ? undefined : o;
  }
  return v;
}

const TRUE_WORDS = new Set(['true', 'on', '1', 'yes']);
const FALSE_WORDS = new Set(['false', 'off', '0', 'no']);

/** Form values -> the object to validate, plus the fields whose text could not be read as a number. */
/** parseFieldPath for the form reader, kept per field name (the same names come with every recompute); read-only. */
const pathCache = new Map<string, readonly PathKey[]>();
function pathOf(name: string): readonly PathKey[] {
  let p = pathCache.get(name);
  if (p === undefined) {
    p = Object.freeze(parseFieldPath(name));
    if (pathCache.size >= 5000) pathCache.clear();
    pathCache.set(name, p);
  }
  return p;
}

export function valuesToInput(values: FormValues, units: UnitSystem): { input: Record<string, unknown>; errors: FieldIssue[] } {
  const input: Record<string, unknown> = {};
  const errors: FieldIssue[] = [];
  const exact = exactOf(values);
  for (const [name, text] of Object.entries(values)) {
    if (name.startsWith('_')) continue;
    // the routes refuse such a name outright (APP_ERR_FIELD_NAME); read directly, it is a problem of that field
    const refused = fieldNameProblem(name);
    if (refused !== null) {
      errors.push({ path: name.slice(0, 80), message: `this is not an input of the design: ${refused}` });
      continue;
    }
    const path = pathOf(name);
    if (path.length === 0) continue;
    const kind = kindOfField(name);
    const t = text.trim();
    if (kind === 'boolean') {
      // a checkbox always sends "false" or "true"; a three-way select (triStateField) sends "" for "not stated",
      // which leaves the key out like an empty number
      const w = t.toLowerCase();
      if (w === '') setAt(input, path, undefined);
      else if (TRUE_WORDS.has(w) || FALSE_WORDS.has(w)) setAt(input, path, TRUE_WORDS.has(w));
      else {
        errors.push({ path: fieldPath(path), message: `${JSON.stringify(text.slice(0, 40))} is not a yes/no value: choose yes, no or not stated` });
        setAt(input, path, undefined);
      }
    }
    else if (kind === 'number') {
      if (t === '') setAt(input, path, undefined);
      else {
        const r = readNumber(name, t, units, exact);
        if (r.ok) setAt(input, path, r.value);
        else {
          errors.push({ path: fieldPath(path), message: r.reason });
          setAt(input, path, undefined);
        }
      }
    } else setAt(input, path, text === '' ? undefined : text); // as typed, like the file: only an empty field is left out
  }
  const provenance = readProvenance(values, input, errors);
  if (provenance) input.provenance = provenance;
  return { input: (prune(input) as Record<string, unknown> | undefined) ?? {}, errors };
}

export type FormReading =
  | { ok: true; design: DesignFile; warnings: Warning[] }
  | { ok: false; errors: FieldIssue[] };

/** Form values -> validated design, with every problem keyed by the field name it belongs to. */
export function readForm(values: FormValues, units: UnitSystem): FormReading {
  const { input, errors } = valuesToInput(values, units);
  const r = readDesign(input);
  if (r.ok && errors.length === 0) return r;
  const seen = new Set(errors.map((e) => e.path));
  const schemaErrors = r.ok ? [] : r.errors.filter((e) => !seen.has(e.path)).map((e) => withShownRange(e, units));
  return { ok: false, errors: [...errors, ...schemaErrors] };
}

/** Adds the allowed range in the unit the user sees when it differs from the design-file unit. */
export function withShownRange(e: FieldIssue, units: UnitSystem): FieldIssue {
  const u = unitOfField(e.path);
  if (!u) return e;
  const shown = DISPLAY_UNITS[u.quantity][units];
  if (shown === u.fileUnit) return e;
  const m = /(?:from|above) (-?[\d.]+) (?:to|and at most) (-?[\d.]+)/.exec(e.message);
  if (!m) return e;
  const conv = (x: string) => String(Number(((Number(x) * TO_SI[u.fileUnit]) / TO_SI[shown]).toPrecision(4)));
  return { path: e.path, message: `${e.message} (${conv(m[1]!)} to ${conv(m[2]!)} ${unitLabel(shown)})` };
}

/** Re-expresses every numeric field in another unit system; text that cannot be read is kept as typed. */
export function convertValues(values: FormValues, from: UnitSystem, to: UnitSystem): FormValues {
  if (from === to) return { ...values };
  const out: FormValues = {};
  const before = exactOf(values);
  const exact: ExactValues = {};
  for (const [name, text] of Object.entries(values)) {
    if (name === '_exact') continue;
    out[name] = text;
    if (name.startsWith('_') || !unitOfField(name) || text.trim() === '') continue;
    const r = readNumber(name, text, from, before);
    if (!r.ok) continue;
    out[name] = formatFieldNumber(name, r.value, to);
    if (out[name] !== String(r.value)) exact[name] = [out[name]!, r.value];
  }
  if (Object.keys(exact).length > 0) out._exact = JSON.stringify(exact);
  return out;
}

// ---- list operations (add / duplicate / remove an entry of a list in the form) --------------------

/** Entries of a list field: the indices present under `listPath`. */
export function listIndices(values: FormValues, listPath: string): number[] {
  const set = new Set<number>();
  const prefix = `${listPath}[`;
  for (const name of Object.keys(values)) {
    if (!name.startsWith(prefix)) continue;
    const m = /^\[(\d+)\]/.exec(name.slice(listPath.length));
    if (m) set.add(Number(m[1]));
  }
  return [...set].sort((a, b) => a - b);
}

function entryOf(values: FormValues, listPath: string, i: number): Array<[string, string]> {
  const p = `${listPath}[${i}]`;
  return Object.entries(values).filter(([n]) => n === p || n.startsWith(`${p}.`) || n.startsWith(`${p}[`));
}

function reindex(values: FormValues, listPath: string, entries: Array<Array<[string, string]>>, from: number[]): FormValues {
  const out: FormValues = {};
  for (const [n, v] of Object.entries(values)) if (!n.startsWith(`${listPath}[`)) out[n] = v;
  entries.forEach((entry, newIndex) => {
    const oldP = `${listPath}[${from[newIndex]}]`;
    for (const [n, v] of entry) out[`${listPath}[${newIndex}]${n.slice(oldP.length)}`] = v;
  });
  return out;
}

export type ListOp = { op: 'add' | 'dup' | 'remove'; list: string; index: number | null };

/**
 * Lists that may be empty (optional lists of an optional block): their last entry can be removed, and "add" on
 * an empty list creates the first entry from these field names and starting texts. Add a line for a new list.
 */
export const EMPTYABLE_LISTS: Array<{ list: string; blank: Record<string, string> }> = [
  { list: 'build_up.removed', blank: { name: '', mass_kg: '', x_m: '', cg_height_m: '', group: 'removed' } },
  { list: 'build_up.added', blank: { name: '', mass_kg: '', x_m: '', cg_height_m: '', group: 'added' } },
  { list: 'build_up.seats', blank: { name: '', x_m: '', cg_height_m: '', driver: 'false' } },
  { list: 'build_up.tanks', blank: { name: '', full_kg: '', x_m: '', cg_height_m: '', fill_weighed: '' } },
  { list: 'heat.hot_friction_factor_at_c', blank: { '[0]': '', '[1]': '' } },
  { list: 'test_results.road', blank: { load_state: '', test: '', speed_kmh: '', pedal_force_n: '', mfdd_ms2: '', stopping_distance_m: '', wheel_lock: '' } },
  { list: 'test_results.roller', blank: { axle: '', left_n: '', right_n: '', pedal_force_n: '' } },
];

/** Reads `_op` values such as "add:load_states", "dup:load_states[1]", "remove:axles.front.brake.piston_diameters_mm[1]". */
export function parseListOp(text: string): ListOp | null {
  const m = /^(add|dup|remove):([A-Za-z0-9_.[\]]+?)(?:\[(\d+)\])?$/.exec(text);
  if (!m) return null;
  const op = m[1] as ListOp['op'];
  const index = m[3] === undefined ? null : Number(m[3]);
  if (op !== 'add' && index === null) return null;
  return { op, list: m[2]!, index };
}

/** Applies a list operation. A copied entry with an `id` gets a fresh one; its `label` is marked as a copy. */
export function applyListOp(values: FormValues, op: ListOp, maxEntries = 64): FormValues {
  // remembered exact numbers of the list's entries are dropped (their names change); the shown text is read
  const exact = exactOf(values);
  const kept = Object.fromEntries(Object.entries(exact).filter(([n]) => !n.startsWith(`${op.list}[`)));
  if (Object.keys(kept).length !== Object.keys(exact).length) {
    values = { ...values };
    if (Object.keys(kept).length > 0) values._exact = JSON.stringify(kept);
    else delete values._exact;
  }
  const idx = listIndices(values, op.list);
  const entries = idx.map((i) => entryOf(values, op.list, i));
  const from = [...idx];
  const emptyable = EMPTYABLE_LISTS.find((l) => l.list === op.list);
  if (op.op === 'add' && emptyable) {
    // a new entry of these lists starts blank (a draft until filled, form/keep-typed.ts), in the last one's group
    if (idx.length >= maxEntries) return values;
    const at = idx.length === 0 ? 0 : idx.at(-1)! + 1;
    const out = { ...values };
    // a blank key "[j]" is an element of a tuple entry (e.g. a [temperature, factor] pair), others are object keys
    for (const [k, v] of Object.entries(emptyable.blank)) {
      out[`${op.list}[${at}]${k.startsWith('[') ? k : `.${k}`}`] = k === 'group' && idx.length ? (values[`${op.list}[${idx.at(-1)}].group`] ?? v) : v;
    }
    return out;
  }
  if (op.op === 'remove') {
    const at = idx.indexOf(op.index ?? -1);
    if (at < 0 || (idx.length <= 1 && !emptyable)) return values;
    entries.splice(at, 1);
    from.splice(at, 1);
    return reindex(values, op.list, entries, from);
  }
  if (idx.length >= maxEntries || idx.length === 0) return values;
  const srcAt = op.op === 'add' ? idx.length - 1 : idx.indexOf(op.index ?? -1);
  if (srcAt < 0) return values;
  const srcP = `${op.list}[${idx[srcAt]}]`;
  const ids = new Set(idx.map((i) => values[`${op.list}[${i}].id`]).filter((v): v is string => v !== undefined));
  const copy = entries[srcAt]!.map(([n, v]): [string, string] => {
    const rest = n.slice(srcP.length);
    if (rest === '.id') {
      let k = 2;
      const base = v.replace(/-\d+$/, '') || 'state';
      while (ids.has(`${base}-${k}`)) k++;
      return [n, `${base}-${k}`];
    }
    if (rest === '.label') return [n, `${v} (copy)`.slice(0, 200)];
    if (rest === '.kind' && op.op === 'add') return [n, 'other'];
    return [n, v];
  });
  entries.splice(srcAt + 1, 0, copy);
  from.splice(srcAt + 1, 0, idx[srcAt]!);
  return reindex(values, op.list, entries, from);
}
