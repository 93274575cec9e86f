/**
 * The design file `lockstep-design/1`: the single source of truth for its shape and limits.
 * Types come from z.infer. Each number carries its quantity, file unit and label (core/field-registry.ts; docs/design-file.md).
 */
import { z } from 'zod';
import { boundedNumber, boundedNumberAbove, describeValue } from './bounded-number.ts';
import { force, length, mass, percent, pressure, ratio, shortLength, speed, temperature, time } from './field-registry.ts';
import { BaseVehicle, Conversion, Hardware } from './hardware-schema.ts';
import { SHOE_ARRANGEMENTS } from './drum-brake-factor.ts';
import { BuildUp, loadStateBuildUpShape, Ratings } from './build-up-schema.ts';
import { RULE_SELECTORS } from './rules/index.ts';
import { VEHICLE_CATEGORIES } from './rules/rule-types.ts';
import { BalanceBar, Tolerances } from './sizing/sizing-schema.ts';
import { casesIssues, LightlyLoaded, Systems, Towing } from './cases-schema.ts';
import { RearValve, valveIssues } from './valves/index.ts';
import { Provenance } from './provenance.ts';
import { TestResults } from './test-results-schema.ts';

export { RearValve };

export { describeValue, VEHICLE_CATEGORIES };

const num = boundedNumber;
/** As num, but the lower limit itself is not allowed. */
const numAbove = boundedNumberAbove;

export { Provenance, PROVENANCE_SOURCES } from './provenance.ts'; // each entry records the value it was stated for

export const Vehicle = z.strictObject({
  category: z.enum(VEHICLE_CATEGORIES),
  wheelbase_m: num(0.5, 10, length('Wheelbase')),
  abs: z.boolean(),
  drive: z.enum(['front', 'rear', 'all']),
});

export const LoadState = z.strictObject({
  id: z.string().regex(/^[A-Za-z0-9_-]{1,40}$/, {
    error: 'must be 1 to 40 letters, digits, "_" or "-"',
  }),
  label: z.string().min(1).max(200),
  kind: z.enum(['unladen', 'laden', 'other']),
  mass_kg: num(50, 60000, mass('Vehicle mass')),
  front_axle_kg: num(1, 60000, mass('Front axle load')), // lower limits keep every result finite (issue 12 point 9)
  cg_height_m: num(0.05, 10, length('CG height')),
  ...loadStateBuildUpShape, // optional: derived_from, from_build_up, overrides, cg_height_derived_from, cg_height_uncertainty_m
}).superRefine((s, ctx) => {
  // On the load state itself, so it is reported even when other parts of the file have problems too.
  if (s.front_axle_kg >= s.mass_kg) {
    ctx.addIssue({
      code: 'custom',
      path: ['front_axle_kg'],
      message: `${s.front_axle_kg} is not below mass_kg ${s.mass_kg} (the front axle load must be between 0 and the vehicle mass)`,
    });
  }
});

export const DiscBrake = z.strictObject({
  type: z.literal('disc'),
  caliper: z.enum(['sliding', 'fixed']),
  piston_diameters_mm: z.array(num(10, 120, shortLength('Piston diameter'))).min(1).max(8),
  effective_radius_m: num(0.03, 0.5, length('Effective disc radius')),
  pad_friction: num(0.05, 1.2, ratio('Pad friction coefficient')),
  threshold_pressure_bar: num(0, 30, pressure('Threshold pressure')),
});

export const DrumBrake = z.strictObject({
  type: z.literal('drum'),
  wheel_cylinder_diameter_mm: num(10, 60, shortLength('Wheel cylinder diameter')),
  drum_radius_m: num(0.05, 0.5, length('Drum radius')),
  brake_factor: num(0.3, 15, ratio('Brake factor')),
  threshold_pressure_bar: num(0, 30, pressure('Threshold pressure')),
  /** How the shoes are arranged: decides how the brake factor moves with lining friction (core/drum-brake-factor.ts). */
  shoe_arrangement: z.enum(SHOE_ARRANGEMENTS).optional(),
});

export const Brake = z.discriminatedUnion('type', [DiscBrake, DrumBrake]);

export const Axle = z.strictObject({
  tyre_radius_m: num(0.1, 1.5, length('Dynamic tyre radius')),
  brake: Brake,
});

