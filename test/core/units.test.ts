/**
 * Units at the edges.
 * Source: NIST Special Publication 811 (2008 edition), Guide for the Use of the International System of
 * Units, appendix B.8 "Factors for units listed alphabetically" (and B.9 by kind of quantity):
 *   pound (avoirdupois) = 4.5359237 E−01 kg (exact); inch = 2.54 E−02 m (exact); foot = 3.048 E−01 m
 *   (exact); pound-force = 4.448222 E+00 N; pound-force per square inch = 6.894757 E+03 Pa;
 *   mile per hour = 4.4704 E−01 m/s (exact); standard acceleration of gravity g_n = 9.80665 m/s² (exact);
 *   bar = 1.0 E+05 Pa (exact); kilometre per hour = 2.777778 E−01 m/s.
 */
import { describe, expect, it } from 'vitest';
import { G_N, PA_PER_BAR } from '../../core/constants.ts';
import { fromSI, parseQuantity, toSI, TO_SI } from '../../core/units.ts';

describe('conversion factors (NIST SP 811 appendix B.8)', () => {
  it('exact factors are exact', () => {
    expect(TO_SI.lb).toBe(0.45359237);
    expect(TO_SI.in).toBe(0.0254);
    expect(TO_SI.ft).toBe(0.3048);
    expect(TO_SI.mph).toBe(0.44704);
    expect(G_N).toBe(9.80665);
    expect(TO_SI.g).toBe(9.80665);
    expect(PA_PER_BAR).toBe(1e5);
    expect(TO_SI.bar).toBe(1e5);
    expect(TO_SI['ft/s2']).toBe(0.3048);
  });

  it('pound-force and psi agree with the printed 7 significant digits and follow from the exact ones', () => {
    expect(Math.abs(TO_SI.lbf - 4.448222)).toBeLessThan(5e-7); // printed 4.448222 E+00
    expect(Math.abs(TO_SI.psi - 6894.757)).toBeLessThan(5e-4); // printed 6.894757 E+03
    // 1 lbf = 1 lb × g_n and 1 psi = 1 lbf / in² (definitions behind the B.8 entries)
    expect(TO_SI.lbf).toBeCloseTo(0.45359237 * 9.80665, 13);
    expect(TO_SI.psi).toBeCloseTo((0.45359237 * 9.80665) / 0.0254 ** 2, 9);
    expect(Math.abs(TO_SI['km/h'] - 0.2777778)).toBeLessThan(5e-8); // printed 2.777778 E−01
  });

  it('toSI and fromSI are inverse', () => {
    for (const u of ['lb', 'in', 'ft', 'lbf', 'psi', 'mph', 'bar', 'km/h', 'g'] as const) {
      expect(fromSI(toSI(123.456, u), u)).toBeCloseTo(123.456, 10);
    }
  });
});

describe('parseQuantity', () => {
  it('"58 in" → 1.4732 m', () => {
    const r = parseQuantity('58 in', 'length', 'm');
    expect(r).toEqual({ ok: true, value: expect.closeTo(58 * 0.0254, 12), unit: 'in' });
  });
  it('"1450 lb" → 657.708937 kg', () => {
    const r = parseQuantity('1450 lb', 'mass', 'kg');
    expect(r.ok && r.value).toBeCloseTo(1450 * 0.45359237, 9);
  });
  it('"90 psi" → 620 528.16 Pa (and upper case is accepted)', () => {
    const r = parseQuantity('90 psi', 'pressure', 'bar');
    expect(r.ok && r.value).toBeCloseTo(90 * 6894.757293168361, 4);
    expect(parseQuantity('90 PSI', 'pressure', 'bar')).toEqual(r);
  });
  it('"2.2 t" → 2200 kg (tonne = 1000 kg, NIST SP 811 B.8)', () => {
    const r = parseQuantity('2.2 t', 'mass', 'kg');
    expect(r.ok && r.value).toBeCloseTo(2200, 9);
  });
  it('a bare number is in the field unit', () => {
    const r = parseQuantity('3.4', 'length', 'm');
    expect(r).toEqual({ ok: true, value: 3.4, unit: null });
    const b = parseQuantity('90', 'pressure', 'bar');
    expect(b.ok && b.value).toBe(90e5);
  });
  it('a unit of the wrong kind or an unknown one is refused, naming what is accepted', () => {
    const r = parseQuantity('58 psi', 'length', 'm');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(/unit "psi" is not accepted here \(use .*in/);
    expect(parseQuantity('3 furlongs', 'length', 'm').ok).toBe(false);
  });
  it('empty text and text that is not a number are refused', () => {
    expect(parseQuantity('', 'mass', 'kg')).toEqual({ ok: false, reason: 'is empty' });
    expect(parseQuantity('   ', 'mass', 'kg')).toEqual({ ok: false, reason: 'is empty' });
    const r = parseQuantity('heavy', 'mass', 'kg');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toContain('is not a number');
    expect(parseQuantity('1e400 kg', 'mass', 'kg').ok).toBe(false); // not finite
  });
  it('a decimal comma is read, but "1,450" is refused as ambiguous (decimal comma or thousands separator)', () => {
    // common practice, no source: European users type decimal commas, US users thousands separators
    expect(parseQuantity('3,4 m', 'length', 'm')).toEqual({ ok: true, value: 3.4, unit: 'm' });
    const r = parseQuantity('1,450 lb', 'mass', 'kg');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toContain('ambiguous');
  });
});
