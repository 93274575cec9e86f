/**
 * The `lockstep` command line. Commands write through a CommandOutput so tests can run them in
 * process; the process wrapper (bin/lockstep.mjs) maps the returned code to the exit status.
 */
import { CAUTION } from '../core/index.ts';
import { demoCommand } from './commands/demo.ts';
import { cgLiftCommand } from './commands/cg-lift.ts';
import { evaluateCommand } from './commands/evaluate.ts';
import { sizeCommand } from './commands/size.ts';
import { packetCommand } from './commands/packet.ts';
import { storeCommand } from './commands/store.ts';
import { CliError } from './errors.ts';
import { EXIT_CODES_TEXT } from './exit-code.ts';

export interface CommandOutput {
  stdout(text: string): void;
  stderr(text: string): void;
}

type Command = (argv: string[], out: CommandOutput) => number | Promise<number>;

const commands: Record<string, { run: Command; summary: string }> = {
  evaluate: { run: evaluateCommand, summary: 'evaluate FILE [--at z1,z2,...] [--rules id,...] [--json] [--curves]   braking distribution, lock order and regulation checks' },
  'cg-lift': { run: cgLiftCommand, summary: 'cg-lift FILE [--json]                                  CG height from axle-lift weighings, with uncertainty' },
  packet: { run: packetCommand, summary: 'packet FILE --out packet.pdf [--date D] | packet --revision ID --out packet.pdf   evidence packet PDF' },
  store: { run: storeCommand, summary: 'store list|save|show|history|diff|rename|duplicate|delete ...   saved designs (LOCKSTEP_DATA_DIR)' },
  size: { run: sizeCommand, summary: 'size FILE [--json] [--samples N] [--seed S]                 split band, parts, valve, robustness (sizing assistant)' },
  demo: { run: demoCommand, summary: 'demo                                                   print the demo design file' },
};

export function usage(): string {
  return [
    'Lockstep: brake-proportioning and traction-limit design assistant',
    '',
    'usage: lockstep <command> [options]',
    '',
    ...Object.values(commands).map((c) => `  lockstep ${c.summary}`),
    '',
    `${EXIT_CODES_TEXT} lockstep packet writes the packet and exits with the verdict's code too.`,
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
    return await cmd.run(rest, out);
  } catch (e) {
    if (e instanceof CliError) {
      out.stderr([`lockstep ${name}: ${e.message} [${e.code}]`, ...e.details.map((d) => `  - ${d}`)].join('\n'));
      return 2;
    }
    if (e instanceof TypeError && (e as NodeJS.ErrnoException).code?.startsWith('ERR_PARSE_ARGS')) {
      out.stderr(`lockstep ${name}: ${e.message} [CLI_ERR_USAGE]`);
      return 2;
    }
    throw e;
  }
}
