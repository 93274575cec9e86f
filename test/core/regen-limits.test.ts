/**
 * The per-surface regeneration limits solved piecewise (core/regen.ts maxAllowedRegenForce) against the plain
 * bisection they replace (test/core/regen-limits-reference.ts, run to 1e-9 N), on random designs (fast-check).
 * The reference decides each step with the predicate itself (the first lock of core/lock-order.ts judged by the
 * lock-order range of 71/320/EEC Annex II Appendix 3.1.1), so agreement to 1e-6 N checks the exact solution; the
 * designs are those of the other property tests with a regeneration block added. Source: derived (the reference
 * search), no outside value.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DEFAULT_ADHESION } from '../../core/constants.ts';
import type { DesignFile } from '../../core/design.ts';
import { stateModels } from '../../core/evaluate.ts';
import { lockOrderRange } from '../../core/lock-order-range.ts';
import { maxAllowedRegenForce, regenAnalysis, regenCurveRules, regenSetup } from '../../core/regen.ts';
import { checkCurveRule } from '../../core/checks/curve-check.ts';
import { arbitraryDesign } from './arbitrary-design.ts';
import { bisectAllowedRegenForce, scanFirstFailingForce } from './regen-limits-reference.ts';

const regenBlock = fc.record({
  max_motor_torque_nm: fc.double({ min: 40, max: 400, noNaN: true }),
  gear_ratio: fc.double({ min: 4, max: 12, noNaN: true }),
  max_power_kw: fc.double({ min: 20, max: 200, noNaN: true }),
  blending: fc.oneof(
    fc.constant({ type: 'regen_first' as const }),
    fc.record({ type: fc.constant('fixed_proportion' as const), proportion: fc.double({ min: 0.05, max: 1.5, noNaN: true }) }),
  ),
  front_share: fc.double({ min: 0, max: 1, noNaN: true }),
});
const withRegen = fc.tuple(arbitraryDesign, regenBlock).map(([d, r]): DesignFile => ({ ...d, regen: r }));

const close = (a: number | null, b: number | null, scale: number) => (a === null || b === null ? a === b : Math.abs(a - b) <= 1e-6 * Math.max(1, scale));

describe('largest regenerative force per surface: piecewise solution = bisection to 1e-6', () => {
  it('for random designs, blendings and drive layouts, on every surface', () => {
    fc.assert(
      fc.property(withRegen, (design) => {
        const setup = regenSetup(design, design.regen!);
        const rule = lockOrderRange(design.vehicle.category);
        for (const m of stateModels(design)) {
          for (const k of [...DEFAULT_ADHESION, 0.25, 0.45]) {
            const exact = maxAllowedRegenForce(m.loads, m.dist, k, setup.frontShare, setup.blending, rule);
            const ref = bisectAllowedRegenForce(m.loads, m.dist, k, setup.frontShare, setup.blending, rule);
            if (!close(exact, ref, 1)) throw new Error(`k ${k}: solved ${exact}, bisection ${ref}`);
          }
        }
      }),
      { numRuns: 150, seed: 17 },
    );
  });
});


describe('largest regenerative force passing the curve checks: solved = scan and bisection to 1e-6', () => {
  it('for random designs, blendings and drive layouts, on every load state', () => {
    let compared = 0;
    fc.assert(
      fc.property(withRegen, (design) => {
        const setup = regenSetup(design, design.regen!);
        const models = stateModels(design);
        const result = regenAnalysis(design, models, DEFAULT_ADHESION)!;
        models.forEach((m, i) => {
          const st = result.load_states[i]!;
          const keep = regenCurveRules(design, m.state.kind).filter((rule) => checkCurveRule(rule, m.loads, m.dist).passed);
          const scan = (steps: number) => (keep.length === 0 ? null : scanFirstFailingForce(keep, m.loads, m.dist, setup.frontShare, setup.blending, setup.maxForce, steps));
          const got = st.max_force_passing_checks_n;
          // the scan misses a failing stretch shorter than its step: where the two differ, scan again in steps of
          // about 0.1 N (the reference's own tolerance then), and the two must agree
          let ref = scan(400);
          if (!close(got, ref, ref ?? 1)) ref = scan(Math.ceil(setup.maxForce / 0.1));
          if (ref !== null) compared++;
          if (!close(got, ref, ref ?? 1)) throw new Error(`state ${i}: solved ${got}, scan and bisection ${ref}`);
        });
      }),
      { numRuns: 150, seed: 17 },
    );
    // the property must have had failing forces to compare (else it proves nothing)
    expect(compared).toBeGreaterThan(20);
  });
});
