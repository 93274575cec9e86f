// Sources: issue 9 contract — pitfalls, failed-valve cases and the pedal-travel margin appear in the CLI
// text, never silently; caution kept on every output (house rules). Pitfall sources: practitioner reports, no
// published source (IVA bias adjuster; load-sensing valve on modified suspension). Failed-valve rule:
// 71/320/EEC Annex II Appendix point 6 (partly verified), shown with the verify note.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CAUTION, demoDesign, evaluate, readDesign, VERIFY_NOTE } from '../../core/index.ts';
import { textReport } from '../../cli/text-report.ts';

describe('evaluate text report, hardware sections', () => {
  it('the demo shows the failed-valve table and the pedal-travel margin, and no pitfall section', () => {
    const text = textReport(evaluate(demoDesign()));
    expect(text).toContain('Failure of the distribution valve');
    expect(text).toContain(VERIFY_NOTE);
    expect(text).toContain('linkage broken, valve at its lowest knee');
    expect(text).toContain('Pedal travel and fluid volume');
    expect(text).toContain('rear circuit failed');
    expect(text).toContain('Defaults used');
    expect(text).not.toContain('Pitfalls (');
    expect(text).toContain(CAUTION);
  });
  it('a design with pitfalls lists each with its source before the load states', () => {
    const d = structuredClone(demoDesign());
    d.conversion = { bias_adjuster: 'driver_adjustable', suspension_modified: true };
    const text = textReport(evaluate(d));
    expect(text).toContain('Pitfalls (2):');
    expect(text).toContain("bias adjuster within the driver's reach");
    expect(text).toContain('load-sensing valve and changed suspension');
    expect(text).toMatch(/source: UK IVA/);
    expect(text.indexOf('Pitfalls (2):')).toBeLessThan(text.indexOf('Load state "Unladen, driver only"'));
  });
  it('a design without a rear valve says there is no failed-valve case', () => {
    const d = structuredClone(demoDesign());
    d.hydraulics.rear_valve = { type: 'none' };
    expect(textReport(evaluate(d))).toContain('No rear valve is fitted');
  });

  it('the example built to show each problem (docs/examples/hardware-problems.json) raises them', () => {
    const read = readDesign(JSON.parse(readFileSync(new URL('../../docs/examples/hardware-problems.json', import.meta.url), 'utf8')));
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    const r = evaluate(read.design);
    // every pitfall except the removed booster (the example keeps a booster without a vacuum source)
    expect(new Set(r.pitfalls.map((p) => p.code))).toEqual(
      new Set([
        'PITFALL_TYRE_RADIUS_CHANGED', 'PITFALL_BIAS_ADJUSTER_REACHABLE', 'PITFALL_ABS_LOST', 'PITFALL_STABILITY_CONTROL_LOST',
        'PITFALL_LOAD_SENSING_SUSPENSION', 'PITFALL_SPLIT_CHANGED', 'PITFALL_DRUM_MASTER_CYLINDER', 'PITFALL_BOOSTER_NO_VACUUM',
      ]),
    );
    // 70 mm of pedal travel available: the service test takes more than 60 % of it (default share, common practice)
    expect(r.pedal_travel.warnings.map((w) => w.code)).toContain('WARN_PEDAL_TRAVEL_SHARE');
    expect(textReport(r)).toMatch(/Warning: much of the pedal travel used: .*\(pedal travel available\)/);
  });
});
