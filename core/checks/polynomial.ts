/**
 * Small real polynomials (coefficients in ascending powers: c0 + c1 z + c2 z² + …) and their real
 * roots on an interval. Roots are isolated exactly: the roots of the derivative split the interval
 * into pieces where the polynomial is monotonic, and each sign change is then bracketed and
 * refined to machine precision (safeguarded Newton). Used for the curve checks, whose margins are ratios of
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

/** Length of `a` (its first n coefficients) once leading coefficients negligible against the largest are dropped. */
function trimmedLength(a: ArrayLike<number>, n: number): number {
  let scale = 0;
  for (let i = 0; i < n; i++) scale = Math.max(scale, Math.abs(a[i]!));
  while (n > 0 && Math.abs(a[n - 1]!) <= scale * 1e-14) n--;
  return n;
}

/** polyEval on the first n coefficients. */
function evalN(a: ArrayLike<number>, n: number, z: number): number {
  let v = 0;
  for (let i = n - 1; i >= 0; i--) v = v * z + a[i]!;
  return v;
}

/**
 * The root of a in [lo, hi], where a changes sign and is monotonic: Newton steps kept inside a
 * shrinking bracket (a bisection step whenever Newton would leave it), to machine precision.
 */
function refineRoot(a: ArrayLike<number>, n: number, lo: number, hi: number): number {
  const negAtLo = evalN(a, n, lo) < 0;
  let x = 0.5 * (lo + hi);
  for (let i = 0; i < 200; i++) {
    // value and derivative at x (Horner)
    let f = 0;
    let df = 0;
    for (let j = n - 1; j >= 0; j--) {
      df = df * x + f;
      f = f * x + a[j]!;
    }
    if (f === 0) return x;
    if (f < 0 === negAtLo) lo = x;
    else hi = x;
    let next = x - f / df;
    if (!(next > lo && next < hi)) {
      next = 0.5 * (lo + hi);
      if (next <= lo || next >= hi) break; // the bracket is two neighbouring doubles
    }
    if (next === x) break;
    x = next;
  }
  return x;
}

// Pascal's triangle up to degree 8, for the Bernstein coefficients.
const BINOMIAL: number[][] = [[1]];
for (let k = 1; k <= 8; k++) BINOMIAL.push(Array.from({ length: k + 1 }, (_, i) => (i === 0 || i === k ? 1 : BINOMIAL[k - 1]![i - 1]! + BINOMIAL[k - 1]![i]!)));
const shifted = new Float64Array(9);

/**
 * True when a (its first n coefficients, degree ≤ 8) stays more than `margin` away from zero on
 * [lo, hi]: on the interval a polynomial lies between the smallest and the largest of its Bernstein
 * coefficients, so it is enough that all of them exceed margin, or all lie below −margin.
 */
function clearOfZero(a: ArrayLike<number>, n: number, lo: number, hi: number, margin: number): boolean {
  const h = hi - lo;
  if (n > 9 || !Number.isFinite(lo) || !Number.isFinite(h)) return false;
  const q = shifted;
  for (let i = 0; i < n; i++) q[i] = a[i]!;
  // coefficients of a(lo + t) (repeated synthetic division), then of a(lo + h s), s in [0, 1]
  for (let i = 0; i < n - 1; i++) for (let j = n - 2; j >= i; j--) q[j]! += lo * q[j + 1]!;
  let hp = 1;
  for (let i = 0; i < n; i++) {
    q[i]! *= hp;
    hp *= h;
  }
  const d = n - 1;
  let min = Infinity;
  let max = -Infinity;
  for (let k = 0; k <= d; k++) {
    let b = 0;
    for (let i = 0; i <= k; i++) b += (BINOMIAL[k]![i]! / BINOMIAL[d]![i]!) * q[i]!;
    min = Math.min(min, b);
    max = Math.max(max, b);
  }
  return min > margin || max < -margin;
}

// Work space per polynomial length n (each level of the recursion has its own n, one less than its
// caller's), so that finding roots allocates nothing after the first call for a given length.
const derivBuf: Float64Array[] = [];
const critBuf: Float64Array[] = [];
const edgeBuf: Float64Array[] = [];

/**
 * Real roots of the polynomial a[0] + a[1] z + … + a[n−1] z^(n−1) in [lo, hi], ascending, written to
 * `out` (room for n values); returns how many. The allocation-free core of polyRootsIn (same result).
 */
export function polyRootsInto(a: ArrayLike<number>, length: number, lo: number, hi: number, out: Float64Array): number {
  const n = trimmedLength(a, length);
  if (n <= 1 || !(hi >= lo)) return 0;
  if (n === 2) {
    const r = -a[0]! / a[1]!;
    if (r >= lo && r <= hi) {
      out[0] = r;
      return 1;
    }
    return 0;
  }
  let scale = 0;
  for (let i = 0; i < n; i++) scale = Math.max(scale, Math.abs(a[i]!));
  scale *= 1e-13;
  // Most polynomials have no root in the interval: when the polynomial keeps well clear of zero there
  // (ten times the near-zero tolerance below, far above the rounding of the test), nothing is found
  // below either, so the search is skipped.
  if (clearOfZero(a, n, lo, hi, 10 * scale * Math.max(1, Math.max(Math.abs(lo), Math.abs(hi)) ** (n - 1)))) return 0;
  const deriv = (derivBuf[n] ??= new Float64Array(n - 1));
  for (let i = 1; i < n; i++) deriv[i - 1] = a[i]! * i;
  const crit = (critBuf[n] ??= new Float64Array(n - 1));
  const nCrit = polyRootsInto(deriv, n - 1, lo, hi, crit);
  // The derivative's roots split [lo, hi] into pieces where the polynomial is monotonic.
  const edges = (edgeBuf[n] ??= new Float64Array(n + 1));
  let nEdges = 0;
  edges[nEdges++] = lo;
  for (let i = 0; i < nCrit; i++) if (crit[i]! > lo && crit[i]! < hi) edges[nEdges++] = crit[i]!;
  edges[nEdges++] = hi;
  // Roots come out ascending (each lies in its own piece); one within 1e-13 of the previous candidate is dropped.
  let count = 0;
  let prev = NaN;
  let f0 = evalN(a, n, lo);
  for (let i = 0; i < nEdges; i++) {
    const x0 = edges[i]!;
    const f1 = i + 1 < nEdges ? evalN(a, n, edges[i + 1]!) : NaN;
    let r = NaN;
    if (Math.abs(f0) <= scale * Math.max(1, Math.abs(x0) ** (n - 1))) r = x0;
    else if (i + 1 < nEdges && f0 < 0 !== f1 < 0 && f1 !== 0) r = refineRoot(a, n, x0, edges[i + 1]!);
    if (!Number.isNaN(r)) {
      if (count === 0 || r - prev > 1e-13) out[count++] = r;
      prev = r;
    }
    f0 = f1;
  }
  return count;
}

/**
 * Real roots of a in [lo, hi], ascending. A polynomial that vanishes identically has no isolated
 * roots and gives []. Touching roots (even multiplicity) are found through the derivative's roots.
 */
export function polyRootsIn(a: Poly, lo: number, hi: number): number[] {
  const out = new Float64Array(Math.max(1, a.length));
  return Array.from(out.subarray(0, polyRootsInto(a, a.length, lo, hi, out)));
}
