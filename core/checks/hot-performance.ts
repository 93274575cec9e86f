/**
 * Hot performance after the Type-I heating sequence, an estimate (rule: core/rules/hot.ts).
 *
 * 1. Heating: the Type-I run of core/brake-heat.ts on the laden load state (heaviest laden): v1 = 80 %
 *    of the maximum speed capped per category, v2 = v1/2, braking at 3 m/s², the category's cycle time
 *    and count, lumped cooling (71/320/EEC Annex II 1.3). The rotor temperature at the end of the last
 *    heating braking, T_front and T_rear, is taken for the hot stop.
 * 2. Pad friction when hot: the design's factor table (heat.hot_friction_factor_at_c, pairs of
 *    temperature °C and factor on the cold pad friction), read piecewise-linearly and held flat beyond
 *    its ends; without it the rough default HOT_FRICTION_DEFAULT (from memory). Each axle's brake gain is
 *    multiplied by its factor (for a drum brake the brake factor is taken to scale with the lining
 *    friction, which understates the fade of a leading-shoe drum).
 * 3. Hot stop: as the Type-0 test (engine disconnected, the rule's figures), with the hot gains: the
 *    deceleration at the pedal-force limit, capped by the first wheel lock on the test surface (by the
 *    surface adhesion with antilock working), exactly as the service check. Cold stop: the same with
 *    the cold gains.
 * 4. Verdict: a_hot ≥ max(prescribed_share · a_prescribed, cold_share · a_cold).
 */
import { heatSetup, fadeRun, typeIParameters, typeIStartSpeedKmh, typeIState } from '../brake-heat.ts';
import type { DesignFile } from '../design.ts';
import { installedDistribution } from '../installed-distribution.ts';
import type { HotRule } from '../rules/case-rule-types.ts';
import type { StateModel } from '../state-model.ts';
import { type CheckResult } from './check-result.ts';
// Object.assign rather than object spread below: on Node 20 a spread of a result-sized object costs far more (bench/evaluate.ts).
import { asDecelerationRule, decelerationCheck, notChecked } from './result-builders.ts';
import { checkDeceleration, DECELERATION_TOLERANCE, requiredDeceleration } from './performance-check.ts';

/**
 * Rough pad-friction factor against rotor temperature for a road pad, from memory (no source): full
 * friction to about 300 °C, falling to 0.85 at 450 °C, 0.65 at 600 °C and 0.5 at 750 °C. State the pad
 * maker's fade data in heat.hot_friction_factor_at_c instead.
 */
export const HOT_FRICTION_DEFAULT: readonly (readonly [number, number])[] = [
  [300, 1],
  [450, 0.85],
  [600, 0.65],
  [750, 0.5],
];

/** The factor at temperature t from a table sorted by temperature (flat beyond the ends). */
export function frictionFactorAt(table: readonly (readonly [number, number])[], t: number): number {
  const first = table[0]!;
  const last = table[table.length - 1]!;
  if (t <= first[0]) return first[1];
  if (t >= last[0]) return last[1];
  let j = 0;
  while (t > table[j + 1]![0]) j++;
  const [t0, f0] = table[j]!;
  const [t1, f1] = table[j + 1]!;
  return f0 + ((f1 - f0) * (t - t0)) / (t1 - t0);
}

/** The load state with both axles' brake gains scaled by their hot friction factors. */
export function hotStateModel(s: StateModel, frontFactor: number, rearFactor: number): StateModel {
  const G1 = s.G1 * frontFactor;
  const G2 = s.G2 * rearFactor;
  const dist = installedDistribution({ P: s.loads.P, G1, G2, threshold1: s.threshold1, threshold2: s.threshold2, valve: s.valve });
  if (s.rearMasterRatio !== 1 && dist.p2) dist.p2 = dist.p2.map((q) => q * s.rearMasterRatio); // real rear line pressure (balance bar)
  return Object.assign({}, s, { G1, G2, dist });
}

export function hotPerformanceResults(design: DesignFile, rule: HotRule, states: readonly StateModel[]): CheckResult[] {
  const h = design.heat;
  if (!h) {
    return [notChecked(rule, null, ['heat.front_rotor_kg', 'heat.rear_rotor_kg'], 'not checked: give the front and rear rotor (or drum) masses (brake heat inputs) for the heating sequence', 'hot_brakes')];
  }
  const s = typeIState(states);
  const setup = heatSetup(h);
  const cat = design.vehicle.category;
  const t = typeIParameters(cat);
  const v1Kmh = typeIStartSpeedKmh(cat, h.max_speed_kmh);
  const run = fadeRun(s.state.id, s.state.mass_kg, s.dist, v1Kmh / 3.6, v1Kmh / 7.2, t.intervalS, t.cycles, setup);
  const table = h.hot_friction_factor_at_c ?? HOT_FRICTION_DEFAULT;
  const ff = frictionFactorAt(table, run.front_final_peak_c);
  const fr = frictionFactorAt(table, run.rear_final_peak_c);
  const as = asDecelerationRule(rule, rule.figures, 'service');
  const cold = checkDeceleration(design, s, as, null);
  const hot = checkDeceleration(design, hotStateModel(s, ff, fr), as, null);
  const aCold = cold.details.deceleration_ms2 as number;
  const aHot = hot.details.deceleration_ms2 as number;
  const prescribed = requiredDeceleration(rule.figures).required_ms2;
  const need = Math.max(rule.prescribed_share * prescribed, rule.cold_share * aCold);
  const margin = aHot - need;
  const factorWords = h.hot_friction_factor_at_c ? 'pad friction factors from the design' : 'rough default pad fade from memory; state the pad maker\'s fade data';
  const note =
    `estimate, a Type-I test must confirm it: after ${t.cycles} brakings from ${v1Kmh.toFixed(0)} to ${(v1Kmh / 2).toFixed(0)} km/h the rotors reach about ` +
    `${run.front_final_peak_c.toFixed(0)} °C front and ${run.rear_final_peak_c.toFixed(0)} °C rear; pad friction × ${ff.toFixed(2)} front, × ${fr.toFixed(2)} rear (${factorWords}); ` +
    `hot stop ${aHot.toFixed(2)} m/s² against ${need.toFixed(2)} m/s² (${Math.round(rule.prescribed_share * 100)} % of the prescribed ${prescribed.toFixed(2)}, ` +
    `${Math.round(rule.cold_share * 100)} % of the cold ${aCold.toFixed(2)}); hot stop ${hot.note}`;
  const r = decelerationCheck(rule, s.state.id, 'hot_brakes', hot, rule.status);
  return [
    Object.assign(r, {
      passed: margin >= -DECELERATION_TOLERANCE,
      worst_margin: margin,
      note,
      details: Object.assign({}, hot.details, {
        estimate: true,
        front_rotor_end_c: run.front_final_peak_c,
        rear_rotor_end_c: run.rear_final_peak_c,
        front_friction_factor: ff,
        rear_friction_factor: fr,
        friction_factor_source: h.hot_friction_factor_at_c ? 'design' : 'default_from_memory',
        cold_deceleration_ms2: aCold,
        prescribed_deceleration_ms2: prescribed,
        hot_required_ms2: need,
        hot_deceleration_ms2: aHot,
      }),
    }),
  ];
}
