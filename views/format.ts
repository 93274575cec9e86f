/** Numbers for people: fixed decimals, units of the chosen system, a dash for "no value". */
import { type Quantity, TO_SI, type Unit, type UnitSystem } from '../core/index.ts';
import { unitLabel } from '../form/design-form.ts';

export function fixed(v: number | null | undefined, digits: number): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '–';
  return v.toFixed(digits);
}

/** Units used in results (forces in kN read better than N in tables). */
export const RESULT_UNITS: Partial<Record<Quantity, Record<UnitSystem, Unit>>> = {
  force: { metric: 'kN', us: 'lbf' },
  pressure: { metric: 'bar', us: 'psi' },
  mass: { metric: 'kg', us: 'lb' },
  length: { metric: 'm', us: 'in' },
};

export interface Shown {
  unit: Unit;
  label: string;
  /** SI value -> shown value. */
  from: (si: number) => number;
}

export function shownUnit(q: Quantity, units: UnitSystem, override?: Unit): Shown {
  const unit = override ?? RESULT_UNITS[q]?.[units] ?? 'N';
  return { unit, label: unitLabel(unit), from: (si) => si / TO_SI[unit] };
}

/** Pedal force: N in metric (pedal forces are a few hundred newtons), lbf in US. */
export const pedalUnit = (units: UnitSystem): Shown => shownUnit('force', units, units === 'us' ? 'lbf' : 'N');
