/**
 * UN R13-H cases beyond Annex 5 and the Annex 3 figures (UN R13-H 02 series, OJ L 2026/502; all from memory,
 * verify against the current official text, except the regeneration category names A and B, which
 * are verified in the hot-performance clause 1.5.3.1 and the 2012 GRRF-72-02 proposal):
 *   regeneration category B (part of the service brake) must keep the Annex 5 distribution rules with
 *   the regeneration acting; a failure that changes the distribution must be signalled to the driver;
 *   M1 vehicles must have antilock; M1 and N1 vehicles must have stability control (from memory).
 */
import type { RegenCategoryRule, SystemFittedRule } from './case-rule-types.ts';

const DOC = 'UN Regulation No. 13-H, 02 series';

export const r13hRegenRules: RegenCategoryRule[] = [
  {
    kind: 'regen_distribution',
    id: 'un-r13h/regen-distribution',
    rule_set: 'un-r13h',
    title: 'Regeneration category B: distribution rules kept with regeneration acting',
    source: { document: DOC, paragraph: '5.2 provisions on electric regenerative braking, category B (paragraph not read; from memory)' },
    status: 'memory',
    categories: ['M1', 'N1'],
    load_states: 'all',
    note: 'the Annex 5 curve rules evaluated with the largest regenerative force on the driven axle',
  },
  {
    kind: 'regen_failure_warning',
    id: 'un-r13h/regen-failure-warning',
    rule_set: 'un-r13h',
    title: 'Regeneration: a failure that changes the distribution is signalled',
    source: { document: DOC, paragraph: '5.2 provisions on electric regenerative braking, failure warning (paragraph not read; from memory)' },
    status: 'memory',
    categories: ['M1', 'N1'],
    load_states: 'all',
  },
];

export const r13hSystemRules: SystemFittedRule[] = [
  {
    kind: 'system_fitted',
    system: 'abs',
    id: 'un-r13h/antilock-fitted',
    rule_set: 'un-r13h',
    title: 'Antilock fitted and working (M1)',
    source: { document: DOC, paragraph: '5.2 antilock for category M1 (paragraph not read; from memory)' },
    status: 'memory',
    categories: ['M1'],
    load_states: 'all',
  },
  {
    kind: 'system_fitted',
    system: 'esc',
    id: 'un-r13h/stability-control-fitted',
    rule_set: 'un-r13h',
    title: 'Stability control fitted and working (M1, N1)',
    source: { document: DOC, paragraph: 'Annex 9 electronic stability control and its application dates (from memory; verify the dates that apply to the vehicle)' },
    status: 'memory',
    categories: ['M1', 'N1'],
    load_states: 'all',
  },
];
