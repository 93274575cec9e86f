/** Proportioning valve: the rear line at master pressure up to the knee, knee + ratio·(p − knee) above it. */
import { z } from 'zod';
import { boundedNumberAbove as numAbove } from '../bounded-number.ts';
import { PA_PER_BAR } from '../constants.ts';
import { pressure, ratio } from '../field-registry.ts';
import { KNEE_INPUT, RATIO_INPUT, STUCK_MODES, stuckFailures } from './stuck.ts';
import { defineValve } from './valve-family.ts';

export const ProportioningValve = z.strictObject({
  type: z.literal('proportioning'),
  knee_bar: numAbove(0, 300, pressure('Knee pressure')),
  ratio: numAbove(0, 1, ratio('Ratio above the knee')),
});
export type ProportioningValve = z.infer<typeof ProportioningValve>;

export const proportioningValve = defineValve({
  type: 'proportioning',
  schema: ProportioningValve,
  name: 'proportioning valve',
  description: 'proportioning (reduced above the knee)',
  law: (v: ProportioningValve) => ({ knee: v.knee_bar * PA_PER_BAR, ratio: v.ratio }),
  failureModes: STUCK_MODES,
  failures: stuckFailures,
  tolerances: { knee: true, ratio: true },
  start: { knee_bar: 28, ratio: 0.3 },
  inputs: [KNEE_INPUT, RATIO_INPUT],
});
