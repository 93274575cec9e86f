// The command line's byte cap holds for pipes and devices too (issue 16, point 6); `-` is standard input.
// Sources: POSIX read(2) (a character device such as /dev/zero never reaches end of file; a pipe has no size to
// stat); the design-file spec, "Command line" (exit code 2 for input that cannot be a design).
import { spawnSync } from 'node:child_process';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { demoDesign } from '../../core/index.ts';
import { MAX_INPUT_BYTES } from '../../cli/errors.ts';
import { readJsonFile } from '../../cli/read-json.ts';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const bin = join(root, 'bin', 'lockstep.mjs');
const lockstep = (args: string[], input: string) => spawnSync(process.execPath, [bin, ...args], { cwd: root, input, encoding: 'utf8', timeout: 60000, maxBuffer: 16 * 1024 * 1024 });

describe('reading an input with a byte cap', () => {
  it('/dev/zero (endless) is refused after the cap, not read to the end', () => {
    expect(() => readJsonFile('/dev/zero')).toThrow(expect.objectContaining({ code: 'CLI_ERR_FILE_TOO_LARGE' }));
  });

  it('`-` reads standard input: the demo piped in evaluates; more than the cap piped in is refused with exit 2', () => {
    const demo = JSON.stringify(demoDesign());
    const ok = lockstep(['evaluate', '-', '--json'], demo);
    expect(ok.stderr).toBe('');
    expect(JSON.parse(ok.stdout).format).toBe('lockstep-result/1');
    // 3 MiB: the example, a valid design padded with spaces (JSON allows white space before a value)
    const big = ' '.repeat(3 * 1024 * 1024) + demo;
    expect(big.length).toBeGreaterThan(MAX_INPUT_BYTES);
    for (const path of ['-', '/dev/stdin']) {
      const r = lockstep(['evaluate', path], big);
      expect(r.status, path).toBe(2);
      expect(r.stderr, path).toContain('CLI_ERR_FILE_TOO_LARGE');
      expect(r.stdout, path).toBe('');
    }
  });
});
