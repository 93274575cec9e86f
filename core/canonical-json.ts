/**
 * Canonical JSON: one text for one content, so that a hash of it can name a design revision.
 * Rules: object keys sorted by UTF-16 code units (JSON.stringify order of a sorted key list), no whitespace,
 * keys whose value is undefined left out (as JSON does), numbers normalised (-0 → 0; rounded to
 * CANONICAL_DIGITS significant digits, which removes conversion noise such as 0.30000000000000004, then
 * printed in the shortest round-trip form ECMAScript defines for Number.prototype.toString).
 * Non-finite numbers, functions, symbols and bigints have no JSON form and are refused (CORE_ERR_CANONICAL_*, a
 * programming error at the caller: designs are parsed JSON).
 */
import { coreErrors } from './errors.ts';

/** Significant digits kept in canonical numbers: below the 15.95 digits a double carries. */
export const CANONICAL_DIGITS = 15;

export function canonicalNumber(n: number): string {
  if (!Number.isFinite(n)) throw coreErrors.canonicalNonFinite(null, n);
  if (n === 0) return '0';
  const rounded = Number(n.toPrecision(CANONICAL_DIGITS));
  // Next to the largest double, rounding up would overflow to Infinity: keep the number as it is.
  return String(Number.isFinite(rounded) ? rounded : n);
}

function write(v: unknown, path: string, out: string[]): void {
  if (v === null) {
    out.push('null');
    return;
  }
  switch (typeof v) {
    case 'number':
      try {
        out.push(canonicalNumber(v));
      } catch {
        throw coreErrors.canonicalNonFinite(path, v);
      }
      return;
    case 'string':
      out.push(JSON.stringify(v));
      return;
    case 'boolean':
      out.push(v ? 'true' : 'false');
      return;
    case 'object': {
      if (Array.isArray(v)) {
        out.push('[');
        v.forEach((item, i) => {
          if (i > 0) out.push(',');
          // JSON writes undefined array members as null
          write(item === undefined ? null : item, `${path}[${i}]`, out);
        });
        out.push(']');
        return;
      }
      const obj = v as Record<string, unknown>;
      const keys = Object.keys(obj).filter((k) => obj[k] !== undefined).sort();
      out.push('{');
      keys.forEach((k, i) => {
        if (i > 0) out.push(',');
        out.push(JSON.stringify(k), ':');
        write(obj[k], path ? `${path}.${k}` : k, out);
      });
      out.push('}');
      return;
    }
    default:
      throw coreErrors.canonicalType(path, typeof v);
  }
}

/** The canonical JSON text of a JSON-like value. */
export function canonicalJson(value: unknown): string {
  const out: string[] = [];
  write(value, '', out);
  return out.join('');
}
