// Titles and number formats of the generic result sections in the evidence packet (packet/packet-content.ts).
// Sources: unit symbols as in NIST SP 811 (2008) section 5 and table 6 (m/s², km/h, °, °C, N·m); the expected
// roundings are hand-derived below (4 significant digits; braking rates and utilisations to 3 decimals).
import { describe, expect, it } from 'vitest';
import { columnTitle, fmtKeyed, fmtSig, recordTables, textOf } from '../../packet/packet-content.ts';

describe('column titles from result keys', () => {
  it('names the unit of the key suffix in brackets', () => {
    expect(columnTitle('max_acceleration_ms2')).toBe('Max acceleration [m/s²]');
    expect(columnTitle('max_gradient_pct')).toBe('Max gradient [%]');
    expect(columnTitle('max_gradient_deg')).toBe('Max gradient [°]');
    expect(columnTitle('base_speed_kmh')).toBe('Base speed [km/h]');
    expect(columnTitle('pedal_force_limit_n')).toBe('Pedal force limit [N]');
    expect(columnTitle('stopping_distance_m')).toBe('Stopping distance [m]');
    expect(columnTitle('total_ft')).toBe('Total [ft]');
    expect(columnTitle('master_pressure_bar')).toBe('Master pressure [bar]');
    expect(columnTitle('test_mass_kg')).toBe('Test mass [kg]');
    expect(columnTitle('max_acceleration_g')).toBe('Max acceleration [g]');
    expect(columnTitle('energy_j')).toBe('Energy [J]');
    expect(columnTitle('energy_kj')).toBe('Energy [kJ]');
    expect(columnTitle('front_rotor_rise_k')).toBe('Front rotor rise [K]');
    expect(columnTitle('reaction_time_s')).toBe('Reaction time [s]');
    expect(columnTitle('specific_heat_j_per_kg_k')).toBe('Specific heat [J/(kg·K)]');
  });
  it('leaves keys without a unit suffix in words, with the explicit overrides', () => {
    expect(columnTitle('adhesion')).toBe('Adhesion');
    expect(columnTitle('cg_height_m')).toBe('CG height [m]');
    expect(columnTitle('k_from')).toBe('Adhesion k from');
    expect(columnTitle('v1_kmh')).toBe('Initial speed v1 [km/h]');
    // a bare suffix is a word, not a unit
    expect(columnTitle('n')).toBe('N');
  });
});

describe('numbers of the generic sections', () => {
  it('rounds to 4 significant digits without exponent notation for ordinary values', () => {
    // hand-derived: 9.80665 -> 9.807; 41.9872 -> 41.99; 126.1321 -> 126.1; 2478.2609 -> 2478; 123456.7 -> 123457
    expect(fmtSig(9.80665)).toBe('9.807');
    expect(fmtSig(41.9872)).toBe('41.99');
    expect(fmtSig(126.1321)).toBe('126.1');
    expect(fmtSig(2478.2609)).toBe('2478');
    expect(fmtSig(123456.7)).toBe('123457');
    expect(fmtSig(0.0012346)).toBe('0.001235'); // hand-derived: 1.2346e-3 to 4 digits
    expect(fmtSig(-0.5)).toBe('-0.5');
    expect(fmtSig(0)).toBe('0');
  });
  it('gives braking rates, utilisations, efficiencies and adhesions 3 decimals', () => {
    // hand-derived: 0.51234 -> 0.512; 0.80345 -> 0.803; -0.0002 -> 0 (no "-0")
    expect(fmtKeyed(0.51234, 'braking_rate')).toBe('0.512');
    expect(fmtKeyed(0.80345, 'efficiency')).toBe('0.803');
    expect(fmtKeyed(-0.0002, 'front_utilisation')).toBe('0');
    // a key with a unit is not a ratio even if it names one: 4 significant digits
    expect(fmtKeyed(27.9326, 'share_of_available_pct')).toBe('27.93');
  });
  it('writes nested records in words with their units', () => {
    expect(textOf({ pedal_travel_mm: 39.1057, braking_rate: 0.50991 })).toBe('pedal travel: 39.11 mm; braking rate: 0.51');
  });
  it('heads a generic table with titles and units, cells at the key precision', () => {
    const [t] = recordTables([{ adhesion: 0.8, max_deceleration_ms2: 6.69351 }]);
    expect(t).toEqual({ kind: 'table', columns: ['Adhesion', 'Max deceleration [m/s²]'], rows: [['0.8', '6.694']] });
  });
});
