/**
 * Selecting and running rule sets (core/checks/run-checks.ts, core/rules/index.ts):
 * category → default selection, the design's `rules` key and the --rules option, the ABS exemption
 * (71/320/EEC Annex II Appendix point 1 with Annex X, held as partial [P]) and the exit rule.
 * Designs from test/core/checks/fixed-split.ts.
 */
import { describe, expect, it } from 'vitest';
import { failedChecks } from '../../../core/checks/check-result.ts';
import { ruleSelection, runChecks } from '../../../core/checks/run-checks.ts';
import { evaluate, stateModels } from '../../../core/evaluate.ts';
import { defaultRuleSelection, RULE_SELECTORS, selectRules } from '../../../core/rules/index.ts';
import { readDesign } from '../../../core/validate.ts';
import { splitDesign } from './fixed-split.ts';

describe('default rule selection follows category and ABS', () => {
  it('every category gets the 71/320 Appendix and the performance set; the lock-order variant follows the category', () => {
    for (const c of ['M1', 'M2', 'M3', 'N1', 'N2', 'N3'] as const) expect(defaultRuleSelection(c, false)).toEqual(['eu-appendix', 'performance']);
    const para = (c: 'M1' | 'N1' | 'N3') => selectRules(['eu-appendix'], c).find((s) => s.rule.id === 'eu-appendix/lock-order')!.rule.source.paragraph;
    expect(para('M1')).toMatch(/M1 requirement/); // point 3.1.1, diagram 1A
    expect(para('N1')).toMatch(/N1 requirement/); // point 3.1.1, footnote (2), diagram 1C
    expect(para('N3')).toMatch(/other categories/); // point 3.1.1, diagram 1B
  });

  it('the option overrides the design key, which overrides the default', () => {
    const d = splitDesign({ frontPistons: 7, rearPistons: 3, extra: { rules: ['fmvss135'] } });
    expect(ruleSelection(d)).toEqual(['fmvss135']);
    expect(ruleSelection(d, { rules: ['eu-appendix/efficiency'] })).toEqual(['eu-appendix/efficiency']);
    const rules = new Set(runChecks(d, stateModels(d), { rules: ['eu-appendix/efficiency'] }).map((c) => c.rule));
    expect([...rules]).toEqual(['eu-appendix/efficiency']);
  });

  it('the design key accepts only known ids; the message names the field and the allowed ids', () => {
    const bad = readDesign({ ...splitDesign({ frontPistons: 7, rearPistons: 3 }), rules: ['eu-apendix'] });
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.errors[0]!.path).toBe('rules[0]');
      expect(bad.errors[0]!.message).toContain('"eu-appendix"');
    }
    expect(RULE_SELECTORS).toContain('fmvss135/lock-sequence');
  });
});

describe('ABS on every axle (71/320 Annex II Appendix point 1 / Annex X)', () => {
  it('curve rules: not applicable as designed, and checked once more, labelled, for the ABS-failed vehicle', () => {
    // φ = 0.6 fails the M1 lock order from z* = 0.50 (see the eu-appendix tests)
    const d = splitDesign({ frontPistons: 3, rearPistons: 2, abs: true });
    const checks = runChecks(d, stateModels(d));
    const lock = checks.filter((c) => c.rule === 'eu-appendix/lock-order');
    expect(lock.length).toBe(4);
    const exempt = lock.filter((c) => c.scenario === 'as_designed');
    expect(exempt.every((c) => c.applies === false && c.passed === null && /not applicable: ABS/.test(c.note ?? ''))).toBe(true);
    const failed = lock.filter((c) => c.scenario === 'abs_failed');
    expect(failed.every((c) => c.applies && c.advisory && c.passed === false && /ABS failed/.test(c.note ?? ''))).toBe(true);
    expect(failed[0]!.failing_ranges[0]![0]).toBeCloseTo(0.5, 8);
    // the advisory failure does not decide the outcome
    expect(failedChecks(checks).filter((c) => c.rule.startsWith('eu-appendix'))).toEqual([]);
  });

  it('without ABS the same design fails, and evaluate() carries the checks', () => {
    const r = evaluate(splitDesign({ frontPistons: 3, rearPistons: 2 }));
    const f = failedChecks(r.checks);
    expect(f.map((c) => c.rule)).toContain('eu-appendix/lock-order');
    expect(f.every((c) => c.passed === false && c.applies && !c.advisory)).toBe(true);
  });

  it('φ = 0.7 passes every default check (a design that should exit 0)', () => {
    const r = evaluate(splitDesign({ frontPistons: 7, rearPistons: 3 }));
    expect(r.checks.length).toBeGreaterThan(10);
    expect(failedChecks(r.checks)).toEqual([]);
  });
});
