/**
 * Numbers for people: one formatter per quantity, in the chosen unit system (metric / US), fixed decimals per
 * quantity decided once here, a dash for "no value", unit labels of the system. Every output (command-line text,
 * workbench panels, evidence packet) formats through this module; results that leave the core in file units
 * (bar, km/h, mm, kg, N) are converted only here.
 *
 * Conversion factors: core/units.ts (NIST SP 811 (2008), appendix B).
 */
import { type FieldMeta, type Quantity, TO_SI, type Unit, unitLabel as coreUnitLabel, type UnitSystem } from '../core/index.ts';

export type { UnitSystem };

/** The text shown for no value (null, undefined, NaN, ±Infinity). */
export const DASH = '–';

/** The quantities shown to people. Each has one unit per system and one number of decimals per unit. */
export type Kind =
  | 'braking_rate' // z, dimensionless
  | 'utilisation' // f = T/N, dimensionless
  | 'adhesion' // tyre-road adhesion coefficient k
  | 'efficiency' // braking efficiency z/k, shown as a percentage
  | 'percent' // a share or percentage, shown as "87.7 %"
  | 'ratio' // a dimensionless ratio (valve ratio, share as a fraction)
  | 'pressure'
  | 'force' // axle and brake forces
  | 'pedal_force'
  | 'mass'
  | 'length' // wheelbase, CG height, tyre radius
  | 'short_length' // piston diameters, strokes, travel
  | 'speed'
  | 'deceleration' // accelerations and decelerations
  | 'distance' // stopping distances
  | 'energy'
  | 'temperature' // absolute temperature, °C
  | 'temperature_rise'
  | 'time'
  | 'power'
  | 'torque'
  | 'volume' // fluid volume
  | 'angle'
  | 'mass_margin'; // a signed mass difference (ratings)

interface Spec {
  unit: Record<UnitSystem, Unit | '%' | '°C' | '°F' | ''>;
  digits: Record<UnitSystem, number>;
}

/**
 * The one table: unit and decimals per quantity and system (common practice, no source: decimals chosen so a
 * figure carries about three significant digits at the sizes a light vehicle's brakes have).
 */
export const KINDS: Readonly<Record<Kind, Spec>> = {
  braking_rate: { unit: { metric: '', us: '' }, digits: { metric: 3, us: 3 } },
  utilisation: { unit: { metric: '', us: '' }, digits: { metric: 3, us: 3 } },
  adhesion: { unit: { metric: '', us: '' }, digits: { metric: 2, us: 2 } },
  efficiency: { unit: { metric: '%', us: '%' }, digits: { metric: 1, us: 1 } },
  percent: { unit: { metric: '%', us: '%' }, digits: { metric: 1, us: 1 } },
  ratio: { unit: { metric: '', us: '' }, digits: { metric: 3, us: 3 } },
  pressure: { unit: { metric: 'bar', us: 'psi' }, digits: { metric: 1, us: 0 } },
  force: { unit: { metric: 'N', us: 'lbf' }, digits: { metric: 0, us: 0 } },
  pedal_force: { unit: { metric: 'N', us: 'lbf' }, digits: { metric: 0, us: 0 } },
  mass: { unit: { metric: 'kg', us: 'lb' }, digits: { metric: 0, us: 0 } },
  mass_margin: { unit: { metric: 'kg', us: 'lb' }, digits: { metric: 0, us: 0 } },
  length: { unit: { metric: 'm', us: 'in' }, digits: { metric: 3, us: 2 } },
  short_length: { unit: { metric: 'mm', us: 'in' }, digits: { metric: 1, us: 2 } },
  speed: { unit: { metric: 'km/h', us: 'mph' }, digits: { metric: 0, us: 0 } },
  deceleration: { unit: { metric: 'm/s2', us: 'ft/s2' }, digits: { metric: 2, us: 1 } },
  distance: { unit: { metric: 'm', us: 'ft' }, digits: { metric: 1, us: 1 } },
  energy: { unit: { metric: 'kJ', us: 'kJ' }, digits: { metric: 1, us: 1 } },
  temperature: { unit: { metric: '°C', us: '°F' }, digits: { metric: 0, us: 0 } },
  temperature_rise: { unit: { metric: 'K', us: '°F' }, digits: { metric: 1, us: 1 } },
  time: { unit: { metric: 's', us: 's' }, digits: { metric: 2, us: 2 } },
  power: { unit: { metric: 'kW', us: 'kW' }, digits: { metric: 0, us: 0 } },
  torque: { unit: { metric: 'N*m', us: 'lbf*ft' }, digits: { metric: 0, us: 0 } },
  angle: { unit: { metric: 'deg', us: 'deg' }, digits: { metric: 2, us: 2 } },
  volume: { unit: { metric: 'mm3', us: 'in3' }, digits: { metric: 0, us: 3 } },
};

