/**
 * The shape of one rear-valve type (core/valves/<type>.ts): its design-file schema, its pressure law, how it can
 * fail, its words for people, the form's start values and input fields. core/valves/index.ts lists the types; a
 * new valve type is its own module and one line there.
 */
import type { z } from 'zod';
import type { ValveLaw } from './valve-law.ts';

/** A failed state of a valve for the distribution-device failure check (core/valve-failure.ts). */
export interface FailedState<M extends string = string> {
  mode: M;
  description: string;
  law: ValveLaw;
  /** The rear line is shut (rear gain 0). */
  rearBlocked: boolean;
}

/** A problem across the fields of a valve, at a path inside `hydraulics.rear_valve`. */
export interface ValveIssue {
  path: (string | number)[];
  message: string;
}

/** An input of the valve in the workbench form, in the order shown; labels of numbers come from the quantity table. */
export type ValveInput =
  | { kind: 'number'; key: string; hint: string }
  | { kind: 'choice'; key: string; label: string; hint: string; options: ReadonlyArray<readonly [value: string, text: string]> }
  | { kind: 'table'; key: string; legend: string; hint: string; maxRows: number };

export interface ValveFamily<V extends { type: string } = { type: string }, M extends string = string> {
  type: V['type'];
  /** The design-file object of this valve type (a strict object with `type` as its literal). */
  schema: z.ZodType<V>;
  /** Name for people, e.g. "proportioning valve". */
  name: string;
  /** One line on what the valve does (the form's choice text). */
  description: string;
  /** Reduced to its law for one load state, with the rear static axle load in kg. */
  law(valve: V, rearStaticKg: number): ValveLaw;
  /** The failure modes it can have, with their words. */
  failureModes: ReadonlyArray<{ mode: M; description: string }>;
  /** Its failed states (one per failure mode). */
  failures(valve: V): FailedState<M>[];
  /** Rules across its fields (checked with the whole design file, after every field is valid). */
  issues?(valve: V): ValveIssue[];
  /** Which of its settings the sizing tolerances move (core/sizing/sizing-schema.ts `valve_knee_pct`, `valve_ratio_pct`). */
  tolerances: { knee: boolean; ratio: boolean };
  /** Starting values of the form when a person picks this type (design-file keys and units). */
  start: Readonly<Record<string, number>>;
  /** The form's inputs for this type. */
  inputs: readonly ValveInput[];
}

/** Declares a valve type, keeping its own types (valve object and failure-mode codes). */
export function defineValve<V extends { type: string }, M extends string>(family: ValveFamily<V, M>): ValveFamily<V, M> {
  return family;
}
