/**
 * The axle-lift form of the conversion panel (views/axle-lift-view.ts) and the `lockstep-axle-lift/1` file
 * (docs/axle-lift.md), both ways. Field names are the file's paths behind the prefix `lift.`
 * (`lift.wheelbase_m`, `lift.level.front_axle_kg`, `lift.lifts[1].lift_height_m`), so lengths and masses are
 * shown and typed in the page's unit system exactly as in the design form (form/design-form.ts).
 * One difference from the file: a lift's scale reading is one field, `lift.lifts[i].reading_kg`, with
 * `lift.lifts[i].read_axle` saying which axle stood on the scales (the file writes `front_axle_kg` or
 * `rear_axle_kg`).
 *
 * "Apply to load state": a button posts the design form with `_op = cglift:apply:<load state id>=<h>,<u>`
 * (metres, SI, so the page's unit system does not matter); `applyCgLiftOp` writes `cg_height_m`,
 * `cg_height_uncertainty_m`, `cg_height_derived_from: "measured"` and adds `cg_height_m` to `overrides`
 * (docs/build-up.md, "Load states from the build-up").
 */
import { type AxleLiftFile, type FieldIssue, readAxleLift, type UnitSystem } from '../core/index.ts';
import { formErrors } from './errors.ts';
import {
  applyListOp,
  convertValues,
  designToValues,
  formatFieldNumber,
  type FormValues,
  listIndices,
  parseFieldNumber,
  NOTE_FIELD,
  parseHiddenJson,
  SOURCE_FIELD,
  withShownRange,
} from './design-form.ts';
import { fieldNameProblem } from './field-names.ts';

export const LIFT_PREFIX = 'lift.';
export const MAX_LIFTS = 30;
/** The unit system the lift fields were typed in (the preserved form may predate a unit switch). */
export const LIFT_UNITS_FIELD = '_lift_units';

const TEXT_FIELDS = /^lifts\[\d+\]\.(raised_axle|read_axle)$/;

/** The lift fields of a posted form, prefix kept. */
export function liftValues(posted: FormValues): FormValues {
  return Object.fromEntries(Object.entries(posted).filter(([k]) => k.startsWith(LIFT_PREFIX)));
}

/** Starting values: two lifts (rear raised, then front raised), each read on the axle that stays down. */
export function startingLiftValues(units: UnitSystem, wheelbaseM?: number): FormValues {
  const v: FormValues = {
    'lift.lifts[0].raised_axle': 'rear',
    'lift.lifts[0].read_axle': 'front',
    'lift.lifts[1].raised_axle': 'front',
    'lift.lifts[1].read_axle': 'rear',
  };
  for (const i of [0, 1]) for (const k of ['lift_height_m', 'lift_angle_deg', 'reading_kg']) v[`lift.lifts[${i}].${k}`] = '';
  if (wheelbaseM !== undefined) v['lift.wheelbase_m'] = formatFieldNumber('lift.wheelbase_m', wheelbaseM, units);
  return v;
}

/**
 * The figures the tool takes from the design (page units): the wheelbase, and as level axle loads the unladen
 * state's (else the first state's) axle loads, to be replaced by the scale readings. The page keeps a field
 * following the design while it still shows the design's figure (static/js/workbench.js).
 */
export function designLiftDefaults(
  wheelbaseM: number,
  states: ReadonlyArray<{ kind: string; mass_kg: number; front_axle_kg: number }>,
  units: UnitSystem,
): FormValues {
  const out: FormValues = { 'lift.wheelbase_m': formatFieldNumber('lift.wheelbase_m', wheelbaseM, units) };
  const s = states.find((x) => x.kind === 'unladen') ?? states[0];
  if (s) {
    out['lift.level.front_axle_kg'] = formatFieldNumber('lift.level.front_axle_kg', s.front_axle_kg, units);
    out['lift.level.rear_axle_kg'] = formatFieldNumber('lift.level.rear_axle_kg', s.mass_kg - s.front_axle_kg, units);
  }
  return out;
}

/** A load state's mass differs from the weighed mass by more than this share: the CG height may not carry over. */
export const LIFT_MASS_TOLERANCE = 0.01;

/** Add ("add") or remove ("remove:<i>") a lift row; the fields keep what was typed. */
export function applyLiftRowOp(values: FormValues, op: string): FormValues {
  if (op === 'add') {
    const idx = listIndices(values, 'lift.lifts');
    if (idx.length === 0) return { ...values, ...startingLiftValues('metric') };
    const next = applyListOp(values, { op: 'add', list: 'lift.lifts', index: null }, MAX_LIFTS);
    // a new row starts empty except for the axles, copied from the row above
    const last = listIndices(next, 'lift.lifts').at(-1)!;
    if (last !== idx.at(-1)) for (const k of ['lift_height_m', 'lift_angle_deg', 'reading_kg']) next[`lift.lifts[${last}].${k}`] = '';
    return next;
  }
  const m = /^remove:(\d+)$/.exec(op);
  if (m) return applyListOp(values, { op: 'remove', list: 'lift.lifts', index: Number(m[1]) });
  throw formErrors.unknownOperation(op);
}