/** The unit a value arrives in when it is not SI: the design-file and result units of the core. */
export type FromUnit = Unit | 'ratio' | 'pct' | 'C';

const LABELS: Partial<Record<string, string>> = {
  'm/s2': 'm/s²',
  'ft/s2': 'ft/s²',
  mm3: 'mm³',
  in3: 'in³',
  deg: '°',
  '1': '',
  'N*m': 'N·m',
  'lbf*ft': 'lbf·ft',
};

/** How a unit is written for people: "m/s²", "psi", "" for a dimensionless number. */
export function unitText(u: string): string {
  return LABELS[u] ?? u;
}

/** The unit label of a quantity in a unit system ("bar", "psi", "%", "" for dimensionless). */
export function unitOf(kind: Kind, units: UnitSystem): string {
  return unitText(KINDS[kind].unit[units]);
}

/** Decimals a quantity is shown with in a unit system. */
export function digitsOf(kind: Kind, units: UnitSystem): number {
  return KINDS[kind].digits[units];
}

function isNumber(v: number | null | undefined): v is number {
  return typeof v === 'number' && Number.isFinite(v);
}

/**
 * The value in the shown unit of the system, not rounded. `from`: the unit the value is in (default SI;
 * 'ratio' for a 0–1 fraction shown as a percentage, 'pct' for a value already in per cent).
 */
export function convertRaw(kind: Kind, v: number, units: UnitSystem, from?: FromUnit): number {
  const shown = KINDS[kind].unit[units];
  if (shown === '%') return from === 'pct' ? v : v * 100;
  if (shown === '' || shown === '°C') return v;
  // degrees Fahrenheit: t/°F = 1.8 t/°C + 32, a difference of 1 K is 1.8 °F (NIST SP 811 B.8)
  if (shown === '°F') return kind === 'temperature' ? v * 1.8 + 32 : v * 1.8;
  const si = from === undefined || from === 'ratio' || from === 'pct' || from === 'C' ? v : v * TO_SI[from];
  return si / TO_SI[shown];
}

/**
 * The value in the shown unit, rounded to the quantity's decimals (plus `extraDigits`: chart coordinates carry one
 * more, below a pixel); null for no value (charts, CSV).
 */
/** Chart coordinates: the shown unit with one decimal more than the text. */
export const plot = (kind: Kind, v: number | null | undefined, units: UnitSystem, from?: FromUnit): number | null => convert(kind, v, units, from, 1);

export function convert(kind: Kind, v: number | null | undefined, units: UnitSystem, from?: FromUnit, extraDigits = 0): number | null {
  if (!isNumber(v)) return null;
  const d = digitsOf(kind, units) + extraDigits;
  const r = Number(convertRaw(kind, v, units, from).toFixed(d));
  return Object.is(r, -0) ? 0 : r;
}

function digitsText(v: number, d: number): string {
  const s = v.toFixed(d);
  return /^-0(\.0*)?$/.test(s) ? s.slice(1) : s;
}

export interface FormatOptions {
  /** The unit the value is in (default SI). */
  from?: FromUnit;
  /** Write the unit after the number (default true). */
  unit?: boolean;
  /** Write a sign in front: "+0.084", "−0.173". */
  signed?: boolean;
  /** Decimals beyond the quantity's own, for small figures such as uncertainties and their contributions. */
  extraDigits?: number;
}

