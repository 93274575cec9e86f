/**
 * CG height by the axle-lift method, with its standard uncertainty.
 *
 * Geometry (hand-derived, moments about the wheel centre of the axle that stays down): the vehicle of
 * weight W (here in kg; only ratios of masses enter) stands level with axle masses Wf, Wr. One axle is
 * raised until the wheel centres differ in height by H, so the body tilts by θ = asin(H / L). The CG lies
 * (h − r) above the line through the wheel centres; tilting moves it horizontally towards the lower axle
 * by (h − r) sin θ, so the axle that stays down gains ΔW = W (h − r) tan θ / L and the raised axle loses
 * the same. Hence, per lift, h = r + L ΔW / (W tan θ) (derived here; R. N. Jazar, Vehicle Dynamics:
 * Theory and Application (2008), Example 43, prints a wrong answer for this method, so it is no check).
 * Assumptions: rigid tyres of equal loaded radius r front and rear, suspension locked, no fluid shift, no horizontal force at the wheels (brakes off, wheels free to roll).
 *
 * Several lifts: the reading of each axle is a straight line in x = σ tan θ (σ = +1 when the reading is
 * of the axle that stays down, −1 when it is of the raised axle), y = c_axle + s x, with the level reading
 * as the point x = 0 and one intercept per axle read; the common slope s = W (h − r) / L comes from the
 * pooled least-squares fit, and h = r + L s / W with W = Wf + Wr (level).
 *
 * Standard uncertainty: linear propagation (JCGM 100:2008 "GUM", 5.1.2, from memory) with sensitivity
 * coefficients taken by central differences of the estimator. Each scale reading contributes a
 * rectangular distribution of full width one resolution step: u = resolution / √12 (GUM 4.3.7 and
 * F.2.2.1, from memory). Lift heights, lift angles, the wheelbase and the wheel-centre height carry the
 * standard uncertainties the user states. Inputs are taken as uncorrelated.
 */
import { coreErrors } from './errors.ts';

export type AxleEnd = 'front' | 'rear';

export interface AxleLiftReading {
  raised_axle: AxleEnd;
  /** Height the raised axle's wheel centres were lifted above the level position, m. */
  lift_height_m?: number | undefined;
  /** Or the body pitch angle measured directly, degrees. */
  lift_angle_deg?: number | undefined;
  /** Scale reading of one axle during the lift, kg (normally the axle that stays down). */
  front_axle_kg?: number | undefined;
  rear_axle_kg?: number | undefined;
}

export interface AxleLiftInput {
  wheelbase_m: number;
  /** Wheel-centre height above the ground (static loaded radius), m. */
  wheel_centre_height_m: number;
  level: { front_axle_kg: number; rear_axle_kg: number };
  lifts: readonly AxleLiftReading[];
  /** Smallest step the scales display, kg. */
  scale_resolution_kg: number;
  /** Standard uncertainties (one standard deviation) of the length measurements, m. */
  lift_height_uncertainty_m: number;
  wheelbase_uncertainty_m: number;
  wheel_centre_height_uncertainty_m?: number | undefined;
  /** Standard uncertainty of a lift angle measured directly, degrees. */
  lift_angle_uncertainty_deg?: number | undefined;
}

export type BudgetSource = 'scale_resolution' | 'lift_height' | 'lift_angle' | 'wheelbase' | 'wheel_centre_height';

/** How each source of the uncertainty budget is named for a person (page, command line, packet). */
export const BUDGET_SOURCE_WORDS: Record<BudgetSource, string> = {
  scale_resolution: 'scale readings (resolution)',
  lift_height: 'lift heights',
  lift_angle: 'lift angles',
  wheelbase: 'wheelbase',
  wheel_centre_height: 'wheel-centre height',
};

export interface BudgetEntry {
  /** What the input is, in words, e.g. "lift 2 (rear raised): front axle reading". */
  input: string;
  /** Key of the input file, e.g. `lifts[1].front_axle_kg`. */
  path: string;
  source: BudgetSource;
  value: number;
  unit: string;
  standard_uncertainty: number;
  /** ∂h/∂input, m per unit of the input. */
  sensitivity: number;
  /** |sensitivity| × standard uncertainty, m. */
  contribution_m: number;
  /** Share of the combined variance, 0..1. */
  variance_share: number;
}

export interface BudgetBySource {
  source: BudgetSource;
  contribution_m: number;
  variance_share: number;
}

export interface AxleLiftBudget {
  entries: BudgetEntry[];
  by_source: BudgetBySource[];
  /** The source of the largest share of the variance (null when every uncertainty is zero). */
  largest_source: BudgetSource | null;
  /** The single input with the largest contribution. */
  largest_input: string | null;
}