export const Hydraulics = z.strictObject({
  master_cylinder_bore_mm: num(10, 60, shortLength('Master cylinder bore')),
  pedal_ratio: num(1, 12, ratio('Pedal ratio')),
  booster_ratio: num(1, 20, ratio('Booster ratio')),
  booster_runout_bar: numAbove(0, 300, pressure('Booster run-out pressure')).optional(),
  circuit_split: z.enum(['front_rear', 'diagonal']),
  rear_valve: RearValve,
  balance_bar: BalanceBar.optional(), // two master cylinders on a balance bar (core/sizing/sizing-schema.ts)
});

/** Who and what an evidence packet is for; printed literally on its cover (all free text, optional). */
export const Identification = z.strictObject({
  vehicle_identification_number: z.string().max(40).optional(),
  owner: z.string().max(200).optional(),
  modifier: z.string().max(200).optional(),
  approval_regime: z.string().max(200).optional(),
  approval_code: z.string().max(200).optional(),
  base_vehicle_make_model: z.string().max(200).optional(),
  conversion_description: z.string().max(2000).optional(),
});

/**
 * Limits at grip and heat (docs/design-file.md, "Optional blocks for the limits"): traction,
 * regenerative braking, stopping distance, brake heat and the roller brake tester. All optional.
 */
export const TractionOptions = z.strictObject({
  all_wheel_front_share: num(0, 1, ratio('Front share of the drive force')).optional(), // share of the drive force on the front axle; omitted: ideal split
  rolling_resistance: num(0, 0.1, ratio('Rolling-resistance coefficient')).optional(), // rolling-resistance coefficient, force / weight
});

export const RegenBlending = z.discriminatedUnion('type', [
  z.strictObject({ type: z.literal('regen_first') }),
  z.strictObject({ type: z.literal('fixed_proportion'), proportion: numAbove(0, 5, ratio('Regenerative to friction braking proportion')) }),
]);

export const Regen = z
  .strictObject({
    max_motor_torque_nm: numAbove(0, 20000, { quantity: 'torque', unit: 'N*m', label: 'Maximum motor torque' }),
    gear_ratio: num(1, 50, ratio('Gear ratio, motor to wheel')),
    max_power_kw: numAbove(0, 2000, { quantity: 'power', unit: 'kW', label: 'Maximum regenerative power' }),
    fade_start_kmh: num(0, 100, speed('Speed where regeneration starts to fade')).optional(),
    cutoff_kmh: num(0, 100, speed('Regeneration cut-off speed')).optional(),
    blending: RegenBlending,
    front_share: num(0, 1, ratio('Front share of the regenerative braking')).optional(),
    speeds_kmh: z.array(numAbove(0, 300, speed('Speed of a regeneration check'))).min(1).max(10).optional(),
    // R13-H regeneration category (core/checks/regen-category.ts): A not part of service braking, B part of it
    category: z.enum(['A', 'B']).optional(),
    abs_controls_regen_axle: z.boolean().optional(),
    failure_warning: z.boolean().optional(),
  })
  .superRefine((r, ctx) => {
    const fade = r.fade_start_kmh ?? 15;
    const cut = r.cutoff_kmh ?? 5;
    if (cut > fade) {
      ctx.addIssue({
        code: 'custom',
        path: ['cutoff_kmh'],
        message: `${cut} is above fade_start_kmh ${fade} (regeneration fades out from fade_start_kmh down to cutoff_kmh)`,
      });
    }
  });

export const StoppingOptions = z.strictObject({
  speeds_kmh: z.array(numAbove(0, 300, speed('Initial speed of a stop'))).min(1).max(10).optional(),
  reaction_time_s: num(0, 5, time('Reaction time')).optional(),
  build_up_time_s: num(0, 3, time('Brake build-up time')).optional(),
  abs_adhesion_factor: num(0.1, 1, ratio('Adhesion used with antilock')).optional(),
});

