/**
 * Optional design-file blocks for the hardware sanity checks (issue 9):
 *   `hardware`      fluid-volume and pedal-travel data per axle and for the tandem master cylinder;
 *   `base_vehicle`  what the vehicle was before the conversion (tyres, split, brake types, ABS, booster);
 *   `conversion`    facts about the conversion that practitioners get wrong (flags).
 * Every key is optional; a design without these blocks keeps its meaning. Each number carries its quantity, unit and label (core/field-registry.ts); the key names say the unit too
 * (`_mm`, `_mm3`, `_per_bar_mm3` = mm³ per bar, `_bar`, `_m`, `_pct`); docs/design-file.md lists them with defaults.
 */
import { z } from 'zod';
import { type FieldMeta, length, percent, pressure, shortLength, withField } from './field-registry.ts';

/** Words for a value a person typed (kept here so this module does not import design.ts, which imports it). */
function describeValue(v: unknown): string {
  if (v === undefined) return 'nothing';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : 'a non-finite number';
  if (typeof v === 'string') return JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v);
  return Array.isArray(v) ? 'a list' : v === null ? 'null' : typeof v;
}

/** A finite number from min to max; the message names the value and the range (units added in validate.ts). */
function quantity(min: number, max: number, meta: FieldMeta) {
  const range = `from ${min} to ${max}`;
  return withField(z
    .number({
      error: (iss) =>
        iss.input === undefined
          ? `is required (a number ${range})`
          : `${describeValue(iss.input)} is not a number (allowed: ${range})`,
    })
    .min(min, { error: (iss) => `${describeValue(iss.input)} is below the allowed range, ${range}` })
    .max(max, { error: (iss) => `${describeValue(iss.input)} is above the allowed range, ${range}` }), meta);
}

/** Fluid-volume data of one axle (both wheels together). */
export const AxleHardware = z.strictObject({
  /** Disc: piston travel from rest until the pads clamp the disc, per piston, mm. */
  running_clearance_mm: quantity(0, 3, shortLength('Running clearance per piston')).optional(),
  /** Disc: extra piston travel after pad knock-back (hub and bearing play pushing the piston back), mm. */
  knock_back_mm: quantity(0, 3, shortLength('Pad knock-back')).optional(),
  /** Drum: travel of each wheel-cylinder piston until its shoe touches the drum, mm. */
  shoe_travel_mm: quantity(0, 5, shortLength('Shoe travel to the drum')).optional(),
  /** Volume taken per bar by the hoses, pipes and caliper or drum elasticity of this axle, mm³/bar. */
  expansion_per_bar_mm3: quantity(0, 2000, { quantity: 'compliance', unit: 'mm3/bar', label: 'Volume taken per bar by hoses and calipers' }).optional(),
  /** Fluid held under pressure in this axle's part of the circuit (pipes, hoses, cylinders), mm³. */
  fluid_volume_mm3: quantity(0, 2_000_000, { quantity: 'volume', unit: 'mm3', label: 'Fluid volume under pressure' }).optional(),
});

export const MasterCylinderHardware = z.strictObject({
  /** Usable stroke of the primary (pushrod-side) piston, mm. */
  primary_stroke_mm: quantity(1, 60, shortLength('Primary piston stroke')).optional(),
  /** Usable stroke of the secondary (floating) piston, mm. */
  secondary_stroke_mm: quantity(1, 60, shortLength('Secondary piston stroke')).optional(),
  /** Piston travel before the compensating port closes and pressure can rise, per piston, mm. */
  dead_travel_mm: quantity(0, 10, shortLength('Dead travel before the port closes')).optional(),
  /** Front/rear split only: which axle the primary chamber feeds. */
  primary_feeds: z.enum(['front', 'rear']).optional(),
});

export const Hardware = z.strictObject({
  front: AxleHardware.optional(),
  rear: AxleHardware.optional(),
  /** Bulk modulus of the brake fluid as installed (air lowers it sharply), bar. Compressibility = 1 / this. */
  fluid_bulk_modulus_bar: quantity(500, 50_000, pressure('Bulk modulus of the fluid')).optional(),
  master_cylinder: MasterCylinderHardware.optional(),
  /** Pedal-pad travel from rest to the floor or the pedal stop, mm. */
  pedal_travel_available_mm: quantity(20, 400, shortLength('Pedal travel available')).optional(),
  /** Warn when the service test deceleration takes more than this share of the pedal travel, %. */
  pedal_travel_warn_pct: quantity(10, 100, percent('Pedal travel warning share')).optional(),
});

export const BRAKE_TYPES = ['disc', 'drum'] as const;

/** The vehicle before the conversion (all optional; each pitfall check uses what is given). */
export const BaseVehicle = z.strictObject({
  front_tyre_radius_m: quantity(0.1, 1.5, length('Base vehicle front tyre radius')).optional(),
  rear_tyre_radius_m: quantity(0.1, 1.5, length('Base vehicle rear tyre radius')).optional(),
  circuit_split: z.enum(['front_rear', 'diagonal']).optional(),
  front_brake_type: z.enum(BRAKE_TYPES).optional(),
  rear_brake_type: z.enum(BRAKE_TYPES).optional(),
  /** Antilock fitted on the base vehicle. */
  abs: z.boolean().optional(),
  /** Electronic stability control fitted on the base vehicle. */
  stability_control: z.boolean().optional(),
  /** Brake booster fitted on the base vehicle. */
  booster: z.boolean().optional(),
});

export const Conversion = z.strictObject({
  /** Front/rear bias adjuster: none fitted, fitted but locked/pinned, or adjustable from the driver's seat. */
  bias_adjuster: z.enum(['none', 'locked', 'driver_adjustable']).optional(),
  /** Stability control works in the converted vehicle (antilock: vehicle.abs). */
  stability_control_working: z.boolean().optional(),
  /** Suspension changed: helper springs, air assistance, lift or lowering. */
  suspension_modified: z.boolean().optional(),
  /** The master cylinder in use came from a drum-braked system. */
  master_cylinder_from_drum_system: z.boolean().optional(),
  /** The master cylinder was replaced when drums were changed to discs. */
  master_cylinder_replaced: z.boolean().optional(),
  /** Where the booster's vacuum (or power) comes from. */
  booster_source: z.enum(['engine_vacuum', 'electric_vacuum_pump', 'hydraulic_pump', 'electric_booster', 'none']).optional(),
  /** The combustion engine was removed (electric conversion). */
  engine_removed: z.boolean().optional(),
});

export type AxleHardware = z.infer<typeof AxleHardware>;
export type MasterCylinderHardware = z.infer<typeof MasterCylinderHardware>;
export type Hardware = z.infer<typeof Hardware>;
export type BaseVehicle = z.infer<typeof BaseVehicle>;
export type Conversion = z.infer<typeof Conversion>;
