/**
 * Rule set `fmvss135`: US FMVSS No. 135 (49 CFR 571.135), light vehicle brake systems, vehicles up
 * to 3 500 kg GVWR (S3, verified). The wheel-lockup sequence and all figures except the 70 m
 * cold-effectiveness stop are from memory (the 70 m stop is verified in NHTSA interpretation letter 11409.MLS,
 * https://nhtsa.gov/node/44266): shown as design guidance; verify against the current official text.
 */
import type { RuleSet } from './rule-types.ts';

const DOC = 'FMVSS No. 135 (49 CFR 571.135)';
const ALL = ['M1', 'M2', 'M3', 'N1', 'N2', 'N3'] as const;

/** The high-friction test surface of the standard: peak friction coefficient 0.9 (from memory). */
export const FMVSS_TEST_SURFACE = { adhesion: 0.9, words: 'peak friction coefficient 0.9 of the standard\'s test surface, from memory' } as const;

export const fmvss135: RuleSet = {
  id: 'fmvss135',
  title: 'FMVSS No. 135: light vehicle brake systems (design guidance where from memory)',
  rules: [
    {
      kind: 'curve',
      id: 'fmvss135/lock-sequence',
      rule_set: 'fmvss135',
      title: 'Front wheels lock before or with the rear (design guidance)',
      source: { document: DOC, paragraph: 'S7.2 wheel lockup sequence / S7.4 adhesion utilization (section numbers from memory)' },
      status: 'memory',
      categories: ALL,
      load_states: ['laden', 'unladen'],
      max_mass_kg: 3500,
      abs_exempt: true,
      note: 'rear curve not above the front curve for braking ratios 0.15–0.80 at GVWR (laden) and lightly loaded (unladen); margin = front minus rear utilisation',
      branches: [{ id: 'primary', label: 'front curve at or above rear curve, braking ratio 0.15–0.80', status: 'memory', pieces: [{ z: [0.15, 0.8], all_of: [[{ type: 'front_above_rear' }]] }] }],
    },
    {
      kind: 'service',
      id: 'fmvss135/cold-effectiveness',
      rule_set: 'fmvss135',
      title: 'Cold effectiveness: stop from 100 km/h within 70 m',
      source: { document: DOC, paragraph: 'S7.5 (70 m, 500 N verified via NHTSA interpretation; formula 0.10V + 0.0060V² from memory)' },
      status: 'partial',
      categories: ALL,
      load_states: 'all',
      max_mass_kg: 3500,
      figures: { speed_kmh: 100, max_pedal_force_n: 500, min_pedal_force_n: 65, max_distance_m: 70, distance: { v_coeff: 0.1, v2_coeff: 0.006 } },
      test_surface: FMVSS_TEST_SURFACE,
    },
    {
      kind: 'secondary',
      id: 'fmvss135/circuit-failure',
      rule_set: 'fmvss135',
      title: 'Hydraulic circuit failure: stop from 100 km/h within 168 m',
      source: { document: DOC, paragraph: 'hydraulic circuit failure test (section number and figures from memory)' },
      status: 'memory',
      categories: ALL,
      load_states: 'all',
      max_mass_kg: 3500,
      figures: { speed_kmh: 100, max_pedal_force_n: 500, max_distance_m: 168, distance: { v_coeff: 0.1, v2_coeff: 0.0158 } },
      test_surface: FMVSS_TEST_SURFACE,
    },
    {
      kind: 'booster_failure',
      id: 'fmvss135/booster-failure',
      rule_set: 'fmvss135',
      title: 'Power assist inoperative: stop from 100 km/h within 168 m',
      source: { document: DOC, paragraph: 'power brake unit failure test (section number and figures from memory)' },
      status: 'memory',
      categories: ALL,
      load_states: 'all',
      max_mass_kg: 3500,
      figures: { speed_kmh: 100, max_pedal_force_n: 500, max_distance_m: 168, distance: { v_coeff: 0.1, v2_coeff: 0.0158 } },
      test_surface: FMVSS_TEST_SURFACE,
    },
    {
      kind: 'parking',
      id: 'fmvss135/parking',
      rule_set: 'fmvss135',
      title: 'Parking brake holds the vehicle at GVWR on 20 %',
      source: { document: DOC, paragraph: 'S7.12 parking brake (from memory)' },
      status: 'memory',
      categories: ALL,
      load_states: ['laden'],
      max_mass_kg: 3500,
      gradient_pct: 20,
      max_hand_force_n: 400,
      max_foot_force_n: 500,
      test_surface: FMVSS_TEST_SURFACE,
    },
  ],
};
