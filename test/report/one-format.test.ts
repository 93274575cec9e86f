/**
 * One number, one format (issue 15 point 7): a braking rate, a percentage and a margin are printed the same way by
 * the command line and every workbench panel; never 1.116 beside 1.1163, nor 87.7 % beside 0.877.
 * Source: the project's rule "one formatter per quantity, everywhere" (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { demoDesign, evaluate } from '../../core/index.ts';
import { textReport } from '../../cli/text-report.ts';
import * as F from '../../report/format.ts';
import { checksPanel } from '../../views/panels/checks.ts';
import { tablePanel } from '../../views/panels/table.ts';
import { verdictPanel } from '../../views/panels/verdict.ts';

describe('one number, one format', () => {
  const design = demoDesign();
  const result = evaluate(design, { curves: true });
  const ctx = { design, result, units: 'metric' as const, warnings: [] };
  const cli = textReport(result);
  const pages = [verdictPanel, checksPanel, tablePanel].map((p) => p.results!(ctx).html).join('\n');

  it('the critical braking rate reads the same in the command line and on the page, to 3 decimals', () => {
    const z = result.load_states[0]!.critical_braking_rate!;
    expect(z).not.toBeNull();
    const shown = F.zText(z);
    expect(shown).toMatch(/^z = \d\.\d{3}$/);
    expect(cli).toContain(`Critical braking rate: ${shown}`);
    expect(pages).toContain(shown);
    // the same rate at 4 decimals appears nowhere
    const four = z.toFixed(4);
    expect(cli).not.toContain(four);
    expect(pages).not.toContain(four);
  });

  it('the lowest braking efficiency is a percentage with one decimal in both, never a fraction', () => {
    const e = result.load_states[0]!.lowest_efficiency!;
    const shown = F.efficiency(e.efficiency);
    expect(shown).toMatch(/^\d+\.\d %$/);
    expect(cli).toContain(`Lowest braking efficiency: ${shown}`);
    expect(pages).toContain(shown);
    expect(pages).not.toContain(e.efficiency.toFixed(3));
  });

  it('a check margin reads the same in the command line and in the checks table', () => {
    const c = result.checks.find((x) => x.applies && x.passed !== null && x.margin_unit === 'adhesion')!;
    const shown = F.margin(c.worst_margin, c.margin_unit, 'metric');
    expect(cli).toContain(`margin ${shown}`);
    expect(pages).toContain(shown);
  });

  it('the operating points print z and f with 3 decimals on the page and in the command line', () => {
    const p = result.load_states[0]!.at[4]!;
    for (const v of [F.brakingRate(p.braking_rate), F.utilisation(p.front_utilisation)]) {
      expect(v).toMatch(/^\d\.\d{3}$/);
      expect(cli).toContain(v);
      expect(pages).toContain(`>${v}<`);
    }
  });
});
