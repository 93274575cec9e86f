/**
 * The rear-valve types Lockstep knows, one module each (core/valves/<type>.ts, shaped as valve-family.ts). A new
 * valve type is its module and one entry in VALVE_FAMILIES (its schema joins the design file's `rear_valve`).
 * Here: the schema of `hydraulics.rear_valve`, and the law, failed states and cross-field issues of any valve.
 */
import { z } from 'zod';
import { LimitingValve, limitingValve } from './limiting.ts';
import { LoadSensingValve, loadSensingValve } from './load-sensing.ts';
import { NoValve, noValve } from './none.ts';
import { ProportioningValve, proportioningValve } from './proportioning.ts';
import { type FieldMeta, fieldMetaIn } from '../field-registry.ts';
import type { FailedState, ValveFamily, ValveIssue } from './valve-family.ts';
import type { ValveLaw } from './valve-law.ts';
import { coreErrors } from '../errors.ts';

export { LimitingValve, limitingValve } from './limiting.ts';
export { LoadSensingValve, loadSensingKneeBar, loadSensingValve } from './load-sensing.ts';
export { NoValve, noValve } from './none.ts';
export { ProportioningValve, proportioningValve } from './proportioning.ts';
export type { FailedState, ValveFamily, ValveInput, ValveIssue } from './valve-family.ts';
export { FULL_PRESSURE, masterPressureForRear, rearPressure, type ValveLaw } from './valve-law.ts';

/** Every valve type, in the order offered to people. */
export const VALVE_FAMILIES = [noValve, limitingValve, proportioningValve, loadSensingValve] as const;

export const RearValve = z.discriminatedUnion('type', [NoValve, LimitingValve, ProportioningValve, LoadSensingValve]);
export type RearValve = z.infer<typeof RearValve>;
export type RearValveType = RearValve['type'];

/** Every failure mode a rear valve can have. */
export type ValveFailureMode = (typeof VALVE_FAMILIES)[number]['failureModes'][number]['mode'];
export const VALVE_FAILURE_MODES: readonly { mode: ValveFailureMode; description: string }[] = [
  ...new Map(VALVE_FAMILIES.flatMap((f) => f.failureModes as readonly { mode: ValveFailureMode; description: string }[]).map((m) => [m.mode, m])).values(),
];

/** A failed valve for one load state: the valve law it follows and whether the rear line is shut. */
export type FailedValve = FailedState<ValveFailureMode>;

export const VALVE_TYPES: readonly RearValveType[] = VALVE_FAMILIES.map((f) => f.type);

/** The family of a valve type; undefined for a type Lockstep does not know (only possible for unchecked input). */
export function valveFamily(type: string): ValveFamily | undefined {
  return (VALVE_FAMILIES as readonly ValveFamily[]).find((f) => f.type === type);
}

/** The family of a checked valve (a valve of the design file always has one). */
export function rearValveFamily(valve: Pick<RearValve, 'type'>): ValveFamily<RearValve, ValveFailureMode> {
  const f = valveFamily(valve.type);
  if (!f) throw coreErrors.unknownValve(JSON.stringify(valve.type), VALVE_TYPES.join(', '));
  return f as unknown as ValveFamily<RearValve, ValveFailureMode>;
}

/** A valve reduced to its law for one load state, with the rear static axle load in kg. */
export function valveLaw(valve: RearValve, rearStaticKg: number): ValveLaw {
  return rearValveFamily(valve).law(valve, rearStaticKg);
}

/** The failed states of a rear valve (empty for "none"). */
export function failedValves(valve: RearValve): FailedValve[] {
  return rearValveFamily(valve).failures(valve);
}

/** Problems across the fields of a valve, at paths inside `hydraulics.rear_valve`. */
export function valveIssues(valve: RearValve): ValveIssue[] {
  return rearValveFamily(valve).issues?.(valve) ?? [];
}

export interface ValveSetting {
  /** Path of the number inside `hydraulics.rear_valve`, e.g. `knee_bar`, `knee_bar_at_rear_axle_kg[1][0]`. */
  path: string;
  /** The value in the design-file unit of its field. */
  value: number;
  /** Quantity, file unit and label of the field (core/field-registry.ts). */
  meta: FieldMeta;
}

/** The numbers that set a valve, in the order of its file object, each with its quantity, unit and label. */
export function valveSettings(valve: RearValve): ValveSetting[] {
  const out: ValveSetting[] = [];
  const walk = (v: unknown, path: (string | number)[]): void => {
    if (typeof v === 'number') {
      const meta = fieldMetaIn(RearValve, path);
      if (meta) out.push({ path: path.map((k, i) => (typeof k === 'number' ? `[${k}]` : i === 0 ? k : `.${k}`)).join(''), value: v, meta });
    } else if (Array.isArray(v)) v.forEach((x, i) => walk(x, [...path, i]));
    else if (v !== null && typeof v === 'object') for (const [k, x] of Object.entries(v)) walk(x, [...path, k]);
  };
  walk(valve, []);
  return out;
}
