/** `lockstep evaluate FILE [--at z1,z2,...] [--rules id,id] [--json]`: exit code from the verdict (cli/exit-code.ts: 0 pass, 1 fail, 2 invalid input, 3 incomplete). */
import { parseArgs } from 'node:util';
import { evaluate, readDesign, RULE_SELECTORS } from '../../core/index.ts';
import { exitCodeFor } from '../exit-code.ts';
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

/** `--rules eu-appendix,fmvss135`: rule-set ids or single rule ids, each one known. */
export function parseRuleSelection(text: string): string[] {
  const ids = text.split(',').map((s) => s.trim());
  for (const id of ids) {
    if (!RULE_SELECTORS.includes(id)) {
      throw cliErrors.usage(`--rules: "${id}" is not a rule set or rule; use one or more of ${RULE_SELECTORS.join(', ')} separated by commas`);
    }
  }
  return ids;
}

export function evaluateCommand(argv: string[], out: CommandOutput): number {
  const { values, positionals } = parseArgs({
    args: argv,
    options: { at: { type: 'string' }, json: { type: 'boolean', default: false }, curves: { type: 'boolean', default: false }, rules: { type: 'string' } },
    allowPositionals: true,
    strict: true,
  });
  if (positionals.length !== 1) throw cliErrors.usage('usage: lockstep evaluate FILE [--at z1,z2,...] [--rules id,id,...] [--json] [--curves]');
  const file = positionals[0]!;
  const at = values.at === undefined ? undefined : parseBrakingRates(values.at);
  const rules = values.rules === undefined ? undefined : parseRuleSelection(values.rules);
  const reading = readDesign(readJsonFile(file));
  if (!reading.ok) throw cliErrors.invalid(file, reading.errors.map((e) => `${e.path || '(file)'}: ${e.message}`));
  const result = evaluate(reading.design, { at, curves: values.curves, rules, warnings: reading.warnings });
  out.stdout(values.json ? JSON.stringify(result, null, 2) : textReport(result));
  // the verdict counts the failed distribution device (71/320 Annex II Appendix point 6) and regeneration too
  return exitCodeFor(result.verdict);
}
