/** `lockstep evaluate FILE [--at z1,z2,...] [--json]`: exit 0 all checks pass, 1 a check fails, 2 invalid input. */
import { parseArgs } from 'node:util';
import { evaluate, readDesign } from '../../core/index.ts';
import { cliErrors } from '../errors.ts';
import { readJsonFile } from '../read-json.ts';
import { textReport } from '../text-report.ts';
import type { CommandOutput } from '../main.ts';

export function parseBrakingRates(text: string): number[] {
  const parts = text.split(',').map((s) => s.trim());
  return parts.map((p) => {
    const z = Number(p);
    if (p === '' || !Number.isFinite(z) || z < 0 || z > 1.5) {
      throw cliErrors.usage(`--at: "${p}" is not a braking rate; give numbers from 0 to 1.5 separated by commas, e.g. --at 0.3,0.5,0.8`);
    }
    return z;
  });
}

export function evaluateCommand(argv: string[], out: CommandOutput): number {
  const { values, positionals } = parseArgs({
    args: argv,
    options: { at: { type: 'string' }, json: { type: 'boolean', default: false }, curves: { type: 'boolean', default: false } },
    allowPositionals: true,
    strict: true,
  });
  if (positionals.length !== 1) throw cliErrors.usage('usage: lockstep evaluate FILE [--at z1,z2,...] [--json] [--curves]');
  const file = positionals[0]!;
  const at = values.at === undefined ? undefined : parseBrakingRates(values.at);
  const reading = readDesign(readJsonFile(file));
  if (!reading.ok) throw cliErrors.invalid(file, reading.errors.map((e) => `${e.path || '(file)'}: ${e.message}`));
  const result = evaluate(reading.design, { at, curves: values.curves, warnings: reading.warnings });
  out.stdout(values.json ? JSON.stringify(result, null, 2) : textReport(result));
  return result.checks.some((c) => (c as { passed?: boolean }).passed === false) ? 1 : 0;
}
