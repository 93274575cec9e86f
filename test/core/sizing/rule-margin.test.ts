/**
 * The fast margins of core/sizing/rule-margin.ts must equal the issue-4 curve check
 * (core/checks/curve-check.ts, checkBranch) on installed distributions with thresholds and valves:
 * rule margin = the best branch's lowest margin. Property test over random realistic designs; no outside values
 * here: the expected side is the issue-4 check, whose sources are cited in test/core/checks.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkCurveRule } from '../../../core/checks/curve-check.ts';
import { segments, stateModel } from '../../../core/index.ts';
import { geometryOf, LIFT_OFF_MARGIN, ruleMargin } from '../../../core/sizing/rule-margin.ts';
import { sizingCurveRules } from '../../../core/sizing/sizing-rules.ts';
import { fixedSplitDesign } from './fixtures.ts';

describe('fast rule margins', () => {
  it('equal the curve check for random designs with thresholds and valves', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('M1', 'N1', 'N3'),
        fc.double({ min: 0.4, max: 0.65, noNaN: true }),
        fc.double({ min: 0.3, max: 1.1, noNaN: true }),
        fc.double({ min: 30, max: 66, noNaN: true }),
        fc.double({ min: 0, max: 4, noNaN: true }),
        fc.oneof(
          fc.constant({ type: 'none' as const }),
          fc.record({ type: fc.constant('limiting' as const), knee_bar: fc.double({ min: 5, max: 80, noNaN: true }) }),
          fc.record({ type: fc.constant('proportioning' as const), knee_bar: fc.double({ min: 5, max: 80, noNaN: true }), ratio: fc.double({ min: 0.1, max: 0.9, noNaN: true }) }),
        ),
        (category, psi, cg, rearPiston, threshold, valve) => {
          const d = fixedSplitDesign({ category: category as 'M1', frontKg: 2000 * psi, cgM: cg, rearPistonMm: rearPiston, rules: ['eu-appendix', 'fmvss135/lock-sequence'] });
          d.axles.rear.brake.threshold_pressure_bar = threshold;
          d.axles.front.brake.threshold_pressure_bar = threshold / 3;
          d.hydraulics.rear_valve = valve;
          const s = stateModel(d, d.load_states[0]!);
          for (const r of sizingCurveRules(d)) {
            const v = checkCurveRule(r.compiled.rule, s.loads, s.dist);
            let expected = -Infinity;
            for (const b of v.branches) expected = Math.max(expected, b.lift_off_in_range ? LIFT_OFF_MARGIN : (b.worst_margin ?? Infinity));
            const got = ruleMargin(r.compiled, geometryOf(s.loads), segments(s.dist));
            if (Number.isFinite(expected)) expect(got).toBeCloseTo(expected, 9);
            else expect(got).toBe(expected);
            expect(got >= -1e-9).toBe(v.passed);
          }
        },
      ),
      { numRuns: 150, seed: 11 },
    );
  });
});
