/**
 * Per-category performance figures the hardware checks compare against, read from the `performance`
 * rule set (core/rules/performance.ts) so the figures live in one place:
 *   secondary braking, R13 Rev.4 Annex 4 2.2 [V]: d_m ≥ 2.9 (M1), 2.5 (M2, M3), 2.2 m/s² (N);
 *     foot control force ≤ 500 N (M1) / 700 N (others);
 *   service braking Type-0, engine disconnected, 71/320 Annex II 2.1.1 ≈ R13 Annex 4 2.1.1 [P]:
 *     d_m ≥ 5.8 (M1), 5.0 m/s² (others); pedal force ≤ 500 N (M1) / 700 N (others).
 * (71/320/EEC Annex II 2.1.1 ≈ UN R13 Annex 4 2.1.1, and UN R13 Annex 4 2.2; statuses in docs/sources.md.)
 */
import type { Vehicle } from './design.ts';
import { SECONDARY_FIGURES, SERVICE_FIGURES } from './rules/performance.ts';
import { coreErrors } from './errors.ts';

export interface CategoryFigures {
  /** Secondary-braking mean fully developed deceleration, m/s². */
  secondary_ms2: number;
  /** Foot control force limit for secondary braking, N. */
  secondary_foot_force_n: number;
  secondarySource: string;
  secondaryStatus: 'V' | 'P' | 'M';
  /** Service-brake Type-0 (engine disconnected) mean fully developed deceleration, m/s². */
  service_test_ms2: number;
  /** Service-brake pedal force limit, N. */
  service_foot_force_n: number;
  serviceSource: string;
  serviceStatus: 'V' | 'P' | 'M';
}

const SECONDARY_SOURCE = 'UN R13 Rev.4 Annex 4 2.2 (secondary braking; 70/311 Annex II shows the same figures)';
const SERVICE_SOURCE = '71/320/EEC Annex II 2.1.1 ≈ UN R13 Annex 4 2.1.1 (Type-0, engine disconnected)';

/** The rule-set tables give every category a deceleration; a gap is a programming error. */
function required(v: number | undefined, what: string): number {
  if (v === undefined) throw coreErrors.ruleTable(what);
  return v;
}

export function categoryFigures(category: Vehicle['category']): CategoryFigures {
  const sec = SECONDARY_FIGURES[category];
  const svc = SERVICE_FIGURES[category];
  return {
    secondary_ms2: required(sec.min_deceleration_ms2, `secondary deceleration for ${category}`),
    secondary_foot_force_n: sec.max_pedal_force_n,
    secondarySource: SECONDARY_SOURCE,
    secondaryStatus: 'V',
    service_test_ms2: required(svc.min_deceleration_ms2, `service deceleration for ${category}`),
    service_foot_force_n: svc.max_pedal_force_n,
    serviceSource: SERVICE_SOURCE,
    serviceStatus: 'P',
  };
}
