/**
 * Bounded numbers for every input schema (design file and its optional blocks, axle-lift file): each
 * message names the value given and the allowed range; the field path and unit are added where issues
 * are formatted (core/validate.ts). Each carries its quantity, file unit and label (core/field-registry.ts).
 */
import { z } from 'zod';
import { type FieldMeta, withField } from './field-registry.ts';

/** Words for a value a person typed, in an error message. */
export function describeValue(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : 'a non-finite number';
  if (typeof v === 'string') return JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v);
  if (Array.isArray(v)) return 'a list';
  if (v === null) return 'null';
  return typeof v === 'object' ? 'an object' : String(v);
}

function bounded(min: number, max: number, openBelow: boolean, meta: FieldMeta) {
  const range = openBelow ? `above ${min} and at most ${max}` : `from ${min} to ${max}`;
  const base = z.number({
    error: (iss) => (iss.input === undefined ? `is required: a number ${range}` : `${describeValue(iss.input)} is not a number; allowed: ${range}`),
  });
  const lower = openBelow
    ? base.gt(min, { error: (iss) => `${describeValue(iss.input)} is not ${range}` })
    : base.min(min, { error: (iss) => `${describeValue(iss.input)} is below the allowed range, ${range}` });
  return withField(lower.max(max, { error: (iss) => `${describeValue(iss.input)} is above the allowed range, ${range}` }), meta);
}

/** A finite number from min to max inclusive, with its quantity, file unit and label. */
export const boundedNumber = (min: number, max: number, meta: FieldMeta) => bounded(min, max, false, meta);
/** A finite number above min (exclusive) and at most max, with its quantity, file unit and label. */
export const boundedNumberAbove = (min: number, max: number, meta: FieldMeta) => bounded(min, max, true, meta);
