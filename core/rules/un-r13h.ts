/**
 * Rule set `un-r13h`: UN Regulation 13-H (M1 and N1), 02 series (OJ L 2026/502). Annex 5 carries
 * over the 71/320 Appendix logic; the detailed paragraphs could not be read, so the curve rules are
 * "partial" (structure seen in a closely related text) and the efficiency coefficient and the Annex 3
 * figures are "memory" (from memory: Annex 5 point 3.1.1 and the Annex 3 figures; verify against the
 * current official text).
 */
import { EFFICIENCY_BRANCHES, M1_LOCK_BRANCHES, N1_LOCK_BRANCHES } from './eu-appendix.ts';
import type { Branch, CurveRule, RuleSet } from './rule-types.ts';
import type { DecelerationRule, ParkingRule } from './rule-types.ts';

const DOC = 'UN Regulation No. 13-H, 02 series';

/** The same branches, each at most as certain as the R13-H text itself ("partial"). */
function asPartial(branches: readonly Branch[], status: Branch['status']): Branch[] {
  return branches.map((b) => ({ ...b, status }));
}

function lockRule(category: 'M1' | 'N1', branches: readonly Branch[]): CurveRule {
  return {
    kind: 'curve',
    id: 'un-r13h/lock-order',
    rule_set: 'un-r13h',
    title: 'Front axle locks first (front curve above rear)',
    source: { document: DOC, paragraph: `Annex 5, point 3.1.1, ${category} requirement (numbering as in 71/320; not read)` },
    status: 'partial',
    categories: [category],
    load_states: 'all',
    abs_exempt: true,
    note: 'margin = front minus rear adhesion utilisation (adhesion units) on the branch that decided',
    branches: asPartial(branches, 'partial'),
  };
}

const service: DecelerationRule = {
  kind: 'service',
  id: 'un-r13h/service',
  rule_set: 'un-r13h',
  title: 'Service braking, Type-0 engine disconnected',
  source: { document: DOC, paragraph: 'Annex 3, Type-0 test (paragraph not read)' },
  status: 'memory',
  categories: ['M1', 'N1'],
  load_states: 'all',
  figures: { speed_kmh: 100, min_deceleration_ms2: 6.43, max_pedal_force_n: 500, min_pedal_force_n: 65, distance: { v_coeff: 0.1, v2_coeff: 0.006 } },
};

const secondary: DecelerationRule = {
  kind: 'secondary',
  id: 'un-r13h/secondary',
  rule_set: 'un-r13h',
  title: 'Service-transmission failure (one circuit failed)',
  source: { document: DOC, paragraph: 'Annex 3, failure of the service-braking transmission (paragraph not read)' },
  status: 'memory',
  categories: ['M1', 'N1'],
  load_states: 'all',
  figures: { speed_kmh: 100, min_deceleration_ms2: 2.44, max_pedal_force_n: 650, distance: { v_coeff: 0.1, v2_coeff: 0.0158 } },
};

const parking: ParkingRule = {
  kind: 'parking',
  id: 'un-r13h/parking',
  rule_set: 'un-r13h',
  title: 'Parking brake holds the laden vehicle on 20 %',
  source: { document: DOC, paragraph: 'Annex 3, parking-braking test (paragraph not read)' },
  status: 'memory',
  categories: ['M1', 'N1'],
  load_states: ['laden'],
  gradient_pct: 20,
  max_hand_force_n: 400,
  max_foot_force_n: 500,
};

export const unR13h: RuleSet = {
  id: 'un-r13h',
  title: 'UN R13-H (M1, N1): Annex 5 distribution of braking, Annex 3 performance',
  rules: [
    {
      kind: 'curve',
      id: 'un-r13h/efficiency',
      rule_set: 'un-r13h',
      title: 'Braking efficiency line',
      source: { document: DOC, paragraph: 'Annex 5, point 3.1.1 (coefficient 0.85 as in 71/320; 0.85 vs 0.7 not verified)' },
      status: 'memory',
      categories: ['M1', 'N1'],
      load_states: 'all',
      abs_exempt: true,
      note: 'margin = limit line minus the higher adhesion utilisation (adhesion units)',
      branches: asPartial(EFFICIENCY_BRANCHES, 'memory'),
    },
    lockRule('M1', M1_LOCK_BRANCHES),
    lockRule('N1', N1_LOCK_BRANCHES),
    service,
    secondary,
    parking,
  ],
};
