/**
 * Words for people: the text reports of `lockstep evaluate` (the demo and every example design), `lockstep size`
 * and `lockstep cg-lift` name no internal code: no snake_case identifier, no UPPER_CASE code (WARN_…, PITFALL_…),
 * no JSON path such as `load_states[1]`, no file name. Source: the project's rule "no internal code, JSON path
 * or file name in what a user reads" (common practice, no source).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { demoDesign, evaluate, readDesign } from '../../core/index.ts';
import { textReport } from '../../cli/text-report.ts';
import { runCli } from '../../cli/main.ts';

/** What an internal code looks like in text (exported for the page test's sibling in test/browser). */
export const CODE_PATTERNS: readonly RegExp[] = [
  /\b[a-z][a-z0-9]*_[a-z0-9_]+\b/, // snake_case identifier
  /\b[A-Z][A-Z0-9]*_[A-Z0-9_]+\b/, // UPPER_CASE code
  /\b[a-z_]+\[\d+\]/, // JSON path
  /\b[\w-]+\.(json|ts|js|mjs)\b/, // file name
];

export function codesIn(text: string): string[] {
  return text.split('\n').filter((l) => CODE_PATTERNS.some((p) => p.test(l)));
}

const dir = join(import.meta.dirname, '../../docs/examples');
const examples = readdirSync(dir).filter((f) => f.endsWith('.json'));

async function cli(argv: string[]): Promise<string> {
  let out = '';
  await runCli(argv, { stdout: (t) => { out += `${t}\n`; }, stderr: (t) => { out += `${t}\n`; } });
  return out;
}

describe('text reports name no internal code', () => {
  it('the code patterns find the codes of the issue', () => {
    for (const s of ['pad_friction_rear', 'WARN_FEW_LIFTS', 'PITFALL_ABS_LOST', 'load_states[1]', 'demo.json', 'linkage_broken_lowest_knee']) {
      expect(codesIn(`a ${s} b`)).toHaveLength(1);
    }
    expect(codesIn('front axle locks first (71/320/EEC Appendix); margin +0.084 (adhesion)')).toEqual([]);
  });

  it('lockstep evaluate of the demo', () => {
    expect(codesIn(textReport(evaluate(demoDesign())))).toEqual([]);
  });

  for (const f of examples) {
    it(`the text output for docs/examples/${f}`, async () => {
      const raw = JSON.parse(readFileSync(join(dir, f), 'utf8'));
      const r = readDesign(raw);
      const text = r.ok ? textReport(evaluate(r.design)) : await cli(['cg-lift', join(dir, f)]);
      expect(text.length).toBeGreaterThan(200);
      expect(codesIn(text)).toEqual([]);
    });
  }

  it('lockstep size of the sizing example', async () => {
    const text = await cli(['size', join(dir, 'sizing-no-fixed-split.json'), '--samples', '2000']);
    expect(text.length).toBeGreaterThan(200);
    expect(codesIn(text)).toEqual([]);
  });
});
