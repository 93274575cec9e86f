/** `lockstep demo`: prints the demo design file (an invented scenario) to stdout. */
import { demoDesign } from '../../core/index.ts';
import { cliErrors } from '../errors.ts';
import type { CommandOutput } from '../output.ts';

export function demoCommand(argv: string[], out: CommandOutput): number {
  if (argv.length > 0) throw cliErrors.usage('usage: lockstep demo  (prints the demo design file; redirect it: lockstep demo > demo.json)');
  out.stdout(JSON.stringify(demoDesign(), null, 2));
  return 0;
}
