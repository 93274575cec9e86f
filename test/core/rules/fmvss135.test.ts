/**
 * Rule set fmvss135: FMVSS No. 135 wheel-lockup sequence (S7.2 / S7.4 from memory [M]): front at or above rear for braking ratios 0.15–0.80 at GVWR and lightly loaded; vehicles
 * up to 3 500 kg GVWR (S3 [V]); ABS on all axles exempts (from memory [M]).
 * Expected values from the fixed-split closed forms (test/core/checks/fixed-split.ts).
 */
import { describe, expect, it } from 'vitest';
import { runChecks } from '../../../core/checks/run-checks.ts';
import { stateModels } from '../../../core/evaluate.ts';
import { splitDesign } from '../checks/fixed-split.ts';

const lockAll = (d: ReturnType<typeof splitDesign>) => runChecks(d, stateModels(d)).filter((c) => c.rule === 'fmvss135/lock-sequence');
// Without a lightly_loaded block the lightly loaded vehicle gets its own "not checked" result (load_state null).
const lockOf = (d: ReturnType<typeof splitDesign>) => lockAll(d).filter((c) => !(c.applies && c.passed === null));

describe('fmvss135/lock-sequence', () => {
  it('passes φ = 0.7 (7 of 10 pistons in front, z* = 1.0) in both load states, as design guidance (memory)', () => {
    const r = lockOf(splitDesign({ frontPistons: 7, rearPistons: 3, extra: { rules: ['fmvss135'] } }));
    expect(r.map((c) => c.load_state)).toEqual(['unladen', 'laden']);
    const llvw = lockAll(splitDesign({ frontPistons: 7, rearPistons: 3, extra: { rules: ['fmvss135'] } })).filter((c) => c.passed === null && c.applies);
    expect(llvw.map((c) => c.missing_inputs)).toEqual([['lightly_loaded']]);
    for (const c of r) {
      expect(c.passed).toBe(true);
      expect(c.status).toBe('memory');
      expect(c.verify_note).toBe('verify against the current official text');
      // f1 − f2 at 0.15: 0.105/0.53 − 0.045/0.47
      expect(c.worst_margin!).toBeCloseTo(0.105 / 0.53 - 0.045 / 0.47, 9);
    }
  });

  it('fails φ = 0.6 (3 of 5 pistons) from z* = 0.50 to 0.80', () => {
    const r = lockOf(splitDesign({ frontPistons: 3, rearPistons: 2, extra: { rules: ['fmvss135/lock-sequence'] } }));
    for (const c of r) {
      expect(c.passed).toBe(false);
      expect(c.failing_ranges[0]![0]).toBeCloseTo(0.5, 8);
      expect(c.failing_ranges[0]![1]).toBeCloseTo(0.8, 12);
    }
  });

  it('does not apply above 3 500 kg or with ABS on every axle', () => {
    const heavy = lockOf(splitDesign({ frontPistons: 3, rearPistons: 2, mass_kg: 3600, extra: { rules: ['fmvss135'] } }));
    expect(heavy.length).toBe(1);
    expect(heavy[0]!.applies).toBe(false);
    expect(heavy[0]!.note).toMatch(/3500 kg/);
    // GVWR from ratings.max_mass_kg when given (S3 scope is by GVWR), even with light load states
    const rated = lockOf(splitDesign({ frontPistons: 7, rearPistons: 3, extra: { rules: ['fmvss135'], ratings: { max_mass_kg: 3600 } } }));
    expect(rated[0]!.applies).toBe(false);
    expect(rated[0]!.note).toMatch(/ratings\.max_mass_kg/);
    const abs = lockOf(splitDesign({ frontPistons: 3, rearPistons: 2, abs: true, extra: { rules: ['fmvss135'] } }));
    expect(abs.filter((c) => c.scenario === 'as_designed').every((c) => !c.applies && c.passed === null)).toBe(true);
    const failed = abs.filter((c) => c.scenario === 'abs_failed');
    expect(failed.length).toBe(2);
    expect(failed.every((c) => c.advisory && c.passed === false)).toBe(true);
  });
});
