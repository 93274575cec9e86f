/** `lockstep cg-lift FILE [--json]`: CG height from axle-lift weighings. Exit 0 on a result, 2 on invalid input. */
import { parseArgs } from 'node:util';
import { type AxleLiftResultFile, axleLiftResultFile, BUDGET_SOURCE_WORDS, readAxleLift } from '../../core/index.ts';
import { cliErrors } from '../errors.ts';
import type { CommandOutput } from '../output.ts';
import { readJsonFile } from '../read-json.ts';
import { fmt, textTable } from '../table.ts';

export function axleLiftText(r: AxleLiftResultFile): string {
  const out: string[] = [];
  out.push(`CG height by axle lift${r.name ? `: ${r.name}` : ''}`);
  out.push('');
  out.push(`  CG height above ground:  ${fmt(r.cg_height_m, 3)} m  (standard uncertainty ${fmt(r.standard_uncertainty_m, 3)} m, k = 1)`);
  out.push(`  CG behind front axle:    ${fmt(r.cg_to_front_axle_m, 3)} m  (from the level readings)`);
  out.push(`  Vehicle mass (level):    ${fmt(r.mass_kg, 1)} kg`);
  if (r.scatter_uncertainty_m !== null) {
    out.push(`  Scatter of the lifts about the fit: ${fmt(r.scatter_uncertainty_m, 3)} m (χ² ${fmt(r.fit_chi_squared, 2)}, ${r.fit_degrees_of_freedom} degrees of freedom)`);
  }
  out.push('');
  out.push('  Each lift alone (angle in degrees, reading change in kg, heights in m):');
  out.push(
    textTable(
      ['lift', 'raised', 'axle read', 'angle °', 'change kg', 'h m', 'u(h) m'],
      r.lifts.map((l) => [
        String(l.index + 1),
        l.raised_axle,
        l.read_axle,
        fmt(l.lift_angle_deg, 2),
        fmt(l.reading_change_kg, 1),
        fmt(l.cg_height_m, 3),
        fmt(l.standard_uncertainty_m, 3),
      ]),
      '    ',
    ),
  );
  out.push('');
  out.push('  Uncertainty budget (contribution = |sensitivity| × standard uncertainty, m):');
  out.push(
    textTable(
      ['input', 'value', 'u', 'contribution m', 'share %'],
      r.budget.entries.map((e) => [
        e.input,
        `${fmt(e.value, e.unit === 'kg' ? 1 : 3)} ${e.unit}`,
        `${fmt(e.standard_uncertainty, e.unit === 'kg' ? 2 : 4)} ${e.unit}`,
        fmt(e.contribution_m, 4),
        fmt(e.variance_share * 100, 1),
      ]),
      '    ',
    ),
  );
  out.push(
    textTable(
      ['by source', 'contribution m', 'share %'],
      r.budget.by_source.map((b) => [BUDGET_SOURCE_WORDS[b.source] ?? b.source, fmt(b.contribution_m, 4), fmt(b.variance_share * 100, 1)]),
      '    ',
    ),
  );
  if (r.budget.largest_source) {
    out.push(`  Largest contribution: ${BUDGET_SOURCE_WORDS[r.budget.largest_source]} (single largest input: ${r.budget.largest_input}).`);
  }
  out.push('');
  out.push(`  Method: ${r.method}`);
  for (const w of r.warnings) out.push(`  Warning: ${w.message}`);
  out.push('');
  out.push(`Caution: ${r.caution}`);
  return out.join('\n');
}

export function cgLiftCommand(argv: string[], out: CommandOutput): number {
  const { values, positionals } = parseArgs({
    args: argv,
    options: { json: { type: 'boolean', default: false } },
    allowPositionals: true,
    strict: true,
  });
  if (positionals.length !== 1) throw cliErrors.usage('usage: lockstep cg-lift FILE [--json]  (FILE: a lockstep-axle-lift/1 JSON file, see docs/axle-lift.md)');
  const file = positionals[0]!;
  const reading = readAxleLift(readJsonFile(file));
  if (!reading.ok) throw cliErrors.axleLiftInvalid(file, reading.errors.map((e) => `${e.path || '(file)'}: ${e.message}`));
  const result = axleLiftResultFile(reading.input);
  out.stdout(values.json ? JSON.stringify(result, null, 2) : axleLiftText(result));
  return 0;
}
