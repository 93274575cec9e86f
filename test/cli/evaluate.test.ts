/**
 * `lockstep evaluate` and `lockstep demo`, run in process through runCli.
 * Sources: design-file spec "Command line" (exit 0 when every check passes, 1 when one fails, 2 when the
 * file is invalid, messages name each field, its value and the allowed range) and "Result" (the keys of
 * the example); issue 2 (garbage never crashes it: empty file, not JSON, wrong shape, huge or negative
 * numbers, strings where numbers go, an oversized file; the message
 * "load_states[1].front_axle_kg: 3600 is not below mass_kg 3500").
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_INPUT_BYTES } from '../../cli/errors.ts';
import { type CommandOutput, runCli } from '../../cli/main.ts';
import { CAUTION } from '../../core/caution.ts';

async function run(argv: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const out: CommandOutput = { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t) };
  const code = await runCli(argv, out);
  return { code, stdout, stderr };
}

let dir: string;
let demoText: string;
const file = (name: string, content: string | Buffer) => {
  const p = join(dir, name);
  writeFileSync(p, content);
  return p;
};
/** The demo design with one edit applied. */
const demoWith = (edit: (d: Record<string, any>) => void) => {
  const d = JSON.parse(demoText) as Record<string, any>;
  edit(d);
  return JSON.stringify(d);
};

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'lockstep-cli-'));
  const r = await run(['demo']);
  expect(r.code).toBe(0);
  demoText = r.stdout;
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('demo and evaluate --json', () => {
  it('the demo evaluates (exit 1: its regeneration fails) and the JSON holds every key of the spec result example', async () => {
    const r = await run(['evaluate', file('demo.json', demoText), '--json']);
    expect(r.stderr).toBe('');
    const res = JSON.parse(r.stdout);
    // exit code from the verdict: 0 pass, 1 fail, 3 incomplete (README "Exit codes"); the demo fails on purpose
    // with regeneration (core/demo.ts) although every check of `checks` passes
    expect(res.checks.every((c: { passed?: boolean | null }) => c.passed !== false)).toBe(true);
    expect(res.verdict.overall).toBe('fail');
    expect(r.code).toBe(1);
    expect(res.format).toBe('lockstep-result/1');
    expect(Array.isArray(res.checks)).toBe(true);
    expect(res.load_states.length).toBe(2);
    for (const s of res.load_states) {
      for (const k of ['id', 'front_axle_static_n', 'rear_axle_static_n', 'critical_braking_rate', 'critical_braking_rates', 'lock', 'at']) expect(s).toHaveProperty(k);
      expect(s.lock.length).toBeGreaterThan(0);
      for (const l of s.lock) for (const k of ['adhesion', 'first_axle', 'braking_rate', 'efficiency']) expect(l).toHaveProperty(k);
      expect(s.at).toHaveLength(10); // default z = 0.1 … 1.0
      for (const a of s.at) {
        for (const k of ['braking_rate', 'front_axle_load_n', 'rear_axle_load_n', 'ideal_front_force_n', 'ideal_rear_force_n', 'front_force_n', 'rear_force_n', 'front_utilisation', 'rear_utilisation', 'front_pressure_bar', 'rear_pressure_bar', 'pedal_force_n']) {
          expect(a).toHaveProperty(k);
        }
      }
    }
  });

  it('--at picks the braking rates; the text report ends with the caution', async () => {
    const p = file('demo-at.json', demoText);
    const j = JSON.parse((await run(['evaluate', p, '--at', '0.25,0.55', '--json'])).stdout);
    expect(j.load_states[0].at.map((a: { braking_rate: number }) => a.braking_rate)).toEqual([0.25, 0.55]);
    const t = await run(['evaluate', p]);
    expect(t.code).toBeLessThan(2);
    expect(t.stdout).toContain('Critical braking rate');
    expect(t.stdout).toContain(CAUTION);
  });
});