/** The number alone or with its unit: "0.633", "87.7 %", "1 450 lb" is written "1450 lb", a dash for no value. */
export function format(kind: Kind, v: number | null | undefined, units: UnitSystem, opts: FormatOptions = {}): string {
  if (!isNumber(v)) return DASH;
  const shown = convertRaw(kind, v, units, opts.from);
  const d = digitsOf(kind, units) + (opts.extraDigits ?? 0);
  let n = digitsText(opts.signed ? Math.abs(shown) : shown, d);
  if (opts.signed) n = `${Number(n) === 0 ? '±' : shown > 0 ? '+' : '−'}${n}`;
  else if (n.startsWith('-')) n = `−${n.slice(1)}`;
  const u = opts.unit === false ? '' : unitOf(kind, units);
  return u === '' ? n : `${n} ${u}`;
}

// ---------------------------------------------------------------- one function per quantity

type Num = number | null | undefined;
/** Braking rate z, 3 decimals: "0.633". */
export const brakingRate = (z: Num): string => format('braking_rate', z, 'metric');
/** "z = 0.633". */
export const zText = (z: Num): string => `z = ${brakingRate(z)}`;
/** Adhesion utilisation f, 3 decimals. */
export const utilisation = (f: Num): string => format('utilisation', f, 'metric');
/** Tyre-road adhesion k, 2 decimals. */
export const adhesion = (k: Num): string => format('adhesion', k, 'metric');
/** Braking efficiency (a 0–1 fraction) as a percentage: "87.7 %". */
export const efficiency = (e: Num): string => format('efficiency', e, 'metric', { from: 'ratio' });
/** A share given as a 0–1 fraction, as a percentage: "43.2 %". */
export const percentOfRatio = (r: Num): string => format('percent', r, 'metric', { from: 'ratio' });
/** A value already in per cent: "43.2 %". */
export const percent = (p: Num): string => format('percent', p, 'metric', { from: 'pct' });
/** Percentage points, signed: "+2.1 points". */
export const percentPoints = (p: Num): string =>
  isNumber(p) ? `${format('percent', p, 'metric', { from: 'pct', unit: false, signed: true })} points` : DASH;
/** A margin in adhesion units (the sizing assistant's smallest margin), signed: "+0.084", "−0.012". */
export const adhesionMargin = (m: Num): string => format('utilisation', m, 'metric', { signed: true });
/** A dimensionless ratio, 3 decimals. */
export const ratio = (r: Num): string => format('ratio', r, 'metric');
export const pressure = (v: Num, units: UnitSystem, from: FromUnit = 'Pa'): string => format('pressure', v, units, { from });
export const force = (v: Num, units: UnitSystem, from: FromUnit = 'N'): string => format('force', v, units, { from });
export const pedalForce = (v: Num, units: UnitSystem, from: FromUnit = 'N'): string => format('pedal_force', v, units, { from });
export const mass = (v: Num, units: UnitSystem, from: FromUnit = 'kg'): string => format('mass', v, units, { from });
export const length = (v: Num, units: UnitSystem, from: FromUnit = 'm'): string => format('length', v, units, { from });
export const shortLength = (v: Num, units: UnitSystem, from: FromUnit = 'mm'): string => format('short_length', v, units, { from });
export const speed = (v: Num, units: UnitSystem, from: FromUnit = 'km/h'): string => format('speed', v, units, { from });
export const deceleration = (v: Num, units: UnitSystem, from: FromUnit = 'm/s2'): string => format('deceleration', v, units, { from });
export const distance = (v: Num, units: UnitSystem, from: FromUnit = 'm'): string => format('distance', v, units, { from });
export const energy = (v: Num, units: UnitSystem, from: FromUnit = 'J'): string => format('energy', v, units, { from });
export const temperature = (v: Num, units: UnitSystem = 'metric'): string => format('temperature', v, units, { from: 'C' });
export const temperatureRise = (v: Num, units: UnitSystem = 'metric'): string => format('temperature_rise', v, units);
export const time = (v: Num): string => format('time', v, 'metric');
export const power = (v: Num, from: FromUnit = 'kW'): string => format('power', v, 'metric', { from });
export const torque = (v: Num, units: UnitSystem, from: FromUnit = 'N*m'): string => format('torque', v, units, { from });
export const volume = (v: Num, units: UnitSystem, from: FromUnit = 'mm3'): string => format('volume', v, units, { from });
/** A standard uncertainty or an uncertainty contribution: two decimals more than the quantity's own ("1.44 kg"). */
export const uncertainty = (kind: Kind, v: Num, units: UnitSystem, opts: FormatOptions = {}): string => format(kind, v, units, { ...opts, extraDigits: 2 });
/** A signed mass difference: "+120 kg", "−35 kg". */
export const massMargin = (v: Num, units: UnitSystem, from: FromUnit = 'kg'): string => format('mass_margin', v, units, { from, signed: true });

