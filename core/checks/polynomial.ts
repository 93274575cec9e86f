/**
 * Small real polynomials (coefficients in ascending powers: c0 + c1 z + c2 z² + …) and their real
 * roots on an interval. Roots are isolated exactly: the roots of the derivative split the interval
 * into pieces where the polynomial is monotonic, and each sign change is then bracketed and
 * bisected to machine precision. Used for the curve checks, whose margins are ratios of
 * low-degree polynomials on each linear piece of a distribution.
 */

export type Poly = number[];

export function polyAdd(a: Poly, b: Poly): Poly {
  const n = Math.max(a.length, b.length);
  return Array.from({ length: n }, (_, i) => (a[i] ?? 0) + (b[i] ?? 0));
}

export function polyMul(a: Poly, b: Poly): Poly {
  if (a.length === 0 || b.length === 0) return [];
  const out = new Array<number>(a.length + b.length - 1).fill(0);
  for (let i = 0; i < a.length; i++) for (let j = 0; j < b.length; j++) out[i + j]! += a[i]! * b[j]!;
  return out;
}

export function polyScale(a: Poly, s: number): Poly {
  return a.map((c) => c * s);
}

export function polyEval(a: Poly, z: number): number {
  let v = 0;
  for (let i = a.length - 1; i >= 0; i--) v = v * z + a[i]!;
  return v;
}

export function polyDerivative(a: Poly): Poly {
  return a.slice(1).map((c, i) => c * (i + 1));
}

/** Drops leading coefficients that are negligible against the largest one. */
function trim(a: Poly): Poly {
  const scale = Math.max(0, ...a.map(Math.abs));
  let n = a.length;
  while (n > 0 && Math.abs(a[n - 1]!) <= scale * 1e-14) n--;
  return a.slice(0, n);
}

function bisect(a: Poly, lo: number, hi: number): number {
  let flo = polyEval(a, lo);
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (mid <= lo || mid >= hi) break;
    const fm = polyEval(a, mid);
    if (fm === 0) return mid;
    if (fm < 0 === flo < 0) {
      lo = mid;
      flo = fm;
    } else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * Real roots of a in [lo, hi], ascending. A polynomial that vanishes identically has no isolated
 * roots and gives []. Touching roots (even multiplicity) are found through the derivative's roots.
 */
export function polyRootsIn(a: Poly, lo: number, hi: number): number[] {
  const p = trim(a);
  if (p.length <= 1 || !(hi >= lo)) return [];
  if (p.length === 2) {
    const r = -p[0]! / p[1]!;
    return r >= lo && r <= hi ? [r] : [];
  }
  const crit = polyRootsIn(polyDerivative(p), lo, hi);
  const edges = [lo, ...crit.filter((c) => c > lo && c < hi), hi];
  const roots: number[] = [];
  const scale = Math.max(...p.map(Math.abs)) * 1e-13;
  for (let i = 0; i + 1 < edges.length; i++) {
    const x0 = edges[i]!;
    const x1 = edges[i + 1]!;
    const f0 = polyEval(p, x0);
    const f1 = polyEval(p, x1);
    if (Math.abs(f0) <= scale * Math.max(1, Math.abs(x0) ** (p.length - 1))) roots.push(x0);
    else if (f0 < 0 !== f1 < 0 && f1 !== 0) roots.push(bisect(p, x0, x1));
  }
  const last = edges[edges.length - 1]!;
  if (Math.abs(polyEval(p, last)) <= scale * Math.max(1, Math.abs(last) ** (p.length - 1))) roots.push(last);
  roots.sort((x, y) => x - y);
  return roots.filter((r, i) => i === 0 || r - roots[i - 1]! > 1e-13);
}
