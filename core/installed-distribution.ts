/**
 * The installed distribution of a hydraulic system: front line at master pressure p, rear line at
 * valve(p); T1 = G1 max(0, p − threshold1), T2 = G2 max(0, p2 − threshold2) (design-file spec).
 * T(p) = T1 + T2 is piecewise linear and non-decreasing in p; its kinks are the thresholds and the
 * valve knee, so the distribution in z is exact at those breakpoints and linear between them.
 */
import type { Distribution } from './distribution.ts';
import { masterPressureForRear, rearPressure, type ValveLaw } from './rear-valve.ts';

export interface HydraulicAxles {
  /** Vehicle weight P, N. */
  P: number;
  /** Brake gains, N per Pa. */
  G1: number;
  G2: number;
  /** Threshold pressures, Pa. */
  threshold1: number;
  threshold2: number;
  valve: ValveLaw;
}

export function installedDistribution(h: HydraulicAxles): Distribution {
  const raw = [0, h.threshold1, masterPressureForRear(h.valve, h.threshold2), h.valve.knee].filter(
    (p) => Number.isFinite(p) && p >= 0,
  );
  const ps = [...new Set(raw)].sort((a, b) => a - b);
  ps.push(ps[ps.length - 1]! + 1e6);
  const d: Distribution = { P: h.P, z: [], t1: [], t2: [], p: [], p2: [] };
  for (const p of ps) {
    const p2 = rearPressure(h.valve, p);
    const t1 = h.G1 * Math.max(0, p - h.threshold1);
    const t2 = h.G2 * Math.max(0, p2 - h.threshold2);
    d.z.push((t1 + t2) / h.P);
    d.t1.push(t1);
    d.t2.push(t2);
    d.p!.push(p);
    d.p2!.push(p2);
  }
  return d;
}
