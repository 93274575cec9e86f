// The one verdict (core/verdict.ts, issue 12 points 1, 4, 5), built from check lists written out by hand.
// The rule of the verdict is the issue's own: "fail" if anything that decides fails; else "incomplete" if anything
// could not be checked (an input is missing); else "pass". Not applicable results and advisory results
// (the ABS-failed case) do not decide. Nothing checked at all is no pass ("no false pass", project brief).
import { describe, expect, it } from 'vitest';
import type { CheckResult } from '../../core/checks/check-result.ts';
import type { RegenResult } from '../../core/regen.ts';
import { buildVerdict, checkAnchor, type VerdictInput } from '../../core/verdict.ts';
import type { FailureModeResult } from '../../core/valve-failure.ts';
import { evaluate } from '../../core/evaluate.ts';
import { demoDesign } from '../../core/demo.ts';

const states = [
  { id: 'unladen', label: 'Unladen, driver only' },
  { id: 'laden', label: 'Laden to 3500 kg' },
];

function check(o: Partial<CheckResult> & Pick<CheckResult, 'rule' | 'passed'>): CheckResult {
  return {
    rule_set: o.rule.split('/')[0]!,
    title: `Title of ${o.rule}`,
    source: { document: 'Doc', paragraph: 'point 1' },
    status: 'verified',
    load_state: 'laden',
    scenario: 'as_designed',
    applies: true,
    advisory: false,
    worst_margin: o.passed === null ? null : o.passed ? 0.05 : -0.02,
    margin_unit: 'adhesion',
    worst_at_braking_rate: null,
    failing_ranges: [],
    branch: null,
    ...o,
  };
}

const input = (checks: CheckResult[], extra: Partial<VerdictInput> = {}): VerdictInput => ({ checks, failure_modes: [], regen: null, load_states: states, ...extra });

