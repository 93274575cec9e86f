/**
 * Unit conversion at the edges. Every factor is exact as given in NIST SP 811 (2008), appendix B.
 * Core modules work in SI only; views, forms and the CLI convert through this module.
 */
import { G_N, PA_PER_BAR } from './constants.ts';

export type Quantity =
  | 'mass' | 'length' | 'short_length' | 'force' | 'pressure' | 'acceleration' | 'speed'
  | 'distance' | 'ratio' | 'angle' | 'energy' | 'temperature_rise' | 'time'
  | 'volume' | 'compliance' | 'power' | 'torque' | 'temperature' | 'percentage' | 'specific_heat' | 'rate';

/** Factor from the unit to SI (value_SI = value × factor). NIST SP 811 B.8 / B.9. */
export const TO_SI = {
  kg: 1,
  t: 1000, // tonne, NIST SP 811 B.8
  lb: 0.45359237, // pound (avoirdupois), exact
  m: 1,
  mm: 1e-3,
  cm: 1e-2,
  in: 0.0254, // inch, exact
  ft: 0.3048, // foot, exact
  N: 1,
  kN: 1e3,
  daN: 10,
  lbf: 4.4482216152605, // pound-force, exact (0.45359237 × 9.80665)
  Pa: 1,
  kPa: 1e3,
  MPa: 1e6,
  bar: PA_PER_BAR,
  psi: 6894.757293168361, // pound-force per square inch = lbf / in², 6.894757 E+03 in B.8
  'm/s2': 1,
  g: G_N,
  'ft/s2': 0.3048,
  'm/s': 1,
  'km/h': 1 / 3.6,
  mph: 0.44704, // mile per hour, exact
  rad: 1,
  deg: Math.PI / 180,
  J: 1,
  kJ: 1e3,
  K: 1,
  s: 1,
  '1': 1,
  mm3: 1e-9, // cubic millimetre
  'mm3/bar': 1e-9 / PA_PER_BAR, // volume taken per pressure (hose and caliper expansion), m³/Pa in SI
  kW: 1e3,
  'N*m': 1,
  /** Degree Celsius: the factor holds for temperature differences only; absolute temperatures stay in °C everywhere. */
  degC: 1,
  '%': 0.01,
  '1/s': 1,
  'J/(kg*K)': 1,
  W: 1,
  'lbf*ft': 1.3558179483314004, // pound-force foot = lbf × ft, exact (4.4482216152605 × 0.3048)
  in3: 1.6387064e-5, // cubic inch, exact (0.0254³)
} as const;

export type Unit = keyof typeof TO_SI;

export function toSI(value: number, unit: Unit): number {
  return value * TO_SI[unit];
}

export function fromSI(value: number, unit: Unit): number {
  return value / TO_SI[unit];
}

/** The unit a value is displayed in, per quantity and unit system. */
export type UnitSystem = 'metric' | 'us';

export const DISPLAY_UNITS: Record<Quantity, Record<UnitSystem, Unit>> = {
  mass: { metric: 'kg', us: 'lb' },
  length: { metric: 'm', us: 'in' },
  short_length: { metric: 'mm', us: 'in' },
  force: { metric: 'N', us: 'lbf' },
  pressure: { metric: 'bar', us: 'psi' },
  acceleration: { metric: 'm/s2', us: 'ft/s2' },
  speed: { metric: 'km/h', us: 'mph' },
  distance: { metric: 'm', us: 'ft' },
  ratio: { metric: '1', us: '1' },
  angle: { metric: 'deg', us: 'deg' },
  energy: { metric: 'kJ', us: 'kJ' },
  temperature_rise: { metric: 'K', us: 'K' },
  time: { metric: 's', us: 's' },
  volume: { metric: 'mm3', us: 'mm3' },
  compliance: { metric: 'mm3/bar', us: 'mm3/bar' },
  power: { metric: 'kW', us: 'kW' },
  torque: { metric: 'N*m', us: 'N*m' },
  temperature: { metric: 'degC', us: 'degC' },
  percentage: { metric: '%', us: '%' },
  specific_heat: { metric: 'J/(kg*K)', us: 'J/(kg*K)' },
  rate: { metric: '1/s', us: '1/s' },
};

/** How a unit is written for a person ("" for a plain number). */
export const UNIT_LABELS: Record<Unit, string> = {
  kg: 'kg', t: 't', lb: 'lb', m: 'm', mm: 'mm', cm: 'cm', in: 'in', ft: 'ft', N: 'N', kN: 'kN', daN: 'daN', lbf: 'lbf',
  Pa: 'Pa', kPa: 'kPa', MPa: 'MPa', bar: 'bar', psi: 'psi', 'm/s2': 'm/s²', g: 'g', 'ft/s2': 'ft/s²', 'm/s': 'm/s',
  'km/h': 'km/h', mph: 'mph', rad: 'rad', deg: '°', J: 'J', kJ: 'kJ', K: 'K', s: 's', '1': '', mm3: 'mm³',
  'mm3/bar': 'mm³/bar', kW: 'kW', 'N*m': 'N·m', degC: '°C', '%': '%', '1/s': '1/s', 'J/(kg*K)': 'J/(kg·K)', W: 'W', 'lbf*ft': 'lbf·ft', in3: 'in³',
};