export const HeatOptions = z.strictObject({
  front_rotor_kg: num(0.5, 200, mass('Front rotor mass, each')),
  rear_rotor_kg: num(0.5, 200, mass('Rear rotor mass, each')),
  specific_heat_j_per_kg_k: num(100, 2000, { quantity: 'specific_heat', unit: 'J/(kg*K)', label: 'Specific heat of the rotor' }).optional(),
  heat_to_rotor_share: numAbove(0, 1, ratio('Share of the heat into the rotor')).optional(),
  cooling_coefficient_per_s: num(0, 1, { quantity: 'rate', unit: '1/s', label: 'Cooling coefficient' }).optional(),
  ambient_c: num(-40, 60, temperature('Ambient temperature')).optional(),
  rotating_energy_share: num(0, 0.5, ratio('Share of rotating energy')).optional(),
  max_speed_kmh: numAbove(0, 400, speed('Maximum speed')).optional(),
  stop_speed_kmh: numAbove(0, 300, speed('Speed at the end of a stop')).optional(),
  base_vehicle_mass_kg: num(50, 60000, mass('Base vehicle mass')).optional(),
  base_vehicle_front_axle_kg: numAbove(0, 60000, mass('Base vehicle front axle load')).optional(),
  // pad friction factor against rotor temperature for the hot stop (core/checks/hot-performance.ts)
  hot_friction_factor_at_c: z.array(z.tuple([num(-40, 1200, temperature('Rotor temperature')), num(0.1, 1.5, ratio('Pad friction factor'))])).min(1).max(12).optional(),
}).superRefine((h, ctx) => {
  const m = h.base_vehicle_mass_kg;
  const f = h.base_vehicle_front_axle_kg;
  if (f !== undefined && (m === undefined || f >= m)) {
    ctx.addIssue({
      code: 'custom',
      path: ['base_vehicle_front_axle_kg'],
      message:
        m === undefined
          ? `${f} needs base_vehicle_mass_kg beside it (the base vehicle's mass)`
          : `${f} is not below base_vehicle_mass_kg ${m} (the front axle load must be between 0 and the mass)`,
    });
  }
  const t = h.hot_friction_factor_at_c ?? [];
  for (let i = 1; i < t.length; i++) {
    if (t[i]![0] <= t[i - 1]![0]) {
      ctx.addIssue({ code: 'custom', path: ['hot_friction_factor_at_c', i, 0], message: `${t[i]![0]} is not above the previous temperature ${t[i - 1]![0]} °C (sorted by temperature, ascending, without repeats)` });
    }
  }
});

export const TesterOptions = z.strictObject({
  roller_adhesion: numAbove(0, 1.5, ratio('Roller adhesion coefficient')).optional(),
  test_mass_kg: num(50, 60000, mass('Test mass')).optional(),
  required_pct: num(1, 150, percent('Required braking force, share of the weight')).optional(),
  pedal_force_limit_n: numAbove(0, 3000, force('Pedal force limit')).optional(),
});

/**
 * Parking brake for the parking checks (core/checks/performance-check.ts): the braked axle, the
 * control, and either a declared holding force at the tyres or the mechanism (control force ×
 * lever_ratio × efficiency = total actuating force into the axle's two brakes; tyre force =
 * that × brake_factor × effective_radius_m / tyre radius). Without either only the adhesion is checked.
 */
export const ParkingBrake = z
  .strictObject({
    axle: z.enum(['front', 'rear']),
    control: z.enum(['hand', 'foot']),
    holding_force_n: numAbove(0, 500000, force('Holding force at the tyres')).optional(),
    control_force_n: numAbove(0, 2000, force('Control force')).optional(),
    lever_ratio: numAbove(0, 1000, ratio('Lever ratio')).optional(),
    efficiency: numAbove(0, 1, ratio('Mechanism efficiency')).optional(),
    brake_factor: num(0.3, 15, ratio('Parking brake factor')).optional(),
    effective_radius_m: num(0.03, 0.5, length('Effective radius of the parking brake')).optional(),
  })
  .superRefine((b, ctx) => {
    const mech = (['lever_ratio', 'efficiency', 'brake_factor', 'effective_radius_m'] as const).filter((k) => b[k] !== undefined);
    if (b.holding_force_n !== undefined && mech.length > 0) {
      ctx.addIssue({ code: 'custom', path: ['holding_force_n'], message: 'give either holding_force_n or the mechanism (lever_ratio, efficiency, brake_factor, effective_radius_m), not both' });
    } else if (mech.length > 0 && mech.length < 4) {
      for (const k of ['lever_ratio', 'efficiency', 'brake_factor', 'effective_radius_m'] as const) {
        if (b[k] === undefined) ctx.addIssue({ code: 'custom', path: [k], message: 'is required with the other mechanism keys (lever_ratio, efficiency, brake_factor, effective_radius_m)' });
      }
    }
  });

