/**
 * Field-level difference between two design files (or any two JSON values): one entry per leaf that
 * was changed, added or removed, with the field path as written in the file and its unit (core/field-meta.ts),
 * e.g. `axles.rear.brake.piston_diameters_mm[0]: 38 → 42 mm`. Numbers are compared in canonical form
 * (core/canonical-json.ts), so conversion noise is not a change. Arrays are compared element by element.
 */
import { canonicalNumber } from './canonical-json.ts';
import { fieldMeta } from './field-meta.ts';
import { unitLabel } from './units.ts';

export type DiffKind = 'changed' | 'added' | 'removed';

export interface DiffEntry {
  /** Field path, e.g. `load_states[1].mass_kg` or `provenance["axles.rear.brake.brake_factor"].source`. */
  path: string;
  kind: DiffKind;
  /** Value before (undefined when added); objects and lists are given whole. */
  before?: unknown;
  after?: unknown;
  /** Unit of the field as written for people ("" when none). */
  unit: string;
  /** One line for a person: `path: before → after unit`. */
  text: string;
}

type Key = string | number;

const IDENT = /^[A-Za-z_][A-Za-z0-9_]*$/;

export function diffPath(path: readonly Key[]): string {
  let out = '';
  for (const k of path) {
    if (typeof k === 'number') out += `[${k}]`;
    else if (IDENT.test(k)) out += out === '' ? k : `.${k}`;
    else out += `[${JSON.stringify(k)}]`;
  }
  return out;
}

/** The unit of a design-file field as written for people, from the quantity table; "" for a field without one. */
export function unitOfDiffPath(path: readonly Key[]): string {
  const meta = fieldMeta(path);
  return meta ? unitLabel(meta.unit) : '';
}

function show(v: unknown): string {
  if (v === undefined) return '(none)';
  if (typeof v === 'number') return Number.isFinite(v) ? canonicalNumber(v) : String(v);
  if (typeof v === 'string') return JSON.stringify(v.length > 80 ? `${v.slice(0, 80)}…` : v);
  if (Array.isArray(v)) return `[${v.map(show).join(', ')}]`;
  if (v !== null && typeof v === 'object') return `{${Object.keys(v).join(', ')}}`;
  return String(v);
}

function line(path: string, before: unknown, after: unknown, unit: string): string {
  const u = unit ? ` ${unit}` : '';
  const b = before === undefined ? '(none)' : `${show(before)}${typeof before === 'number' ? u : ''}`;
  const a = after === undefined ? '(none)' : `${show(after)}${typeof after === 'number' ? u : ''}`;
  // One unit at the end when both sides are numbers: "38 → 42 mm"
  if (typeof before === 'number' && typeof after === 'number') return `${path}: ${show(before)} → ${show(after)}${u}`;
  return `${path}: ${b} → ${a}`;
}

function isObject(v: unknown): v is Record<string, unknown> {
  return v !== null && typeof v === 'object' && !Array.isArray(v);
}

function same(a: unknown, b: unknown): boolean {
  if (typeof a === 'number' && typeof b === 'number') {
    if (!Number.isFinite(a) || !Number.isFinite(b)) return Object.is(a, b);
    return canonicalNumber(a) === canonicalNumber(b);
  }
  return a === b;
}

function walk(a: unknown, b: unknown, path: Key[], out: DiffEntry[]): void {
  if (a === undefined && b === undefined) return;
  // An added or removed block is listed field by field, like an edit of each of its fields.
  if ((isObject(a) || a === undefined) && (isObject(b) || b === undefined)) {
    const oa = a ?? {};
    const ob = b ?? {};
    const keys = [...new Set([...Object.keys(oa), ...Object.keys(ob)])].sort();
    for (const k of keys) walk(oa[k], ob[k], [...path, k], out);
    return;
  }
  if ((Array.isArray(a) || a === undefined) && (Array.isArray(b) || b === undefined)) {
    const la: unknown[] = a ?? [];
    const lb: unknown[] = b ?? [];
    for (let i = 0; i < Math.max(la.length, lb.length); i++) walk(la[i], lb[i], [...path, i], out);
    return;
  }
  if (same(a, b)) return;
  const p = diffPath(path);
  const unit = unitOfDiffPath(path);
  const kind: DiffKind = a === undefined ? 'added' : b === undefined ? 'removed' : 'changed';
  const e: DiffEntry = { path: p, kind, unit, text: line(p, a, b, unit) };
  if (a !== undefined) e.before = a;
  if (b !== undefined) e.after = b;
  out.push(e);
}

/** Every field that differs between `before` and `after`, in file order of sorted keys. */
export function designDiff(before: unknown, after: unknown): DiffEntry[] {
  const out: DiffEntry[] = [];
  walk(before, after, [], out);
  return out;
}
