/**
 * The axle-lift input file `lockstep-axle-lift/1` (docs/axle-lift.md): schema, reading with
 * field-level messages in the same words as the design file, and the result file
 * `lockstep-axle-lift-result/1`.
 */
import { z } from 'zod';
import { type AxleLiftResult, axleLift } from './axle-lift.ts';
import { CAUTION } from './caution.ts';
import { boundedNumber, boundedNumberAbove } from './bounded-number.ts';
import { angle, length, mass } from './field-registry.ts';
import { describeIssue, type FieldIssue } from './validate.ts';

const num = boundedNumber;
const numAbove = boundedNumberAbove;

export const AxleLiftReadingSchema = z.strictObject({
  raised_axle: z.enum(['front', 'rear']),
  lift_height_m: numAbove(0, 3, length('Lift height at the wheel centre')).optional(),
  lift_angle_deg: numAbove(0, 45, angle('Body pitch angle')).optional(),
  front_axle_kg: numAbove(0, 60000, mass('Front axle reading')).optional(),
  rear_axle_kg: numAbove(0, 60000, mass('Rear axle reading')).optional(),
});

export const AxleLiftFile = z
  .strictObject({
    format: z.literal('lockstep-axle-lift/1'),
    name: z.string().min(1).max(200).optional(),
    notes: z.string().max(20000).optional(),
    wheelbase_m: num(0.5, 10, length('Wheelbase')),
    wheel_centre_height_m: numAbove(0, 1.5, length('Wheel centre height')),
    level: z.strictObject({ front_axle_kg: numAbove(0, 60000, mass('Front axle reading, level')), rear_axle_kg: numAbove(0, 60000, mass('Rear axle reading, level')) }),
    lifts: z.array(AxleLiftReadingSchema).min(1).max(30),
    scale_resolution_kg: numAbove(0, 100, mass('Scale resolution')),
    lift_height_uncertainty_m: num(0, 0.5, length('Uncertainty of the lift height')),
    wheelbase_uncertainty_m: num(0, 0.5, length('Uncertainty of the wheelbase')),
    wheel_centre_height_uncertainty_m: num(0, 0.5, length('Uncertainty of the wheel centre height')).optional(),
    lift_angle_uncertainty_deg: num(0, 10, angle('Uncertainty of the pitch angle')).optional(),
  })
  .superRefine((d, ctx) => {
    d.lifts.forEach((l, i) => {
      const hasH = l.lift_height_m !== undefined;
      const hasA = l.lift_angle_deg !== undefined;
      if (hasH === hasA) {
        ctx.addIssue({
          code: 'custom',
          path: ['lifts', i, hasH ? 'lift_angle_deg' : 'lift_height_m'],
          message: hasH
            ? 'give lift_height_m or lift_angle_deg, not both'
            : 'is required: the lift as lift_height_m (m, wheel-centre rise) or lift_angle_deg (°, body pitch)',
        });
      }
      if (hasH && l.lift_height_m! >= 0.9 * d.wheelbase_m) {
        ctx.addIssue({
          code: 'custom',
          path: ['lifts', i, 'lift_height_m'],
          message: `${l.lift_height_m} is not below 0.9 × wheelbase ${d.wheelbase_m} m (the lift must be well below the wheelbase: θ = asin(H/L))`,
        });
      }
      const hasF = l.front_axle_kg !== undefined;
      const hasR = l.rear_axle_kg !== undefined;
      if (hasF === hasR) {
        const down = l.raised_axle === 'front' ? 'rear' : 'front';
        ctx.addIssue({
          code: 'custom',
          path: ['lifts', i, `${down}_axle_kg`],
          message: hasF
            ? 'give the reading of one axle only: front_axle_kg or rear_axle_kg (normally the axle that stays down)'
            : `is required: the scale reading in kg of the axle on the scales (normally ${down}_axle_kg, the axle that stays down)`,
        });
      }
      const reading = l.front_axle_kg ?? l.rear_axle_kg;
      const total = d.level.front_axle_kg + d.level.rear_axle_kg;
      if (reading !== undefined && reading >= total) {
        ctx.addIssue({
          code: 'custom',
          path: ['lifts', i, hasF ? 'front_axle_kg' : 'rear_axle_kg'],
          message: `${reading} is not below the vehicle mass ${total} kg from the level readings (one axle cannot carry the whole vehicle)`,
        });
      }
    });
  });

export type AxleLiftFile = z.infer<typeof AxleLiftFile>;

export type AxleLiftFileReading =
  | { ok: true; input: AxleLiftFile }
  | { ok: false; errors: FieldIssue[] };

export function readAxleLift(input: unknown): AxleLiftFileReading {
  const r = AxleLiftFile.safeParse(input);
  if (!r.success) {
    return {
      ok: false,
      errors: r.error.issues.map((iss) => {
        const fi = describeIssue(iss, input, AxleLiftFile);
        // describeIssue points at docs/design-file.md for unknown keys; this file has its own page.
        return { path: fi.path, message: fi.message.replace('docs/design-file.md', 'docs/axle-lift.md') };
      }),
    };
  }
  return { ok: true, input: r.data };
}

export interface AxleLiftResultFile extends AxleLiftResult {
  format: 'lockstep-axle-lift-result/1';
  name: string | null;
  /** How the scale resolution entered the budget, in words. */
  method: string;
  caution: string;
}

export function axleLiftResultFile(input: AxleLiftFile): AxleLiftResultFile {
  const r = axleLift(input);
  return {
    format: 'lockstep-axle-lift-result/1',
    name: input.name ?? null,
    ...r,
    method:
      'h = r + L ΔW / (W tan θ), θ = asin(H / L); several lifts fitted by least squares (axle load against tan θ, one intercept per axle read). ' +
      'Standard uncertainty by linear propagation (GUM); each scale reading counts as a rectangular distribution one resolution step wide, u = resolution / √12.',
    caution: CAUTION,
  };
}