export interface LiftResult {
  index: number;
  raised_axle: AxleEnd;
  read_axle: AxleEnd;
  lift_angle_deg: number;
  tan_angle: number;
  /** Change of the reading from the level reading of the same axle, kg. */
  reading_change_kg: number;
  /** CG height from this lift alone, and its standard uncertainty, m. */
  cg_height_m: number;
  standard_uncertainty_m: number;
}

export interface AxleLiftWarning {
  code: string;
  path: string;
  message: string;
}

export interface AxleLiftResult {
  cg_height_m: number;
  standard_uncertainty_m: number;
  /** Longitudinal CG position from the level readings, behind the front axle, m. */
  cg_to_front_axle_m: number;
  /** Vehicle mass from the level readings, kg. */
  mass_kg: number;
  /** Slope of the fit, kg of axle load per unit tan θ. */
  fit_slope_kg: number;
  /** Type A uncertainty from the scatter of the lifts about the fit (null with fewer than two lifts), m. */
  scatter_uncertainty_m: number | null;
  /** χ² of the fit residuals against the stated uncertainties and its degrees of freedom. */
  fit_chi_squared: number | null;
  fit_degrees_of_freedom: number;
  lifts: LiftResult[];
  budget: AxleLiftBudget;
  warnings: AxleLiftWarning[];
}

/**
 * Below this largest lift angle the result is flagged. Why 10°: the load change is W (h − r) tan θ / L,
 * which for a van (h − r ≈ 0.5 m, L ≈ 3.5 m) at 10° is about 2.5 % of the vehicle mass, so scale
 * resolution, tyre deflection and friction at the wheels already weigh heavily; the axle-lift method
 * (ISO 10392) as practitioners describe it asks for a lift of at least 600 mm (practitioner reports, no
 * published source), which is about 10° on a 3.5 m wheelbase.
 */
export const MIN_USEFUL_LIFT_ANGLE_DEG = 10;

/** A standard uncertainty above this is flagged as too coarse for brake design (5 cm is about 5 % of a van's CG height; common practice, no source). */
export const LARGE_CG_UNCERTAINTY_M = 0.05;

/** One scale step of width `resolution` as a rectangular distribution: u = resolution / √12. */
export function resolutionUncertainty(resolution: number): number {
  return resolution / Math.sqrt(12);
}

const DEG = Math.PI / 180;

/** χ² quantile by the Wilson–Hilferty approximation (within about 1 % for k ≥ 1; from memory). */
export function chiSquaredQuantile(p: number, k: number): number {
  // z for p = 0.99 is 2.3263 (from memory); only the quantiles used here are tabulated.
  const z = p === 0.99 ? 2.3263478740408408 : p === 0.95 ? 1.6448536269514722 : NaN;
  const a = 2 / (9 * k);
  return k * (1 - a + z * Math.sqrt(a)) ** 3;
}

interface Param {
  input: string;
  path: string;
  source: BudgetSource;
  value: number;
  unit: string;
  u: number;
}

interface Layout {
  params: Param[];
  /** Index of each quantity inside the parameter vector. */
  L: number;
  r: number;
  lf: number;
  lr: number;
  liftMeasure: number[];
  liftReading: number[];
  liftIsAngle: boolean[];
  raised: AxleEnd[];
  read: AxleEnd[];
}

function readAxleOf(l: AxleLiftReading): AxleEnd {
  if (l.front_axle_kg !== undefined && l.rear_axle_kg === undefined) return 'front';
  if (l.rear_axle_kg !== undefined && l.front_axle_kg === undefined) return 'rear';
  throw coreErrors.axleLiftReading();
}

