/**
 * One formatter per quantity: fixed decimals, units of the chosen system, a dash for no value.
 * Conversion factors: NIST SP 811 (2008), appendix B (1 psi = 6 894.757 Pa, 1 lbf = 4.448 222 N,
 * 1 lb = 0.453 592 37 kg, 1 in = 25.4 mm, 1 mph = 1.609 344 km/h, 1 ft = 0.3048 m).
 * Decimals per quantity and the sign and dash conventions: the project's choice (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import * as F from '../../report/format.ts';

describe('report/format', () => {
  it('prints braking rate and utilisation with 3 decimals, adhesion with 2, efficiency as a percentage', () => {
    expect(F.brakingRate(1.11634)).toBe('1.116');
    expect(F.zText(0.6333)).toBe('z = 0.633');
    expect(F.utilisation(0.87654)).toBe('0.877');
    expect(F.adhesion(0.8)).toBe('0.80');
    // one convention for a percentage: "87.7 %", never 0.877
    expect(F.efficiency(0.877)).toBe('87.7 %');
    expect(F.percentOfRatio(0.432)).toBe('43.2 %');
    expect(F.percent(43.21)).toBe('43.2 %');
  });

  it('writes a dash for no value', () => {
    for (const v of [null, undefined, NaN, Infinity]) {
      expect(F.brakingRate(v)).toBe(F.DASH);
      expect(F.pressure(v, 'us', 'bar')).toBe(F.DASH);
      expect(F.margin(v, 'adhesion', 'metric')).toBe(F.DASH);
    }
  });

  it('converts file units to the chosen system and rounds per quantity', () => {
    // 100 bar = 1450.38 psi (NIST SP 811 B.8: 1 psi = 6.894757 E+03 Pa)
    expect(F.pressure(100, 'metric', 'bar')).toBe('100.0 bar');
    expect(F.pressure(100, 'us', 'bar')).toBe('1450 psi');
    // 1000 N = 224.809 lbf
    expect(F.force(1000, 'us')).toBe('225 lbf');
    expect(F.force(1000, 'metric')).toBe('1000 N');
    // 1500 kg = 3306.9 lb
    expect(F.mass(1500, 'us')).toBe('3307 lb');
    // 2.8 m = 110.2 in; 42 mm = 1.65 in
    expect(F.length(2.8, 'us')).toBe('110.24 in');
    expect(F.shortLength(42, 'us')).toBe('1.65 in');
    expect(F.shortLength(42, 'metric')).toBe('42.0 mm');
    // 100 km/h = 62.14 mph; 70 m = 229.7 ft
    expect(F.speed(100, 'us')).toBe('62 mph');
    expect(F.distance(70, 'us')).toBe('229.7 ft');
    // 5.8 m/s² = 19.03 ft/s²
    expect(F.deceleration(5.8, 'us')).toBe('19.0 ft/s²');
    expect(F.deceleration(5.8, 'metric')).toBe('5.80 m/s²');
    expect(F.convert('pressure', 100, 'us', 'bar')).toBe(1450);
  });

  it('signs margins and writes them in the unit system', () => {
    expect(F.margin(0.0843, 'adhesion', 'metric')).toBe('+0.084 (adhesion)');
    expect(F.margin(-0.1734, 'adhesion', 'us')).toBe('−0.173 (adhesion)');
    expect(F.margin(-0.27, 'm/s²', 'metric')).toBe('−0.27 m/s²');
    // 1 m/s² = 3.2808 ft/s²
    expect(F.margin(1, 'm/s²', 'us')).toBe('+3.3 ft/s²');
    expect(F.margin(1000, 'N', 'us')).toBe('+225 lbf');
    expect(F.margin(0, 'adhesion', 'metric')).toBe('±0.000 (adhesion)');
  });

  it('never prints a negative zero', () => {
    expect(F.brakingRate(-0.0001)).toBe('0.000');
    expect(F.convert('braking_rate', -0.0001, 'metric')).toBe(0);
  });

  it('names a unit of the chosen system for every quantity', () => {
    const metricOnly = /\b(bar|kg|N|km\/h|mm|m\/s²)\b/;
    for (const k of Object.keys(F.KINDS) as F.Kind[]) {
      expect(F.unitOf(k, 'us')).not.toMatch(metricOnly);
    }
    expect(F.headWithUnit('Front pressure', 'pressure', 'us')).toBe('Front pressure (psi)');
    expect(F.headWithUnit('Braking rate z', 'braking_rate', 'us')).toBe('Braking rate z');
  });
});
