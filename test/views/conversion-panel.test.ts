/**
 * The conversion panel (views/panels/conversion.ts).
 * Sources: hand-derived figures of a small build-up (wheelbase 3.0 m; baseline 1200 / 800 kg; battery
 * 300 kg added at x = 1.5 m → front +150 kg, rear +150 kg by the rule rear = m x / L of a medium-duty
 * truck body-builder manual, appendix "Weight Distribution"), and OWASP rule #1 for the escaping of
 * user text (item names).
 */
import { describe, expect, it } from 'vitest';
import { demoDesign, evaluate, readDesign } from '../../core/index.ts';
import { conversionResults } from '../../views/panels/conversion.ts';

function design(withRatings: boolean) {
  const d = demoDesign() as unknown as Record<string, unknown>;
  (d.vehicle as Record<string, unknown>).wheelbase_m = 3.0;
  d.build_up = {
    baseline: { front_axle_kg: 1200, rear_axle_kg: 800, cg_height_m: 0.7, cg_height_source: 'maker' },
    added: [{ name: 'battery <b>pack</b>', mass_kg: 300, x_m: 1.5, cg_height_m: 0.4, group: 'battery' }],
  };
  if (withRatings) d.ratings = { max_mass_kg: 3500, max_rear_axle_kg: 1000 };
  const r = readDesign(d);
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r;
}

describe('conversion panel', () => {
  it('shows the build-up lines, group subtotals, before/after and escapes item names', () => {
    const r = design(false);
    const out = conversionResults({ design: r.design, result: evaluate(r.design), units: 'metric', warnings: r.warnings }).html;
    expect(out).toContain('battery &lt;b&gt;pack&lt;/b&gt;');
    expect(out).not.toContain('<b>pack</b>');
    expect(out).toMatch(/Subtotals per group/);
    // battery: +300 kg, front +150, rear +150 (hand-derived)
    expect(out).toMatch(/<td>battery<\/td><td>1<\/td><td>\+300<\/td><td>\+150<\/td><td>\+150<\/td>/);
    expect(out).toMatch(/After conversion/);
    expect(out).toMatch(/Enter the ratings/);
  });

  it('shows rating margins with "over" where a rating is exceeded', () => {
    const r = design(true);
    const out = conversionResults({ design: r.design, result: evaluate(r.design), units: 'metric', warnings: r.warnings }).html;
    expect(out).toMatch(/Margins against the ratings/);
    // demo laden state: 3500 kg, front 1610 → rear 1890 kg, 890 kg over a 1000 kg rear rating
    expect(out).toContain('−890 (over)');
    expect(out).toContain('WARN_AXLE_OVER_RATING');
  });
});
