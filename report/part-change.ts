/**
 * A proposed part change of the sizing assistant in words, from its structured values (core/sizing PartOption):
 * "front caliper pistons 2 × 48.0 mm → 2 × 50.0 mm", "rear wheel cylinder 0.75 in → 0.81 in" in US units.
 */
import type { SizingResult } from '../core/index.ts';
import * as F from './format.ts';

/** Diameters in the unit system: "2 × 50.0 mm" when all are equal, otherwise "48.0 mm + 44.0 mm". */
function diameters(ds: readonly number[], units: F.UnitSystem): string {
  if (ds.length > 1 && ds.every((d) => d === ds[0])) return `${ds.length} × ${F.shortLength(ds[0], units)}`;
  return ds.map((d) => F.shortLength(d, units)).join(' + ');
}

export function partChangeText(o: Pick<SizingResult['options'][number], 'axle' | 'part' | 'from_mm' | 'to_mm' | 'series'>, units: F.UnitSystem): string {
  const what = o.part === 'caliper_piston' ? 'caliper piston' : 'wheel cylinder';
  const plural = o.to_mm.length > 1 ? 's' : '';
  const note = o.series === 'exact' ? ' (computed, not a stock size)' : '';
  return `${o.axle} ${what}${plural} ${diameters(o.from_mm, units)} → ${diameters(o.to_mm, units)}${note}`;
}
