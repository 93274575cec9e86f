/**
 * The sizing assistant's proposals (core/sizing): applying the recommended change turns a failing
 * design into one that passes the issue-4 curve checks (core/checks/run-checks.ts) in every load
 * state; a balance bar locked at the proposed setting gives the hand-derived split; catalogue sizes
 * carry their source.
 */
import { describe, expect, it } from 'vitest';
import { runChecks } from '../../../core/checks/run-checks.ts';
import { demoDesign, type DesignFile, frontShareAtLowPressure, readDesign, stateModel, stateModels } from '../../../core/index.ts';
import { applySizingChange } from '../../../core/sizing/apply-change.ts';
import { CATALOGUE_SOURCE, catalogueSizes, SIZE_CATALOGUE } from '../../../core/sizing/catalogue.ts';
import { masterCylinderBore } from '../../../core/sizing/master-cylinder-bore.ts';
import { sizeDesign } from '../../../core/sizing/sizing.ts';
import { fixedSplitDesign } from './fixtures.ts';

/** Curve-rule checks of issue 4 that decide the outcome and failed. */
function failingCurveChecks(d: DesignFile) {
  const reading = readDesign(d);
  if (!reading.ok) throw new Error(JSON.stringify(reading.errors));
  const checks = runChecks(reading.design, stateModels(reading.design));
  const curveIds = new Set(['eu-appendix/efficiency', 'eu-appendix/lock-order']);
  return checks.filter((c) => curveIds.has(c.rule) && c.applies && !c.advisory && c.passed === false);
}

/** Demo van with too much rear brake and no valve (test data): fails lock order. */
function tooMuchRear(): DesignFile {
  const d = demoDesign();
  d.hydraulics.rear_valve = { type: 'none' };
  d.axles.rear.brake = { ...d.axles.rear.brake, piston_diameters_mm: [66] } as DesignFile['axles']['rear']['brake'];
  return d;
}

/** Van whose unladen and laden states differ so much that no fixed split serves both (test data). */
function noFixedSplit(): DesignFile {
  const d = demoDesign();
  d.hydraulics.rear_valve = { type: 'none' };
  d.load_states[0] = { ...d.load_states[0]!, mass_kg: 2300, front_axle_kg: 1600, cg_height_m: 0.75 };
  d.load_states[1] = { ...d.load_states[1]!, mass_kg: 3500, front_axle_kg: 1450, cg_height_m: 1.05 };
  return d;
}

describe('applying the recommended option', () => {
  it('a design failing lock order passes every curve check after the recommended part change', () => {
    const d = tooMuchRear();
    expect(failingCurveChecks(d).length).toBeGreaterThan(0);
    const r = sizeDesign(d, { samples: 500 });
    expect(r.current.passes).toBe(false);
    expect(r.band).not.toBeNull();
    const opt = r.recommended_option!;
    expect(opt.series).not.toBe('exact');
    const fixed = applySizingChange(d, opt.path, opt.value);
    expect(failingCurveChecks(fixed)).toEqual([]);
    // the recommended share lies in the band
    expect(r.recommended_front_share!).toBeGreaterThanOrEqual(r.band!.min_front_share);
    expect(r.recommended_front_share!).toBeLessThanOrEqual(r.band!.max_front_share);
  });

  it('the exact diameter gives the recommended share (thresholds zero): φ = G1/(G1 + G2), G ∝ piston area', () => {
    // hand-derived: with no thresholds and no valve the installed share is G1/(G1 + G2) (design-file spec, brake gain);
    // scaling the rear piston diameter by √k scales G2 by k.
    const d = fixedSplitDesign({ rules: ['eu-appendix'], rearPistonMm: 50 });
    const r = sizeDesign(d, { samples: 200 });
    const exact = r.options.find((o) => o.series === 'exact' && o.axle === 'rear')!;
    const changed = applySizingChange(d, exact.path, exact.value);
    const s = stateModel(changed, changed.load_states[0]!);
    expect(s.G1 / (s.G1 + s.G2)).toBeCloseTo(r.recommended_front_share!, 4);
  });

  it('when no fixed split passes, the band is reported empty and a rear valve setting is found that passes', () => {
    const d = noFixedSplit();
    const r = sizeDesign(d, { samples: 500 });
    expect(r.band).toBeNull();
    expect(r.messages.join(' ')).toMatch(/band is empty/);
    expect(r.valve).not.toBeNull();
    expect(r.valve!.passes).toBe(true);
    const fixed = applySizingChange(d, r.valve_search!.path, r.valve!.valve);
    expect(failingCurveChecks(d).length).toBeGreaterThan(0);
    expect(failingCurveChecks(fixed)).toEqual([]);
    // the margin map covers the whole grid and marks the chosen point
    const map = r.valve_search!.map;
    expect(map.smallest_margin).toHaveLength(map.ratio.length);
    expect(map.smallest_margin[0]).toHaveLength(map.knee_bar.length);
  });
});

