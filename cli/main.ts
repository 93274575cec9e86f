/**
 * The `lockstep` command line. Commands write through a CommandOutput so tests can run them in
 * process; the process wrapper (bin/lockstep.mjs) maps the returned code to the exit status.
 */
import { CAUTION } from '../core/caution.ts';
import { cliErrors, isCommandError } from './errors.ts';
import { EXIT_CODES_TEXT } from './exit-code.ts';
import type { Command, CommandOutput } from './output.ts';

export type { CommandOutput } from './output.ts';

// Each command is imported only when it runs: the packet (pdfkit) and the store (SQLite) are not loaded to evaluate.
const commands: Record<string, { load: () => Promise<Command>; summary: string }> = {
  evaluate: {
    load: async () => (await import('./commands/evaluate.ts')).evaluateCommand,
    summary: 'evaluate FILE|FOLDER ... [--at z1,z2,...] [--rules id,...] [--json] [--curves] [--report junit OUT.xml]   braking distribution, lock order and regulation checks',
  },
  'cg-lift': { load: async () => (await import('./commands/cg-lift.ts')).cgLiftCommand, summary: 'cg-lift FILE [--json]                                  CG height from axle-lift weighings, with uncertainty' },
  packet: { load: async () => (await import('./commands/packet.ts')).packetCommand, summary: 'packet FILE --out packet.pdf [--date D] | packet --revision ID --out packet.pdf   evidence packet PDF' },
  store: { load: async () => (await import('./commands/store.ts')).storeCommand, summary: 'store list|save|show|history|diff|rename|duplicate|delete ...   saved designs (LOCKSTEP_DATA_DIR)' },
  size: { load: async () => (await import('./commands/size.ts')).sizeCommand, summary: 'size FILE [--json] [--samples N] [--seed S]                 split band, parts, valve, robustness (sizing assistant)' },
  demo: { load: async () => (await import('./commands/demo.ts')).demoCommand, summary: 'demo                                                   print the demo design file' },
};

export function usage(): string {
  return [
    'Lockstep: brake-proportioning and traction-limit design assistant',
    '',
    'usage: lockstep <command> [options]',
    '',
    ...Object.values(commands).map((c) => `  lockstep ${c.summary}`),
    '',
    `${EXIT_CODES_TEXT} lockstep packet writes the packet and exits with the verdict's code too. For several files: the worst of them (2, then 1, then 3, then 0).`,
    `Caution: ${CAUTION}`,
  ].join('\n');
}

export async function runCli(argv: string[], out: CommandOutput): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    out.stdout(usage());
    return name === undefined ? 2 : 0;
  }
  const cmd = commands[name];
  if (!cmd) {
    out.stderr(`lockstep: unknown command "${name}"\n\n${usage()}`);
    return 2;
  }
  try {
    return await (await cmd.load())(rest, out);
  } catch (thrown) {
    // node:util parseArgs refuses an unknown option or a missing value with a TypeError of its own
    const parseArgs = thrown instanceof TypeError && (thrown as NodeJS.ErrnoException).code?.startsWith('ERR_PARSE_ARGS');
    const e = parseArgs ? cliErrors.usage((thrown as Error).message) : thrown;
    if (!isCommandError(e)) throw thrown;
    out.stderr([`lockstep ${name}: ${e.message} [${e.code}]`, ...e.details.map((d) => `  - ${d}`)].join('\n'));
    return 2;
  }
}
