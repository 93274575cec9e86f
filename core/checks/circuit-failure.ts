/**
 * Brake systems with part of the hardware out of action, each built as a Distribution so that
 * firstLock and the curve checks work on it unchanged:
 *  - front/rear split, one circuit failed: front brakes only (G2 = 0) or rear brakes only (G1 = 0,
 *    the rear valve still acting on the rear line);
 *  - diagonal split, one circuit failed: one front and the opposite rear wheel, i.e. half of each
 *    axle's braking force (G1/2, G2/2). Each braked wheel carries half its axle's dynamic load, so it
 *    locks when (T_i/2) reaches k·N_i/2; with axle forces T_i/2 in the Distribution that is
 *    T_i/2 ≥ (k/2)·N_i, i.e. the first lock on adhesion k is firstLock(…, k/2). The yaw moment of
 *    the one-sided braking is not modelled.
 * Also: the braking rate a master-cylinder pressure gives, and the pressure a braking rate needs.
 */
import type { Distribution } from '../distribution.ts';
import { dynamicSensingDistribution, installedDistribution } from '../installed-distribution.ts';
import type { StateModel } from '../state-model.ts';

export type CircuitCase = 'front_circuit_only' | 'rear_circuit_only' | 'one_diagonal';

export function circuitCases(split: 'front_rear' | 'diagonal'): CircuitCase[] {
  return split === 'diagonal' ? ['one_diagonal'] : ['front_circuit_only', 'rear_circuit_only'];
}

/**
 * The failed-circuit distributions already built per load-state model and case: the service, secondary, residual,
 * hot and failure-mode checks of one evaluation ask for the same ones. Kept with the figures they were built from
 * and rebuilt should any of them have changed; at most three per model (one per case).
 */
const failedMemo = new WeakMap<StateModel, Map<CircuitCase, { inputs: readonly unknown[]; d: Distribution }>>();

function failedInputs(s: StateModel): readonly unknown[] {
  return [s.G1, s.G2, s.loads.P, s.threshold1, s.threshold2, s.sensing, s.valve];
}

/** The distribution with one circuit failed. Shared between callers (kept per model): do not change it. */
export function failedCircuitDistribution(s: StateModel, which: CircuitCase): Distribution {
  let perCase = failedMemo.get(s);
  const inputs = failedInputs(s);
  const kept = perCase?.get(which);
  if (kept && kept.inputs.every((x, i) => x === inputs[i])) return kept.d;
  const d = buildFailedCircuit(s, which);
  if (!perCase) failedMemo.set(s, (perCase = new Map()));
  perCase.set(which, { inputs, d });
  return d;
}

function buildFailedCircuit(s: StateModel, which: CircuitCase): Distribution {
  const G1 = which === 'rear_circuit_only' ? 0 : which === 'one_diagonal' ? s.G1 / 2 : s.G1;
  const G2 = which === 'front_circuit_only' ? 0 : which === 'one_diagonal' ? s.G2 / 2 : s.G2;
  const axles = { P: s.loads.P, G1, G2, threshold1: s.threshold1, threshold2: s.threshold2 };
  // a travel-sensing valve follows the (smaller) load transfer of the weaker stop too
  const d = s.sensing && G2 > 0 ? dynamicSensingDistribution(axles, s.sensing) : installedDistribution({ ...axles, valve: s.valve });
  return d;
}

/** Adhesion to pass to firstLock so that it finds the lock of the braked wheels on a surface of adhesion k. */
export function lockAdhesionFor(which: CircuitCase | 'intact', k: number): number {
  return which === 'one_diagonal' ? k / 2 : k;
}

/** Braking rate produced by master-cylinder pressure p (Pa): the distribution read backwards along its pressure column. */
export function brakingRateAtPressure(d: Distribution, p: number): number {
  const ps = d.p;
  if (!ps || !(p > 0)) return 0;
  let j = 0;
  while (j < ps.length - 2 && p > ps[j + 1]!) j++;
  const p0 = ps[j]!;
  const p1 = ps[j + 1]!;
  const z = d.z[j]! + ((d.z[j + 1]! - d.z[j]!) * (p - p0)) / (p1 - p0);
  return Math.max(0, z);
}

/**
 * Master-cylinder pressure needed for braking rate z, Pa: the lowest pressure that reaches z, read
 * along the pressure column (extrapolated on the last piece); NaN when the brakes never reach z
 * (e.g. the rear line held at a limiting valve's knee with the front circuit failed) or the
 * distribution carries no pressures.
 */
export function pressureAtBrakingRate(d: Distribution, z: number): number {
  const ps = d.p;
  if (!ps) return NaN;
  if (!(z > 0)) return 0;
  const n = d.z.length;
  for (let j = 0; j + 1 < n; j++) {
    const z0 = d.z[j]!;
    const z1 = d.z[j + 1]!;
    if (!(z1 > z0)) continue;
    if (z <= z1 || j + 2 === n) return ps[j]! + ((ps[j + 1]! - ps[j]!) * (z - z0)) / (z1 - z0);
  }
  return NaN;
}
