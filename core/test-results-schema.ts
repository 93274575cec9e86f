/**
 * The `test_results` block of a design file: what the physical brake test measured (road test with a
 * decelerometer or the mean fully developed deceleration, and the roller brake tester). Entered on the page
 * or in the file after the test; the packet prints them against the prediction and the requirement
 * (core/test-results.ts). Units in the key names (docs/design-file.md, "test_results").
 */
import { z } from 'zod';
import { boundedNumber, boundedNumberAbove } from './bounded-number.ts';
import { force, speed } from './field-registry.ts';

const num = boundedNumber;
const numAbove = boundedNumberAbove;

/** The four readings of a mean-fully-developed-deceleration measurement (speeds at 0.8 v0 and 0.1 v0, distances). */
export const MfddReadings = z.strictObject({
  speed_b_kmh: numAbove(0, 300, speed('Speed at 0.8 of the initial speed')),
  speed_e_kmh: num(0, 300, speed('Speed at 0.1 of the initial speed')),
  distance_b_m: num(0, 2000, { quantity: 'distance', unit: 'm', label: 'Distance travelled to 0.8 of the initial speed' }),
  distance_e_m: numAbove(0, 2000, { quantity: 'distance', unit: 'm', label: 'Distance travelled to 0.1 of the initial speed' }),
});

export const RoadTest = z.strictObject({
  /** Id of the load state the vehicle was tested in. */
  load_state: z.string().min(1).max(40),
  test: z.enum(['service', 'secondary']),
  speed_kmh: numAbove(0, 300, speed('Test speed')).optional(),
  pedal_force_n: numAbove(0, 3000, force('Pedal force')).optional(),
  /** Mean fully developed deceleration as read, m/s² (or give the readings in `mfdd`). */
  mfdd_ms2: numAbove(0, 15, { quantity: 'acceleration', unit: 'm/s2', label: 'Mean fully developed deceleration' }).optional(),
  mfdd: MfddReadings.optional(),
  stopping_distance_m: numAbove(0, 2000, { quantity: 'distance', unit: 'm', label: 'Stopping distance' }).optional(),
  wheel_lock: z.enum(['none', 'front', 'rear', 'both']).optional(),
});

export const RollerTest = z.strictObject({
  axle: z.enum(['front', 'rear']),
  left_n: num(0, 100000, force('Left wheel roller reading')),
  right_n: num(0, 100000, force('Right wheel roller reading')),
  pedal_force_n: numAbove(0, 3000, force('Pedal force')).optional(),
});

export const TestResults = z.strictObject({
  date: z.string().max(40).optional(),
  place: z.string().max(200).optional(),
  tested_by: z.string().max(200).optional(),
  road: z.array(RoadTest).max(16).optional(),
  roller: z.array(RollerTest).max(4).optional(),
});

export type TestResults = z.infer<typeof TestResults>;
export type RoadTest = z.infer<typeof RoadTest>;
export type RollerTest = z.infer<typeof RollerTest>;
export type MfddReadings = z.infer<typeof MfddReadings>;
