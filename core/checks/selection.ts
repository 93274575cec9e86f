/**
 * Which rules a design is checked against: the `--rules` option, else the design's `rules` key, else the default
 * for the category and ABS (core/rules/index.ts). Shared by the regulation checks and the regeneration analysis.
 */
import type { DesignFile } from '../design.ts';
import { defaultRuleSelection } from '../rules/index.ts';

export interface RunChecksOptions {
  /** Rule-set or rule ids; overrides the design's `rules` key. */
  rules?: readonly string[];
}

/** The selection in force for a design: option, design key, or the default. */
export function ruleSelection(design: DesignFile, opts: RunChecksOptions = {}): string[] {
  return [...(opts.rules ?? design.rules ?? defaultRuleSelection(design.vehicle.category, design.vehicle.abs))];
}
