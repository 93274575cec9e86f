/**
 * Ratings: the maximum permitted mass and axle masses, and a minimum front-axle share, checked per
 * load state. An axle can be over its rating while the total is within (camper and motorhome
 * converters report that mass behind the rear axle adds more than its own weight to it; practitioner
 * reports, no published source).
 */
import type { DesignFile, LoadState } from './design.ts';
import type { Warning } from './validate.ts';

export interface RatingMargins {
  /** Rating minus the state's figure, kg (negative = over); null where no rating is given. */
  mass_margin_kg: number | null;
  front_axle_margin_kg: number | null;
  rear_axle_margin_kg: number | null;
  /** The state's front-axle share, percent, and its margin above the minimum (percentage points). */
  front_axle_share_pct: number;
  front_share_margin_pct: number | null;
  /** Utilisation of each rating, percent (state figure / rating). */
  mass_use_pct: number | null;
  front_axle_use_pct: number | null;
  rear_axle_use_pct: number | null;
}

export function ratingMargins(design: DesignFile, s: LoadState): RatingMargins | null {
  const r = design.ratings;
  if (!r) return null;
  const rear = s.mass_kg - s.front_axle_kg;
  const share = (100 * s.front_axle_kg) / s.mass_kg;
  const margin = (rating: number | undefined, v: number) => (rating === undefined ? null : rating - v);
  const use = (rating: number | undefined, v: number) => (rating === undefined ? null : (100 * v) / rating);
  return {
    mass_margin_kg: margin(r.max_mass_kg, s.mass_kg),
    front_axle_margin_kg: margin(r.max_front_axle_kg, s.front_axle_kg),
    rear_axle_margin_kg: margin(r.max_rear_axle_kg, rear),
    front_axle_share_pct: share,
    front_share_margin_pct: r.min_front_axle_share_pct === undefined ? null : share - r.min_front_axle_share_pct,
    mass_use_pct: use(r.max_mass_kg, s.mass_kg),
    front_axle_use_pct: use(r.max_front_axle_kg, s.front_axle_kg),
    rear_axle_use_pct: use(r.max_rear_axle_kg, rear),
  };
}

export function ratingWarnings(design: DesignFile, s: LoadState, index: number): Warning[] {
  const r = design.ratings;
  const m = ratingMargins(design, s);
  if (!r || !m) return [];
  const w: Warning[] = [];
  const path = `load_states[${index}]`;
  const totalOver = m.mass_margin_kg !== null && m.mass_margin_kg < 0;
  if (totalOver) {
    w.push({
      code: 'WARN_MASS_OVER_RATING',
      path: `${path}.mass_kg`,
      message: `"${s.id}": mass ${s.mass_kg.toFixed(0)} kg is ${(-m.mass_margin_kg!).toFixed(0)} kg over the maximum permitted mass ${r.max_mass_kg} kg`,
    });
  }
  const axles = [
    ['front', s.front_axle_kg, r.max_front_axle_kg, m.front_axle_margin_kg],
    ['rear', s.mass_kg - s.front_axle_kg, r.max_rear_axle_kg, m.rear_axle_margin_kg],
  ] as const;
  for (const [axle, kg, rating, margin] of axles) {
    if (margin === null || margin >= 0) continue;
    const within = r.max_mass_kg !== undefined && !totalOver;
    w.push({
      code: 'WARN_AXLE_OVER_RATING',
      path: `${path}.${axle === 'front' ? 'front_axle_kg' : 'mass_kg'}`,
      message:
        `"${s.id}": ${axle} axle ${kg.toFixed(0)} kg is ${(-margin).toFixed(0)} kg over its rating ${rating} kg` +
        (within ? ` although the total ${s.mass_kg.toFixed(0)} kg is within the maximum ${r.max_mass_kg} kg; move load ${axle === 'rear' ? 'forward' : 'rearward'} or lighten it` : ''),
    });
  }
  if (m.front_share_margin_pct !== null && m.front_share_margin_pct < 0) {
    w.push({
      code: 'WARN_FRONT_SHARE_LOW',
      path: `${path}.front_axle_kg`,
      message: `"${s.id}": the front axle carries ${m.front_axle_share_pct.toFixed(1)} % of the mass, below the minimum ${r.min_front_axle_share_pct} % set in ratings (steering and braking suffer; move load forward)`,
    });
  }
  return w;
}
