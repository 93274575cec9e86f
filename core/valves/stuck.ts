/**
 * The two ways a pressure-reducing valve without a load linkage fails (71/320/EEC Annex II Appendix point 6):
 * stuck open, the rear gets full master pressure; stuck shut, the rear gets none. Shared by the limiting and
 * the proportioning valve.
 */
import type { FailedState } from './valve-family.ts';
import { FULL_PRESSURE } from './valve-law.ts';

export const STUCK_MODES = [
  { mode: 'passes_full_pressure', description: 'valve stuck open: the rear brakes get full master-cylinder pressure' },
  { mode: 'blocks_rear', description: 'valve stuck shut: the rear brakes get no pressure' },
] as const;

export type StuckMode = (typeof STUCK_MODES)[number]['mode'];

export function stuckFailures(): FailedState<StuckMode>[] {
  return [
    { mode: 'passes_full_pressure', description: STUCK_MODES[0].description, law: FULL_PRESSURE, rearBlocked: false },
    { mode: 'blocks_rear', description: STUCK_MODES[1].description, law: FULL_PRESSURE, rearBlocked: true },
  ];
}

/** The form input of the knee pressure (limiting and proportioning valves). */
export const KNEE_INPUT = { kind: 'number', key: 'knee_bar', hint: 'master-cylinder pressure where the valve starts to act' } as const;
/** The form input of the ratio above the knee (proportioning and load-sensing valves). */
export const RATIO_INPUT = { kind: 'number', key: 'ratio', hint: 'rise of rear pressure per unit rise of master-cylinder pressure' } as const;
