/**
 * The design file `lockstep-design/1`: the single source of truth for its shape and limits.
 * Types come from z.infer. Units are those in the key names (see docs/design-file.md).
 */
import { z } from 'zod';

/** Words for a value a person typed, in an error message. */
export function describeValue(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : 'a non-finite number';
  if (typeof v === 'string') return JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v);
  if (Array.isArray(v)) return 'a list';
  if (v === null) return 'null';
  return typeof v === 'object' ? 'an object' : String(v);
}

/**
 * A finite number within hard limits. Every message names the value given and the allowed range;
 * the path and unit are added where issues are formatted (core/validate.ts).
 */
function bounded(min: number, max: number, openBelow: boolean) {
  const range = openBelow ? `above ${min} and at most ${max}` : `from ${min} to ${max}`;
  const base = z.number({
    error: (iss) =>
      iss.input === undefined
        ? `is required (a number ${range})`
        : `${describeValue(iss.input)} is not a number (allowed: ${range})`,
  });
  const lower = openBelow
    ? base.gt(min, { error: (iss) => `${describeValue(iss.input)} is not ${range}` })
    : base.min(min, { error: (iss) => `${describeValue(iss.input)} is below the allowed range, ${range}` });
  return lower.max(max, { error: (iss) => `${describeValue(iss.input)} is above the allowed range, ${range}` });
}
const num = (min: number, max: number) => bounded(min, max, false);
/** As num, but the lower limit itself is not allowed. */
const numAbove = (min: number, max: number) => bounded(min, max, true);

export const VEHICLE_CATEGORIES = ['M1', 'M2', 'M3', 'N1', 'N2', 'N3'] as const;
export const PROVENANCE_SOURCES = ['measured', 'maker', 'donor', 'assumed'] as const;

export const Vehicle = z.strictObject({
  category: z.enum(VEHICLE_CATEGORIES),
  wheelbase_m: num(0.5, 10),
  abs: z.boolean(),
  drive: z.enum(['front', 'rear', 'all']),
});

export const LoadState = z.strictObject({
  id: z.string().regex(/^[A-Za-z0-9_-]{1,40}$/, {
    error: 'must be 1 to 40 letters, digits, "_" or "-"',
  }),
  label: z.string().min(1).max(200),
  kind: z.enum(['unladen', 'laden', 'other']),
  mass_kg: num(50, 60000),
  front_axle_kg: numAbove(0, 60000),
  cg_height_m: numAbove(0, 10),
});

export const DiscBrake = z.strictObject({
  type: z.literal('disc'),
  caliper: z.enum(['sliding', 'fixed']),
  piston_diameters_mm: z.array(num(10, 120)).min(1).max(8),
  effective_radius_m: num(0.03, 0.5),
  pad_friction: num(0.05, 1.2),
  threshold_pressure_bar: num(0, 30),
});

export const DrumBrake = z.strictObject({
  type: z.literal('drum'),
  wheel_cylinder_diameter_mm: num(10, 60),
  drum_radius_m: num(0.05, 0.5),
  brake_factor: num(0.3, 15),
  threshold_pressure_bar: num(0, 30),
});

export const Brake = z.discriminatedUnion('type', [DiscBrake, DrumBrake]);

export const Axle = z.strictObject({
  tyre_radius_m: num(0.1, 1.5),
  brake: Brake,
});

export const RearValve = z.discriminatedUnion('type', [
  z.strictObject({ type: z.literal('none') }),
  z.strictObject({ type: z.literal('limiting'), knee_bar: numAbove(0, 300) }),
  z.strictObject({ type: z.literal('proportioning'), knee_bar: numAbove(0, 300), ratio: numAbove(0, 1) }),
  z.strictObject({
    type: z.literal('load_sensing'),
    ratio: numAbove(0, 1),
    knee_bar_at_rear_axle_kg: z.array(z.tuple([numAbove(0, 60000), numAbove(0, 300)])).min(1).max(20),
  }),
]);

export const Hydraulics = z.strictObject({
  master_cylinder_bore_mm: num(10, 60),
  pedal_ratio: num(1, 12),
  booster_ratio: num(1, 20),
  booster_runout_bar: numAbove(0, 300).optional(),
  circuit_split: z.enum(['front_rear', 'diagonal']),
  rear_valve: RearValve,
});

export const Provenance = z.record(
  z.string().min(1).max(200),
  z.strictObject({ source: z.enum(PROVENANCE_SOURCES), note: z.string().max(2000).optional() }),
);

/** Keys of the design file proper. Later features add optional blocks here (see docs/design-file.md). */
export const designShape = {
  format: z.literal('lockstep-design/1'),
  name: z.string().min(1).max(200),
  notes: z.string().max(20000).optional(),
  vehicle: Vehicle,
  load_states: z.array(LoadState).min(1).max(8),
  axles: z.strictObject({ front: Axle, rear: Axle }),
  hydraulics: Hydraulics,
  adhesion_coefficients: z.array(num(0.05, 1.5)).min(1).max(20).optional(),
  provenance: Provenance.optional(),
};

/** Cross-field rules: each issue lands on the field a person has to change. */
export const DesignFile = z.strictObject(designShape).superRefine((d, ctx) => {
  const seen = new Map<string, number>();
  d.load_states.forEach((s, i) => {
    if (s.front_axle_kg >= s.mass_kg) {
      ctx.addIssue({
        code: 'custom',
        path: ['load_states', i, 'front_axle_kg'],
        message: `${s.front_axle_kg} is not below mass_kg ${s.mass_kg} (the front axle load must be between 0 and the vehicle mass)`,
      });
    }
    if (s.cg_height_m >= d.vehicle.wheelbase_m) {
      ctx.addIssue({
        code: 'custom',
        path: ['load_states', i, 'cg_height_m'],
        message: `${s.cg_height_m} is not below the wheelbase ${d.vehicle.wheelbase_m} m (CG height must be above 0 and below the wheelbase)`,
      });
    }
    const first = seen.get(s.id);
    if (first !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['load_states', i, 'id'],
        message: `"${s.id}" is used already by load_states[${first}] (ids must be unique)`,
      });
    } else seen.set(s.id, i);
  });
  const v = d.hydraulics.rear_valve;
  if (v.type === 'load_sensing') {
    const t = v.knee_bar_at_rear_axle_kg;
    for (let i = 1; i < t.length; i++) {
      if (t[i]![0] <= t[i - 1]![0]) {
        ctx.addIssue({
          code: 'custom',
          path: ['hydraulics', 'rear_valve', 'knee_bar_at_rear_axle_kg', i, 0],
          message: `${t[i]![0]} is not above the previous rear axle load ${t[i - 1]![0]} kg (the table must be sorted by rear axle load, ascending, without repeats)`,
        });
      }
    }
  }
  const adh = d.adhesion_coefficients;
  if (adh) {
    const dup = adh.findIndex((k, i) => adh.indexOf(k) !== i);
    if (dup >= 0) {
      ctx.addIssue({
        code: 'custom',
        path: ['adhesion_coefficients', dup],
        message: `${adh[dup]} is listed twice (each surface once)`,
      });
    }
  }
});

export type DesignFile = z.infer<typeof DesignFile>;
export type LoadState = z.infer<typeof LoadState>;
export type Brake = z.infer<typeof Brake>;
export type DiscBrake = z.infer<typeof DiscBrake>;
export type DrumBrake = z.infer<typeof DrumBrake>;
export type RearValve = z.infer<typeof RearValve>;
export type Hydraulics = z.infer<typeof Hydraulics>;
export type Vehicle = z.infer<typeof Vehicle>;
