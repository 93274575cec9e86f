/**
 * Looking up the quantity table (core/field-registry.ts) of the design file and the axle-lift file by field
 * path: `fieldMeta('load_states[1].mass_kg')` gives { quantity: 'mass', unit: 'kg', label: 'Vehicle mass' }.
 * Paths are written as in the file (dots and [index], a record key as ["key"]) or given as key lists. Every
 * reader of units (validation messages, the diff, the form, the generated docs, the evidence packet) asks here
 * instead of reading key suffixes.
 */
import { AxleLiftFile } from './axle-lift-file.ts';
import { DesignFile } from './design.ts';
import { type FieldMeta, fieldMetaIn, type PathKey } from './field-registry.ts';
import type { Quantity } from './units.ts';

const designCache = new Map<string, FieldMeta | null>();

/** Quantity, file unit and label of a design-file field, e.g. `axles.rear.brake.piston_diameters_mm[0]`; null when none. */
export function fieldMeta(path: string | readonly PathKey[]): FieldMeta | null {
  const key = typeof path === 'string' ? path : JSON.stringify(path);
  let m = designCache.get(key);
  if (m === undefined) {
    m = fieldMetaIn(DesignFile, path);
    if (designCache.size >= 5000) designCache.clear();
    designCache.set(key, m);
  }
  return m;
}

/** The quantity of a design-file field, or null for a field that is no number. */
export function quantityOfPath(path: string | readonly PathKey[]): Quantity | null {
  return fieldMeta(path)?.quantity ?? null;
}

/** Quantity, file unit and label of an axle-lift file field (`lifts[0].lift_height_m`); null when none. */
export function axleLiftFieldMeta(path: string | readonly PathKey[]): FieldMeta | null {
  return fieldMetaIn(AxleLiftFile, path);
}

