/**
 * `lockstep evaluate` with the regulation checks, run in process: exit 1 when a selected check fails,
 * 0 when all pass, 2 for an unknown --rules id, 3 when a check could not be made; the verdict at the top of the
 * text report and its checks section.
 * Designs: hand-built fixed splits (test/core/checks/fixed-split.ts). φ = 0.6 fails the M1 lock order
 * of 71/320/EEC Annex II Appendix point 3.1.1 from z* = (0.6 − 0.5)/0.2 = 0.50 to 0.80; φ = 0.7 passes.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { run, tempFiles } from './run-cli.ts';
import { splitDesign } from '../core/checks/fixed-split.ts';
import { exitCodeFor } from '../../cli/exit-code.ts';

const tmp = tempFiles('lockstep-checks-');
afterAll(() => tmp.remove());
const file = tmp.file;

describe('lockstep evaluate: checks decide the exit status', () => {
  it('a design failing the M1 lock order exits 1; the JSON names the rule, paragraph, range and margin', async () => {
    const r = await run(['evaluate', file('fail.json', splitDesign({ frontPistons: 3, rearPistons: 2 })), '--json']);
    expect(r.code).toBe(1);
    const res = JSON.parse(r.stdout);
    const lock = res.checks.find((c: any) => c.rule === 'eu-appendix/lock-order' && c.load_state === 'laden');
    expect(lock.passed).toBe(false);
    expect(lock.source.paragraph).toMatch(/3\.1\.1/);
    expect(lock.failing_ranges[0][0]).toBeCloseTo(0.5, 8);
    expect(lock.worst_margin).toBeLessThan(0);
  });

  // A parking brake declared to hold 3000 N at the tyres: more than m g sin θ = 1000 · 9.80665 · 0.18/√1.0324 = 1737 N
  // on the 18 % of the parking rule (hand derivation; the laden state is 1000 kg).
  // Rotor masses let the hot-performance estimate (Type-I heating sequence) be made; without them it is not checked.
  const heat = { heat: { front_rotor_kg: 8, rear_rotor_kg: 6, max_speed_kmh: 130 } };
  const parked = { parking_brake: { axle: 'rear' as const, control: 'hand' as const, holding_force_n: 3000 }, ...heat };

  it('a design passing every default check exits 0; the text report opens with the verdict, then shows verdicts, sources and the verify note', async () => {
    const r = await run(['evaluate', file('pass.json', splitDesign({ frontPistons: 7, rearPistons: 3, extra: parked }))]);
    expect(r.code).toBe(0);
    // the verdict comes first: right after the title line, before any table
    const lines = r.stdout.split('\n');
    expect(lines[2]).toMatch(/^VERDICT PASS: every check that applies passes \(\d+ checks made, 0 failed\)\.$/);
    expect(r.stdout.indexOf('VERDICT')).toBeLessThan(r.stdout.indexOf('----'));
    expect(r.stdout).toContain('Regulation checks');
    expect(r.stdout).toMatch(/pass\s+front axle locks first \(71\/320\/EEC Appendix\)/);
    expect(r.stdout).not.toContain('eu-appendix/lock-order'); // words, not the rule id
    expect(r.stdout).toContain('71/320/EEC Annex II Appendix, point 3.1.1');
    // efficiency coefficient 0.85 is held as partly verified (wording not checked against the official text) → the verify note
    expect(r.stdout).toMatch(/point 3\.1\.1 \(coefficient 0\.85\) \[partly verified: verify against the current official text\]/);
    expect(r.stdout).toContain('Verdict: PASS: every check that applies passes');
  });

  it('the same design without a parking brake is incomplete: exit 3, the missing input named in words on the second line (issue 12 point 5)', async () => {
    const r = await run(['evaluate', file('noparking.json', splitDesign({ frontPistons: 7, rearPistons: 3, extra: heat }))]);
    expect(r.code).toBe(3);
    const lines = r.stdout.split('\n');
    expect(lines[2]).toMatch(/^VERDICT INCOMPLETE: nothing fails, but not everything could be checked \(.*1 check could not be made/);
    expect(lines[3]).toMatch(/^  NOT CHECKED  .*Parking brake holds the laden vehicle on 18 %: not checked: needs the parking brake \(which axle it brakes/);
    expect(lines[3]).not.toMatch(/parking_brake/); // words, not the design-file path
    expect(r.stdout).toMatch(/NOT CHECKED\s+parking brake on the gradient \(71\/320\/EEC \/ UN R13\)/);
    const j = JSON.parse((await run(['evaluate', file('noparking.json', splitDesign({ frontPistons: 7, rearPistons: 3, extra: heat })), '--json'])).stdout);
    expect(j.verdict.not_checked).toEqual([expect.objectContaining({ rule: 'performance/parking', load_state: 'laden', passed: null, missing_inputs: ['parking_brake'] })]);
  });

  it('a failing design prints FAIL and each failing item on its own line before any table (exit 1)', async () => {
    const r = await run(['evaluate', file('fail-text.json', splitDesign({ frontPistons: 3, rearPistons: 2, extra: parked }))]);
    expect(r.code).toBe(1);
    const top = r.stdout.slice(0, r.stdout.indexOf('----'));
    expect(top).toMatch(/VERDICT FAIL: at least one check fails/);
    // φ = 0.6 fails the M1 lock order laden from z = 0.50 (header comment)
    expect(top).toMatch(/\n  FAIL         .*Front axle locks first \(front curve above rear\): fails by \d\.\d{3} \(adhesion\)\n/);
  });

  it('--rules chooses the sets: the failing design passes when only the service check is asked for', async () => {
    const p = file('fail2.json', splitDesign({ frontPistons: 3, rearPistons: 2 }));
    const r = await run(['evaluate', p, '--rules', 'performance/service', '--json']);
    expect(r.code).toBe(0);
    expect(new Set(JSON.parse(r.stdout).checks.map((c: any) => c.rule))).toEqual(new Set(['performance/service']));
    const both = await run(['evaluate', p, '--rules', 'eu-appendix,fmvss135']);
    expect(both.code).toBe(1);
    expect(both.stdout).toMatch(/FAIL\s+front wheels lock before or with the rear \(FMVSS No\. 135\)/);
  });

  it('ABS on every axle: the lock-order failure is shown for the ABS-failed case but does not fail the run', async () => {
    const r = await run(['evaluate', file('abs.json', splitDesign({ frontPistons: 3, rearPistons: 2, abs: true })), '--rules', 'eu-appendix']);
    // no rule selected applies with ABS on every axle: nothing is shown to comply, so "incomplete" (exit 3), not a pass
    expect(r.code).toBe(3);
    expect(r.stdout).toMatch(/VERDICT INCOMPLETE: no check that applies to this design was selected/);
    expect(r.stdout).toMatch(/\n  for information \(does not decide\): .*ABS failed/);
    const withService = await run(['evaluate', file('abs2.json', splitDesign({ frontPistons: 3, rearPistons: 2, abs: true })), '--rules', 'eu-appendix,performance/service']);
    expect(withService.code).toBe(0);
    expect(r.stdout).toMatch(/not applicable\s+front axle locks first \(71\/320\/EEC Appendix\)/);
    expect(r.stdout).toMatch(/fails \(for information\)\s+front axle locks first \(71\/320\/EEC Appendix\) \(ABS failed: checked as a vehicle without ABS, for information\)/);
  });

  it('an unknown --rules id exits 2 and lists the known ids', async () => {
    const r = await run(['evaluate', file('x.json', splitDesign({ frontPistons: 7, rearPistons: 3 })), '--rules', 'eu-appendix,r13']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--rules: "r13" is not a rule set or rule; use one or more of eu-appendix, performance/);
    expect(r.stderr).toContain('CLI_ERR_USAGE');
  });
});

describe('lockstep evaluate: a failed distribution device also decides the exit status', () => {
  it('exits 1 when a failed load-sensing valve leaves the vehicle short of the secondary figure, though the selected curve rule passes', async () => {
    // 71/320/EEC Annex II Appendix point 6 (held as partial [P]): with the device failed the vehicle must
    // still stop as required for secondary braking (N1: 2.2 m/s², UN R13 Rev.4 Annex 4 para 2.2).
    // The demo's hydraulics made weak on purpose (no booster, 38 mm bore): at 700 N the pedal gives
    // p = 700 · 3.8 / (π/4 · 0.038²) ≈ 23.4 bar, far below what 2.2 m/s² needs, while the split (and so the
    // lock order) is unchanged.
    const { demoDesign } = await import('../../core/index.ts');
    const d = demoDesign();
    d.hydraulics = { ...d.hydraulics, booster_ratio: 1, master_cylinder_bore_mm: 38 };
    delete d.hydraulics.booster_runout_bar;
    const r = await run(['evaluate', file('weak.json', d), '--rules', 'fmvss135/lock-sequence', '--json']);
    const res = JSON.parse(r.stdout);
    expect(res.checks.every((c: any) => c.passed !== false)).toBe(true);
    expect(res.failure_modes.some((f: any) => f.passed === false)).toBe(true);
    expect(r.code).toBe(1);
  });
});

describe('exit codes (README "Exit codes", issue 12): 0 pass, 1 fail, 2 invalid input, 3 incomplete', () => {
  it('one mapping from the verdict, and an invalid file exits 2 with nothing on stdout', async () => {
    expect([exitCodeFor({ overall: 'pass' }), exitCodeFor({ overall: 'fail' }), exitCodeFor({ overall: 'incomplete' })]).toEqual([0, 1, 3]);
    const bad = splitDesign({ frontPistons: 7, rearPistons: 3 });
    (bad.vehicle as { wheelbase_m: number }).wheelbase_m = 0.1;
    const r = await run(['evaluate', file('invalid.json', bad)]);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/vehicle\.wheelbase_m/);
  });
});
