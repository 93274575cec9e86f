// Text sections for the limits (report/limits.ts rendered by cli/text-report.ts).
// Sources: issue 7 contract (traction, regeneration, stopping in m and ft, tester, heat in the CLI output,
// each labelled as an estimate); brief "Rules of the house" (every output keeps the caution).
import { describe, expect, it } from 'vitest';
import { CAUTION, demoDesign, evaluate } from '../../core/index.ts';
import { textReport } from '../../cli/text-report.ts';

describe('limits in the text report', () => {
  it('the demo shows all five parts, distances in m and ft, and the caution', () => {
    const text = textReport(evaluate(demoDesign()));
    for (const s of ['Traction limits', 'Stopping distance', 'Roller brake tester', 'Regenerative braking (estimate)', 'Brake heat (estimate']) {
      expect(text).toContain(s);
    }
    expect(text).toMatch(/No ABS: total \(m\)\s+No ABS: total \(ft\)/);
    expect(text).toContain(`CAUTION: ${CAUTION}`);
  });
  it('without regen and heat blocks those parts are left out, the per-state parts stay', () => {
    const d = demoDesign();
    delete d.regen;
    delete d.heat;
    const lines = textReport(evaluate(d));
    expect(lines).not.toContain('Regenerative braking');
    expect(lines).not.toContain('Brake heat');
    expect(lines).toContain('Traction limits');
  });
  it('an unladen van with a light rear axle on the rollers is flagged for a laden test', () => {
    // hand-derived with the demo brakes: G1 = 4 · 0.4 · 2 · (π/4 · 0.048²) · 0.128/0.345 = 214.8 N/bar (threshold
    // 0.5 bar), G2 = 4 · 0.4 · (π/4 · 0.048²) · 0.118/0.345 = 99.0 N/bar (threshold 1 bar). Rear axle 300 kg,
    // no valve: slip at 0.85 · 300 · 9.80665 = 2500.7 N → 1 + 2500.7/99.0 = 26.3 bar. 50 % of 3500 kg = 17 161.6 N
    // needs 214.8 (p − 0.5) + 99.0 (p − 1) = 17 161.6 → p = 55.3 bar, so the rear slips first; the reading is at
    // most 0.85 · (1500 + 300)/3500 = 43.7 % < 50 %.
    const d = demoDesign();
    d.hydraulics.rear_valve = { type: 'none' };
    d.load_states[0] = { ...d.load_states[0]!, mass_kg: 1800, front_axle_kg: 1500 };
    const text = textReport(evaluate(d));
    expect(text).toMatch(/Flag: the rear wheels will slip on the rollers/);
    expect(text).toContain('plan a laden or load-simulated roller test');
  });
});

describe('docs/examples/limits-awd-ev.json', () => {
  it('is a valid design that uses every limits block; the all-wheel rows use its 40/60 split', async () => {
    const { readFileSync } = await import('node:fs');
    const { readDesign } = await import('../../core/index.ts');
    const r = readDesign(JSON.parse(readFileSync(new URL('../../docs/examples/limits-awd-ev.json', import.meta.url), 'utf8')));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    for (const k of ['traction', 'regen', 'stopping', 'heat', 'tester'] as const) expect(r.design[k]).toBeDefined();
    const res = evaluate(r.design);
    const awd = res.load_states[0]!.traction.filter((t) => t.drive === 'all');
    expect(awd.every((t) => t.front_drive_share === 0.4 && t.is_design_drive)).toBe(true);
    expect(res.regen!.blending).toBe('fixed_proportion');
    expect(res.regen!.front_share).toBe(0.4);
  });
});
