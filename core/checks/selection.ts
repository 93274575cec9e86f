/**
 * Which rules a design is checked against: the `--rules` option, else the design's `rules` key, else the default
 * for the category and ABS (core/rules/index.ts). Shared by the regulation checks and the regeneration analysis.
 */
import type { DesignFile } from '../design.ts';
import { defaultRuleSelection, type SelectedRule } from '../rules/index.ts';
import { lightN1Reading, selectDesignRules } from '../rules/light-n1.ts';

export interface RunChecksOptions {
  /** Rule-set or rule ids; overrides the design's `rules` key. */
  rules?: readonly string[];
}

/** The selection in force for a design: option, design key, or the default. */
export function ruleSelection(design: DesignFile, opts: RunChecksOptions = {}): string[] {
  return [...(opts.rules ?? design.rules ?? defaultRuleSelection(design.vehicle.category, design.vehicle.abs))];
}

/** How many rule selections designRules keeps (each a short list of shared rule records). */
export const DESIGN_RULES_CACHE_SIZE = 64;
const designRulesCache = new Map<string, SelectedRule[]>();

/**
 * selectDesignRules(ruleSelection(design, opts), design), kept for the inputs it depends on (the selection, the
 * category and the light-N1 reading), so that the checks and the regeneration analysis of one design, and the
 * next keystroke's design, share one selection. The records are shared: callers must not change them.
 */
export function designRules(design: DesignFile, opts: RunChecksOptions = {}): SelectedRule[] {
  const selection = ruleSelection(design, opts);
  const key = `${selection.join('\u0000')}\u0001${design.vehicle.category}\u0001${lightN1Reading(design)?.words ?? ''}`;
  let rules = designRulesCache.get(key);
  if (!rules) {
    rules = selectDesignRules(selection, design);
    if (designRulesCache.size >= DESIGN_RULES_CACHE_SIZE) designRulesCache.delete(designRulesCache.keys().next().value!);
    designRulesCache.set(key, rules);
  }
  return rules;
}
