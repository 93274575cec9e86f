/**
 * The real `lockstep` process (bin/lockstep.mjs: the build in dist/, which `npm test` makes first), spawned once per case.
 * Source: design-file spec "Command line" (`npx lockstep demo > x.json && npx lockstep evaluate x.json
 * --json`, exit codes 0 / 2).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const bin = join(root, 'bin', 'lockstep.mjs');
const dir = mkdtempSync(join(tmpdir(), 'lockstep-bin-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const lockstep = (...args: string[]) => spawnSync(process.execPath, [bin, ...args], { cwd: root, encoding: 'utf8', timeout: 60000 });

describe('bin/lockstep.mjs', () => {
  it('demo > file, then evaluate file --json: a lockstep-result/1 (exit code by its verdict); a broken file: exit 2', () => {
    const demo = lockstep('demo');
    expect(demo.status).toBe(0);
    const p = join(dir, 'demo.json');
    writeFileSync(p, demo.stdout);
    const ev = lockstep('evaluate', p, '--json');
    expect(ev.stderr).toBe('');
    const res = JSON.parse(ev.stdout);
    expect(res.format).toBe('lockstep-result/1');
    // exit code from the verdict (README "Exit codes"): the demo fails on purpose (regeneration, core/demo.ts)
    expect(res.verdict.overall).toBe('fail');
    expect(ev.status).toBe(1);

    const bad = join(dir, 'bad.json');
    writeFileSync(bad, demo.stdout.replace('"mass_kg": 3500', '"mass_kg": "heavy"'));
    const r = lockstep('evaluate', bad);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/load_states\[1\]\.mass_kg: "heavy" is not a number/);
  }, 120000); // three process starts on a shared 2-core machine
});

describe('bin/lockstep.mjs and a reader that stops early', () => {
  it('ends quietly when stdout is closed (lockstep evaluate x.json --json | head)', () => {
    // common practice, no source: command-line tools end without a stack trace on a closed pipe (EPIPE)
    const demo = lockstep('demo');
    const p = join(dir, 'demo-pipe.json');
    writeFileSync(p, demo.stdout);
    const r = spawnSync('bash', ['-c', `"${process.execPath}" "${bin}" evaluate "${p}" --json | head -c 50 > /dev/null; echo "status \${PIPESTATUS[0]}" >&2`], {
      cwd: root,
      encoding: 'utf8',
      timeout: 60000,
    });
    expect(r.stderr).not.toMatch(/EPIPE|Unhandled/);
    expect(r.stderr).toMatch(/status 1/); // the demo's verdict is "fail" (core/demo.ts), not a crash
  });
});
