/** The opening of every text report that judges a design: the overall verdict, then one line per failing and not-checked item. */
import { overallWord, type Verdict } from '../core/index.ts';

export function verdictSection(v: Verdict): string[] {
  const out = [`VERDICT ${v.summary}`];
  for (const f of v.failed) out.push(`  FAIL         ${f.description}`);
  for (const n of v.not_checked) out.push(`  NOT CHECKED  ${n.description}`);
  for (const a of v.advisories) out.push(`  for information (does not decide): ${a.description}`);
  if (v.overall !== 'pass') out.push(`  The design is not shown to comply (${overallWord(v)}); details in the tables below.`);
  return out;
}