describe('garbage gets exit 2 and a message naming the field or file', () => {
  const cases: [string, () => string[], RegExp[]][] = [
    ['an empty file', () => ['evaluate', file('empty.json', '')], [/CLI_ERR_FILE_EMPTY/, /is empty/]],
    ['whitespace only', () => ['evaluate', file('blank.json', ' \n\t\n')], [/CLI_ERR_FILE_EMPTY/]],
    ['not JSON', () => ['evaluate', file('notjson.json', '{"format": "lockstep-design/1", name: oops}')], [/CLI_ERR_NOT_JSON/, /not valid JSON/]],
    ['a JSON array', () => ['evaluate', file('array.json', '[1, 2, 3]')], [/CLI_ERR_DESIGN_INVALID/, /\(file\): a list is not an object/]],
    ['wrong shape', () => ['evaluate', file('shape.json', '{"hello": "world"}')], [/CLI_ERR_DESIGN_INVALID/, /format: is required/, /load_states: is required/, /unknown key "hello"/]],
    [
      'a huge number (1e400 parses as Infinity)',
      () => ['evaluate', file('huge.json', demoText.replace('"mass_kg": 2720', '"mass_kg": 1e400'))],
      [/CLI_ERR_DESIGN_INVALID/, /load_states\[0\]\.mass_kg: a non-finite number is not a number; allowed: from 50 to 60000 kg/],
    ],
    [
      'a number above its range',
      () => ['evaluate', file('big.json', demoWith((d) => (d.vehicle.wheelbase_m = 250)))],
      [/vehicle\.wheelbase_m: 250 is above the allowed range, from 0\.5 to 10 m/],
    ],
    [
      'a negative number',
      () => ['evaluate', file('neg.json', demoWith((d) => (d.axles.front.brake.pad_friction = -0.4)))],
      [/axles\.front\.brake\.pad_friction: -0\.4 is below the allowed range, from 0\.05 to 1\.2/],
    ],
    [
      'a string where a number goes',
      () => ['evaluate', file('str.json', demoWith((d) => (d.load_states[1].cg_height_m = '0.9')))],
      [/load_states\[1\]\.cg_height_m: "0\.9" is not a number; allowed: from 0.05 to 10 m/],
    ],
    [
      'front axle load not below the mass',
      () => ['evaluate', file('front.json', demoWith((d) => (d.load_states[1].front_axle_kg = 3600)))],
      [/load_states\[1\]\.front_axle_kg: 3600 is not below mass_kg 3500/],
    ],
    [
      'a negative wheelbase gives one message, not one per load state',
      () => ['evaluate', file('negwb.json', demoWith((d) => (d.vehicle.wheelbase_m = -3)))],
      [/\(1 problem\)/, /vehicle\.wheelbase_m: -3 is below the allowed range/],
    ],
    ['a missing file', () => ['evaluate', join(dir, 'nowhere', 'missing.json')], [/CLI_ERR_FILE_NOT_FOUND/, /missing\.json/]],
    ['a folder', () => { mkdirSync(join(dir, 'folder.json'), { recursive: true }); return ['evaluate', join(dir, 'folder.json')]; }, [/CLI_ERR_FILE_UNREADABLE/, /folder/]],
    ['a bad --at', () => ['evaluate', file('demo-bad-at.json', demoText), '--at', '0.3,fast'], [/CLI_ERR_USAGE/, /--at: "fast" is not a braking rate/, /0 to 1\.5/]],
    ['an --at beyond 1.5', () => ['evaluate', file('demo-bad-at2.json', demoText), '--at', '2'], [/CLI_ERR_USAGE/, /--at: "2"/]],
    ['an unknown option', () => ['evaluate', file('demo-opt.json', demoText), '--fast'], [/CLI_ERR_USAGE/]],
    ['no file', () => ['evaluate'], [/CLI_ERR_USAGE/, /usage: lockstep evaluate FILE/]],
  ];
  for (const [label, argv, patterns] of cases) {
    it(label, async () => {
      const r = await run(argv());
      expect(r.code).toBe(2);
      expect(r.stdout).toBe(''); // nothing is written on invalid input
      for (const p of patterns) expect(r.stderr).toMatch(p);
    });
  }

  it(`a file over the ${MAX_INPUT_BYTES / 1048576} MiB limit is refused before it is parsed`, async () => {
    const big = Buffer.alloc(MAX_INPUT_BYTES + 1024, 0x20); // 2 MiB + 1 KiB of spaces
    big.write('{"format":"lockstep-design/1"}', 0);
    const r = await run(['evaluate', file('big-file.json', big)]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/CLI_ERR_FILE_TOO_LARGE/);
    expect(r.stderr).toMatch(/larger than 2 MiB are refused/);
  });

  it('an unknown command and no command get exit 2 with the usage', async () => {
    const r = await run(['frobnicate']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('unknown command "frobnicate"');
    expect((await run([])).code).toBe(2);
  });
});
