/** Limiting valve: the rear line follows the master pressure up to the knee and stays there, min(p, knee). */
import { z } from 'zod';
import { boundedNumberAbove as numAbove } from '../bounded-number.ts';
import { PA_PER_BAR } from '../constants.ts';
import { pressure } from '../field-registry.ts';
import { KNEE_INPUT, STUCK_MODES, stuckFailures } from './stuck.ts';
import { defineValve } from './valve-family.ts';

export const LimitingValve = z.strictObject({ type: z.literal('limiting'), knee_bar: numAbove(0, 300, pressure('Knee pressure')) });
export type LimitingValve = z.infer<typeof LimitingValve>;

export const limitingValve = defineValve({
  type: 'limiting',
  schema: LimitingValve,
  name: 'limiting valve',
  description: 'limiting (rear pressure capped at the knee)',
  law: (v: LimitingValve) => ({ knee: v.knee_bar * PA_PER_BAR, ratio: 0 }),
  failureModes: STUCK_MODES,
  failures: stuckFailures,
  tolerances: { knee: true, ratio: false },
  start: { knee_bar: 35 },
  inputs: [KNEE_INPUT],
});