/** Keys of the design file proper. Later features add optional blocks here (see docs/design-file.md). */
export const designShape = {
  format: z.literal('lockstep-design/1'),
  name: z.string().min(1).max(200),
  notes: z.string().max(20000).optional(),
  vehicle: Vehicle,
  load_states: z.array(LoadState).min(1).max(8),
  axles: z.strictObject({ front: Axle, rear: Axle }),
  hydraulics: Hydraulics,
  adhesion_coefficients: z.array(num(0.05, 1.5, ratio('Adhesion coefficient'))).min(1).max(20).optional(),
  provenance: Provenance.optional(),
  traction: TractionOptions.optional(),
  regen: Regen.optional(),
  stopping: StoppingOptions.optional(),
  heat: HeatOptions.optional(),
  tester: TesterOptions.optional(),
  identification: Identification.optional(),
  hardware: Hardware.optional(),
  base_vehicle: BaseVehicle.optional(),
  conversion: Conversion.optional(),
  build_up: BuildUp.optional(),
  ratings: Ratings.optional(),
  rules: z.array(z.enum(RULE_SELECTORS as [string, ...string[]])).min(1).max(20).optional(),
  test_adhesion: num(0.05, 1.5, ratio('Test surface adhesion')).optional(),
  parking_brake: ParkingBrake.optional(),
  tolerances: Tolerances.optional(), // robustness analysis of the sizing assistant (core/sizing/sizing-schema.ts)
  lightly_loaded: LightlyLoaded.optional(), // FMVSS 135 lightly loaded vehicle (core/cases-schema.ts)
  towing: Towing.optional(), // trailer for the towing load state and the combination gradient
  systems: Systems.optional(), // ABS, ESC, EBD status
  test_results: TestResults.optional(), // measured brake-test results (core/test-results-schema.ts)
};

/** Cross-field rules: each issue lands on the field a person has to change. */
export const DesignFile = z.strictObject(designShape).superRefine((d, ctx) => {
  const seen = new Map<string, number>();
  d.load_states.forEach((s, i) => {
    // Compared only with a wheelbase inside its own range, so a bad wheelbase gives one message, not one per state.
    const E = d.vehicle.wheelbase_m;
    if (E >= 0.5 && E <= 10 && s.cg_height_m >= E) {
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
  // rules across the fields of the rear valve, from its type's module (core/valves/)
  for (const iss of valveIssues(d.hydraulics.rear_valve)) {
    ctx.addIssue({ code: 'custom', path: ['hydraulics', 'rear_valve', ...iss.path], message: iss.message });
  }
  for (const axle of ['front', 'rear'] as const) {
    const b = d.axles[axle].brake;
    // an opposed-piston caliper has the same pistons on both sides of the disc: an even count
    if (b.type === 'disc' && b.caliper === 'fixed' && b.piston_diameters_mm.length % 2 === 1) {
      ctx.addIssue({
        code: 'custom',
        path: ['axles', axle, 'brake', 'piston_diameters_mm'],
        message: `${b.piston_diameters_mm.length} pistons cannot make a fixed (opposed-piston) caliper: it has the same pistons on each side of the disc, so an even number (list every piston of both sides), or use "sliding"`,
      });
    }
  }
  if (d.hydraulics.balance_bar && d.hydraulics.circuit_split === 'diagonal') {
    ctx.addIssue({
      code: 'custom',
      path: ['hydraulics', 'circuit_split'],
      message: '"diagonal" cannot go with a balance bar: each of its master cylinders feeds one axle; use "front_rear" or remove hydraulics.balance_bar',
    });
  }
  casesIssues(d, ctx);
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
export type Hydraulics = z.infer<typeof Hydraulics>;
export type Vehicle = z.infer<typeof Vehicle>;
export type TractionOptions = z.infer<typeof TractionOptions>;
export type Regen = z.infer<typeof Regen>;
export type StoppingOptions = z.infer<typeof StoppingOptions>;
export type HeatOptions = z.infer<typeof HeatOptions>;
export type TesterOptions = z.infer<typeof TesterOptions>;
export type Identification = z.infer<typeof Identification>;
export type ParkingBrake = z.infer<typeof ParkingBrake>;
