/**
 * Schemas of the optional design-file blocks `build_up` (mass build-up of a conversion) and `ratings`
 * (maximum permitted masses), and of the load-state keys that tie a state to the build-up
 * (docs/design-file.md, sections "build_up", "ratings" and "Load states from the build-up").
 * Positions: x_m from the front axle centre, rearward positive (ahead of the front axle negative);
 * cg_height_m above the ground; y_m lateral, positive to the right looking forward.
 */
import { z } from 'zod';
import { boundedNumber as num, boundedNumberAbove as numAbove } from './bounded-number.ts';
import { length, mass, ratio } from './field-registry.ts';
import { OCCUPANT_BASES } from './occupant-masses.ts';

export const CG_HEIGHT_SOURCES = ['measured', 'maker', 'estimated', 'assumed'] as const;
export const DERIVED_FROM = ['build_up', 'measured', 'entered'] as const;
export const BUILD_UP_STATES = ['unladen', 'laden'] as const;
export const OVERRIDABLE_FIGURES = ['mass_kg', 'front_axle_kg', 'cg_height_m'] as const;

const name = z.string().min(1).max(200);
const x = () => num(-10, 20, length('Distance behind the front axle'));
const height = () => num(0, 10, length('CG height'));
const lateral = () => num(-3, 3, length('Lateral offset, right positive'));

export const BuildUpItem = z.strictObject({
  name,
  mass_kg: numAbove(0, 60000, mass('Item mass')),
  x_m: x(),
  cg_height_m: height(),
  y_m: lateral().optional(),
  group: z.string().min(1).max(100).optional(),
});

export const BuildUpBaseline = z.strictObject({
  label: z.string().max(200).optional(),
  front_axle_kg: numAbove(0, 60000, mass('Weighed front axle load')),
  rear_axle_kg: numAbove(0, 60000, mass('Weighed rear axle load')),
  /** Optional corner weights; they give the left/right split (needs build_up.track_m). */
  wheels_kg: z
    .strictObject({
      front_left: numAbove(0, 30000, mass('Front left wheel load')),
      front_right: numAbove(0, 30000, mass('Front right wheel load')),
      rear_left: numAbove(0, 30000, mass('Rear left wheel load')),
      rear_right: numAbove(0, 30000, mass('Rear right wheel load')),
    })
    .optional(),
  cg_height_m: numAbove(0, 10, length('CG height as weighed')),
  cg_height_source: z.enum(CG_HEIGHT_SOURCES),
  cg_height_uncertainty_m: num(0, 1, length('Standard uncertainty of the CG height')).optional(),
  note: z.string().max(2000).optional(),
});

export const BuildUpSeat = z.strictObject({
  name,
  x_m: x(),
  cg_height_m: height(),
  y_m: lateral().optional(),
  driver: z.boolean().optional(),
});

export const BuildUpTank = z.strictObject({
  name,
  /** Mass of the contents when full, kg (water about 1 kg per litre). */
  full_kg: numAbove(0, 20000, mass('Contents when full')),
  x_m: x(),
  cg_height_m: height(),
  y_m: lateral().optional(),
  /** Fraction full when the baseline was weighed (0 empty, 1 full). */
  fill_weighed: num(0, 1, ratio('Fill when weighed')),
  /** Fraction full in the unladen state (default: as weighed). The laden state has every tank full. */
  fill_unladen: num(0, 1, ratio('Fill when unladen')).optional(),
});

export const BuildUpPayload = z.strictObject({
  mass_kg: numAbove(0, 60000, mass('Payload mass')),
  x_m: x(),
  cg_height_m: height(),
  y_m: lateral().optional(),
});

