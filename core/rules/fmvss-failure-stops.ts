/**
 * FMVSS No. 135 stops with part of the system failed (49 CFR 571.135, all from memory; verify against the
 * current official text): from 100 km/h with pedal force ≤ 500 N, variable-proportioning system failed within
 * 110 m (0.10V + 0.0100V²), antilock functional failure within 85 m (0.10V + 0.0075V²). "Variable brake
 * proportioning system" (definition in 571.135, verified): devices that change the front/rear pressure ratio
 * automatically with load or deceleration — a load-sensing, proportioning or limiting valve, or electronic
 * brake-force distribution.
 */
import type { FailureStopRule } from './case-rule-types.ts';

const DOC = 'FMVSS No. 135 (49 CFR 571.135)';
const ALL = ['M1', 'M2', 'M3', 'N1', 'N2', 'N3'] as const;

export const fmvssFailureStops: FailureStopRule[] = [
  {
    kind: 'valve_failure_stop',
    id: 'fmvss135/proportioning-failure',
    rule_set: 'fmvss135',
    title: 'Variable proportioning failed: stop from 100 km/h within 110 m',
    source: { document: DOC, paragraph: 'S7.9 variable brake proportioning system failure (section number and figures from memory)' },
    status: 'memory',
    categories: ALL,
    load_states: 'all',
    max_mass_kg: 3500,
    figures: { speed_kmh: 100, max_pedal_force_n: 500, max_distance_m: 110, distance: { v_coeff: 0.1, v2_coeff: 0.01 } },
  },
  {
    kind: 'abs_failure_stop',
    id: 'fmvss135/antilock-failure',
    rule_set: 'fmvss135',
    title: 'Antilock failed: stop from 100 km/h within 85 m',
    source: { document: DOC, paragraph: 'antilock functional failure test (section number and figures from memory)' },
    status: 'memory',
    categories: ALL,
    load_states: 'all',
    max_mass_kg: 3500,
    figures: { speed_kmh: 100, max_pedal_force_n: 500, max_distance_m: 85, distance: { v_coeff: 0.1, v2_coeff: 0.0075 } },
  },
];