function setAt(root: Record<string, unknown>, path: string, value: unknown): void {
  const keys = [...path.matchAll(/([^.[\]]+)|\[(\d+)\]/g)].map((m) => (m[2] !== undefined ? Number(m[2]) : m[1]!));
  let cur: Record<PropertyKey, unknown> = root;
  keys.forEach((k, i) => {
    if (i === keys.length - 1) cur[k] = value;
    else {
      if (!Object.hasOwn(cur, k)) cur[k] = typeof keys[i + 1] === 'number' ? [] : {};
      cur = cur[k] as Record<PropertyKey, unknown>;
    }
  });
}

/** Form paths of the file paths a reading error names (the reading is one field in the form). */
function formPathOf(filePath: string): string {
  return LIFT_PREFIX + filePath.replace(/^(lifts\[\d+\])\.(front|rear)_axle_kg$/, '$1.reading_kg');
}

export type LiftReading = { ok: true; input: AxleLiftFile } | { ok: false; errors: FieldIssue[] };

/** The lift fields -> a checked `lockstep-axle-lift/1` input; every problem keyed by the form field it belongs to. */
export function readLiftForm(posted: FormValues, units: UnitSystem): LiftReading {
  const input: Record<string, unknown> = { format: 'lockstep-axle-lift/1' };
  const errors: FieldIssue[] = [];
  // the route refuses such names outright (APP_ERR_FIELD_NAME); read directly, each is a problem of its field
  const values: FormValues = {};
  for (const [name, text] of Object.entries(posted)) {
    const refused = name.startsWith(LIFT_PREFIX) ? fieldNameProblem(name) : null;
    if (refused === null) values[name] = text;
    else errors.push({ path: name.slice(0, 80), message: `this is not an input of the tool: ${refused}` });
  }
  const readAxle: Record<number, string> = {};
  for (const [name, text] of Object.entries(values)) {
    if (!name.startsWith(LIFT_PREFIX)) continue;
    const path = name.slice(LIFT_PREFIX.length);
    const t = text.trim();
    const row = /^lifts\[(\d+)\]\.read_axle$/.exec(path);
    if (row) {
      readAxle[Number(row[1])] = t;
      continue;
    }
    if (TEXT_FIELDS.test(path)) {
      if (t !== '') setAt(input, path, t);
      continue;
    }
    if (t === '') continue;
    const r = parseFieldNumber(name, t, units);
    if (r.ok) setAt(input, path, r.value);
    else errors.push({ path: name, message: r.reason });
  }
  // the reading goes under the axle it was taken on
  const lifts = (input.lifts as Array<Record<string, unknown> | undefined> | undefined) ?? [];
  for (const i of listIndices(values, 'lift.lifts')) {
    const l = (lifts[i] ??= {});
    const reading = l.reading_kg;
    delete l.reading_kg;
    const axle = readAxle[i] === 'rear' ? 'rear' : readAxle[i] === 'front' ? 'front' : l.raised_axle === 'front' ? 'rear' : 'front';
    if (reading !== undefined) l[`${axle}_axle_kg`] = reading;
  }
  if (lifts.length > 0) input.lifts = Array.from(lifts, (l) => l ?? {});
  const r = readAxleLift(input);
  if (r.ok && errors.length === 0) return { ok: true, input: r.input };
  const seen = new Set(errors.map((e) => e.path));
  const more = r.ok
    ? []
    : r.errors
        .map((e) => ({ path: formPathOf(e.path), message: e.message.replace(/\(normally (front|rear)_axle_kg, the axle that stays down\)/, '(normally the $1 axle, which stays down)').replace(/\b(front|rear)_axle_kg\b/g, 'the reading').replace(/lift_height_m or lift_angle_deg/g, 'a lift height or a lift angle') }))
        .filter((e) => !seen.has(e.path))
        .map((e) => withShownRange(e, units));
  return { ok: false, errors: [...errors, ...more] };
}

/** A `lockstep-axle-lift/1` file -> lift fields in the given unit system (for "paste a file"). */
export function liftFileToValues(file: AxleLiftFile, units: UnitSystem): FormValues {
  const { format: _f, name: _n, notes: _t, lifts, ...rest } = file;
  const values = designToValues(rest, units);
  const out: FormValues = {};
  // after a unit conversion the shown values keep 6 significant digits: far below a scale step or a tape's reading
  for (const [k, v] of Object.entries(values)) if (!k.startsWith('_')) out[LIFT_PREFIX + k] = v;
  lifts.forEach((l, i) => {
    const p = `lift.lifts[${i}]`;
    const read = l.front_axle_kg !== undefined ? 'front' : 'rear';
    out[`${p}.raised_axle`] = l.raised_axle;
    out[`${p}.read_axle`] = read;
    out[`${p}.lift_height_m`] = l.lift_height_m === undefined ? '' : formatFieldNumber(`${p}.lift_height_m`, l.lift_height_m, units);
    out[`${p}.lift_angle_deg`] = l.lift_angle_deg === undefined ? '' : String(l.lift_angle_deg);
    out[`${p}.reading_kg`] = formatFieldNumber(`${p}.reading_kg`, (l.front_axle_kg ?? l.rear_axle_kg)!, units);
  });
  return out;
}

