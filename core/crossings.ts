/**
 * Crossings of the ideal distribution: braking rates where f1 − f2 changes sign.
 * Where both axle loads are positive, f1 − f2 has the sign of D(z) = T1(z) − z N1(z)
 * (T1 + T2 = z(N1 + N2), so f1 and f2 lie on either side of z). On a linear piece
 * T1 = a + b z, D(z) = −χP z² + (b − P1) z + a: a quadratic solved exactly per piece.
 * Searched over (0, 1.5] below rear-axle lift-off (design-file spec).
 */
import type { AxleLoadModel } from './axle-loads.ts';
import { CROSSING_Z_MAX } from './constants.ts';
import { type Distribution, forcesAt, type Segment, segments } from './distribution.ts';

export interface Crossings {
  /** Every z at which f1 − f2 changes sign, ascending. */
  rates: number[];
  /** Lowest crossing where f1 − f2 goes from positive to negative (rear locks first above it), or null. */
  critical: number | null;
}

function quadraticRoots(A: number, B: number, C: number): number[] {
  if (A === 0) return B === 0 ? [] : [-C / B];
  const disc = B * B - 4 * A * C;
  if (disc < 0) return [];
  const sq = Math.sqrt(disc);
  const q = -0.5 * (B + (B >= 0 ? sq : -sq));
  const roots: number[] = [];
  if (q !== 0) roots.push(q / A, C / q);
  else roots.push(0);
  return roots;
}

/** Sign of f1 − f2 at z (where N2 > 0): +1 front uses more adhesion, −1 rear, 0 equal. */
export function frontRearSign(m: AxleLoadModel, d: Distribution, z: number): number {
  const D = forcesAt(d, z).front - z * (m.P1 + m.chi * m.P * z);
  const scale = 1e-12 * m.P * Math.max(z, 1e-9);
  return D > scale ? 1 : D < -scale ? -1 : 0;
}

/** `segs` may be passed in when the caller has them already (segments(d) of the same distribution). */
export function crossings(m: AxleLoadModel, d: Distribution, segs: readonly Segment[] = segments(d)): Crossings {
  const zMax = Math.min(CROSSING_Z_MAX, m.zLift);
  const A = -m.chi * m.P;
  const candidates: number[] = [];
  for (const s of segs) {
    if (s.zFrom >= zMax) break;
    const hi = Math.min(s.zTo, zMax);
    for (const r of quadraticRoots(A, s.b1 - m.P1, s.a1)) {
      if (r > 1e-12 && r >= s.zFrom - 1e-12 && r <= hi + 1e-12 && r < zMax) candidates.push(r);
    }
  }
  candidates.sort((a, b) => a - b);
  const roots: number[] = [];
  for (const r of candidates) {
    if (roots.length === 0 || r - roots[roots.length - 1]! > 1e-10) roots.push(r);
  }
  // The sign is constant between consecutive roots: read it at the midpoints.
  const edges = [0, ...roots, zMax];
  const signs: number[] = [];
  for (let i = 0; i + 1 < edges.length; i++) signs.push(frontRearSign(m, d, (edges[i]! + edges[i + 1]!) / 2));
  const rates: number[] = [];
  let critical: number | null = null;
  for (let i = 0; i < roots.length; i++) {
    const left = signs[i]!;
    const right = signs[i + 1]!;
    if (left !== 0 && right !== 0 && left !== right) {
      rates.push(roots[i]!);
      if (critical === null && left > 0 && right < 0) critical = roots[i]!;
    }
  }
  return { rates, critical };
}