export const BuildUp = z
  .strictObject({
    baseline: BuildUpBaseline,
    /** Track width, m; needed for the left/right split. */
    track_m: num(0.5, 3, length('Track width')).optional(),
    removed: z.array(BuildUpItem).max(200).optional(),
    added: z.array(BuildUpItem).max(200).optional(),
    occupant: z.strictObject({ basis: z.enum(OCCUPANT_BASES), mass_kg: num(20, 200, mass('Mass per occupant')).optional() }).optional(),
    seats: z.array(BuildUpSeat).max(20).optional(),
    payload: BuildUpPayload.optional(),
    tanks: z.array(BuildUpTank).max(20).optional(),
  })
  .superRefine((b, ctx) => {
    if (b.seats && b.seats.length > 0 && !b.occupant) {
      ctx.addIssue({
        code: 'custom',
        path: ['occupant'],
        message: `is required when seats are listed: choose basis ${OCCUPANT_BASES.map((s) => `"${s}"`).join(', ')} (kg per occupant; see docs/design-file.md)`,
      });
    }
    if (b.occupant?.basis === 'custom' && b.occupant.mass_kg === undefined) {
      ctx.addIssue({ code: 'custom', path: ['occupant', 'mass_kg'], message: 'is required with basis "custom": kg per occupant, from 20 to 200' });
    }
    if (b.occupant && b.occupant.basis !== 'custom' && b.occupant.mass_kg !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['occupant', 'mass_kg'],
        message: `is only for basis "custom"; basis "${b.occupant.basis}" fixes the mass (remove mass_kg or use basis "custom")`,
      });
    }
    const drivers = (b.seats ?? []).map((s, i) => (s.driver ? i : -1)).filter((i) => i >= 0);
    if (drivers.length > 1) {
      ctx.addIssue({ code: 'custom', path: ['seats', drivers[1]!, 'driver'], message: 'only one seat can be the driver seat' });
    }
    if (b.track_m === undefined) {
      const lists = [['removed', b.removed], ['added', b.added], ['seats', b.seats], ['tanks', b.tanks]] as const;
      for (const [key, list] of lists) {
        (list ?? []).forEach((it, i) => {
          if (it.y_m !== undefined) {
            ctx.addIssue({ code: 'custom', path: [key, i, 'y_m'], message: 'needs build_up.track_m (m) to split the load left and right; add the track or remove y_m' });
          }
        });
      }
      if (b.payload?.y_m !== undefined) {
        ctx.addIssue({ code: 'custom', path: ['payload', 'y_m'], message: 'needs build_up.track_m (m) to split the load left and right; add the track or remove y_m' });
      }
      if (b.baseline.wheels_kg) {
        ctx.addIssue({ code: 'custom', path: ['track_m'], message: 'is required with baseline.wheels_kg: the track width in m, from 0.5 to 3' });
      }
    }
  });

export const Ratings = z
  .strictObject({
    max_mass_kg: numAbove(0, 60000, mass('Maximum permitted mass')).optional(),
    max_front_axle_kg: numAbove(0, 60000, mass('Maximum permitted front axle load')).optional(),
    max_rear_axle_kg: numAbove(0, 60000, mass('Maximum permitted rear axle load')).optional(),
    /** Least share of the vehicle mass on the front axle, percent (set by some regimes and chassis makers). */
    min_front_axle_share_pct: num(0, 100, { quantity: 'percentage', unit: '%', label: 'Least front axle share of the mass' }).optional(),
  })
  .refine((r) => Object.values(r).some((v) => v !== undefined), {
    error: 'is empty: give at least one of max_mass_kg, max_front_axle_kg, max_rear_axle_kg, min_front_axle_share_pct',
  });

/** Load-state keys of the build-up (spread into LoadState in core/design.ts). */
export const loadStateBuildUpShape = {
  /** Where the state's figures come from; filled when the file is read (build_up when from_build_up, else entered). */
  derived_from: z.enum(DERIVED_FROM).optional(),
  /** Take mass_kg, front_axle_kg and cg_height_m from this state of the build-up. */
  from_build_up: z.enum(BUILD_UP_STATES).optional(),
  /** Figures kept as written although from_build_up is set (e.g. a CG height measured by axle lift). */
  overrides: z.array(z.enum(OVERRIDABLE_FIGURES)).max(3).optional(),
  /** Where the CG height comes from when it differs from derived_from. */
  cg_height_derived_from: z.enum(DERIVED_FROM).optional(),
  /** Standard uncertainty of cg_height_m, m. */
  cg_height_uncertainty_m: num(0, 1, length('Standard uncertainty of the CG height')).optional(),
};

export type BuildUp = z.infer<typeof BuildUp>;
export type BuildUpItem = z.infer<typeof BuildUpItem>;
export type Ratings = z.infer<typeof Ratings>;
export type DerivedFrom = (typeof DERIVED_FROM)[number];
