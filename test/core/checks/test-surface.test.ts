/**
 * The test surface each performance rule is judged on (issue 12 point 6): FMVSS No. 135 names a
 * high-friction surface, peak friction coefficient 0.9 (from memory); the R13 / 71/320 figures name no
 * number and the dry-road default 0.8 is used (common practice, no source); a design's test_adhesion
 * overrides both. The cold-effectiveness stop (S7.5: 70 m from 100 km/h) is lock-limited on this
 * vehicle, so the surface decides the verdict.
 *
 * Hand calculation (fixed split, thresholds 0, no valve, no ABS; first lock from f = k on each axle):
 *   fixture: 2000 kg, ψ = 0.55, χ = 0.2, φ = 54²/(54² + 34²) = 2916/4072 = 0.71611 (same rotors)
 *   front lock at k: φz/(ψ + χz) = k → z = kψ/(φ − kχ); rear lock: (1 − φ)z/(1 − ψ − χz) = k → z = k(1 − ψ)/(1 − φ + kχ)
 *   k 0.8: front 0.44/0.55611 = 0.79121, rear 0.36/0.44389 = 0.81101 → z 0.79121, a = 7.7591 m/s²,
 *          distance 0.1·100 + 100²/(25.92·7.7591) = 59.72 m
 *   k 0.3 (design override): front 0.165/0.65611 = 0.25148 → a = 2.4663 m/s², 10 + 10000/(25.92·2.4663) = 166.4 m > 70 m: fails
 */
import { describe, expect, it } from 'vitest';
import { checkDeceleration, testSurfaceFor } from '../../../core/checks/performance-check.ts';
import { stateModel } from '../../../core/state-model.ts';
import { fmvss135, performance } from '../../../core/rules/index.ts';
import type { DecelerationRule } from '../../../core/rules/rule-types.ts';
import { fixedSplitDesign } from '../sizing/fixtures.ts';

const cold = fmvss135.rules.find((r) => r.id === 'fmvss135/cold-effectiveness') as DecelerationRule;
const service = performance.rules.find((r) => r.id === 'performance/service' && r.categories.includes('N1')) as DecelerationRule;

describe('test surface per rule', () => {
  it('FMVSS: the rule\'s surface 0.9 (from memory); R13: the default 0.8; the design overrides', () => {
    const d = fixedSplitDesign();
    expect(testSurfaceFor(d, cold)).toMatchObject({ k: 0.9, source: 'rule' });
    expect(testSurfaceFor(d, service)).toMatchObject({ k: 0.8, source: 'default' });
    expect(testSurfaceFor({ ...d, test_adhesion: 0.7 }, cold)).toMatchObject({ k: 0.7, source: 'design' });
  });

  it('the cold stop at k 0.8 (design override): lock-limited at z 0.79121, 59.72 m; the note prints the value used', () => {
    const d = { ...fixedSplitDesign(), test_adhesion: 0.8 };
    const o = checkDeceleration(d, stateModel(d, d.load_states[0]!), cold, null);
    expect(o.details.first_lock_braking_rate as number).toBeCloseTo(0.79121, 5);
    expect(o.details.stopping_distance_m as number).toBeCloseTo(59.72, 2);
    expect(o.note).toMatch(/test surface adhesion 0\.8: the design's test-surface adhesion/);
  });

  it('a slippery override fails the stop: 166.4 m against 70 m', () => {
    const d = { ...fixedSplitDesign(), test_adhesion: 0.3 };
    const o = checkDeceleration(d, stateModel(d, d.load_states[0]!), cold, null);
    expect(o.details.stopping_distance_m as number).toBeCloseTo(166.4, 1);
    expect(o.passed).toBe(false);
  });

  it('without an override the rule\'s 0.9 is used and printed', () => {
    const d = fixedSplitDesign();
    const o = checkDeceleration(d, stateModel(d, d.load_states[0]!), cold, null);
    expect(o.details.test_adhesion).toBe(0.9);
    expect(o.details.test_adhesion_source).toBe('rule');
    expect(o.note).toMatch(/test surface adhesion 0\.9: peak friction coefficient 0\.9/);
  });
});
