/**
 * `lockstep evaluate` over several files and a folder, in process (runCli).
 * Sources: issue 17 point 3 (one line per file plus a summary; --json one result per line, JSON Lines;
 * --report junit writes one test case per check per design); the exit statuses of the design-file spec
 * "Command line" (0 every check passes, 1 a check fails, 2 invalid input); the order of severity over files
 * (2 > 1 > 3 > 0) is this project's choice, documented in cli/commands/evaluate.ts and the README.
 * JUnit shape (testsuites > testsuite > testcase with failure/error/skipped): common practice, no source.
 */
import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { worstStatus } from '../../cli/commands/evaluate.ts';
import { xmlText } from '../../cli/junit.ts';
import { demoDesign } from '../../core/index.ts';
import { run, tempFiles } from './run-cli.ts';

const t = tempFiles('lockstep-batch-');
afterAll(() => t.remove());

const demo = demoDesign();
// the demo fails on purpose with its regeneration (core/demo.ts); without the regen block every check passes
const passing = structuredClone(demo) as Record<string, any>;
delete passing.regen;
// The demo with an efficiency line no real brake meets: a pad friction of 0.05 makes the service-braking
// deceleration (UN R13 Annex 4 point 2.1, ≥ 5.0 m/s² for M1/N1 at the pedal-force limit) impossible.
const weak = structuredClone(demo) as Record<string, any>;
weak.axles.front.brake.pad_friction = 0.05;
weak.axles.rear.brake.pad_friction = 0.05;

mkdirSync(join(t.dir, 'designs'));
const good = t.file('designs/a-good.json', passing);
const failing = t.file('designs/b-weak.json', weak);
const broken = t.file('designs/c-broken.json', '{"format": "lockstep-design/1"');
t.file('designs/notes.txt', 'not a design');

describe('lockstep evaluate with several files', () => {
  it('prints one line per file and a summary; the exit status is the worst of the files', async () => {
    const r = await run(['evaluate', good, failing]);
    const lines = r.stdout.trim().split('\n');
    expect(lines[0]).toMatch(/^PASS\s+.*a-good\.json/);
    expect(lines[1]).toMatch(/^FAIL\s+.*b-weak\.json.*FAIL: at least one check fails/);
    expect(r.stdout).toMatch(/2 designs: 1 pass, 1 fail, 0 invalid\./);
    expect(r.stdout).toContain('CAUTION');
    expect(r.code).toBe(1);
  });
  it('reads a folder (its .json files in name order) and goes on past an unreadable file (exit 2)', async () => {
    const r = await run(['evaluate', join(t.dir, 'designs')]);
    const lines = r.stdout.trim().split('\n');
    expect(lines.slice(0, 3).map((l) => l.split(/\s+/)[0])).toEqual(['PASS', 'FAIL', 'INVALID']);
    expect(r.stdout).not.toContain('notes.txt');
    expect(r.code).toBe(2);
  });
  it('--json prints one JSON object per line (JSON Lines) with the file, its status and the result', async () => {
    const r = await run(['evaluate', good, failing, broken, '--json']);
    const rows = r.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(rows.map((x) => [x.file, x.status])).toEqual([
      [good, 0],
      [failing, 1],
      [broken, 2],
    ]);
    expect(rows[0].result.format).toBe('lockstep-result/1');
    expect(rows[2].error.code).toBe('CLI_ERR_NOT_JSON');
  });
  it('--report junit writes one test case per check per design, failures marked', async () => {
    const out = join(t.dir, 'report.xml');
    const json = await run(['evaluate', good, '--json']);
    const checks = JSON.parse(json.stdout).checks.length;
    const modes = JSON.parse(json.stdout).failure_modes.length;
    const r = await run(['evaluate', good, failing, '--report', 'junit', out]);
    expect(r.code).toBe(1);
    const xml = readFileSync(out, 'utf8');
    expect(xml.startsWith('<?xml')).toBe(true);
    expect(xml.match(/<testsuite /g)).toHaveLength(2);
    const firstSuite = xml.slice(xml.indexOf('<testsuite '), xml.indexOf('</testsuite>'));
    expect(firstSuite.match(/<testcase /g)).toHaveLength(checks + modes);
    expect(xml).toMatch(/<failure message=/);
    expect(firstSuite).not.toMatch(/<failure/);
  });
  it('refuses --report with an unknown format', async () => {
    const r = await run(['evaluate', good, '--report', 'html', 'x.xml']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('CLI_ERR_USAGE');
  });
});

describe('worstStatus and xmlText', () => {
  it('orders 2 (invalid) > 1 (fail) > 3 (incomplete) > 0 (pass)', () => {
    expect(worstStatus([])).toBe(0);
    expect(worstStatus([0, 3])).toBe(3);
    expect(worstStatus([3, 1, 0])).toBe(1);
    expect(worstStatus([1, 2, 3])).toBe(2);
  });
  it('escapes the XML special characters (XML 1.0 section 2.4) and drops control characters (section 2.2)', () => {
    expect(xmlText(`a<b>&"c'\u0001`)).toBe('a&lt;b&gt;&amp;&quot;c&apos;');
  });
});
