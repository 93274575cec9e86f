/**
 * Reading a design: parse with the schema, turn zod issues into messages a person can act on,
 * and add warnings for values that are allowed but odd.
 */
import type { z } from 'zod';
import { resolveBuildUp } from './build-up.ts';
import { DesignFile, describeValue } from './design.ts';
import type { FieldIssue, Warning } from './field-issue.ts';
import { fieldMetaIn } from './field-registry.ts';
import { unitLabel } from './units.ts';

export type { FieldIssue, Warning } from './field-issue.ts';

export type DesignReading =
  | { ok: true; design: DesignFile; warnings: Warning[] }
  | { ok: false; errors: FieldIssue[] };

export function formatPath(path: ReadonlyArray<PropertyKey>): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else out += out === '' ? String(key) : `.${String(key)}`;
  }
  return out;
}

/** The unit of the numeric field at a path of a schema (the design file unless named), as written for people; "" for none. */
export function unitOfPath(path: ReadonlyArray<PropertyKey>, schema: z.ZodType = DesignFile): string {
  const keys = path.filter((k): k is string | number => typeof k === 'string' || typeof k === 'number');
  const meta = fieldMetaIn(schema, keys);
  return meta ? unitLabel(meta.unit) : '';
}

function valueAt(input: unknown, path: ReadonlyArray<PropertyKey>): unknown {
  let v: unknown = input;
  for (const k of path) {
    if (v === null || typeof v !== 'object') return undefined;
    v = (v as Record<PropertyKey, unknown>)[k];
  }
  return v;
}

/** One zod issue as a message that names the field, the value given and what is allowed. */
export function describeIssue(issue: z.core.$ZodIssue, input: unknown, schema: z.ZodType = DesignFile): FieldIssue {
  const path = formatPath(issue.path);
  const value = valueAt(input, issue.path);
  const unit = unitOfPath(issue.path, schema);
  let message: string;
  switch (issue.code) {
    case 'too_small':
    case 'too_big':
      if (issue.origin === 'array') {
        const n = Array.isArray(value) ? value.length : 0;
        message = issue.code === 'too_small'
          ? `has ${n} entries; at least ${String(issue.minimum)} needed`
          : `has ${n} entries; at most ${String(issue.maximum)} allowed`;
      } else if (issue.origin === 'string') {
        const n = typeof value === 'string' ? value.length : 0;
        message = issue.code === 'too_small'
          ? (n === 0 ? 'is empty; enter at least one character' : `is ${n} characters; at least ${String(issue.minimum)} needed`)
          : `is ${n} characters long; at most ${String(issue.maximum)} allowed`;
      } else message = issue.message + (unit ? ` ${unit}` : '');
      break;
    case 'invalid_type':
      if (issue.expected === 'number') message = issue.message + (unit ? ` ${unit}` : '');
      else if (value === undefined) message = `is required (${issue.expected === 'array' ? 'a list' : `${issue.expected === 'object' ? 'an object' : `a ${issue.expected}`}`})`;
      else message = `${describeValue(value)} is not ${issue.expected === 'array' ? 'a list' : issue.expected === 'object' ? 'an object' : `a ${issue.expected}`}`;
      break;
    case 'invalid_value':
      message = `${value === undefined ? 'is required' : `${describeValue(value)} is not allowed`}; use one of ${issue.values.map((v) => JSON.stringify(v)).join(', ')}`;
      break;
    case 'invalid_union': {
      const opts = (issue as { options?: unknown[] }).options;
      message = opts
        ? `${describeValue(value)} is not allowed; use one of ${opts.map((v) => JSON.stringify(v)).join(', ')}`
        : `${describeValue(value)} does not match any allowed form`;
      break;
    }
    case 'unrecognized_keys':
      return {
        path,
        message: `${path === '' ? 'the file' : 'this object'} has unknown key${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((k) => `"${k}"`).join(', ')} (check the spelling; see docs/design-file.md for the keys allowed)`,
      };
    case 'invalid_format':
      message = `${describeValue(value)} ${issue.message}`;
      break;
    default:
      message = issue.message;
  }
  return { path, message };
}

/** Values that are legal but unusual enough that an engineer should look twice. */
export function designWarnings(d: DesignFile): Warning[] {
  const w: Warning[] = [];
  const E = d.vehicle.wheelbase_m;
  d.load_states.forEach((s, i) => {
    if (s.cg_height_m > 0.45 * E) {
      w.push({
        code: 'WARN_CG_HIGH',
        path: `load_states[${i}].cg_height_m`,
        message: `CG height ${s.cg_height_m} m is over 0.45 of the wheelbase (${(0.45 * E).toFixed(3)} m); check the figure`,
      });
    }
  });
  (['front', 'rear'] as const).forEach((axle) => {
    const b = d.axles[axle].brake;
    if (b.type === 'disc' && b.pad_friction > 0.7) {
      w.push({
        code: 'WARN_PAD_FRICTION_HIGH',
        path: `axles.${axle}.brake.pad_friction`,
        message: `pad friction ${b.pad_friction} is above 0.7, unusual for road pads; check the maker's figure`,
      });
    }
    if (b.type === 'drum' && b.brake_factor > 8) {
      w.push({
        code: 'WARN_BRAKE_FACTOR_HIGH',
        path: `axles.${axle}.brake.brake_factor`,
        message: `brake factor ${b.brake_factor} is above 8, typical of duo-servo drums only and very sensitive to lining friction`,
      });
    }
  });
  const unladen = d.load_states.filter((s) => s.kind === 'unladen');
  const laden = d.load_states.filter((s) => s.kind === 'laden');
  if (unladen.length === 0) {
    w.push({ code: 'WARN_NO_UNLADEN', path: 'load_states', message: 'no load state of kind "unladen"; the regulation checks need one' });
  }
  if (laden.length === 0) {
    w.push({ code: 'WARN_NO_LADEN', path: 'load_states', message: 'no load state of kind "laden"; the regulation checks need one' });
  }
  for (const l of laden) {
    for (const u of unladen) {
      if (l.mass_kg < u.mass_kg) {
        const i = d.load_states.indexOf(l);
        w.push({
          code: 'WARN_LADEN_LIGHTER',
          path: `load_states[${i}].mass_kg`,
          message: `laden state "${l.id}" (${l.mass_kg} kg) is lighter than unladen state "${u.id}" (${u.mass_kg} kg)`,
        });
      }
    }
  }
  return w;
}

export function readDesign(input: unknown): DesignReading {
  // Load states that name `from_build_up` get their figures from the build-up first (core/build-up.ts).
  const pre = resolveBuildUp(input);
  const r = DesignFile.safeParse(pre.input);
  if (!r.success || pre.issues.length > 0) {
    const errors = r.success ? [] : r.error.issues.map((iss) => describeIssue(iss, pre.input)).filter((e) => !pre.suppress.includes(e.path));
    return { ok: false, errors: [...pre.issues, ...errors] };
  }
  return { ok: true, design: r.data, warnings: [...designWarnings(r.data), ...pre.warnings] };
}
