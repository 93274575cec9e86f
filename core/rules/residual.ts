/**
 * Residual braking after failure of part of the service-braking transmission (71/320/EEC Annex II
 * 2.1.4 / UN R13 Annex 4; verify against the current official text): the service control must still give
 *   laden   d_m ≥ 1.7 (M1), 1.5 (M2, M3), 1.3 m/s² (N)   — shown in 70/311 Annex II, partly verified;
 *   unladen d_m ≥ 1.5 (M1), 1.3 (M2, M3), 1.1 m/s² (N)   — from memory;
 * distances 0.1v + (100/30)·v²/150 laden and 0.1v + (100/25)·v²/150 unladen for M1, with 0.15v and
 * v²/130 (M2, M3) or v²/115 (N) for the others, control force ≤ 700 N, from memory. Test speeds as for
 * secondary braking (M1 80, M2/M3 60, N1 70, N2 50, N3 40 km/h; from memory).
 */
import type { ResidualRule } from './case-rule-types.ts';
import type { Category, DecelerationFigures } from './rule-types.ts';

const DOC = '71/320/EEC Annex II (≈ UN R13 Annex 4)';

function figures(speed: number, vCoeff: number, base: number, share: number, decel: number): DecelerationFigures {
  return { speed_kmh: speed, min_deceleration_ms2: decel, max_pedal_force_n: 700, distance: { v_coeff: vCoeff, v2_coeff: share / base } };
}

/** Laden and unladen residual figures per category. */
export const RESIDUAL_FIGURES: Record<Category, { laden: DecelerationFigures; unladen: DecelerationFigures }> = {
  M1: { laden: figures(80, 0.1, 150, 100 / 30, 1.7), unladen: figures(80, 0.1, 150, 100 / 25, 1.5) },
  M2: { laden: figures(60, 0.15, 130, 100 / 30, 1.5), unladen: figures(60, 0.15, 130, 100 / 25, 1.3) },
  M3: { laden: figures(60, 0.15, 130, 100 / 30, 1.5), unladen: figures(60, 0.15, 130, 100 / 25, 1.3) },
  N1: { laden: figures(70, 0.15, 115, 100 / 30, 1.3), unladen: figures(70, 0.15, 115, 100 / 25, 1.1) },
  N2: { laden: figures(50, 0.15, 115, 100 / 30, 1.3), unladen: figures(50, 0.15, 115, 100 / 25, 1.1) },
  N3: { laden: figures(40, 0.15, 115, 100 / 30, 1.3), unladen: figures(40, 0.15, 115, 100 / 25, 1.1) },
};

export function residualRules(categories: readonly Category[]): ResidualRule[] {
  return categories.map((c) => ({
    kind: 'residual',
    id: 'performance/residual',
    rule_set: 'performance',
    title: 'Residual braking: part of the service transmission failed, service control',
    source: { document: DOC, paragraph: '2.1.4 (residual braking; laden decelerations as in 70/311 Annex II, unladen figures and distances from memory)' },
    status: 'partial',
    categories: [c],
    load_states: 'all',
    note: 'laden figures for laden and other load states, unladen figures for unladen ones',
    laden: RESIDUAL_FIGURES[c].laden,
    unladen: RESIDUAL_FIGURES[c].unladen,
    unladen_status: 'memory',
  }));
}