describe('balance bar', () => {
  it('the proposed setting gives the recommended split: λ = ((1 − s)/s)(d_f/d_r)², φ = G1/(G1 + λ G2)', () => {
    // hand-derived: pushrod force F splits s : (1 − s); p_front = sF/A_f, p_rear = (1 − s)F/A_r,
    // so p_rear/p_front = λ and, with no thresholds, T2/T1 = λ G2 / G1.
    const d = fixedSplitDesign({ rules: ['eu-appendix'], category: 'M1' });
    d.hydraulics.balance_bar = { rear_bore_mm: 19, setting_front_share: 0.5, driver_adjustable: true };
    const r = sizeDesign(d, { samples: 200 });
    const bb = r.balance_bar!;
    expect(bb.warning).toMatch(/driver/);
    const locked = applySizingChange(d, bb.path, bb.recommended_setting_front_share);
    const s = stateModel(locked, locked.load_states[0]!);
    const own = stateModel({ ...d, hydraulics: { ...d.hydraulics, balance_bar: undefined } }, d.load_states[0]!);
    const sb = bb.recommended_setting_front_share;
    const lambda = ((1 - sb) / sb) * (22.2 / 19) ** 2;
    expect(frontShareAtLowPressure(s.dist)).toBeCloseTo(own.G1 / (own.G1 + lambda * own.G2), 9);
    expect(frontShareAtLowPressure(s.dist)).toBeCloseTo(r.recommended_front_share!, 3);
    expect(bb.with_recommended.passes).toBe(true);
    // the rear line pressure is the rear master pressure: λ times the front one
    const p = s.dist.p!;
    const p2 = s.dist.p2!;
    expect(p2[1]! / p[1]!).toBeCloseTo(lambda, 9);
  });
});

describe('catalogue and master cylinder', () => {
  it('every catalogue size carries its source, marked common practice', () => {
    expect(SIZE_CATALOGUE.length).toBeGreaterThan(0);
    for (const s of SIZE_CATALOGUE) expect(s.source).toContain(CATALOGUE_SOURCE);
    expect(CATALOGUE_SOURCE).toBe('common practice, no source');
    const r = sizeDesign(tooMuchRear(), { samples: 200 });
    for (const o of r.options) expect(o.source.length).toBeGreaterThan(0);
    for (const o of r.options.filter((x) => x.series !== 'exact')) expect(o.source).toContain(CATALOGUE_SOURCE);
  });

  it('inch sizes are exact fractions of 25.4 mm', () => {
    // NIST SP 811 B.8: 1 in = 25.4 mm exactly.
    const sevenEighths = catalogueSizes('master_cylinder').find((c) => c.label === '7/8 in')!;
    expect(sevenEighths.diameter_mm).toBeCloseTo(22.225, 12);
  });

  it('line pressure at the pedal-force limit follows p = F·i_pedal/A (hot-rod tech page)', () => {
    // Hot-rod technical page "Formula for Master Cylinder Pressure" (hotrodheaven.com/tech/brakes/brakes4.htm,
    // π = 3.14, ±1 psi): 100 lbf, ratio 6:1, no booster, 7/8 in → 998 psi.
    // Pressure is proportional to force, so at the rule's 700 N limit p = 998 psi × 700 N / 100 lbf.
    // 1 lbf = 4.448222 N, 1 psi = 6894.757 Pa (NIST SP 811 B.8).
    const d = fixedSplitDesign({ rules: ['eu-appendix', 'performance'] });
    d.hydraulics.pedal_ratio = 6;
    d.hydraulics.booster_ratio = 1;
    const b = masterCylinderBore(d, { max_line_pressure_bar: 400 })!;
    expect(b.pedal_force_limit_n).toBe(700); // N1 service figure of 71/320/EEC Annex II 2.1.1 (rule set performance)
    const c = b.candidates.find((x) => x.label === '7/8 in')!;
    const expectedPsi = (998 * 700) / (100 * 4.448222);
    // ±1 psi of the source scaled by 700/444.8 plus the source's π = 3.14 (0.05 %): 3 psi
    expect(Math.abs((c.pressure_at_limit_bar * 1e5) / 6894.757 - expectedPsi)).toBeLessThan(3);
  });

  it('the bore window: pedal force at the largest bore equals the target', () => {
    // hand-derived: pedal force ∝ bore area at a fixed pressure (design-file spec, pedal force), so at
    // max_bore = bore·√(target/F) the force is the target.
    const d = demoDesign();
    const b = masterCylinderBore(d)!;
    expect(b.max_bore_mm).not.toBeNull();
    const at = structuredClone(d);
    at.hydraulics.master_cylinder_bore_mm = b.max_bore_mm!;
    const again = masterCylinderBore(at)!;
    expect(again.max_bore_mm!).toBeCloseTo(b.max_bore_mm!, 6);
    for (const c of b.candidates.filter((x) => x.meets)) {
      expect(c.pedal_force_n).toBeLessThanOrEqual(b.pedal_force_target_n + 1e-9);
      expect(c.pressure_at_limit_bar).toBeLessThanOrEqual(b.max_line_pressure_bar + 1e-9);
    }
  });
});
