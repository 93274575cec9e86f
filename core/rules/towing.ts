/**
 * Towing (71/320/EEC and UN R13 / R13-H Annex 3 parking provisions, from memory; verify against the
 * current official text): the parking brake of a vehicle allowed to tow must hold
 * the combination on 12 % up and down (71/320 / R13; R13-H likewise), with the control forces of the
 * solo parking test; and the combination's service braking with the trailer's nose load on the hitch
 * and, for an unbraked trailer, the trailer's mass to stop. The combination service requirement is
 * taken, stricter reading, as the towing vehicle's own Type-0 figure (from memory).
 */
import type { CombinationParkingRule, TowingServiceRule } from './case-rule-types.ts';
import { PARKING_FIGURES, SERVICE_FIGURES } from './performance.ts';
import type { Category } from './rule-types.ts';

export const COMBINATION_GRADIENT_PCT = 12;

const EU_DOC = '71/320/EEC Annex II (≈ UN R13 Annex 4)';
const R13H_DOC = 'UN Regulation No. 13-H, 02 series';

export function performanceTowingRules(categories: readonly Category[]): (TowingServiceRule | CombinationParkingRule)[] {
  return categories.flatMap((c): (TowingServiceRule | CombinationParkingRule)[] => [
    {
      kind: 'towing_service',
      id: 'performance/towing-service',
      rule_set: 'performance',
      title: 'Service braking when towing: nose load on the hitch, unbraked trailer mass to stop',
      source: { document: EU_DOC, paragraph: 'service braking of a towing vehicle with its trailer (paragraph not identified; solo Type-0 figure applied, from memory)' },
      status: 'memory',
      categories: [c],
      load_states: ['laden'],
      figures: SERVICE_FIGURES[c],
    },
    {
      kind: 'combination_parking',
      id: 'performance/parking-combination',
      rule_set: 'performance',
      title: 'Parking brake holds the combination on 12 %',
      source: { document: EU_DOC, paragraph: 'parking braking of a vehicle allowed to tow a trailer (paragraph not identified; 12 % from memory)' },
      status: 'memory',
      categories: [c],
      load_states: ['laden'],
      gradient_pct: COMBINATION_GRADIENT_PCT,
      max_hand_force_n: c === 'M1' ? PARKING_FIGURES.hand.M1 : PARKING_FIGURES.hand.other,
      max_foot_force_n: c === 'M1' ? PARKING_FIGURES.foot.M1 : PARKING_FIGURES.foot.other,
    },
  ]);
}

export const r13hCombinationParking: CombinationParkingRule = {
  kind: 'combination_parking',
  id: 'un-r13h/parking-combination',
  rule_set: 'un-r13h',
  title: 'Parking brake holds the combination on 12 %',
  source: { document: R13H_DOC, paragraph: 'Annex 3, parking-braking test, combination gradient (paragraph not read; from memory)' },
  status: 'memory',
  categories: ['M1', 'N1'],
  load_states: ['laden'],
  gradient_pct: COMBINATION_GRADIENT_PCT,
  max_hand_force_n: 400,
  max_foot_force_n: 500,
};
