/**
 * From a front share φ to parts. The recommended share is the one that maximises the smallest margin
 * over every rule and load state for a fixed split (margins from core/sizing/rule-margin.ts). Keeping
 * one axle's brakes as they are, the other axle's brake gain must be G_other = G_kept·φ/(1 − φ) (front)
 * or G_kept·(1 − φ)/φ (rear); the gain is proportional to the clamp (or wheel-cylinder) area, so every
 * piston diameter of that axle scales by √(G_new/G_old). The exact diameters are then rounded to the
 * neighbouring standard sizes (core/sizing/catalogue.ts) and each candidate is run through the full
 * model and the issue-4 curve checks (thresholds and valves included).
 */
import { axleLoadModel } from '../axle-loads.ts';
import type { DesignFile } from '../design.ts';
import { stateModel } from '../state-model.ts';
import { type CatalogueSize, CATALOGUE_SOURCE, nearestSizes, type PartKind, SIZE_CATALOGUE } from './catalogue.ts';
import { designMargins, type RuleMargin } from './design-margins.ts';
import { fixedSplitSegments, geometryOf, ruleMargin } from './rule-margin.ts';
import type { SizingRule } from './sizing-rules.ts';
import type { IntervalSet } from './split-band.ts';

/** Smallest margin of a fixed split φ over every rule and load state (adhesion units). */
export function splitMargin(design: DesignFile, rules: readonly SizingRule[], phi: number): number {
  let m = Infinity;
  for (const r of rules) {
    for (const i of r.states) {
      const s = design.load_states[i]!;
      const loads = axleLoadModel(s.mass_kg, s.front_axle_kg, s.cg_height_m, design.vehicle.wheelbase_m);
      m = Math.min(m, ruleMargin(r.compiled, geometryOf(loads), fixedSplitSegments(phi, loads.P)));
    }
  }
  return m;
}

/**
 * φ maximising the smallest margin: a grid of step 0.0025 over the band (or over 0.02…0.98 when it is
 * empty), then a golden-section refinement around the best grid point to 1e-7.
 */
export function recommendedSplit(design: DesignFile, rules: readonly SizingRule[], band: IntervalSet): { phi: number; margin: number } {
  const f = (phi: number) => splitMargin(design, rules, phi);
  const ranges: IntervalSet = band.length > 0 ? band : [[0.02, 0.98]];
  let best = { phi: NaN, margin: -Infinity };
  const step = 0.0025;
  for (const [lo, hi] of ranges) {
    const n = Math.max(1, Math.ceil((hi - lo) / step));
    for (let k = 0; k <= n; k++) {
      const phi = lo + ((hi - lo) * k) / n;
      const m = f(phi);
      if (m > best.margin) best = { phi, margin: m };
    }
  }
  if (!Number.isFinite(best.margin)) return best;
  const within = ranges.find(([lo, hi]) => best.phi >= lo && best.phi <= hi) ?? ranges[0]!;
  let a = Math.max(within[0], best.phi - step);
  let b = Math.min(within[1], best.phi + step);
  const gr = (Math.sqrt(5) - 1) / 2;
  let c = b - gr * (b - a);
  let d = a + gr * (b - a);
  let fc = f(c);
  let fd = f(d);
  while (b - a > 1e-7) {
    if (fc >= fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - gr * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + gr * (b - a);
      fd = f(d);
    }
  }
  const phi = 0.5 * (a + b);
  const m = f(phi);
  return m >= best.margin ? { phi, margin: m } : best;
}

export interface PartOption {
  /** What changes, in words. */
  change: string;
  axle: 'front' | 'rear';
  part: PartKind;
  /** Design-file path of the changed value and the new value (the page's "apply" writes it). */
  path: string;
  value: number | number[];
  from_mm: number[];
  to_mm: number[];
  /** "exact" for the computed diameter, otherwise the catalogue series. */
  series: 'exact' | 'metric' | 'inch';
  label: string;
  source: string;
  /** Front share at low pressure with this part (first load state). */
  front_share: number | null;
  smallest_margin: number | null;
  passes: boolean;
  margins: RuleMargin[];
}

type Axle = 'front' | 'rear';

function axleParts(design: DesignFile, axle: Axle): { kind: PartKind; path: string; diameters: number[] } {
  const b = design.axles[axle].brake;
  return b.type === 'disc'
    ? { kind: 'caliper_piston', path: `axles.${axle}.brake.piston_diameters_mm`, diameters: [...b.piston_diameters_mm] }
    : { kind: 'wheel_cylinder', path: `axles.${axle}.brake.wheel_cylinder_diameter_mm`, diameters: [b.wheel_cylinder_diameter_mm] };
}

