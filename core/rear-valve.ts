/**
 * Rear line pressure from master-cylinder pressure for the four rear-valve types (design-file spec):
 * none p; limiting min(p, knee); proportioning p up to the knee, knee + ratio·(p − knee) above;
 * load-sensing like proportioning with the knee read off the rear static axle load
 * (linear between table points, held flat outside). Pressures in Pa.
 */
import { PA_PER_BAR } from './constants.ts';
import type { RearValve } from './design.ts';

/** A valve reduced to its characteristic for one load state: knee (Pa) and slope above it. */
export interface ValveLaw {
  /** Knee pressure, Pa; Infinity when the rear pressure always equals the master pressure. */
  knee: number;
  /** dp2/dp above the knee (0 for a limiting valve). */
  ratio: number;
}

/** Knee of a load-sensing valve at a rear static axle load, bar. */
export function loadSensingKneeBar(table: ReadonlyArray<readonly [number, number]>, rearAxleKg: number): number {
  const first = table[0]!;
  const last = table[table.length - 1]!;
  if (rearAxleKg <= first[0]) return first[1];
  if (rearAxleKg >= last[0]) return last[1];
  // indices, not array destructuring: this runs for every knee a travel-sensing valve reads (bench/engine.ts)
  for (let i = 1; i < table.length; i++) {
    const b = table[i]!;
    if (rearAxleKg <= b[0]) {
      const a = table[i - 1]!;
      return a[1] + ((b[1] - a[1]) * (rearAxleKg - a[0])) / (b[0] - a[0]);
    }
  }
  return last[1];
}

export function valveLaw(valve: RearValve, rearStaticKg: number): ValveLaw {
  switch (valve.type) {
    case 'none':
      return { knee: Infinity, ratio: 1 };
    case 'limiting':
      return { knee: valve.knee_bar * PA_PER_BAR, ratio: 0 };
    case 'proportioning':
      return { knee: valve.knee_bar * PA_PER_BAR, ratio: valve.ratio };
    case 'load_sensing':
      return { knee: loadSensingKneeBar(valve.knee_bar_at_rear_axle_kg, rearStaticKg) * PA_PER_BAR, ratio: valve.ratio };
  }
}

/** Rear line pressure for master pressure p, Pa. */
export function rearPressure(law: ValveLaw, p: number): number {
  return p <= law.knee ? p : law.knee + law.ratio * (p - law.knee);
}

/** The master pressure at which the rear line reaches pressure q, Pa; Infinity when it never does. */
export function masterPressureForRear(law: ValveLaw, q: number): number {
  if (q <= law.knee) return q;
  return law.ratio > 0 ? law.knee + (q - law.knee) / law.ratio : Infinity;
}
