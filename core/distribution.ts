/**
 * A braking-force distribution as a function of braking rate z: the front and rear braking forces
 * T1(z), T2(z), with T1 + T2 = z P. Every distribution Lockstep handles (hydraulic with thresholds
 * and valves, a failed valve, added regeneration, a fixed split) is piecewise linear in z, so it is
 * kept as breakpoints and evaluated exactly by linear interpolation; beyond the last breakpoint it
 * continues with the last segment's slope.
 */

export interface Distribution {
  /** Vehicle weight P, N. */
  P: number;
  /** Breakpoints in braking rate, ascending, z[0] = 0. At least two, the last segment of positive length. */
  z: number[];
  /** Front and rear braking force at the breakpoints, N. */
  t1: number[];
  t2: number[];
  /** Master-cylinder and rear line pressure at the breakpoints, Pa (absent when no pedal drives it). */
  p?: number[];
  p2?: number[];
}

export interface ForcesAt {
  front: number;
  rear: number;
  /** Master-cylinder pressure, Pa (NaN when the distribution has none). */
  p: number;
  /** Rear line pressure, Pa (NaN when the distribution has none). */
  p2: number;
}

/** A linear piece T1 = a1 + b1 z, T2 = a2 + b2 z on [zFrom, zTo] (zTo may be Infinity). */
export interface Segment {
  zFrom: number;
  zTo: number;
  a1: number;
  b1: number;
  a2: number;
  b2: number;
}

/** Index j of the segment [z_j, z_j+1] that holds z (the last one for z beyond the end). */
export function segmentIndex(d: Distribution, z: number): number {
  const zs = d.z;
  let lo = 0;
  let hi = zs.length - 2;
  if (z >= zs[hi]!) return hi;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (zs[mid]! <= z) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Value of breakpoint list v a fraction `frac` of the way along segment j (the one interpolation rule). */
export function lerpAt(v: readonly number[], j: number, frac: number): number {
  const a = v[j]!;
  return a + (v[j + 1]! - a) * frac;
}
const lerp = lerpAt;

export function forcesAt(d: Distribution, z: number): ForcesAt {
  if (!(z > 0)) return { front: 0, rear: 0, p: d.p ? 0 : NaN, p2: d.p2 ? 0 : NaN };
  const j = segmentIndex(d, z);
  const frac = (z - d.z[j]!) / (d.z[j + 1]! - d.z[j]!);
  return {
    front: lerp(d.t1, j, frac),
    rear: lerp(d.t2, j, frac),
    p: d.p ? lerp(d.p, j, frac) : NaN,
    p2: d.p2 ? lerp(d.p2, j, frac) : NaN,
  };
}

/** The linear pieces of the distribution, zero-length pieces left out, the last one open-ended. */
export function segments(d: Distribution): Segment[] {
  const out: Segment[] = [];
  const n = d.z.length;
  for (let j = 0; j < n - 1; j++) {
    const z0 = d.z[j]!;
    const z1 = d.z[j + 1]!;
    if (!(z1 > z0)) continue;
    const b1 = (d.t1[j + 1]! - d.t1[j]!) / (z1 - z0);
    const b2 = (d.t2[j + 1]! - d.t2[j]!) / (z1 - z0);
    out.push({ zFrom: z0, zTo: j === n - 2 ? Infinity : z1, a1: d.t1[j]! - b1 * z0, b1, a2: d.t2[j]! - b2 * z0, b2 });
  }
  return out;
}

/** Front share of the total braking force on the first piece where both axles brake, or null. */
export function frontShareAtLowPressure(d: Distribution, segs: readonly Segment[] = segments(d)): number | null {
  for (const s of segs) {
    if (s.b1 > 0 && s.b2 > 0) return s.b1 / (s.b1 + s.b2);
  }
  return null;
}

/** Forces and pressures at many braking rates at once. */
export interface ForcesAlong {
  front: number[];
  rear: number[];
  p: number[];
  p2: number[];
}

/**
 * forcesAt for an ascending list of braking rates, walking the breakpoints once instead of searching
 * for each rate (the curves' hot loop). Same segment choice and the same arithmetic as forcesAt, so the
 * values are identical to calling it point by point.
 */
export function forcesAlong(d: Distribution, zs: ArrayLike<number>): ForcesAlong {
  const n = zs.length;
  // Plain arrays of the final length: typed arrays of this size get a separate backing store and
  // growing arrays are copied, both of which cost more than the loop itself.
  const out: ForcesAlong = { front: new Array<number>(n), rear: new Array<number>(n), p: new Array<number>(n), p2: new Array<number>(n) };
  const bz = d.z;
  const last = bz.length - 2;
  const pz = d.p;
  const p2z = d.p2;
  let j = 0;
  for (let i = 0; i < n; i++) {
    const z = zs[i]!;
    if (!(z > 0)) {
      out.front[i] = 0;
      out.rear[i] = 0;
      out.p[i] = pz ? 0 : NaN;
      out.p2[i] = p2z ? 0 : NaN;
      continue;
    }
    if (z < bz[j]!) j = 0; // not ascending after all: start the walk again
    while (j < last && bz[j + 1]! <= z) j++;
    const frac = (z - bz[j]!) / (bz[j + 1]! - bz[j]!);
    out.front[i] = lerp(d.t1, j, frac);
    out.rear[i] = lerp(d.t2, j, frac);
    out.p[i] = pz ? lerp(pz, j, frac) : NaN;
    out.p2[i] = p2z ? lerp(p2z, j, frac) : NaN;
  }
  return out;
}
