/**
 * The gate every posted form passes before any of it is read. A form field's name is a design-file path
 * (form/design-form.ts), and names come from the network, so a name is refused unless it is a path the
 * design could have:
 * - no segment is `__proto__`, `constructor`, `prototype` or any other member of Object.prototype (such a key
 *   would reach the shared prototype, or a function where a value is expected);
 * - the name is written the one way the page writes it (`a.b[2].c`: no empty or negative parts, no leading zeros);
 * - where the design schema knows the path, a list position goes into a list and a named part into an object,
 *   and a position is below the list's own limit (at most 8 load states, ...). Elsewhere (names the schema does
 *   not know, which the schema reports as unknown keys, and the axle-lift tool's `lift.*` fields) a position is
 *   below DEFAULT_LIST_LIMIT. So no name can make the reader allocate more than a few entries.
 * Page controls (names starting with "_") are single words and are never turned into paths.
 */
import { z } from 'zod';
import { designShape, formatPath } from '../core/index.ts';
import { formErrors } from './errors.ts';

/** Keys that are never accepted: Object.prototype's own members as this module loads, and the special names. */
export const FORBIDDEN_KEYS: ReadonlySet<string> = new Set([...Object.getOwnPropertyNames(Object.prototype), '__proto__', 'constructor', 'prototype']);
/** Longest field name accepted (the longest the page writes is under 80 characters). */
export const MAX_FIELD_NAME = 200;
/** Most fields in one form (the demo's form has about 200). */
export const MAX_FIELDS = 5000;
/** Positions in a list the schema gives no limit for (and the axle-lift tool's rows): 0 to 63. */
export const DEFAULT_LIST_LIMIT = 64;

type Key = string | number;
type Def = { type: string; [k: string]: unknown };
const defOf = (s: unknown): Def => (s as { _zod: { def: Def } })._zod.def;
let designSchema: unknown = null;

function unwrap(d: Def): Def {
  for (;;) {
    if (['optional', 'nullable', 'default', 'readonly', 'catch', 'nonoptional', 'prefault'].includes(d.type)) d = defOf(d.innerType);
    else if (d.type === 'pipe') d = defOf(d.in);
    else if (d.type === 'lazy') d = defOf((d.getter as () => unknown)());
    else return d;
  }
}

function maxLength(d: Def): number {
  for (const c of (d.checks as Array<{ _zod: { def: { check: string; maximum?: number } } }> | undefined) ?? []) {
    const cd = c._zod.def;
    if (cd.check === 'max_length' && typeof cd.maximum === 'number') return cd.maximum;
  }
  return DEFAULT_LIST_LIMIT;
}

const outOfList = (where: string, n: number) => `${where} holds at most ${n} entr${n === 1 ? 'y' : 'ies'} (positions 0 to ${n - 1})`;

/** Why `path` (from `at` on) cannot be a path of the schema `def`, or null when it can. */
function pathProblem(def: Def | null, path: readonly Key[], at: number): string | null {
  let d = def;
  for (let i = at; i < path.length; i++) {
    const k = path[i]!;
    const where = formatPath(path.slice(0, i)) || 'the design';
    if (d === null) {
      // beyond what the schema knows: the schema reports the unknown key; only keep positions small
      if (typeof k === 'number' && k >= DEFAULT_LIST_LIMIT) return outOfList(where, DEFAULT_LIST_LIMIT);
      continue;
    }
    d = unwrap(d);
    if (d.type === 'union') {
      let first: string | null = null;
      for (const o of d.options as unknown[]) {
        const p = pathProblem(defOf(o), path, i);
        if (p === null) return null;
        first ??= p;
      }
      return first;
    }
    if (d.type === 'object' || d.type === 'record') {
      if (typeof k === 'number') return `${where} is a group of named inputs, not a list`;
      if (d.type === 'record') d = defOf(d.valueType);
      else {
        const shape = d.shape as Record<string, unknown>;
        d = Object.hasOwn(shape, k) ? defOf(shape[k]) : null;
      }
    } else if (d.type === 'array' || d.type === 'tuple') {
      if (typeof k !== 'number') return `${where} is a list; "${k.slice(0, 40)}" is not a position in it`;
      const n = d.type === 'array' ? maxLength(d) : d.rest ? DEFAULT_LIST_LIMIT : (d.items as unknown[]).length;
      if (k >= n) return outOfList(where, n);
      d = defOf(d.type === 'array' ? d.element : ((d.items as unknown[])[k] ?? d.rest));
    } else return `${where} is a single value and has no parts`;
  }
  return null;
}

/** The segments of a field name (`a.b[2]` -> ["a", "b", 2]), or null when it is not written as the page writes names. */
function segments(name: string): Key[] | null {
  const out: Key[] = [];
  const re = /([^.[\]]+)|\[(0|[1-9]\d{0,8})\]/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(name)) !== null) out.push(m[2] !== undefined ? Number(m[2]) : m[1]!);
  return out.length > 0 && typeof out[0] === 'string' && formatPath(out) === name ? out : null;
}

/** Answers by name: the same names come with every recompute. */
const answers = new Map<string, string | null>();

/** Why a posted field name is refused, or null when it may be read. */
export function fieldNameProblem(name: string): string | null {
  let a = answers.get(name);
  if (a === undefined) {
    a = findProblem(name);
    if (answers.size >= MAX_FIELDS) answers.clear();
    answers.set(name, a);
  }
  return a;
}

function findProblem(name: string): string | null {
  if (name.length > MAX_FIELD_NAME) return `the name is longer than ${MAX_FIELD_NAME} characters`;
  // the source select and note of an input (form/design-form.ts): the input's own name behind the prefix
  const src = /^_(src|srcnote):(?!_)/.exec(name);
  if (src) return findProblem(name.slice(src[0].length));
  if (name.startsWith('_')) return /^_[A-Za-z0-9_]+$/.test(name) && !FORBIDDEN_KEYS.has(name) ? null : 'not a control of the page';
  const path = segments(name);
  if (path === null) return 'not written as a field of the page (parts separated by dots, list positions as [0], [1], ...)';
  const bad = path.find((k) => typeof k === 'string' && FORBIDDEN_KEYS.has(k));
  if (bad !== undefined) return `"${bad}" is a reserved word and never the name of an input`;
  if (path[0] === 'lift') return pathProblem(null, path, 1); // the axle-lift tool (form/axle-lift-form.ts)
  designSchema ??= z.object(designShape);
  return pathProblem(defOf(designSchema), path, 0);
}

/** Throws APP_ERR_FIELD_NAME for the first name that cannot be read (or APP_ERR_TOO_MANY_FIELDS). */
export function checkFieldNames(names: readonly string[]): void {
  if (names.length > MAX_FIELDS) throw formErrors.tooManyFields(names.length, MAX_FIELDS);
  for (const n of names) {
    const why = fieldNameProblem(n);
    if (why !== null) throw formErrors.fieldName(n, why);
  }
}
