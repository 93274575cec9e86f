/**
 * Where an input value came from (the `provenance` block of a design file), true by construction:
 * an entry names the field (its path, e.g. `axles.rear.brake.pad_friction`) and records the value it was
 * given for. When the value in the design is no longer the one recorded (typed over on the page, changed by
 * an upload or in the file), the entry no longer speaks for it: the input reads "source not stated" and is
 * flagged. An entry without a recorded value (files written before values were recorded) is shown with a
 * flag asking to confirm it. Figures that come out of the mass build-up or an axle-lift weighing say so
 * whatever an entry claims. Pure: reads the design and the load-state results only.
 */
import { z } from 'zod';
import { withField } from './field-registry.ts';

export const PROVENANCE_SOURCES = ['measured', 'maker', 'donor', 'calculated', 'assumed'] as const;
export type ProvenanceSource = (typeof PROVENANCE_SOURCES)[number];

export const ProvenanceEntry = z.strictObject({
  source: z.enum(PROVENANCE_SOURCES),
  note: z.string().max(2000).optional(),
  /** The value the source was stated for, as it stood in the design then (number, text or yes/no). */
  value: z
    .union([withField(z.number(), { quantity: 'ratio', unit: '1', label: 'Value the source was stated for, in the unit of its field' }), z.string().max(200), z.boolean()])
    .optional(),
});
export type ProvenanceEntry = z.infer<typeof ProvenanceEntry>;

export const Provenance = z.record(z.string().min(1).max(200), ProvenanceEntry);

/** How an input's source reads in the packet and on the page. */
export type ProvenanceState =
  /** An entry recorded for this very value. */
  | 'recorded'
  /** An entry recorded for another value: the value was changed since; its source is not stated. */
  | 'changed'
  /** An entry that does not record its value: it may belong to an earlier value; confirm it. */
  | 'unconfirmed'
  /** Computed by the mass build-up. */
  | 'build_up'
  /** Measured by weighing with one axle lifted (CG height). */
  | 'axle_lift'
  | 'not_stated';

export interface InputSource {
  state: ProvenanceState;
  /** The stated source, when it still applies (recorded or unconfirmed); calculated for build-up and axle lift. */
  source: ProvenanceSource | null;
  note: string;
  /** The value the entry was recorded for (changed entries). */
  recorded_value: number | string | boolean | null;
}

/** How the load-state figures were derived (the evaluation's load-state results carry this). */
export interface DerivedFigures {
  derived_from?: string;
  cg_height_derived_from?: string;
}

const STATE_FIGURE = /^load_states\[(\d+)\]\.(mass_kg|front_axle_kg|cg_height_m)$/;

function derivedState(path: string, states: readonly DerivedFigures[]): 'build_up' | 'axle_lift' | null {
  const m = STATE_FIGURE.exec(path);
  if (!m) return null;
  const s = states[Number(m[1])];
  if (!s) return null;
  const from = m[2] === 'cg_height_m' ? s.cg_height_derived_from : s.derived_from;
  if (from === 'build_up') return 'build_up';
  // a CG height "measured" on a load state is the axle-lift result (core/axle-lift.ts)
  if (from === 'measured' && m[2] === 'cg_height_m') return 'axle_lift';
  return null;
}

function sameValue(a: unknown, b: unknown): boolean {
  if (typeof a === 'number' && typeof b === 'number') return a === b || Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a));
  return a === b;
}

/** The source of the input at `path` whose current value is `value`. */
export function inputSource(
  provenance: Readonly<Record<string, ProvenanceEntry>> | undefined,
  path: string,
  value: unknown,
  states: readonly DerivedFigures[] = [],
): InputSource {
  const derived = derivedState(path, states);
  const entry = provenance && Object.hasOwn(provenance, path) ? provenance[path] : undefined;
  if (derived) {
    const note = derived === 'build_up' ? 'from the mass build-up' : 'from the axle-lift weighings';
    return { state: derived, source: 'calculated', note, recorded_value: null };
  }
  if (!entry) return { state: 'not_stated', source: null, note: '', recorded_value: null };
  if (entry.value === undefined) return { state: 'unconfirmed', source: entry.source, note: entry.note ?? '', recorded_value: null };
  if (!sameValue(entry.value, value)) return { state: 'changed', source: null, note: '', recorded_value: entry.value };
  return { state: 'recorded', source: entry.source, note: entry.note ?? '', recorded_value: entry.value };
}

/** A provenance entry for the value as it stands now (the workbench and the file writer record it so). */
export function recordSource(source: ProvenanceSource, value: number | string | boolean, note?: string): ProvenanceEntry {
  return { source, value, ...(note ? { note } : {}) };
}
