/**
 * The FMVSS No. 135 lightly loaded vehicle (49 CFR 571.135 S7.2 / S7.4, from memory; verify against the
 * current official text): the unloaded vehicle plus 180 kg for the driver and the test instruments. Whenever
 * a rule of the fmvss135 set is selected it is derived from the `lightly_loaded` block as a load state of
 * kind "unladen" and checked beside the design's own load states by every FMVSS rule that covers unladen
 * states. Without the block those rules get a "not checked" result naming it (never a pass). Axle loads: the
 * added mass m_a at a distance x behind the front axle puts m_a·(1 − x/E) on the front axle; the CG height is
 * the mass-weighted mean h = (m_u·h_u + m_a·h_a)/(m_u + m_a).
 */
import { LIGHTLY_LOADED_ADDED_KG } from '../cases-schema.ts';
import type { DesignFile, LoadState } from '../design.ts';
import type { Rule } from '../rules/rule-types.ts';
import type { SelectedRule } from '../rules/index.ts';
import { type StateModel, stateModel } from '../state-model.ts';
import type { CheckResult } from './check-result.ts';
import { notChecked } from './result-builders.ts';

export const LIGHTLY_LOADED_ID = 'lightly-loaded';

/** The derived load state, or the reason it cannot be made (null block: nothing given). */
export function lightlyLoadedState(design: DesignFile): { state: LoadState } | { missing: string[]; reason: string } {
  const b = design.lightly_loaded;
  if (!b) return { missing: ['lightly_loaded'], reason: 'the lightly loaded vehicle (FMVSS 135) is not checked: give the unloaded vehicle and where the driver and instruments sit (lightly loaded vehicle inputs)' };
  const E = design.vehicle.wheelbase_m;
  const added = b.added_mass_kg ?? LIGHTLY_LOADED_ADDED_KG;
  const mass = b.unloaded_mass_kg + added;
  const front = b.unloaded_front_axle_kg + added * (1 - b.added_behind_front_axle_m / E);
  const h = (b.unloaded_mass_kg * b.unloaded_cg_height_m + added * b.added_height_m) / mass;
  if (!(front > 0 && front < mass) || !(h < E)) {
    return {
      missing: ['lightly_loaded.added_behind_front_axle_m'],
      reason: `the lightly loaded vehicle is not checked: its front axle load (${front.toFixed(0)} kg of ${mass.toFixed(0)} kg) or CG height (${h.toFixed(3)} m) is outside the vehicle; check the position of the added mass`,
    };
  }
  const taken = new Set(design.load_states.map((s) => s.id));
  const id = taken.has(LIGHTLY_LOADED_ID) ? `${LIGHTLY_LOADED_ID}-derived` : LIGHTLY_LOADED_ID;
  return {
    state: {
      id,
      label: `Lightly loaded (FMVSS 135): unloaded vehicle + ${added} kg driver and instruments`,
      kind: 'unladen',
      mass_kg: mass,
      front_axle_kg: front,
      cg_height_m: h,
    },
  };
}

export interface DerivedStates {
  fmvss: boolean;
  llvw: StateModel | null;
  missing: string[];
  reason: string;
}

export function derivedStates(design: DesignFile, selected: readonly SelectedRule[]): DerivedStates {
  const fmvss = selected.some((s) => s.rule.rule_set === 'fmvss135' && s.covers_category);
  if (!fmvss) return { fmvss, llvw: null, missing: [], reason: '' };
  const r = lightlyLoadedState(design);
  if ('state' in r) return { fmvss, llvw: stateModel(design, r.state), missing: [], reason: '' };
  return { fmvss, llvw: null, missing: r.missing, reason: r.reason };
}

function coversUnladen(rule: Rule): boolean {
  return rule.load_states === 'all' || rule.load_states.includes('unladen');
}

function stateWords(s: StateModel, llvwId: string | null): string {
  return s.state.id === llvwId ? `lightly loaded "${s.state.id}" (derived)` : `${s.state.kind} "${s.state.id}"`;
}

export interface DerivedForRule {
  models: StateModel[];
  not_checked: CheckResult[];
  /** Adds "load states used" to the results of the FMVSS lock-sequence rule (out[first..]). */
  annotate(out: CheckResult[], first: number, states: readonly StateModel[]): void;
}

const NOTHING: DerivedForRule = { models: [], not_checked: [], annotate: () => {} };

export function derivedForRule(rule: Rule, d: DerivedStates): DerivedForRule {
  if (!d.fmvss || rule.rule_set !== 'fmvss135' || !coversUnladen(rule)) return NOTHING;
  const llvwId = d.llvw?.state.id ?? null;
  return {
    models: d.llvw ? [d.llvw] : [],
    not_checked: d.llvw ? [] : [notChecked(rule, null, d.missing, d.reason)],
    annotate(out, first, states) {
      if (rule.kind !== 'curve') return;
      const used = `load states used: ${states.map((s) => stateWords(s, llvwId)).join(', ')}${d.llvw ? '' : ' (lightly loaded vehicle not checked)'}`;
      for (let i = first; i < out.length; i++) {
        const c = out[i]!;
        c.note = c.note ? `${c.note}; ${used}` : used;
      }
    },
  };
}
