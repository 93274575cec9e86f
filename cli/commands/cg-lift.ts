/** `lockstep cg-lift FILE [--json]`: CG height from axle-lift weighings. Exit 0 on a result, 2 on invalid input. */
import { parseArgs } from 'node:util';
import { type AxleLiftResultFile, axleLiftResultFile, BUDGET_SOURCE_WORDS, readAxleLift } from '../../core/index.ts';
import { cliErrors } from '../errors.ts';
import type { CommandOutput } from '../output.ts';
import { readJsonFile } from '../read-json.ts';
import * as F from '../../report/format.ts';
import { textTable } from '../table.ts';

/** The command's text is in metric units (it has no units option). */
const UNITS = 'metric' as const;
const len = (v: number | null | undefined) => F.length(v, UNITS);
const bare = (kind: F.Kind, v: number | null | undefined, from?: F.FromUnit) => F.format(kind, v, UNITS, { from, unit: false });
/** A budget entry's value in the quantity of its unit (metres, kilograms or degrees). */
function entryValue(v: number, unit: string, extraDigits = 0): string {
  if (unit === 'kg') return F.format('mass', v, UNITS, { extraDigits });
  if (unit === '°') return F.format('angle', v, UNITS, { from: 'deg', extraDigits });
  return F.format('length', v, UNITS, { extraDigits });
}

export function axleLiftText(r: AxleLiftResultFile): string {
  const out: string[] = [];
  out.push(`CG height by axle lift${r.name ? `: ${r.name}` : ''}`);
  out.push('');
  out.push(`  CG height above ground:  ${len(r.cg_height_m)}  (standard uncertainty ${len(r.standard_uncertainty_m)}, k = 1)`);
  out.push(`  CG behind front axle:    ${len(r.cg_to_front_axle_m)}  (from the level readings)`);
  out.push(`  Vehicle mass (level):    ${F.mass(r.mass_kg, UNITS)}`);
  if (r.scatter_uncertainty_m !== null) {
    out.push(`  Scatter of the lifts about the fit: ${len(r.scatter_uncertainty_m)} (χ² ${F.ratio(r.fit_chi_squared)}, ${r.fit_degrees_of_freedom} degrees of freedom)`);
  }
  out.push('');
  out.push('  Each lift alone (angle, reading change and heights in the units of the column heads):');
  out.push(
    textTable(
      ['lift', 'raised', 'axle read', F.headWithUnit('angle', 'angle', UNITS), F.headWithUnit('change', 'mass', UNITS), F.headWithUnit('h', 'length', UNITS), F.headWithUnit('u(h)', 'length', UNITS)],
      r.lifts.map((l) => [
        String(l.index + 1),
        l.raised_axle,
        l.read_axle,
        bare('angle', l.lift_angle_deg, 'deg'),
        bare('mass', l.reading_change_kg),
        bare('length', l.cg_height_m),
        bare('length', l.standard_uncertainty_m),
      ]),
      '    ',
    ),
  );
  out.push('');
  out.push('  Uncertainty budget (contribution = |sensitivity| × standard uncertainty):');
  out.push(
    textTable(
      ['input', 'value', 'u', F.headWithUnit('contribution', 'length', UNITS), F.headWithUnit('share', 'percent', UNITS)],
      r.budget.entries.map((e) => [
        e.input,
        entryValue(e.value, e.unit),
        entryValue(e.standard_uncertainty, e.unit, 2),
        F.uncertainty('length', e.contribution_m, UNITS, { unit: false }),
        F.format('percent', e.variance_share, UNITS, { from: 'ratio', unit: false }),
      ]),
      '    ',
    ),
  );
  out.push(
    textTable(
      ['by source', F.headWithUnit('contribution', 'length', UNITS), F.headWithUnit('share', 'percent', UNITS)],
      r.budget.by_source.map((b) => [BUDGET_SOURCE_WORDS[b.source] ?? b.source, F.uncertainty('length', b.contribution_m, UNITS, { unit: false }), F.format('percent', b.variance_share, UNITS, { from: 'ratio', unit: false })]),
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
