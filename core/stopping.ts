/**
 * Stopping distance from a speed: reaction distance, brake build-up and the braking distance at the
 * deceleration the surface allows. Estimates only.
 *
 * - Reaction: constant speed for reaction_time_s. Conventions differ (0.67 s, 1.5 s and 2.5 s are all
 *   in use; common practice, no source); default 1.5 s, so set your own.
 * - Build-up: the deceleration rises linearly from 0 to its full value over build_up_time_s. A linear
 *   ramp costs about half its duration at constant speed, so the default (0.72 s for M1, 1.08 s for other
 *   categories) is twice the 0.36 s / 0.54 s that the 0.1·v / 0.15·v terms of the Type-0 stopping-distance
 *   formulas allow (71/320/EEC Annex II 2.1.1, verify against the current official text: s = 0.1v + v²/150
 *   for M1, 0.15v + v²/130 for N1; with v in km/h, 0.1·v m is 0.36 s of travel).
 * - Without ABS: the deceleration at the first lock on that surface (installed distribution, no
 *   regeneration): z_lock·g. A locked axle is taken as the end of controlled braking.
 * - With ABS: utilisation close to the ideal, z = factor·k (default factor 0.9, an assumption: ABS
 *   is taken to use 90 % of the surface's adhesion; from memory, not from a source), never above
 *   rear-axle lift-off.
 */
import type { AxleLoadModel } from './axle-loads.ts';
import { G_N } from './constants.ts';
import type { Vehicle } from './design.ts';
import { type Distribution, segments } from './distribution.ts';
import { firstLock } from './lock-order.ts';

export const STOPPING_DEFAULTS = {
  speeds_kmh: [50, 80, 100],
  reaction_time_s: 1.5,
  abs_adhesion_factor: 0.9,
} as const;

/** Default build-up time: twice the Type-0 formula's 0.1·v (M1) or 0.15·v (others) allowance, s. */
export function defaultBuildUpTime(category: Vehicle['category']): number {
  return category === 'M1' ? 0.72 : 1.08;
}

export interface StopDistances {
  reaction_m: number;
  build_up_m: number;
  braking_m: number;
  total_m: number;
  total_ft: number;
}

/** Distances for a stop from v0 (m/s) at full deceleration a (m/s²). */
export function stopDistances(v0: number, a: number, reactionS: number, buildUpS: number): StopDistances {
  const reaction = v0 * reactionS;
  let buildUp: number;
  let braking: number;
  if (!(a > 0)) {
    buildUp = Infinity;
    braking = Infinity;
  } else if (buildUpS > 0 && v0 <= (a * buildUpS) / 2) {
    // Stops during the ramp: v(t) = v0 − a t²/(2 t_b) reaches 0 at t_s = √(2 v0 t_b / a).
    const ts = Math.sqrt((2 * v0 * buildUpS) / a);
    buildUp = v0 * ts - (a * ts ** 3) / (6 * buildUpS);
    braking = 0;
  } else {
    buildUp = v0 * buildUpS - (a * buildUpS * buildUpS) / 6;
    const v1 = v0 - (a * buildUpS) / 2;
    braking = (v1 * v1) / (2 * a);
  }
  const total = reaction + buildUp + braking;
  return { reaction_m: reaction, build_up_m: buildUp, braking_m: braking, total_m: total, total_ft: total / 0.3048 };
}

export interface StopRow extends StopDistances {
  speed_kmh: number;
  adhesion: number;
  mode: 'no_abs' | 'abs';
  braking_rate: number;
  deceleration_ms2: number;
  /** Axle that limits the stop without ABS (null with ABS). */
  first_axle: string | null;
}

export interface StoppingSetup {
  speedsKmh: readonly number[];
  reactionS: number;
  buildUpS: number;
  absFactor: number;
}

export function stoppingTable(
  loads: AxleLoadModel,
  dist: Distribution,
  adhesions: readonly number[],
  setup: StoppingSetup,
): StopRow[] {
  const rows: StopRow[] = [];
  const segs = segments(dist);
  const locks = adhesions.map((k) => firstLock(loads, dist, k, segs)); // the same for every speed
  for (const kmh of setup.speedsKmh) {
    const v0 = kmh / 3.6;
    for (const [i, k] of adhesions.entries()) {
      const lock = locks[i]!;
      const cases: [StopRow['mode'], number, string | null][] = [
        ['no_abs', lock.braking_rate, lock.first_axle],
        ['abs', Math.min(setup.absFactor * k, loads.zLift), null],
      ];
      for (const [mode, z, axle] of cases) {
        const a = z * G_N;
        // Object.assign rather than a spread: much cheaper on Node 20 for rows built this often.
        rows.push(
          Object.assign(
            { speed_kmh: kmh, adhesion: k, mode, braking_rate: z, deceleration_ms2: a, first_axle: axle },
            stopDistances(v0, a, setup.reactionS, setup.buildUpS),
          ),
        );
      }
    }
  }
  return rows;
}