/** The label of a unit; "" for a plain number or none. */
export function unitLabel(u: Unit | null): string {
  return u === null ? '' : UNIT_LABELS[u];
}

/** Units a user may type after a number, per quantity, with the spellings accepted. */
const ACCEPTED: Record<Quantity, Record<string, Unit>> = {
  mass: { kg: 'kg', t: 't', tonne: 't', tonnes: 't', lb: 'lb', lbs: 'lb' },
  length: { m: 'm', mm: 'mm', cm: 'cm', in: 'in', '"': 'in', inch: 'in', inches: 'in', ft: 'ft', "'": 'ft' },
  short_length: { m: 'm', mm: 'mm', cm: 'cm', in: 'in', '"': 'in', inch: 'in', inches: 'in' },
  force: { n: 'N', kn: 'kN', dan: 'daN', lbf: 'lbf', lb: 'lbf' },
  pressure: { bar: 'bar', pa: 'Pa', kpa: 'kPa', mpa: 'MPa', psi: 'psi' },
  acceleration: { 'm/s2': 'm/s2', 'm/s²': 'm/s2', g: 'g', 'ft/s2': 'ft/s2', 'ft/s²': 'ft/s2' },
  speed: { 'km/h': 'km/h', kph: 'km/h', mph: 'mph', 'm/s': 'm/s' },
  distance: { m: 'm', ft: 'ft' },
  ratio: {},
  angle: { deg: 'deg', '°': 'deg', rad: 'rad' },
  energy: { j: 'J', kj: 'kJ' },
  temperature_rise: { k: 'K' },
  time: { s: 's' },
  volume: { mm3: 'mm3', 'mm³': 'mm3' },
  compliance: { 'mm3/bar': 'mm3/bar', 'mm³/bar': 'mm3/bar' },
  power: { kw: 'kW' },
  torque: { nm: 'N*m', 'n·m': 'N*m', 'n*m': 'N*m' },
  temperature: { '°c': 'degC', c: 'degC' },
  percentage: { '%': '%' },
  specific_heat: {},
  rate: { '1/s': '1/s' },
};

export type ParsedQuantity =
  | { ok: true; value: number; unit: Unit | null }
  | { ok: false; reason: string };

/**
 * Reads what a person typed into a field: "58 in", "1450 lb", "90 psi", "2.2 t", "3,40 m" or a bare number.
 * A bare number is in `fallback` (the unit the field shows). Returns the value in SI.
 */
export function parseQuantity(text: string, quantity: Quantity, fallback: Unit): ParsedQuantity {
  const s = text.trim().replace(/\s+/g, ' ');
  if (s === '') return { ok: false, reason: 'is empty' };
  const m = /^([-+]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:e[-+]?\d+)?)\s*(.*)$/i.exec(s);
  if (!m) return { ok: false, reason: `"${text.trim()}" is not a number` };
  // "1,450" could be 1.45 (decimal comma) or 1450 (thousands separator): refuse rather than guess.
  if (/^[-+]?\d{1,3},\d{3}$/.test(m[1]!)) {
    return { ok: false, reason: `"${m[1]}" is ambiguous: write 1450 or 1.45 (no thousands separators)` };
  }
  const num = Number(m[1]!.replace(',', '.'));
  if (!Number.isFinite(num)) return { ok: false, reason: `"${text.trim()}" is not a finite number` };
  const unitText = (m[2] ?? '').trim();
  if (unitText === '') return { ok: true, value: toSI(num, fallback), unit: null };
  const table = ACCEPTED[quantity];
  const key = unitText.toLowerCase();
  const unit = table[key] ?? table[unitText];
  if (!unit) {
    const allowed = [...new Set(Object.values(table))].join(', ');
    return { ok: false, reason: `unit "${unitText}" is not accepted here${allowed ? ` (use ${allowed})` : ' (enter a plain number)'}` };
  }
  return { ok: true, value: toSI(num, unit), unit };
}

/** Pressure in bar to pascals and back: the design file keeps bar, the core works in Pa. */
export const barToPa = (bar: number): number => bar * PA_PER_BAR;
export const paToBar = (pa: number): number => pa / PA_PER_BAR;
/** Millimetres to metres. */
export const mmToM = (mm: number): number => mm * 1e-3;