function layout(inp: AxleLiftInput): Layout {
  const uRead = resolutionUncertainty(inp.scale_resolution_kg);
  const params: Param[] = [];
  const add = (p: Param) => params.push(p) - 1;
  const L = add({ input: 'wheelbase', path: 'wheelbase_m', source: 'wheelbase', value: inp.wheelbase_m, unit: 'm', u: inp.wheelbase_uncertainty_m });
  const r = add({
    input: 'wheel-centre height',
    path: 'wheel_centre_height_m',
    source: 'wheel_centre_height',
    value: inp.wheel_centre_height_m,
    unit: 'm',
    u: inp.wheel_centre_height_uncertainty_m ?? 0,
  });
  const lf = add({ input: 'level: front axle reading', path: 'level.front_axle_kg', source: 'scale_resolution', value: inp.level.front_axle_kg, unit: 'kg', u: uRead });
  const lr = add({ input: 'level: rear axle reading', path: 'level.rear_axle_kg', source: 'scale_resolution', value: inp.level.rear_axle_kg, unit: 'kg', u: uRead });
  const out: Layout = { params, L, r, lf, lr, liftMeasure: [], liftReading: [], liftIsAngle: [], raised: [], read: [] };
  inp.lifts.forEach((l, i) => {
    const read = readAxleOf(l);
    const name = `lift ${i + 1} (${l.raised_axle} raised)`;
    const isAngle = l.lift_height_m === undefined;
    if (isAngle && l.lift_angle_deg === undefined) throw coreErrors.axleLiftMeasure();
    out.liftIsAngle.push(isAngle);
    out.liftMeasure.push(
      isAngle
        ? add({ input: `${name}: angle`, path: `lifts[${i}].lift_angle_deg`, source: 'lift_angle', value: l.lift_angle_deg!, unit: '°', u: inp.lift_angle_uncertainty_deg ?? 0 })
        : add({ input: `${name}: lift height`, path: `lifts[${i}].lift_height_m`, source: 'lift_height', value: l.lift_height_m!, unit: 'm', u: inp.lift_height_uncertainty_m }),
    );
    const reading = read === 'front' ? l.front_axle_kg! : l.rear_axle_kg!;
    out.liftReading.push(
      add({ input: `${name}: ${read} axle reading`, path: `lifts[${i}].${read}_axle_kg`, source: 'scale_resolution', value: reading, unit: 'kg', u: uRead }),
    );
    out.raised.push(l.raised_axle);
    out.read.push(read);
  });
  return out;
}

function tanAngle(lay: Layout, v: readonly number[], i: number): number {
  const m = v[lay.liftMeasure[i]!]!;
  if (lay.liftIsAngle[i]) return Math.tan(m * DEG);
  const L = v[lay.L]!;
  return m / Math.sqrt(L * L - m * m);
}

interface FitPoint {
  group: AxleEnd;
  x: number;
  y: number;
  /** Index of the lift, −1 for a level reading. */
  lift: number;
}

function points(lay: Layout, v: readonly number[]): FitPoint[] {
  const pts: FitPoint[] = [
    { group: 'front', x: 0, y: v[lay.lf]!, lift: -1 },
    { group: 'rear', x: 0, y: v[lay.lr]!, lift: -1 },
  ];
  lay.raised.forEach((raised, i) => {
    const sigma = lay.read[i] === raised ? -1 : 1;
    pts.push({ group: lay.read[i]!, x: sigma * tanAngle(lay, v, i), y: v[lay.liftReading[i]!]!, lift: i });
  });
  return pts;
}

interface Fit {
  s: number;
  c: Record<AxleEnd, number>;
  sxx: number;
  pts: FitPoint[];
}

function fit(lay: Layout, v: readonly number[]): Fit {
  const pts = points(lay, v);
  const mean = { front: { x: 0, y: 0, n: 0 }, rear: { x: 0, y: 0, n: 0 } };
  for (const p of pts) {
    mean[p.group].x += p.x;
    mean[p.group].y += p.y;
    mean[p.group].n += 1;
  }
  for (const g of ['front', 'rear'] as const) {
    mean[g].x /= mean[g].n;
    mean[g].y /= mean[g].n;
  }
  let sxy = 0;
  let sxx = 0;
  for (const p of pts) {
    const dx = p.x - mean[p.group].x;
    sxy += dx * (p.y - mean[p.group].y);
    sxx += dx * dx;
  }
  const s = sxy / sxx;
  return { s, sxx, pts, c: { front: mean.front.y - s * mean.front.x, rear: mean.rear.y - s * mean.rear.x } };
}

function cgHeight(lay: Layout, v: readonly number[]): number {
  const W = v[lay.lf]! + v[lay.lr]!;
  return v[lay.r]! + (v[lay.L]! * fit(lay, v).s) / W;
}

function liftHeight(lay: Layout, v: readonly number[], i: number): number {
  const W = v[lay.lf]! + v[lay.lr]!;
  const level = lay.read[i] === 'front' ? v[lay.lf]! : v[lay.lr]!;
  const sigma = lay.read[i] === lay.raised[i] ? -1 : 1;
  const dW = sigma * (v[lay.liftReading[i]!]! - level);
  return v[lay.r]! + (v[lay.L]! * dW) / (W * tanAngle(lay, v, i));
}