/** A copy of the design with the axle's piston (or wheel-cylinder) diameters replaced. */
export function withDiameters(design: DesignFile, axle: Axle, diameters: readonly number[]): DesignFile {
  const b = design.axles[axle].brake;
  const brake = b.type === 'disc' ? { ...b, piston_diameters_mm: [...diameters] } : { ...b, wheel_cylinder_diameter_mm: diameters[0]! };
  return { ...design, axles: { ...design.axles, [axle]: { ...design.axles[axle], brake } } };
}

const LIMITS: Record<string, [number, number]> = { caliper_piston: [10, 120], wheel_cylinder: [10, 60] };

function evaluateOption(
  design: DesignFile,
  rules: readonly SizingRule[],
  axle: Axle,
  kind: PartKind,
  path: string,
  from: number[],
  to: number[],
  series: PartOption['series'],
  label: string,
  source: string,
): PartOption {
  const changed = withDiameters(design, axle, to);
  const dm = designMargins(changed, rules);
  const what = kind === 'caliper_piston' ? 'caliper piston' : 'wheel cylinder';
  return {
    change: `${axle} ${what}${to.length > 1 ? 's' : ''} ${from.map((d) => `${round(d)} mm`).join(' + ')} → ${label}`,
    axle,
    part: kind,
    path,
    value: kind === 'caliper_piston' ? to.map(round) : round(to[0]!),
    from_mm: from,
    to_mm: to.map(round),
    series,
    label,
    source,
    front_share: dm.front_share[0] ?? null,
    smallest_margin: dm.smallest_margin,
    passes: dm.passes,
    margins: dm.margins,
  };
}

function round(x: number): number {
  return Math.round(x * 1000) / 1000;
}

/**
 * Options that move the low-pressure front share to φ: for each axle changed (the other kept), the
 * exact diameters and the neighbouring catalogue sizes, each checked with the full model. Passing
 * options first, then by smallest margin.
 */
export function partOptions(design: DesignFile, rules: readonly SizingRule[], phi: number): PartOption[] {
  const s = stateModel(design, design.load_states[0]!);
  const out: PartOption[] = [];
  for (const axle of ['front', 'rear'] as const) {
    const { kind, path, diameters } = axleParts(design, axle);
    const factor = axle === 'front' ? (s.G2 * phi) / (1 - phi) / s.G1 : (s.G1 * (1 - phi)) / phi / s.G2;
    if (!(factor > 0) || !Number.isFinite(factor)) continue;
    const scale = Math.sqrt(factor);
    const exact = diameters.map((d) => d * scale);
    const [min, max] = LIMITS[kind]!;
    if (exact.some((d) => d < min || d > max)) continue;
    out.push(evaluateOption(design, rules, axle, kind, path, diameters, exact, 'exact', exact.map((d) => `${round(d)} mm`).join(' + ') + ' (computed, not a stock size)', 'computed from the recommended front share'));
    const candidates: { to: number[]; series: 'metric' | 'inch'; label: string; source: string }[] = [];
    if (diameters.every((d) => d === diameters[0])) {
      for (const c of nearestSizes(kind, exact[0]!)) candidates.push(fromSize(c, diameters.length));
    } else {
      for (const series of SIZE_CATALOGUE.filter((x) => x.kind === kind)) {
        const picks = exact.map((d) => {
          let best = 0;
          for (let i = 1; i < series.diameters_mm.length; i++) if (Math.abs(series.diameters_mm[i]! - d) < Math.abs(series.diameters_mm[best]! - d)) best = i;
          return best;
        });
        candidates.push({ to: picks.map((i) => series.diameters_mm[i]!), series: series.series, label: picks.map((i) => series.labels[i]!).join(' + '), source: series.source });
      }
    }
    for (const c of candidates) {
      if (c.to.some((d) => d < min || d > max)) continue;
      out.push(evaluateOption(design, rules, axle, kind, path, diameters, c.to, c.series, c.label, c.source));
    }
  }
  return out.sort((a, b) => Number(b.passes) - Number(a.passes) || (b.smallest_margin ?? -Infinity) - (a.smallest_margin ?? -Infinity));
}

function fromSize(c: CatalogueSize, n: number): { to: number[]; series: 'metric' | 'inch'; label: string; source: string } {
  return { to: Array(n).fill(c.diameter_mm), series: c.series, label: n > 1 ? `${n} × ${c.label}` : c.label, source: c.source };
}

export { CATALOGUE_SOURCE };
