/**
 * Light N1 vehicles: 71/320/EEC Annex II Appendix point 3.1.1 (and UN R13 Annex 10), from memory — an N1
 * vehicle with a rear-axle load ratio laden/unladen of at most 1.5, or a maximum mass under 2 t, meets the
 * M1 lock-order requirement. Design: docs/examples/light-n1-van.json (invented, issue 12 point 3).
 *
 * Hand calculation (fixed split, no thresholds, no valve; reference relations f1 = φz/(ψ + χz),
 * f2 = (1 − φ)z/(1 − ψ − χz), lock-order margin f1 − f2, smallest at the top of the range here):
 *   φ = G1/(G1 + G2) = (54² · 0.120) / (54² · 0.120 + 38² · 0.114) = 349.92 / 514.54 = 0.68006
 *   unladen: ψ = 883.5/1600 = 0.55219, χ = 0.609/3 = 0.20300
 *     z = 0.50: f1 = 0.34003/0.65369 = 0.52017, f2 = 0.15997/0.34631 = 0.46194 → +0.0582 (N1, z 0.15–0.50)
 *     z = 0.80: f1 = 0.54405/0.71459 = 0.76134, f2 = 0.25595/0.28541 = 0.89680 → −0.1355 (M1, z 0.15–0.80)
 *   laden: ψ = 1097/2100 = 0.52238, χ = 0.763/3 = 0.25433
 *     z = 0.50: f1 = 0.34003/0.64955 = 0.52349, f2 = 0.15997/0.35045 = 0.45647 → +0.0670
 *     z = 0.80: f1 = 0.54405/0.72585 = 0.74953, f2 = 0.25595/0.27415 = 0.93361 → −0.1841
 *   rear-axle load ratio (2100 − 1097)/(1600 − 883.5) = 1003/716.5 = 1.400 ≤ 1.5: the M1 requirement applies.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { DesignFile } from '../../../core/design.ts';
import { evaluate } from '../../../core/evaluate.ts';
import { lightN1Reading } from '../../../core/rules/light-n1.ts';
import { sizingCurveRules } from '../../../core/sizing/sizing-rules.ts';
import { readDesign } from '../../../core/validate.ts';

const r = readDesign(JSON.parse(readFileSync(new URL('../../../docs/examples/light-n1-van.json', import.meta.url), 'utf8')));
if (!r.ok) throw new Error(JSON.stringify(r.errors));
const van: DesignFile = r.design;

describe('light N1 vehicles meet the M1 lock-order requirement', () => {
  it('the ratio from the laden and unladen states, and the requirement applied', () => {
    const reading = lightN1Reading(van)!;
    expect(reading.rear_load_ratio).toBeCloseTo(1003 / 716.5, 9);
    expect(reading.light).toBe(true);
    expect(reading.words).toMatch(/M1 requirement applied.*1\.40 does not exceed 1\.5/);
  });

  it('the van fails the M1 rule by −0.136/−0.184 and would pass the N1 one by +0.058/+0.067', () => {
    const lock = evaluate(van).checks.filter((c) => c.rule === 'eu-appendix/lock-order');
    expect(lock.map((c) => c.passed)).toEqual([false, false]);
    expect(lock[0]!.worst_margin!).toBeCloseTo(-0.1355, 3);
    expect(lock[1]!.worst_margin!).toBeCloseTo(-0.1841, 3);
    expect(lock[0]!.details!.replaced_requirement_margin as number).toBeCloseTo(0.0582, 3);
    expect(lock[1]!.details!.replaced_requirement_margin as number).toBeCloseTo(0.067, 3);
    expect(lock[0]!.details!.requirement_applied).toBe('M1');
    expect(lock[0]!.status).toBe('memory');
    expect(lock[0]!.verify_note).toBeDefined();
  });

  it('a rear-axle load ratio above 1.5 with a maximum mass of 2 t or more keeps the N1 requirement', () => {
    // laden rear load 1003 kg over an unladen 600 kg: 1.67 > 1.5, maximum mass 2100 kg
    const heavy: DesignFile = { ...van, load_states: [{ ...van.load_states[0]!, front_axle_kg: 1000 }, van.load_states[1]!] };
    const reading = lightN1Reading(heavy)!;
    expect(reading.light).toBe(false);
    const lock = evaluate(heavy).checks.filter((c) => c.rule === 'eu-appendix/lock-order');
    expect(lock[1]!.details!.requirement_applied).toBe('N1');
    expect(lock[1]!.passed).toBe(true);
  });

  it('a maximum mass under 2 t makes it light whatever the ratio', () => {
    const small: DesignFile = { ...van, ratings: { max_mass_kg: 1950 }, load_states: [{ ...van.load_states[0]!, front_axle_kg: 1000 }, van.load_states[1]!] };
    expect(lightN1Reading(small)!.light).toBe(true);
  });

  it('the sizing band works to the same requirement (z up to 0.80)', () => {
    const rules = sizingCurveRules(van);
    const lock = rules.find((x) => x.compiled.rule.id === 'eu-appendix/lock-order')!;
    expect(lock.compiled.rule.branches[0]!.pieces[0]!.z).toEqual([0.15, 0.8]);
  });
});
