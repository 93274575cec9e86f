/**
 * The quantity table of the input files: every numeric field of a schema (design file, axle-lift file) is
 * registered here once with its quantity, the unit the file stores it in and a label for people. Validation
 * messages, the form, the diff, the generated docs and the evidence packet read it (core/field-meta.ts looks a
 * field up by its path); test/core/field-meta.test.ts fails when a numeric leaf of a schema has none.
 */
import { z } from 'zod';
import type { Quantity, Unit } from './units.ts';

export interface FieldMeta {
  quantity: Quantity;
  /** Unit of the value in the file ('1' for a plain number). */
  unit: Unit;
  /** What the field is, in words for people, e.g. "Wheelbase", "Knee pressure" (sentence case, no unit). */
  label: string;
}

/** Schema instance → its quantity, file unit and label. Kept apart from z.globalRegistry, so the JSON Schema output stays as it is. */
export const FIELD_META = z.registry<FieldMeta>();

/** Registers a numeric schema with its quantity, file unit and label; returns the same schema. */
export function withField<S extends z.ZodType>(schema: S, meta: FieldMeta): S {
  FIELD_META.add(schema, meta);
  return schema;
}

export type PathKey = string | number;

type Def = { type: string; [k: string]: unknown };
const defOf = (s: unknown): Def => (s as { _zod: { def: Def } })._zod.def;
const WRAPPERS = new Set(['optional', 'nullable', 'default', 'readonly', 'catch', 'nonoptional', 'prefault']);

/** The schema under wrappers (optional, default, pipe input, lazy). */
function unwrap(schema: z.ZodType): z.ZodType {
  let s = schema;
  for (;;) {
    const d = defOf(s);
    if (WRAPPERS.has(d.type)) s = d.innerType as z.ZodType;
    else if (d.type === 'pipe') s = d.in as z.ZodType;
    else if (d.type === 'lazy') s = (d.getter as () => z.ZodType)();
    else return s;
  }
}

/** Keys of a path written as in the file: `a.b[2].c`, `provenance["axles.rear.brake.brake_factor"].source`. */
export function parsePath(path: string): PathKey[] {
  const out: PathKey[] = [];
  const re = /\["((?:[^"\\]|\\.)*)"\]|\[(\d+)\]|([^.[\]]+)/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(path)) !== null) {
    if (m[1] !== undefined) out.push(JSON.parse(`"${m[1]}"`) as string);
    else if (m[2] !== undefined) out.push(Number(m[2]));
    else out.push(m[3]!);
  }
  return out;
}

/** The leaf schema at a path, or null when the path is not in the schema. */
export function schemaAt(schema: z.ZodType, path: readonly PathKey[]): z.ZodType | null {
  const s = unwrap(schema);
  if (path.length === 0) return s;
  const d = defOf(s);
  const [k, ...rest] = path as [PathKey, ...PathKey[]];
  switch (d.type) {
    case 'union':
      for (const o of d.options as z.ZodType[]) {
        const r = schemaAt(o, path);
        if (r) return r;
      }
      return null;
    case 'object': {
      const shape = d.shape as Record<string, z.ZodType>;
      return typeof k === 'string' && Object.hasOwn(shape, k) ? schemaAt(shape[k]!, rest) : null;
    }
    case 'array':
      return typeof k === 'number' ? schemaAt(d.element as z.ZodType, rest) : null;
    case 'tuple': {
      if (typeof k !== 'number') return null;
      const item = (d.items as z.ZodType[])[k] ?? (d.rest as z.ZodType | null);
      return item ? schemaAt(item, rest) : null;
    }
    case 'record':
      return typeof k === 'string' ? schemaAt(d.valueType as z.ZodType, rest) : null;
    default:
      return null;
  }
}

/** Quantity, file unit and label of the numeric field at a path of a schema; null when it is not a registered number. */
export function fieldMetaIn(schema: z.ZodType, path: string | readonly PathKey[]): FieldMeta | null {
  const leaf = schemaAt(schema, typeof path === 'string' ? parsePath(path) : path);
  return leaf ? (FIELD_META.get(leaf) ?? null) : null;
}

export interface NumericLeaf {
  /** Path pattern: `[]` for any list entry, `[i]` for a member of a fixed pair, `.<key>` for a record key. */
  path: string;
  meta: FieldMeta | null;
}

/** Every numeric leaf of a schema (through objects, lists, pairs, unions and records) with its registered metadata. */
export function numericLeaves(schema: z.ZodType): NumericLeaf[] {
  const out: NumericLeaf[] = [];
  const seen = new Set<z.ZodType>();
  const join = (base: string, k: string) => (base === '' ? k : `${base}.${k}`);
  const walk = (raw: z.ZodType, path: string): void => {
    const s = unwrap(raw);
    const d = defOf(s);
    switch (d.type) {
      case 'number':
      case 'int':
      case 'bigint':
        out.push({ path, meta: FIELD_META.get(s) ?? null });
        return;
      case 'literal':
        if ((d.values as unknown[]).some((v) => typeof v === 'number')) out.push({ path, meta: FIELD_META.get(s) ?? null });
        return;
      case 'union':
        for (const o of d.options as z.ZodType[]) walk(o, path);
        return;
      case 'object':
        if (seen.has(s)) return;
        seen.add(s);
        for (const [k, v] of Object.entries(d.shape as Record<string, z.ZodType>)) walk(v, join(path, k));
        seen.delete(s);
        return;
      case 'array':
        walk(d.element as z.ZodType, `${path}[]`);
        return;
      case 'tuple':
        (d.items as z.ZodType[]).forEach((it, i) => walk(it, `${path}[${i}]`));
        if (d.rest) walk(d.rest as z.ZodType, `${path}[]`);
        return;
      case 'record':
        walk(d.valueType as z.ZodType, join(path, '<key>'));
        return;
      default:
        return;
    }
  };
  walk(schema, '');
  return out;
}

/** Shorthands for the common field kinds, so each field names its quantity, unit and label in one short call. */
export const mass = (label: string): FieldMeta => ({ quantity: 'mass', unit: 'kg', label });
export const length = (label: string): FieldMeta => ({ quantity: 'length', unit: 'm', label });
export const shortLength = (label: string): FieldMeta => ({ quantity: 'short_length', unit: 'mm', label });
export const pressure = (label: string): FieldMeta => ({ quantity: 'pressure', unit: 'bar', label });
export const force = (label: string): FieldMeta => ({ quantity: 'force', unit: 'N', label });
export const speed = (label: string): FieldMeta => ({ quantity: 'speed', unit: 'km/h', label });
export const time = (label: string): FieldMeta => ({ quantity: 'time', unit: 's', label });
export const angle = (label: string): FieldMeta => ({ quantity: 'angle', unit: 'deg', label });
export const ratio = (label: string): FieldMeta => ({ quantity: 'ratio', unit: '1', label });
export const percent = (label: string): FieldMeta => ({ quantity: 'percentage', unit: '%', label });
export const temperature = (label: string): FieldMeta => ({ quantity: 'temperature', unit: 'degC', label });
