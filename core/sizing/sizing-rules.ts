/**
 * Which curve rules the sizing assistant works to, and on which load states: the design's rule
 * selection (or the default one), the record for its vehicle category, the load-state kinds the rule
 * names, and its mass limit (laden mass above max_mass_kg: not covered). Lock-order rules that ABS
 * exempts are kept: a design is sized for the ABS-failed vehicle too (the caution says so).
 */
import type { DesignFile, LoadState } from '../design.ts';
import { defaultRuleSelection } from '../rules/index.ts';
import { selectDesignRules } from '../rules/light-n1.ts';
import type { CurveRule, DecelerationRule } from '../rules/rule-types.ts';
import { type CompiledRule, compileRule } from './rule-margin.ts';

export interface SizingRule {
  compiled: CompiledRule;
  /** Indices into design.load_states of the states the rule covers. */
  states: number[];
}

export function sizingRuleSelection(design: DesignFile, override?: readonly string[]): string[] {
  return [...(override ?? design.rules ?? defaultRuleSelection(design.vehicle.category, design.vehicle.abs))];
}

function coversState(rule: CurveRule | DecelerationRule, s: LoadState): boolean {
  return rule.load_states === 'all' || rule.load_states.includes(s.kind);
}

function withinMass(rule: CurveRule | DecelerationRule, design: DesignFile): boolean {
  if (rule.max_mass_kg === undefined) return true;
  return Math.max(...design.load_states.map((s) => s.mass_kg)) <= rule.max_mass_kg;
}

export function sizingCurveRules(design: DesignFile, selection?: readonly string[]): SizingRule[] {
  const out: SizingRule[] = [];
  for (const { rule, covers_category } of selectDesignRules(sizingRuleSelection(design, selection), design)) {
    if (rule.kind !== 'curve' || !covers_category || !withinMass(rule, design)) continue;
    const states = design.load_states.flatMap((s, i) => (coversState(rule, s) ? [i] : []));
    if (states.length > 0) out.push({ compiled: compileRule(rule), states });
  }
  return out;
}

/** The service-braking rule of the selection for the design's category (the pedal-force target), or null. */
export function serviceRule(design: DesignFile, selection?: readonly string[]): DecelerationRule | null {
  for (const { rule, covers_category } of selectDesignRules(sizingRuleSelection(design, selection), design)) {
    if (rule.kind === 'service' && covers_category && withinMass(rule, design)) return rule;
  }
  return null;
}
