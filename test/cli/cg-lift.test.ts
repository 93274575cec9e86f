/**
 * `lockstep cg-lift FILE [--json]`, run in process.
 * Sources: the readings are generated for a vehicle whose CG height is known (hand-derived statics:
 * with the rear raised by H on wheelbase L, the front axle gains W (h − r) tan θ / L, θ = asin(H/L));
 * the expected value is that known height, not the tool's own output.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../../cli/main.ts';
import { KNOWN_LIFT, knownLiftFile } from '../fixtures/known-lift.ts';

function capture() {
  const out = { stdout: '', stderr: '' };
  return { out, io: { stdout: (t: string) => void (out.stdout += t), stderr: (t: string) => void (out.stderr += t) } };
}

const dir = mkdtempSync(join(tmpdir(), 'lockstep-cg-lift-'));
function file(name: string, body: unknown): string {
  const p = join(dir, name);
  writeFileSync(p, typeof body === 'string' ? body : JSON.stringify(body));
  return p;
}

// The known vehicle of test/fixtures/known-lift.ts: CG height 0.95 m.
const { h } = KNOWN_LIFT;
const good = knownLiftFile();

describe('lockstep cg-lift', () => {
  it('--json gives lockstep-axle-lift-result/1 with the known CG height, budget, warnings and caution', async () => {
    const { out, io } = capture();
    const code = await runCli(['cg-lift', file('good.json', good), '--json'], io);
    expect(code).toBe(0);
    const res = JSON.parse(out.stdout);
    expect(res.format).toBe('lockstep-axle-lift-result/1');
    expect(Math.abs(res.cg_height_m - h)).toBeLessThan(1e-6);
    expect(res.cg_to_front_axle_m).toBeCloseTo(1.7, 9);
    expect(res.standard_uncertainty_m).toBeGreaterThan(0);
    expect(Array.isArray(res.budget.entries)).toBe(true);
    expect(typeof res.budget.largest_source).toBe('string');
    expect(res.warnings.map((w: { code: string }) => w.code)).toContain('WARN_FEW_LIFTS');
    expect(res.caution).toMatch(/physical brake testing/);
  });

  it('text form names the result, the budget and the caution', async () => {
    const { out, io } = capture();
    expect(await runCli(['cg-lift', file('good2.json', good)], io)).toBe(0);
    expect(out.stdout).toMatch(/CG height above ground:\s+0\.950 m/);
    expect(out.stdout).toMatch(/Uncertainty budget/);
    expect(out.stdout).toMatch(/Largest contribution/);
    expect(out.stdout).toMatch(/Caution: /);
  });

  it('bad input: exit 2, each field named with its allowed range, nothing on stdout', async () => {
    const bad = {
      ...good,
      wheelbase_m: 0.1,
      lifts: [{ raised_axle: 'rear', lift_height_m: 0.6 }, { raised_axle: 'up', lift_height_m: 0.5, rear_axle_kg: 1400 }],
    };
    const { out, io } = capture();
    expect(await runCli(['cg-lift', file('bad.json', bad)], io)).toBe(2);
    expect(out.stdout).toBe('');
    expect(out.stderr).toMatch(/CLI_ERR_AXLE_LIFT_INVALID/);
    expect(out.stderr).toMatch(/wheelbase_m: 0\.1 is below the allowed range, from 0\.5 to 10 m/);
    expect(out.stderr).toMatch(/lifts\[1\]\.raised_axle: "up" is not allowed; use one of "front", "rear"/);
  });

  it('a lift without its reading and one with both a height and an angle are named', async () => {
    const bad = { ...good, lifts: [{ raised_axle: 'rear', lift_height_m: 0.6 }, { raised_axle: 'front', lift_height_m: 0.5, lift_angle_deg: 8, rear_axle_kg: 1400 }] };
    const { out, io } = capture();
    expect(await runCli(['cg-lift', file('bad2.json', bad)], io)).toBe(2);
    expect(out.stderr).toMatch(/lifts\[0\]\.front_axle_kg: is required/);
    expect(out.stderr).toMatch(/lifts\[1\]\.lift_angle_deg: give lift_height_m or lift_angle_deg, not both/);
  });

  it('not JSON, a missing file and a missing argument exit 2 with their codes', async () => {
    let c = capture();
    expect(await runCli(['cg-lift', file('nojson.json', '{oops')], c.io)).toBe(2);
    expect(c.out.stderr).toMatch(/CLI_ERR_NOT_JSON/);
    c = capture();
    expect(await runCli(['cg-lift', join(dir, 'absent.json')], c.io)).toBe(2);
    expect(c.out.stderr).toMatch(/CLI_ERR_FILE_NOT_FOUND/);
    c = capture();
    expect(await runCli(['cg-lift'], c.io)).toBe(2);
    expect(c.out.stderr).toMatch(/CLI_ERR_USAGE/);
  });
});

describe('lockstep evaluate text with a build-up (docs/examples/conversion-build-up.json)', () => {
  it('says where each state\'s figures come from and prints the rating margins', async () => {
    const { out, io } = capture();
    const code = await runCli(['evaluate', join(import.meta.dirname, '../../docs/examples/conversion-build-up.json')], io);
    expect(code).not.toBe(2);
    expect(out.stdout).toMatch(/Figures from: mass build-up \(unladen state\)/);
    expect(out.stdout).toMatch(/CG height from measured, standard uncertainty 0\.011 m/);
    expect(out.stdout).toMatch(/Rating margins: mass \+\d+ kg/);
  });
});
