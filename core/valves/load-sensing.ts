/**
 * Load-sensing valve: like a proportioning valve, with the knee read off a table against the rear axle load
 * (linear between table points, held flat outside). Its linkage follows the suspension travel ("dynamic", the
 * rear load while braking, core/installed-distribution.ts) or the load at rest ("static").
 */
import { z } from 'zod';
import { boundedNumberAbove as numAbove } from '../bounded-number.ts';
import { PA_PER_BAR } from '../constants.ts';
import { mass, pressure, ratio } from '../field-registry.ts';
import { RATIO_INPUT } from './stuck.ts';
import { defineValve, type ValveIssue } from './valve-family.ts';

export const LoadSensingValve = z.strictObject({
  type: z.literal('load_sensing'),
  ratio: numAbove(0, 1, ratio('Ratio above the knee')),
  /**
   * What the valve's linkage follows: "dynamic" (default) the suspension travel, so the rear axle load
   * while braking, N2 = P2 − z·(h/E)·P; "static" the rear axle load at rest (a valve that reads it only
   * when standing, or a check of the table alone).
   */
  senses: z.enum(['static', 'dynamic']).optional(),
  knee_bar_at_rear_axle_kg: z.array(z.tuple([numAbove(0, 60000, mass('Rear axle load')), numAbove(0, 300, pressure('Knee pressure'))])).min(1).max(20),
});
export type LoadSensingValve = z.infer<typeof LoadSensingValve>;

/** Knee of a load-sensing valve at a rear static axle load, bar. */
export function loadSensingKneeBar(table: ReadonlyArray<readonly [number, number]>, rearAxleKg: number): number {
  const first = table[0]!;
  const last = table[table.length - 1]!;
  if (rearAxleKg <= first[0]) return first[1];
  if (rearAxleKg >= last[0]) return last[1];
  // indices, not array destructuring: this runs for every knee a travel-sensing valve reads (bench/engine.ts)
  for (let i = 1; i < table.length; i++) {
    const b = table[i]!;
    if (rearAxleKg <= b[0]) {
      const a = table[i - 1]!;
      return a[1] + ((b[1] - a[1]) * (rearAxleKg - a[0])) / (b[0] - a[0]);
    }
  }
  return last[1];
}

const MODES = [
  { mode: 'linkage_broken_lowest_knee', description: 'load-sensing linkage broken: the valve holds its lowest knee (reads the vehicle as empty)' },
  { mode: 'linkage_broken_highest_knee', description: 'load-sensing linkage broken: the valve holds its highest knee (reads the vehicle as fully laden)' },
] as const;

export const loadSensingValve = defineValve({
  type: 'load_sensing',
  schema: LoadSensingValve,
  name: 'load-sensing valve',
  description: 'load-sensing (knee follows rear axle load)',
  law: (v: LoadSensingValve, rearStaticKg: number) => ({ knee: loadSensingKneeBar(v.knee_bar_at_rear_axle_kg, rearStaticKg) * PA_PER_BAR, ratio: v.ratio }),
  failureModes: MODES,
  failures: (v: LoadSensingValve) => {
    // a broken linkage holds the knee of the lightest or heaviest row whatever the load
    const knees = v.knee_bar_at_rear_axle_kg.map(([, k]) => k);
    const lo = Math.min(...knees) * PA_PER_BAR;
    const hi = Math.max(...knees) * PA_PER_BAR;
    return [
      { mode: MODES[0].mode, description: MODES[0].description, law: { knee: lo, ratio: v.ratio }, rearBlocked: false },
      { mode: MODES[1].mode, description: MODES[1].description, law: { knee: hi, ratio: v.ratio }, rearBlocked: false },
    ];
  },
  issues: (v: LoadSensingValve) => {
    const out: ValveIssue[] = [];
    const t = v.knee_bar_at_rear_axle_kg;
    for (let i = 1; i < t.length; i++) {
      if (t[i]![0] <= t[i - 1]![0]) {
        out.push({
          path: ['knee_bar_at_rear_axle_kg', i, 0],
          message: `${t[i]![0]} is not above the previous rear axle load ${t[i - 1]![0]} kg (the table must be sorted by rear axle load, ascending, without repeats)`,
        });
      }
      if (t[i]![1] < t[i - 1]![1]) {
        out.push({
          path: ['knee_bar_at_rear_axle_kg', i, 1],
          message: `${t[i]![1]} bar is below the previous knee ${t[i - 1]![1]} bar (a load-sensing valve gives the rear more pressure with more load: the knee must not fall as the rear axle load rises)`,
        });
      }
    }
    return out;
  },
  tolerances: { knee: true, ratio: true }, // the whole knee table moves together
  start: { ratio: 0.3, 'knee_bar_at_rear_axle_kg[0][0]': 1100, 'knee_bar_at_rear_axle_kg[0][1]': 18, 'knee_bar_at_rear_axle_kg[1][0]': 1900, 'knee_bar_at_rear_axle_kg[1][1]': 42 },
  inputs: [
    RATIO_INPUT,
    {
      kind: 'choice',
      key: 'senses',
      label: 'Valve follows',
      hint: 'a linkage to the axle follows the load transfer while braking; the knee then falls as the rear unloads',
      options: [['', 'suspension travel while braking (default)'], ['dynamic', 'suspension travel while braking'], ['static', 'the rear axle load at rest']],
    },
    { kind: 'table', key: 'knee_bar_at_rear_axle_kg', legend: 'Knee pressure by rear axle load', hint: "Read from the valve's setting chart; linear between rows, held flat outside. Rows ascending by load.", maxRows: 20 },
  ],
});
