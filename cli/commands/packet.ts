/**
 * `lockstep packet FILE --out packet.pdf [--date ISO] [--rules id,...]` (rules as for `lockstep evaluate`) or `lockstep packet --revision ID --out packet.pdf`:
 * writes the evidence packet PDF of a design file or of a saved revision (see docs/evidence-packet.md). The packet is
 * written whatever the verdict; the exit code is the verdict's (cli/exit-code.ts), as for `lockstep evaluate`.
 */
import { writeFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { readDesign } from '../../core/index.ts';
import { buildPacket } from '../../packet/build-packet.ts';
import { openStore } from '../../store/design-store.ts';
import { cliErrors } from '../errors.ts';
import { exitCodeFor } from '../exit-code.ts';
import { readJsonFile } from '../read-json.ts';
import type { CommandOutput } from '../output.ts';
import { parseRuleSelection } from './evaluate.ts';
import { runStore } from './store.ts';

const USAGE = 'usage: lockstep packet FILE --out packet.pdf [--date YYYY-MM-DD] [--rules id,...]  or  lockstep packet --revision ID --out packet.pdf';

export function parseDate(text: string | undefined): Date {
  if (text === undefined) return new Date();
  const d = new Date(/^\d{4}-\d{2}-\d{2}$/.test(text) ? `${text}T00:00:00Z` : text);
  if (Number.isNaN(d.getTime())) throw cliErrors.usage(`--date: "${text}" is not a date; give e.g. 2026-12-01 or 2026-12-01T14:30:00Z`);
  return d;
}

export async function packetCommand(argv: string[], out: CommandOutput): Promise<number> {
  const { values, positionals } = parseArgs({
    args: argv,
    options: { out: { type: 'string', short: 'o' }, date: { type: 'string' }, revision: { type: 'string' }, rules: { type: 'string' } },
    allowPositionals: true,
    strict: true,
  });
  if (!values.out) throw cliErrors.usage(`--out is required. ${USAGE}`);
  if ((values.revision === undefined) === (positionals.length !== 1) || positionals.length > 1) throw cliErrors.usage(USAGE);
  const date = parseDate(values.date);
  const rules = values.rules === undefined ? undefined : parseRuleSelection(values.rules);
  let input: unknown;
  let label: string;
  if (values.revision !== undefined) {
    const rev = values.revision;
    input = runStore((s) => s.revision(rev).design, () => openStore());
    label = `revision ${rev}`;
  } else {
    label = positionals[0]!;
    input = readJsonFile(label);
  }
  const reading = readDesign(input);
  if (!reading.ok) throw cliErrors.invalid(label, reading.errors.map((e) => `${e.path || '(file)'}: ${e.message}`));
  const saved = values.revision !== undefined;
  const { pdf, revisionId, result } = await buildPacket(reading.design, { date, saved, warnings: reading.warnings, ...(rules ? { rules } : {}) });
  try {
    writeFileSync(values.out, pdf);
  } catch (e) {
    throw cliErrors.fileUnwritable(values.out, (e as Error).message);
  }
  out.stdout(`wrote ${values.out} (${pdf.length} bytes), ${saved ? `revision ${revisionId}` : 'a draft (not a saved revision; save it with lockstep store save to print its revision)'}\nVERDICT ${result.verdict.summary}`);
  return exitCodeFor(result.verdict);
}