describe('overall verdict from hand-built check lists', () => {
  it('every deciding check passes: pass; not-applicable and passing advisory results change nothing', () => {
    const v = buildVerdict(
      input([
        check({ rule: 'a/lock', passed: true }),
        check({ rule: 'a/eff', passed: true, margin_unit: 'm/s²', worst_margin: 1.78 }),
        check({ rule: 'b/x', applies: false, passed: null, load_state: null }),
        check({ rule: 'a/lock', passed: true, advisory: true, scenario: 'abs_failed' }),
      ]),
    );
    expect(v.overall).toBe('pass');
    expect(v.counts).toEqual({ checked: 2, passed: 2, failed: 0, not_checked: 0, advisories: 0 });
    expect(v.summary).toBe('PASS: every check that applies passes (2 checks made, 0 failed).');
  });

  it('one failure makes it fail, even beside a check that could not be made; the failing item names where and by how much', () => {
    const v = buildVerdict(
      input([
        check({ rule: 'a/lock', passed: false, worst_margin: -0.173, load_state: 'unladen' }),
        check({ rule: 'p/park', passed: null, missing_inputs: ['parking_brake'] }),
        check({ rule: 'a/eff', passed: true }),
      ]),
    );
    expect(v.overall).toBe('fail');
    expect(v.failed).toHaveLength(1);
    expect(v.failed[0]).toMatchObject({ rule: 'a/lock', load_state: 'unladen', load_state_label: 'Unladen, driver only', margin: -0.173, margin_unit: 'adhesion' });
    expect(v.failed[0]!.description).toBe('Unladen, driver only: Title of a/lock: fails by 0.173 (adhesion)');
    expect(v.failed[0]!.anchor).toBe(checkAnchor('a/lock', 'unladen', 'as_designed'));
    expect(v.not_checked).toHaveLength(1);
  });

  it('no failure but a missing input: incomplete, the missing input named in words (not the design path)', () => {
    const v = buildVerdict(input([check({ rule: 'a/lock', passed: true }), check({ rule: 'p/park', passed: null, missing_inputs: ['parking_brake'] })]));
    expect(v.overall).toBe('incomplete');
    expect(v.not_checked[0]).toMatchObject({ rule: 'p/park', missing_inputs: ['parking_brake'], passed: null });
    expect(v.not_checked[0]!.missing[0]).toMatch(/^the parking brake \(which axle it brakes/);
    expect(v.not_checked[0]!.description).toMatch(/^Laden to 3500 kg: Title of p\/park: not checked: needs the parking brake/);
    expect(v.not_checked[0]!.description).not.toContain('parking_brake');
  });

  it('a rule without the load-state kind it needs is not checked, the kind named (not "not applicable")', () => {
    const v = buildVerdict(input([check({ rule: 'p/park', passed: null, load_state: null, missing_inputs: ['load_states'], details: { needs_load_state_kind: 'laden' } })]));
    expect(v.overall).toBe('incomplete');
    expect(v.not_checked[0]!.description).toBe('Whole design: Title of p/park: not checked: needs a load state of kind laden');
  });

  it('an advisory failure (ABS failed) is listed for information and does not decide; nothing checked at all is incomplete', () => {
    const v = buildVerdict(input([check({ rule: 'a/lock', applies: false, passed: null }), check({ rule: 'a/lock', passed: false, advisory: true, scenario: 'abs_failed' })]));
    expect(v.failed).toEqual([]);
    expect(v.advisories).toHaveLength(1);
    expect(v.overall).toBe('incomplete');
    expect(v.summary).toMatch(/^INCOMPLETE: no check that applies/);
  });

  it('a failed distribution valve fails the verdict (71/320/EEC Annex II Appendix point 6): margin = reached − required', () => {
    const fm = { mode: 'blocks_rear', description: 'valve stuck shut: the rear brakes get no pressure', load_state: 'laden', max_deceleration_ms2: 2.0, required_ms2: 2.2, passed: false } as FailureModeResult;
    const v = buildVerdict(input([check({ rule: 'a/lock', passed: true })], { failure_modes: [fm] }));
    expect(v.overall).toBe('fail');
    expect(v.failed[0]).toMatchObject({ kind: 'failure_mode', scenario: 'blocks_rear', margin_unit: 'm/s²' });
    expect(v.failed[0]!.margin!).toBeCloseTo(-0.2, 12);
    expect(v.failed[0]!.description).toBe('Laden to 3500 kg: valve stuck shut: the rear brakes get no pressure: 2.00 m/s² reached, 2.20 m/s² required, fails by 0.20 m/s²');
  });
});

describe('regeneration cases count like the checks (issue 12 point 4)', () => {
  // A hand-made regeneration result: the lock-order rule passes without regeneration and at 80 km/h (1800 N) but
  // fails at 20 km/h (2478 N); the largest force keeping it passing is 2203 N. Motor torque at that force:
  // F · r / i = 2203 · 0.345 / 9.5 = 80.0 N·m.
  const regen = {
    max_force_n: 2478,
    tyre_radius_m: 0.345,
    gear_ratio: 9.5,
    load_states: [
      {
        id: 'unladen',
        max_force_passing_checks_n: 2203,
        max_force_basis: 'solved',
        checks: [
          { rule: 'a/lock', title: 'Front axle locks first', status: 'verified', speed_kmh: null, regen_force_n: 0, passed: true, worst_margin: 0.084 },
          { rule: 'a/lock', title: 'Front axle locks first', status: 'verified', speed_kmh: 20, regen_force_n: 2478, passed: false, worst_margin: -0.173 },
          { rule: 'a/lock', title: 'Front axle locks first', status: 'verified', speed_kmh: 80, regen_force_n: 1800, passed: true, worst_margin: 0.023 },
        ],
      },
    ],
  } as unknown as RegenResult;
  const checks = [check({ rule: 'a/lock', passed: true, load_state: 'unladen' })];

  it('a failing speed makes the verdict fail though every regulation check passes; the limit is reported beside it', () => {
    const v = buildVerdict(input(checks, { regen }));
    expect(v.overall).toBe('fail');
    expect(v.counts.checked).toBe(3); // the check itself and two speeds (zero regeneration is the check itself)
    expect(v.failed).toHaveLength(1);
    const f = v.failed[0]!;
    expect(f).toMatchObject({ kind: 'regeneration', rule: 'a/lock', load_state: 'unladen', speed_kmh: 20, regen_force_n: 2478, regen_limit_n: 2203, margin: -0.173 });
    expect(f.regen_limit_motor_nm!).toBeCloseTo((2203 * 0.345) / 9.5, 9);
    expect(f.description).toBe(
      'Unladen, driver only, 20 km/h with 2478 N regeneration: Front axle locks first: fails by 0.173 (adhesion); ' +
        'largest regenerative force that keeps the checks passing 2203 N (80.0 N·m at the motor)',
    );
    expect(f.anchor).toBe(checkAnchor('a/lock', 'unladen', 'regen', 20));
  });

  it('all-wheel drive without the regeneration front share: the cases rest on the 0.5 default, so they are not checked', () => {
    const v = buildVerdict(input(checks, { regen: { ...regen, assumed_inputs: ['regen.front_share'] } as RegenResult }));
    expect(v.overall).toBe('incomplete');
    expect(v.failed).toEqual([]);
    expect(v.not_checked.map((n) => n.speed_kmh)).toEqual([20, 80]);
    expect(v.not_checked[0]).toMatchObject({ passed: null, margin: null, missing_inputs: ['regen.front_share'] });
    expect(v.not_checked[0]!.description).toBe(
      'Unladen, driver only, 20 km/h with 2478 N regeneration: Front axle locks first: not checked: needs the share of the regenerative braking force on the front axle (all-wheel drive)',
    );
  });

  it('a regeneration case of a rule that is not selected (or only advisory) does not decide', () => {
    expect(buildVerdict(input([check({ rule: 'b/other', passed: true, load_state: 'unladen' })], { regen })).overall).toBe('pass');
    const abs = [check({ rule: 'a/lock', applies: false, passed: null, load_state: 'unladen' }), check({ rule: 'a/lock', passed: true, advisory: true, scenario: 'abs_failed', load_state: 'unladen' }), check({ rule: 'b/other', passed: true })];
    const v = buildVerdict(input(abs, { regen }));
    expect(v.overall).toBe('pass');
    expect(v.advisories.map((a) => a.speed_kmh)).toEqual([20]);
  });
});

describe('the demo (core/demo.ts): fails on regeneration only, with its limit named', () => {
  it('every regulation check passes, the regeneration cases (unladen at 20 and 50 km/h among them) fail, and deferred evaluation says the same', () => {
    const r = evaluate(demoDesign());
    expect(r.checks.every((c) => c.passed !== false)).toBe(true);
    expect(r.verdict.overall).toBe('fail');
    expect(r.verdict.failed.length).toBeGreaterThan(0);
    expect(r.verdict.failed.every((f) => f.kind === 'regeneration')).toBe(true);
    const where = new Set(r.verdict.failed.map((f) => `${f.load_state} ${f.speed_kmh}`));
    expect(where.has('unladen 20') && where.has('unladen 50')).toBe(true);
    for (const f of r.verdict.failed) {
      expect(f.regen_limit_n).toBe(r.regen!.load_states.find((s) => s.id === f.load_state)!.max_force_passing_checks_n);
    }
    expect(r.verdict.not_checked).toEqual([]); // the demo states its parking brake and rotor masses
    const deferred = evaluate(demoDesign(), { deferLimits: true });
    expect(JSON.stringify(deferred.verdict)).toBe(JSON.stringify(r.verdict));
    expect(JSON.stringify(deferred)).toBe(JSON.stringify(r));
  });
});
