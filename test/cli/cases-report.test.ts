// `lockstep evaluate` on the inspection-case example (docs/examples/towing-camper-fmvss.json): the derived load
// states (FMVSS lightly loaded vehicle, towing) are reported after the design's own, "not checked" is said in
// words, and the exit status follows the failing checks (README: 1 when a check fails). The example removes the
// stability control the base vehicle had, which the R13-H rule (from memory) requires: that check fails.
import { readFileSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../../cli/main.ts';

function capture() {
  const out = { stdout: '', stderr: '' };
  return { out, io: { stdout: (t: string) => void (out.stdout += t), stderr: (t: string) => void (out.stderr += t) } };
}
const EXAMPLE = join(import.meta.dirname, '../../docs/examples/towing-camper-fmvss.json');

describe('lockstep evaluate on the inspection-case example', () => {
  it('reports the derived load states and the failing stability-control check', async () => {
    const { out, io } = capture();
    expect(await runCli(['evaluate', EXAMPLE], io)).toBe(1);
    expect(out.stdout).toMatch(/Derived load state: towing the trailer/);
    expect(out.stdout).toMatch(/Derived load state: lightly loaded vehicle/);
    expect(out.stdout).toMatch(/FAIL +stability control fitted and working \(UN R13-H\)/);
    expect(out.stdout).toMatch(/pass +hot brakes after the heating sequence \(71\/320\/EEC \/ UN R13\) \(hot brakes after the heating sequence\)/);
  });

  it('says "not checked" when the lightly loaded vehicle cannot be made', async () => {
    const d = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as Record<string, unknown>;
    delete d.lightly_loaded;
    const p = join(mkdtempSync(join(tmpdir(), 'lockstep-cases-')), 'no-llvw.json');
    writeFileSync(p, JSON.stringify(d));
    const { out, io } = capture();
    await runCli(['evaluate', p, '--rules', 'fmvss135/lock-sequence'], io);
    expect(out.stdout).toMatch(/not checked +front wheels lock before or with the rear \(FMVSS No\. 135\)/i);
    expect(out.stdout).toMatch(/the lightly loaded vehicle \(FMVSS 135\) is not checked/);
  });
});