/** ∂f/∂v_j by central differences, for every parameter. */
function sensitivities(f: (v: readonly number[]) => number, v0: readonly number[], params: readonly Param[]): number[] {
  return params.map((p, j) => {
    const d = 1e-6 * Math.max(Math.abs(p.value), p.u, 1e-3);
    const up = [...v0];
    const down = [...v0];
    up[j] = v0[j]! + d;
    down[j] = v0[j]! - d;
    return (f(up) - f(down)) / (2 * d);
  });
}

function combined(c: readonly number[], params: readonly Param[]): number {
  return Math.sqrt(c.reduce((acc, cj, j) => acc + (cj * params[j]!.u) ** 2, 0));
}

/** CG height from one or more axle lifts, with its GUM uncertainty budget and warnings. */
export function axleLift(inp: AxleLiftInput): AxleLiftResult {
  if (inp.lifts.length === 0) throw coreErrors.axleLiftEmpty();
  const lay = layout(inp);
  const v0 = lay.params.map((p) => p.value);
  const W = inp.level.front_axle_kg + inp.level.rear_axle_kg;
  const L = inp.wheelbase_m;
  const f0 = fit(lay, v0);
  const h = inp.wheel_centre_height_m + (L * f0.s) / W;
  const c = sensitivities((v) => cgHeight(lay, v), v0, lay.params);
  const u = combined(c, lay.params);

  const entries: BudgetEntry[] = lay.params.map((p, j) => {
    const contribution = Math.abs(c[j]! * p.u);
    return {
      input: p.input,
      path: p.path,
      source: p.source,
      value: p.value,
      unit: p.unit,
      standard_uncertainty: p.u,
      sensitivity: c[j]!,
      contribution_m: contribution,
      variance_share: u > 0 ? contribution ** 2 / u ** 2 : 0,
    };
  });
  const sources: BudgetSource[] = ['scale_resolution', 'lift_height', 'lift_angle', 'wheelbase', 'wheel_centre_height'];
  const bySource = sources
    .filter((s) => entries.some((e) => e.source === s))
    .map((s) => {
      const variance = entries.filter((e) => e.source === s).reduce((a, e) => a + e.contribution_m ** 2, 0);
      return { source: s, contribution_m: Math.sqrt(variance), variance_share: u > 0 ? variance / u ** 2 : 0 };
    });
  const largestSource = u > 0 ? bySource.reduce((a, b) => (b.variance_share > a.variance_share ? b : a)).source : null;
  const largestInput = u > 0 ? entries.reduce((a, b) => (b.contribution_m > a.contribution_m ? b : a)).input : null;

  const lifts: LiftResult[] = inp.lifts.map((l, i) => {
    const ci = sensitivities((v) => liftHeight(lay, v, i), v0, lay.params);
    const t = tanAngle(lay, v0, i);
    const level = lay.read[i] === 'front' ? inp.level.front_axle_kg : inp.level.rear_axle_kg;
    return {
      index: i,
      raised_axle: l.raised_axle,
      read_axle: lay.read[i]!,
      lift_angle_deg: Math.atan(t) / DEG,
      tan_angle: t,
      reading_change_kg: v0[lay.liftReading[i]!]! - level,
      cg_height_m: liftHeight(lay, v0, i),
      standard_uncertainty_m: combined(ci, lay.params),
    };
  });

  // Fit residuals against the scatter expected from the stated uncertainties.
  const uRead = resolutionUncertainty(inp.scale_resolution_kg);
  const dof = f0.pts.length - 3;
  let chi2: number | null = null;
  let scatter: number | null = null;
  let worst = { lift: -1, z: 0 };
  if (dof >= 1) {
    let ssr = 0;
    chi2 = 0;
    for (const p of f0.pts) {
      const res = p.y - (f0.c[p.group] + f0.s * p.x);
      ssr += res * res;
      let ux = 0;
      if (p.lift >= 0) {
        const j = lay.liftMeasure[p.lift]!;
        const d = 1e-6 * Math.max(Math.abs(v0[j]!), 1e-3);
        const up = [...v0];
        up[j] = v0[j]! + d;
        ux = (Math.abs(tanAngle(lay, up, p.lift) - tanAngle(lay, v0, p.lift)) / d) * lay.params[j]!.u;
      }
      const sigma2 = uRead ** 2 + (f0.s * ux) ** 2;
      const z2 = sigma2 > 0 ? (res * res) / sigma2 : res === 0 ? 0 : Infinity;
      chi2 += z2;
      if (p.lift >= 0 && Math.sqrt(z2) > worst.z) worst = { lift: p.lift, z: Math.sqrt(z2) };
    }
    scatter = (L / W) * Math.sqrt(ssr / dof / f0.sxx);
  }

  const warnings: AxleLiftWarning[] = [];
  const maxAngle = Math.max(...lifts.map((l) => l.lift_angle_deg));
  if (maxAngle < MIN_USEFUL_LIFT_ANGLE_DEG) {
    warnings.push({
      code: 'WARN_LIFT_ANGLE_SMALL',
      path: 'lifts',
      message:
        `the largest lift angle is ${maxAngle.toFixed(1)}°, below ${MIN_USEFUL_LIFT_ANGLE_DEG}°: the axle-load change is then a few percent of the ` +
        'vehicle mass and scale resolution, tyre deflection and wheel friction dominate; lift further (at least about 600 mm of lift is the usual practice)',
    });
  }
  lifts.forEach((l, i) => {
    if (Math.abs(l.reading_change_kg) <= inp.scale_resolution_kg) {
      warnings.push({
        code: 'WARN_LIFT_NO_CHANGE',
        path: `lifts[${i}]`,
        message: `lift ${i + 1} changed the ${l.read_axle} axle reading by ${l.reading_change_kg.toFixed(1)} kg, within one scale step (${inp.scale_resolution_kg} kg); it carries almost no information`,
      });
    }
  });
  if (chi2 !== null && chi2 > chiSquaredQuantile(0.99, dof)) {
    warnings.push({
      code: 'WARN_LIFTS_DISAGREE',
      path: 'lifts',
      message:
        `the lifts disagree beyond their stated uncertainties (χ² = ${chi2.toFixed(1)} with ${dof} degree${dof === 1 ? '' : 's'} of freedom, ` +
        `99 % limit ${chiSquaredQuantile(0.99, dof).toFixed(1)}; lift ${worst.lift + 1} is furthest from the fit). Likely causes: suspension not locked, ` +
        'fluids moving, tyres deflecting, the vehicle rolling or the brakes on; the stated uncertainty then understates the real one' +
        (scatter !== null ? ` (the scatter alone gives ${scatter.toFixed(3)} m)` : ''),
    });
  }
  const ends = new Set(inp.lifts.map((l) => l.raised_axle));
  if (ends.size === 1) {
    const other = ends.has('front') ? 'rear' : 'front';
    warnings.push({
      code: 'WARN_LIFT_ONE_END',
      path: 'lifts',
      message: `only the ${[...ends][0]} axle was raised; repeat with the ${other} axle raised as standard practice does: errors that change sign with the direction of tilt (fluid shift, suspension settling, unequal tyre radii) then show up and average out`,
    });
  }
  if (inp.lifts.length < 3) {
    warnings.push({
      code: 'WARN_FEW_LIFTS',
      path: 'lifts',
      message: `${inp.lifts.length} lift${inp.lifts.length === 1 ? '' : 's'} given; lift in several steps (three or more) so that disagreement between lifts can be detected`,
    });
  }
  if (h <= inp.wheel_centre_height_m) {
    warnings.push({
      code: 'WARN_CG_BELOW_WHEEL_CENTRE',
      path: 'lifts',
      message: `the result ${h.toFixed(3)} m is not above the wheel-centre height ${inp.wheel_centre_height_m} m: check which axle was raised and which axle each reading belongs to`,
    });
  }
  if (u > LARGE_CG_UNCERTAINTY_M) {
    warnings.push({
      code: 'WARN_CG_UNCERTAINTY_LARGE',
      path: '',
      message: `standard uncertainty ${u.toFixed(3)} m is above ${LARGE_CG_UNCERTAINTY_M} m, coarse for brake design; the budget names the input to improve first`,
    });
  }
  if (inp.lifts.some((l) => l.lift_height_m === undefined) && !(inp.lift_angle_uncertainty_deg! > 0)) {
    warnings.push({
      code: 'WARN_ANGLE_UNCERTAINTY_MISSING',
      path: 'lift_angle_uncertainty_deg',
      message: 'lift angles were given without lift_angle_uncertainty_deg; the budget counts them as exact',
    });
  }

  return {
    cg_height_m: h,
    standard_uncertainty_m: u,
    cg_to_front_axle_m: (L * inp.level.rear_axle_kg) / W,
    mass_kg: W,
    fit_slope_kg: f0.s,
    scatter_uncertainty_m: scatter,
    fit_chi_squared: chi2,
    fit_degrees_of_freedom: Math.max(0, dof),
    lifts,
    budget: { entries, by_source: bySource, largest_source: largestSource, largest_input: largestInput },
    warnings,
  };
}
