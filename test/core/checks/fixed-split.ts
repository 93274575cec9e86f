/**
 * Hand-built systems for the regulation-check tests (not a test file).
 *
 * Loads: m = 1000 kg, ψ = P1/P = 0.5, χ = h/E = 0.5/2.5 = 0.2, so N1 = P(0.5 + 0.2 z),
 * N2 = P(0.5 − 0.2 z), rear lift-off at z = 2.5.
 * A fixed split φ = T1/(T1 + T2) gives the closed forms (hand-derived from the axle loads under braking, N1 = P1 + zPh/E: common practice, no source):
 *   f1(z) = φ z / (ψ + χ z),  f2(z) = (1 − φ) z / (1 − ψ − χ z),  crossing at z* = (φ − ψ)/χ.
 */
import { axleLoadModel } from '../../../core/axle-loads.ts';
import type { DesignFile } from '../../../core/design.ts';
import type { Distribution } from '../../../core/distribution.ts';

export const PSI = 0.5;
export const CHI = 0.2;
export const loads = axleLoadModel(1000, 1000 * PSI, CHI * 2.5, 2.5);
export const P = loads.P;

export function fixedSplit(phi: number): Distribution {
  return { P, z: [0, 1], t1: [0, phi * P], t2: [0, (1 - phi) * P] };
}

export const f1 = (phi: number, z: number) => (phi * z) / (PSI + CHI * z);
export const f2 = (phi: number, z: number) => ((1 - phi) * z) / (1 - PSI - CHI * z);

/**
 * Two pieces: front share 0.57 up to z = 0.40 (T2 = 0.43·0.40 P = 0.172 P there), then the rear
 * force held at 0.172 P (a limiting valve) and the front taking the rest, T1 = zP − 0.172 P.
 * Piece 1 crosses the ideal at z* = (0.57 − 0.5)/0.2 = 0.35; on piece 2, f1 = f2 where
 * T1 = z N1: z − 0.172 = z(0.5 + 0.2 z) → 0.2 z² − 0.5 z + 0.172 = 0 → z = (0.5 − √0.1124)/0.4.
 */
export function crossBack(): Distribution {
  return { P, z: [0, 0.4, 1], t1: [0, 0.57 * 0.4 * P, (1 - 0.172) * P], t2: [0, 0.172 * P, 0.172 * P] };
}

/**
 * A whole design file with a fixed split: equal sliding calipers (40 mm pistons, μ 0.4, r 0.12 m,
 * tyre 0.3 m) on both axles, no thresholds, no valve, so φ = front pistons / all pistons exactly.
 * Brake gain per axle (design-file spec): G = 2·2·μ·n·(π/4)d²·r/R.
 */
export function splitDesign(opts: {
  frontPistons: number;
  rearPistons: number;
  category?: DesignFile['vehicle']['category'];
  abs?: boolean;
  mass_kg?: number;
  boosterRatio?: number;
  split?: 'front_rear' | 'diagonal';
  extra?: Partial<DesignFile>;
}): DesignFile {
  const m = opts.mass_kg ?? 1000;
  const caliper = (n: number) => ({
    type: 'disc' as const,
    caliper: 'sliding' as const,
    piston_diameters_mm: Array.from({ length: n }, () => 40),
    effective_radius_m: 0.12,
    pad_friction: 0.4,
    threshold_pressure_bar: 0,
  });
  return {
    format: 'lockstep-design/1',
    name: 'hand-built fixed split',
    vehicle: { category: opts.category ?? 'M1', wheelbase_m: 2.5, abs: opts.abs ?? false, drive: 'front' },
    load_states: [
      { id: 'unladen', label: 'unladen', kind: 'unladen', mass_kg: m, front_axle_kg: m * PSI, cg_height_m: 0.5 },
      { id: 'laden', label: 'laden', kind: 'laden', mass_kg: m, front_axle_kg: m * PSI, cg_height_m: 0.5 },
    ],
    axles: { front: { tyre_radius_m: 0.3, brake: caliper(opts.frontPistons) }, rear: { tyre_radius_m: 0.3, brake: caliper(opts.rearPistons) } },
    hydraulics: {
      master_cylinder_bore_mm: 25,
      pedal_ratio: 4,
      booster_ratio: opts.boosterRatio ?? 4,
      circuit_split: opts.split ?? 'front_rear',
      rear_valve: { type: 'none' },
    },
    ...opts.extra,
  } as DesignFile;
}

/** Brake gain of one axle with n 40 mm pistons as in splitDesign, N/Pa (design-file spec formula). */
export function gainOf(n: number): number {
  return (2 * 2 * 0.4 * n * (Math.PI / 4) * 0.04 ** 2 * 0.12) / 0.3;
}

/** Master pressure for a pedal force with splitDesign's pedal (bore 25 mm, ratio 4, booster b): p = F·4·b / A. */
export function pressureFor(force: number, booster: number): number {
  return (force * 4 * booster) / ((Math.PI / 4) * 0.025 ** 2);
}

/** Smallest margin by a dense scan: a cross-check only, never the checker's method. */
export function scanMin(fn: (z: number) => number, a: number, b: number, n = 20000): { min: number; at: number } {
  let min = Infinity;
  let at = a;
  for (let i = 0; i <= n; i++) {
    const z = a + ((b - a) * i) / n;
    const v = fn(z);
    if (v < min) {
      min = v;
      at = z;
    }
  }
  return { min, at };
}
