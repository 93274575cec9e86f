/**
 * Optional design-file blocks for the inspection cases of issue 18 (docs/design-file.md):
 *   `lightly_loaded`  the unloaded vehicle and the driver-and-instruments mass for the FMVSS 135
 *                     lightly loaded vehicle (a load state derived whenever the FMVSS rules are selected);
 *   `towing`          the trailer: its mass, braked or not, the nose load and where the hitch sits
 *                     (towing load state, combination gradient);
 *   `systems`         antilock (ABS), stability control (ESC) and electronic brake-force distribution
 *                     (EBD): fitted, retained from the base vehicle, not working or removed.
 * Each number carries its quantity, unit and label (core/field-registry.ts). Every block is optional; a design without them keeps its meaning.
 */
import { z } from 'zod';
import { boundedNumber as num, boundedNumberAbove as numAbove } from './bounded-number.ts';
import { length, mass } from './field-registry.ts';

/** Driver plus instruments added to the unloaded vehicle for the lightly loaded vehicle, kg (FMVSS 135, from memory). */
export const LIGHTLY_LOADED_ADDED_KG = 180;

export const LightlyLoaded = z
  .strictObject({
    unloaded_mass_kg: num(50, 60000, mass('Unloaded vehicle mass')),
    unloaded_front_axle_kg: numAbove(0, 60000, mass('Unloaded front axle load')),
    unloaded_cg_height_m: numAbove(0, 10, length('Unloaded CG height')),
    /** Driver and instruments, kg; default 180 (from memory). */
    added_mass_kg: num(0, 1000, mass('Driver and instruments')).optional(),
    /** Where that mass sits: distance behind the front axle (negative: ahead of it), m. */
    added_behind_front_axle_m: num(-3, 15, length('Driver and instruments, distance behind the front axle')),
    /** Height of its centre of gravity above the road, m. */
    added_height_m: numAbove(0, 5, length('Driver and instruments, height of the CG')),
  })
  .superRefine((b, ctx) => {
    if (b.unloaded_front_axle_kg >= b.unloaded_mass_kg) {
      ctx.addIssue({
        code: 'custom',
        path: ['unloaded_front_axle_kg'],
        message: `${b.unloaded_front_axle_kg} is not below unloaded_mass_kg ${b.unloaded_mass_kg} (the front axle load must be between 0 and the mass)`,
      });
    }
  });

export const Towing = z
  .strictObject({
    trailer_mass_kg: numAbove(0, 60000, mass('Trailer mass')),
    /** The trailer has its own (overrun or other) service brakes. */
    trailer_braked: z.boolean(),
    /** Static vertical load of the trailer on the hitch, kg. */
    nose_load_kg: num(0, 2000, mass('Nose load on the hitch')),
    /** Hitch (coupling point) behind the rear axle, m. */
    hitch_behind_rear_axle_m: num(0, 5, length('Hitch behind the rear axle')),
    /** Hitch height above the road, m; default: the towing vehicle's CG height (the stricter choice for the rear axle). */
    hitch_height_m: numAbove(0, 3, length('Hitch height')).optional(),
    /** Load state the nose load is added to (its id); default: the heaviest laden load state. */
    load_state: z.string().regex(/^[A-Za-z0-9_-]{1,40}$/, { error: 'must be 1 to 40 letters, digits, "_" or "-"' }).optional(),
  })
  .superRefine((t, ctx) => {
    if (t.nose_load_kg > t.trailer_mass_kg) {
      ctx.addIssue({
        code: 'custom',
        path: ['nose_load_kg'],
        message: `${t.nose_load_kg} is above trailer_mass_kg ${t.trailer_mass_kg} (the nose load is part of the trailer's mass)`,
      });
    }
  });

/**
 * Status of a driver-assistance braking system:
 *   not_fitted   never fitted;       fitted   fitted (new or original) and working;
 *   retained     kept from the base vehicle and working;
 *   not_working  fitted but not working (disabled, faulty, not adapted);   removed  removed by the conversion.
 */
export const SYSTEM_STATUSES = ['not_fitted', 'fitted', 'retained', 'not_working', 'removed'] as const;
export type SystemStatus = (typeof SYSTEM_STATUSES)[number];

export const Systems = z.strictObject({
  abs: z.enum(SYSTEM_STATUSES).optional(),
  esc: z.enum(SYSTEM_STATUSES).optional(),
  ebd: z.enum(SYSTEM_STATUSES).optional(),
});

export function systemWorks(s: SystemStatus | undefined): boolean {
  return s === 'fitted' || s === 'retained';
}

export type LightlyLoaded = z.infer<typeof LightlyLoaded>;
export type Towing = z.infer<typeof Towing>;
export type Systems = z.infer<typeof Systems>;

interface CasesInput {
  vehicle: { abs: boolean };
  load_states: readonly { id: string; kind: string }[];
  towing?: Towing;
  systems?: Systems;
}

/** Cross-field rules of these blocks (called from the design file's own superRefine). */
export function casesIssues(d: CasesInput, ctx: z.RefinementCtx): void {
  const abs = d.systems?.abs;
  if (abs !== undefined && systemWorks(abs) !== d.vehicle.abs) {
    ctx.addIssue({
      code: 'custom',
      path: ['systems', 'abs'],
      message: `"${abs}" does not agree with vehicle.abs ${d.vehicle.abs} (vehicle.abs is true exactly when antilock is "fitted" or "retained")`,
    });
  }
  const ebd = d.systems?.ebd;
  if (systemWorks(ebd) && !d.vehicle.abs) {
    ctx.addIssue({
      code: 'custom',
      path: ['systems', 'ebd'],
      message: `"${ebd}" needs working antilock (vehicle.abs true): electronic brake-force distribution works through the antilock modulator`,
    });
  }
  const id = d.towing?.load_state;
  if (id !== undefined && !d.load_states.some((s) => s.id === id)) {
    ctx.addIssue({
      code: 'custom',
      path: ['towing', 'load_state'],
      message: `"${id}" is not the id of a load state (known: ${d.load_states.map((s) => s.id).join(', ')})`,
    });
  }
}
