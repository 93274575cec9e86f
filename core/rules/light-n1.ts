/**
 * Light N1 vehicles: 71/320/EEC Annex II Appendix point 3.1.1 (and UN R13 Annex 10), from memory — an N1
 * vehicle whose rear-axle load ratio laden/unladen does not exceed 1.5, or whose maximum mass is under
 * 2 t, must meet the M1 lock-order requirement (z 0.15–0.80, with the 0.30–0.45 allowance) instead of
 * the N1 one. Status "memory": verify against the current official text.
 *
 * The ratio is computed from the design's load states: the largest rear axle load of a laden state over
 * the largest of an unladen state (the heaviest unladen state gives the lower, stricter ratio). Without
 * both kinds the ratio is unknown and, as the stricter reading, the M1 requirement is applied.
 */
import type { DesignFile } from '../design.ts';
import { M1_LOCK_BRANCHES } from './eu-appendix.ts';
import { type SelectedRule, selectRules } from './index.ts';
import type { CurveRule } from './rule-types.ts';

export const LIGHT_N1_MAX_REAR_LOAD_RATIO = 1.5;
export const LIGHT_N1_MASS_BELOW_KG = 2000;
const LOCK_ORDER_ID = 'eu-appendix/lock-order';

export interface LightN1Reading {
  /** True when the M1 lock-order requirement applies to this N1 vehicle. */
  light: boolean;
  /** Rear axle load laden / unladen, or null without a laden and an unladen load state. */
  rear_load_ratio: number | null;
  max_mass_kg: number;
  /** Which requirement applies and why, in words. */
  words: string;
}

/** The light-N1 reading of an N1 design; null for any other category. */
export function lightN1Reading(design: DesignFile): LightN1Reading | null {
  if (design.vehicle.category !== 'N1') return null;
  const rear = (kind: string) => {
    const loads = design.load_states.filter((s) => s.kind === kind).map((s) => s.mass_kg - s.front_axle_kg);
    return loads.length ? Math.max(...loads) : null;
  };
  const laden = rear('laden');
  const unladen = rear('unladen');
  const ratio = laden !== null && unladen !== null ? laden / unladen : null;
  const maxMass = design.ratings?.max_mass_kg ?? Math.max(...design.load_states.map((s) => s.mass_kg));
  const massLight = maxMass < LIGHT_N1_MASS_BELOW_KG;
  const ratioLight = ratio === null || ratio <= LIGHT_N1_MAX_REAR_LOAD_RATIO;
  const ratioWords =
    ratio === null
      ? 'the rear-axle load ratio laden/unladen is unknown (no laden and unladen load state), so the stricter M1 requirement is applied'
      : `rear-axle load ratio laden/unladen ${laden!.toFixed(0)}/${unladen!.toFixed(0)} kg = ${ratio.toFixed(2)} ${ratio <= LIGHT_N1_MAX_REAR_LOAD_RATIO ? 'does not exceed' : 'exceeds'} 1.5`;
  const massWords = `maximum mass ${maxMass.toFixed(0)} kg ${massLight ? 'is under' : 'is not under'} 2 t`;
  const light = massLight || ratioLight;
  const words = light
    ? `M1 requirement applied to this N1 vehicle: ${ratioLight ? ratioWords : massWords} (light N1 vehicle, 71/320/EEC Annex II Appendix point 3.1.1, from memory)`
    : `N1 requirement applied: ${ratioWords} and ${massWords}`;
  return { light, rear_load_ratio: ratio, max_mass_kg: maxMass, words };
}

/** The M1 lock-order record standing in for the N1 one on a light N1 vehicle (status memory: the applicability is remembered). */
function lightN1LockRule(n1: CurveRule, reading: LightN1Reading): CurveRule {
  return {
    ...n1,
    source: { document: n1.source.document, paragraph: 'point 3.1.1, M1 requirement (diagram 1A) applied to a light N1 vehicle (from memory)' },
    status: 'memory',
    branches: M1_LOCK_BRANCHES.map((b) => ({ ...b, status: 'memory' as const })),
    note: `${n1.note ?? ''}; ${reading.words}`,
    replaces: n1,
    requirement_words: reading.words,
  };
}

/**
 * selectRules for a design: as selectRules for its category, with the light-N1 substitution of the
 * lock-order requirement. Every place that judges the curves (checks, regeneration, sizing) uses this.
 */
export function selectDesignRules(selection: readonly string[], design: DesignFile): SelectedRule[] {
  const selected = selectRules(selection, design.vehicle.category);
  const reading = lightN1Reading(design);
  return selected.map((x) => {
    if (x.rule.id !== LOCK_ORDER_ID || x.rule.kind !== 'curve' || !x.covers_category || !reading) return x;
    return reading.light ? { ...x, rule: lightN1LockRule(x.rule, reading) } : { ...x, rule: { ...x.rule, requirement_words: reading.words } };
  });
}
