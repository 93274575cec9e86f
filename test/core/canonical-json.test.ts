// Sources: RFC 8785 (JSON Canonicalization Scheme) §3.2.3 — object members sorted by their names as UTF-16
// code units, no whitespace; ECMA-262 Number::toString for the shortest round-trip number text; RFC 8259 for
// what JSON can hold (no NaN/Infinity). The rounding to 15 significant digits is our own rule (documented in
// core/canonical-json.ts): IEEE 754 doubles carry 15.95 decimal digits, so 15 removes conversion noise only.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { canonicalJson, canonicalNumber, demoDesign } from '../../core/index.ts';
import { LockstepError } from '../../core/errors.ts';

describe('canonicalJson', () => {
  it('sorts keys at every depth and writes no whitespace (RFC 8785 §3.2.3)', () => {
    expect(canonicalJson({ b: 1, a: { d: [3, { z: 1, y: 2 }], c: 'x' } })).toBe('{"a":{"c":"x","d":[3,{"y":2,"z":1}]},"b":1}');
  });
  it('orders keys by UTF-16 code units: upper case before lower case, "_" between (RFC 8785 §3.2.3)', () => {
    // code units: "B" 0x42 < "_" 0x5F < "a" 0x61
    expect(canonicalJson({ a: 1, _: 2, B: 3 })).toBe('{"B":3,"_":2,"a":1}');
  });
  it('leaves out keys whose value is undefined, as JSON.stringify does', () => {
    expect(canonicalJson({ a: undefined, b: null })).toBe('{"b":null}');
  });
  it('writes -0 as 0 and removes float noise beyond 15 significant digits', () => {
    expect(canonicalNumber(-0)).toBe('0');
    // 0.1 + 0.2 = 0.30000000000000004 in IEEE 754 binary64 (17 significant digits)
    expect(canonicalNumber(0.1 + 0.2)).toBe('0.3');
    // 25.4 mm entered as 1 in × 25.4: the same number, the same text
    expect(canonicalNumber(1 * 25.4)).toBe('25.4');
    expect(canonicalNumber(1e21)).toBe('1e+21'); // ECMA-262 Number::toString switches to exponent form at 1e21
    // rounding 1.7976931348623151e308 to 15 digits would overflow past Number.MAX_VALUE (found by fast-check)
    expect(canonicalNumber(1.7976931348623151e308)).toBe('1.7976931348623151e+308');
  });
  it('keeps numbers that differ in the 15th significant digit apart', () => {
    expect(canonicalNumber(1.23456789012345)).not.toBe(canonicalNumber(1.23456789012346));
  });
  it('refuses values JSON cannot hold (RFC 8259 §6: no NaN or Infinity)', () => {
    expect(() => canonicalJson({ a: Number.NaN })).toThrow(LockstepError);
    expect(() => canonicalJson({ a: Number.NaN })).toThrow(expect.objectContaining({ code: 'CORE_ERR_CANONICAL_NON_FINITE' }));
    expect(() => canonicalJson({ f: () => 1 })).toThrow(expect.objectContaining({ code: 'CORE_ERR_CANONICAL_TYPE' }));
    expect(() => canonicalJson({ a: { b: [Infinity] } })).toThrow(/a\.b\[0\]/);
    expect(() => canonicalJson({ f: () => 1 })).toThrow(/function/);
  });
  it('is independent of key insertion order (property)', () => {
    fc.assert(
      fc.property(fc.dictionary(fc.string(), fc.oneof(fc.integer(), fc.string(), fc.boolean())), (obj) => {
        const reversed = Object.fromEntries(Object.entries(obj).reverse());
        expect(canonicalJson(reversed)).toBe(canonicalJson(obj));
      }),
    );
  });
  it('parses back to an equal value (property, finite numbers)', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (v) => {
        const text = canonicalJson(v);
        // parse → canonicalise again gives the same text (idempotent)
        expect(canonicalJson(JSON.parse(text))).toBe(text);
      }),
    );
  });
  it('gives the demo design the same text however its keys were ordered', () => {
    const d = demoDesign();
    const shuffled = JSON.parse(JSON.stringify(d, Object.keys(d).reverse().concat(...collectKeys(d))));
    expect(canonicalJson(shuffled)).toBe(canonicalJson(d));
  });
});

function collectKeys(v: unknown, out: string[] = []): string[] {
  if (Array.isArray(v)) v.forEach((x) => collectKeys(x, out));
  else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) (out.push(k), collectKeys(x, out));
  return out;
}
