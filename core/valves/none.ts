/** No rear valve: the rear line always gets the master-cylinder pressure; nothing to fail. */
import { z } from 'zod';
import { defineValve } from './valve-family.ts';
import { FULL_PRESSURE } from './valve-law.ts';

export const NoValve = z.strictObject({ type: z.literal('none') });
export type NoValve = z.infer<typeof NoValve>;

export const noValve = defineValve<NoValve, never>({
  type: 'none',
  schema: NoValve,
  name: 'no valve',
  description: 'none (rear gets master-cylinder pressure)',
  law: () => FULL_PRESSURE,
  failureModes: [],
  failures: () => [],
  tolerances: { knee: false, ratio: false },
  start: {},
  inputs: [],
});
