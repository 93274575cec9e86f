/**
 * Rule set `performance`: braking-performance figures of 71/320/EEC Annex II and UN R13 Annex 4
 * per vehicle category: service braking Type-0 engine disconnected (71/320/EEC Annex II 2.1.1,
 * partly verified: the same figures are tabulated in Dir. 70/311/EEC Annex II), secondary braking
 * (R13 Rev.4 Annex 4 para 2.2, verified), booster failure compared with the secondary figures (from
 * memory) and parking on 18 % (from memory); verify against the current official text.
 * Distances: s ≤ a·v + b·v² with v in km/h (e.g. M1 0.1v + v²/150).
 */
import type { Category, DecelerationFigures, DecelerationRule, ParkingRule, Rule, RuleSet } from './rule-types.ts';

const SERVICE_DOC = '71/320/EEC Annex II (≈ UN R13 Annex 4)';
const SECONDARY_DOC = 'UN R13 Rev.4 Annex 4';

/** Service braking, Type-0 engine disconnected (71/320 Annex II 2.1.1; values also in 70/311 Annex II). */
export const SERVICE_FIGURES: Record<Category, DecelerationFigures> = {
  M1: { speed_kmh: 80, min_deceleration_ms2: 5.8, max_pedal_force_n: 500, distance: { v_coeff: 0.1, v2_coeff: 1 / 150 } },
  M2: { speed_kmh: 60, min_deceleration_ms2: 5.0, max_pedal_force_n: 700, distance: { v_coeff: 0.15, v2_coeff: 1 / 130 } },
  M3: { speed_kmh: 60, min_deceleration_ms2: 5.0, max_pedal_force_n: 700, distance: { v_coeff: 0.15, v2_coeff: 1 / 130 } },
  N1: { speed_kmh: 80, min_deceleration_ms2: 5.0, max_pedal_force_n: 700, distance: { v_coeff: 0.15, v2_coeff: 1 / 130 } },
  N2: { speed_kmh: 60, min_deceleration_ms2: 5.0, max_pedal_force_n: 700, distance: { v_coeff: 0.15, v2_coeff: 1 / 130 } },
  N3: { speed_kmh: 60, min_deceleration_ms2: 5.0, max_pedal_force_n: 700, distance: { v_coeff: 0.15, v2_coeff: 1 / 130 } },
};

/** Secondary braking (R13 Rev.4 Annex 4 para 2.2): foot control ≤ 500 N (M1) / 700 N (others). */
export const SECONDARY_FIGURES: Record<Category, DecelerationFigures> = {
  M1: { speed_kmh: 80, min_deceleration_ms2: 2.9, max_pedal_force_n: 500, distance: { v_coeff: 0.1, v2_coeff: 2 / 150 } },
  M2: { speed_kmh: 60, min_deceleration_ms2: 2.5, max_pedal_force_n: 700, distance: { v_coeff: 0.15, v2_coeff: 2 / 130 } },
  M3: { speed_kmh: 60, min_deceleration_ms2: 2.5, max_pedal_force_n: 700, distance: { v_coeff: 0.15, v2_coeff: 2 / 130 } },
  N1: { speed_kmh: 70, min_deceleration_ms2: 2.2, max_pedal_force_n: 700, distance: { v_coeff: 0.15, v2_coeff: 2 / 115 } },
  N2: { speed_kmh: 50, min_deceleration_ms2: 2.2, max_pedal_force_n: 700, distance: { v_coeff: 0.15, v2_coeff: 2 / 115 } },
  N3: { speed_kmh: 40, min_deceleration_ms2: 2.2, max_pedal_force_n: 700, distance: { v_coeff: 0.15, v2_coeff: 2 / 115 } },
};

/** Parking braking (71/320 / R13, from memory): 18 %, hand ≤ 400 N (M1) / 600 N, foot ≤ 500 N (M1) / 700 N. */
export const PARKING_FIGURES = { gradient_pct: 18, hand: { M1: 400, other: 600 }, foot: { M1: 500, other: 700 } } as const;

const CATEGORIES: readonly Category[] = ['M1', 'M2', 'M3', 'N1', 'N2', 'N3'];

function perCategory(c: Category): Rule[] {
  const service: DecelerationRule = {
    kind: 'service',
    id: 'performance/service',
    rule_set: 'performance',
    title: 'Service braking, Type-0 engine disconnected',
    source: { document: SERVICE_DOC, paragraph: '2.1.1 (Type-0, engine disconnected)' },
    status: 'partial',
    categories: [c],
    load_states: 'all',
    figures: SERVICE_FIGURES[c],
  };
  const secondary: DecelerationRule = {
    kind: 'secondary',
    id: 'performance/secondary',
    rule_set: 'performance',
    title: 'Secondary braking: one hydraulic circuit failed',
    source: { document: SECONDARY_DOC, paragraph: 'para 2.2 (secondary braking)' },
    status: 'verified',
    categories: [c],
    load_states: 'all',
    figures: SECONDARY_FIGURES[c],
  };
  const booster: DecelerationRule = {
    kind: 'booster_failure',
    id: 'performance/booster-failure',
    rule_set: 'performance',
    title: 'Booster failure (no assist) against the secondary figure',
    source: { document: SECONDARY_DOC, paragraph: 'para 2.2 figures applied to a failed booster (requirement from memory)' },
    status: 'memory',
    categories: [c],
    load_states: 'all',
    figures: SECONDARY_FIGURES[c],
  };
  const parking: ParkingRule = {
    kind: 'parking',
    id: 'performance/parking',
    rule_set: 'performance',
    title: 'Parking brake holds the laden vehicle on 18 %',
    source: { document: SERVICE_DOC, paragraph: 'parking-braking requirements (paragraph not identified)' },
    status: 'memory',
    categories: [c],
    load_states: ['laden'],
    gradient_pct: PARKING_FIGURES.gradient_pct,
    max_hand_force_n: c === 'M1' ? PARKING_FIGURES.hand.M1 : PARKING_FIGURES.hand.other,
    max_foot_force_n: c === 'M1' ? PARKING_FIGURES.foot.M1 : PARKING_FIGURES.foot.other,
  };
  return [service, secondary, booster, parking];
}

export const performance: RuleSet = {
  id: 'performance',
  title: '71/320/EEC Annex II / UN R13 Annex 4: service, secondary and parking performance',
  rules: CATEGORIES.flatMap(perCategory),
};