/** The unit a check margin is given in by the core (core/checks/check-result.ts MarginUnit). */
export type MarginUnitCode = 'adhesion' | 'm/s²' | 'N' | 'none';

/** A check margin, signed, in the unit system: "+0.084 (adhesion)", "−0.27 m/s²", "+5.8 ft/s²", "+310 lbf". */
export function margin(v: Num, unitCode: MarginUnitCode, units: UnitSystem): string {
  if (!isNumber(v) || unitCode === 'none') return DASH;
  if (unitCode === 'adhesion') return `${format('utilisation', v, units, { signed: true })} (adhesion)`;
  if (unitCode === 'N') return format('force', v, units, { signed: true });
  return format('deceleration', v, units, { signed: true });
}

/** The unit words of a margin column: "adhesion", "m/s²" / "ft/s²", "N" / "lbf". */
export function marginUnitText(unitCode: MarginUnitCode, units: UnitSystem): string {
  if (unitCode === 'adhesion') return 'adhesion';
  if (unitCode === 'N') return unitOf('force', units);
  if (unitCode === 'none') return '';
  return unitOf('deceleration', units);
}

/** A range of braking rates: "0.312–0.420". */
export const zRange = ([a, b]: readonly [number, number]): string => `${brakingRate(a)}–${brakingRate(b)}`;

/** A list of numbers in one quantity: "0.2, 0.4, 0.8". */
export function list(kind: Kind, vs: readonly Num[], units: UnitSystem = 'metric', opts: FormatOptions = {}): string {
  return vs.map((v) => format(kind, v, units, { ...opts, unit: false })).join(', ') + (opts.unit === false || vs.length === 0 ? '' : unitOf(kind, units) ? ` ${unitOf(kind, units)}` : '');
}

/** A column head with its unit: "Front pressure (psi)"; the head alone for a dimensionless quantity. */
export function headWithUnit(head: string, kind: Kind, units: UnitSystem): string {
  const u = unitOf(kind, units);
  return u ? `${head} (${u})` : head;
}

/** The kind each quantity of the design file's quantity table (core/field-registry.ts) is shown as. */
const KIND_OF_QUANTITY: Partial<Record<Quantity, Kind>> = {
  mass: 'mass',
  length: 'length',
  short_length: 'short_length',
  force: 'force',
  pressure: 'pressure',
  acceleration: 'deceleration',
  speed: 'speed',
  distance: 'distance',
  ratio: 'ratio',
  angle: 'angle',
  energy: 'energy',
  temperature_rise: 'temperature_rise',
  time: 'time',
  power: 'power',
  torque: 'torque',
  volume: 'volume',
};

/**
 * A design-file value by its field's quantity and file unit (`fieldMeta(path)`): "28.0 bar", "406 psi". Quantities
 * with no kind of their own (compliance, specific heat, rates, percentages) are written in their file unit.
 */
export function fieldValue(meta: Pick<FieldMeta, 'quantity' | 'unit'>, v: Num, units: UnitSystem): string {
  const kind = KIND_OF_QUANTITY[meta.quantity];
  if (kind) return format(kind, v, units, { from: meta.unit });
  if (!isNumber(v)) return DASH;
  const u = coreUnitLabel(meta.unit);
  const n = String(Number(v.toPrecision(4)));
  return u === '' ? n : `${n} ${u}`;
}