/** Lift fields typed in one unit system, shown in another. */
export function convertLiftValues(values: FormValues, from: UnitSystem, to: UnitSystem): FormValues {
  const out = convertValues(values, from, to);
  delete out._exact;
  return out;
}

// ---- apply to a load state -----------------------------------------------------------------------

export const CG_LIFT_OP = 'cglift:apply:';

/** `_op` value of the "Apply to load state" button: SI metres, rounded to 0.1 mm. */
export function cgLiftOp(loadStateId: string, heightM: number, uncertaintyM: number): string {
  const r = (x: number) => Math.round(x * 1e4) / 1e4;
  return `${CG_LIFT_OP}${loadStateId}=${r(heightM)},${r(uncertaintyM)}`;
}

/** The load states of a posted design form: index, id, label and (when entered and readable) the mass in kg. */
export function loadStatesOf(values: FormValues, units: UnitSystem = 'metric'): Array<{ index: number; id: string; label: string; massKg: number | null }> {
  return listIndices(values, 'load_states').map((i) => {
    const name = `load_states[${i}].mass_kg`;
    const text = (values[name] ?? '').trim();
    const mass = text === '' ? null : parseFieldNumber(name, text, units);
    return {
      index: i,
      id: values[`load_states[${i}].id`] ?? '',
      label: values[`load_states[${i}].label`] ?? values[`load_states[${i}].id`] ?? `Load state ${i + 1}`,
      massKg: mass && mass.ok ? mass.value : null,
    };
  });
}

/** Writes a measured CG height and its uncertainty into the load state with that id (form values, page units). */
export function applyCgLiftOp(values: FormValues, op: string, units: UnitSystem): FormValues {
  const m = /^cglift:apply:(.+)=([0-9.eE+-]+),([0-9.eE+-]+)$/.exec(op);
  const h = m ? Number(m[2]) : NaN;
  const u = m ? Number(m[3]) : NaN;
  if (!m || !Number.isFinite(h) || !Number.isFinite(u)) throw formErrors.unknownOperation(op);
  const state = loadStatesOf(values).find((s) => s.id === m[1]);
  if (!state) {
    throw formErrors.badRequest(`Load state "${m[1]!.slice(0, 60)}" is no longer in the design. Compute the CG height again and choose one of the load states listed.`);
  }
  const p = `load_states[${state.index}]`;
  const out: FormValues = { ...values };
  let exact: Record<string, [string, number]> = {};
  try {
    const e = values._exact ? parseHiddenJson(values._exact) : {};
    exact = e !== null && typeof e === 'object' && !Array.isArray(e) ? (e as Record<string, [string, number]>) : {};
  } catch {
    exact = {};
  }
  for (const [key, v] of [['cg_height_m', h], ['cg_height_uncertainty_m', u]] as const) {
    const name = `${p}.${key}`;
    out[name] = formatFieldNumber(name, v, units);
    if (out[name] !== String(v)) exact[name] = [out[name]!, v];
    else delete exact[name];
  }
  if (Object.keys(exact).length > 0) out._exact = JSON.stringify(exact);
  out[`${p}.cg_height_derived_from`] = 'measured';
  // the height's source is the lift, recorded for the new value; an entry made for the former height is dropped
  const cgName = `${p}.cg_height_m`;
  try {
    const prov = values._provenance ? parseHiddenJson(values._provenance) : null;
    if (prov !== null && typeof prov === 'object' && !Array.isArray(prov) && Object.hasOwn(prov, cgName)) {
      const rest = Object.fromEntries(Object.entries(prov).filter(([k]) => k !== cgName));
      out._provenance = JSON.stringify(rest);
    }
  } catch {
    /* a damaged hidden field only loses the provenance notes (as the form reader does) */
  }
  out[`${SOURCE_FIELD}${cgName}`] = 'measured';
  out[`${NOTE_FIELD}${cgName}`] = 'CG height measured by axle lift';
  const ov = listIndices(values, `${p}.overrides`);
  if (!ov.some((i) => values[`${p}.overrides[${i}]`] === 'cg_height_m')) out[`${p}.overrides[${ov.length === 0 ? 0 : ov.at(-1)! + 1}]`] = 'cg_height_m';
  return out;
}
