/**
 * Hot performance after the Type-I heating sequence (UN R13 Annex 4 / R13-H Annex 3, paragraph
 * 1.5.3.1 as quoted in a public clause collection, https://lawinsider.com/clause/hot-performance, which
 * does not name the regulation; figures verified, where they stand partly verified — verify against the
 * current official text): measured like the engine-disconnected
 * Type-0 test, the hot stop must reach at least 80 % of the prescribed deceleration and at least
 * 60 % of the Type-0 (cold) result.
 */
import type { HotRule } from './case-rule-types.ts';
import { SERVICE_FIGURES } from './performance.ts';
import type { Category, DecelerationFigures } from './rule-types.ts';

export const HOT_PRESCRIBED_SHARE = 0.8;
export const HOT_COLD_SHARE = 0.6;

function hotRule(id: string, ruleSet: string, document: string, categories: readonly Category[], figures: DecelerationFigures): HotRule {
  return {
    kind: 'hot',
    id,
    rule_set: ruleSet,
    title: 'Hot performance after the Type-I heating sequence (estimate)',
    source: { document, paragraph: '1.5.3.1 hot performance: ≥ 80 % of the prescribed and ≥ 60 % of the Type-0 figure (paragraph as quoted, regulation not named)' },
    status: 'partial',
    categories,
    load_states: ['laden'],
    note: 'estimate from the brake-heat model: a physical Type-I test must confirm it',
    figures,
    prescribed_share: HOT_PRESCRIBED_SHARE,
    cold_share: HOT_COLD_SHARE,
  };
}

export function performanceHotRules(categories: readonly Category[]): HotRule[] {
  return categories.map((c) => hotRule('performance/hot', 'performance', 'UN R13 Annex 4 (≈ 71/320/EEC Annex II 1.5)', [c], SERVICE_FIGURES[c]));
}

export function r13hHotRule(service: DecelerationFigures): HotRule {
  return hotRule('un-r13h/hot', 'un-r13h', 'UN Regulation No. 13-H, 02 series, Annex 3', ['M1', 'N1'], service);
}
