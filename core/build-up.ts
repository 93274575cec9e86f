/**
 * Mass build-up of a conversion: from the weighed base vehicle, minus what was taken out, plus what
 * went in, to the unladen and laden states.
 *
 * Statics (hand-derived; checked against R. N. Jazar, Vehicle Dynamics: Theory and Application (2008),
 * Example 40, and a medium-duty truck body-builder manual, appendix "Weight Distribution"): with x measured
 * from the front axle centre, rearward positive, an item of mass m at x loads the rear axle with m x / L and
 * the front axle with m − m x / L (an item ahead of the front axle, x < 0, adds more than its own mass to the
 * front and unloads the rear). Masses add; so do their moments about the front axle (Σ m x) and about the
 * ground (Σ m z), giving the CG position x = Σ m x / Σ m and CG height h = Σ m z / Σ m. Laterally (y positive
 * to the right, track t) an item loads the right wheels with m (1/2 + y/t) and the left with m (1/2 − y/t).
 */
import { BuildUp, type BuildUpItem, type DerivedFrom } from './build-up-schema.ts';
import { occupantMass } from './occupant-masses.ts';
import type { FieldIssue, Warning } from './field-issue.ts';

export interface MassPoint {
  mass_kg: number;
  x_m: number;
  cg_height_m: number;
  y_m?: number | undefined;
}

export interface WheelLoads {
  front_left: number;
  front_right: number;
  rear_left: number;
  rear_right: number;
}

export interface MassTotals {
  mass_kg: number;
  front_axle_kg: number;
  rear_axle_kg: number;
  /** CG behind the front axle, m. */
  cg_x_m: number;
  cg_height_m: number;
  /** Front axle mass / total mass, 0..1. */
  front_share: number;
  /** Present when the track is known. */
  lateral: { cg_y_m: number; left_kg: number; right_kg: number; wheels_kg: WheelLoads } | null;
}

/** Running sums of a build-up: mass and moments about the front axle, the ground and the centreline. */
export class MassSum {
  m = 0;
  mx = 0;
  mz = 0;
  my = 0;
  wheels: WheelLoads = { front_left: 0, front_right: 0, rear_left: 0, rear_right: 0 };

  constructor(
    readonly wheelbase: number,
    readonly track: number | null,
  ) {}

  /** Add (sign +1) or take away (sign −1) a point mass. */
  add(p: MassPoint, sign: 1 | -1 = 1): this {
    const m = sign * p.mass_kg;
    const y = p.y_m ?? 0;
    this.m += m;
    this.mx += m * p.x_m;
    this.mz += m * p.cg_height_m;
    this.my += m * y;
    const split = itemAxleLoads(m, p.x_m, this.wheelbase);
    const right = this.track ? 0.5 + y / this.track : 0.5;
    this.wheels.front_left += split.front_kg * (1 - right);
    this.wheels.front_right += split.front_kg * right;
    this.wheels.rear_left += split.rear_kg * (1 - right);
    this.wheels.rear_right += split.rear_kg * right;
    return this;
  }

  clone(): MassSum {
    const c = new MassSum(this.wheelbase, this.track);
    Object.assign(c, { m: this.m, mx: this.mx, mz: this.mz, my: this.my, wheels: { ...this.wheels } });
    return c;
  }

  totals(): MassTotals {
    const rear = this.mx / this.wheelbase;
    const front = this.m - rear;
    const w = this.wheels;
    return {
      mass_kg: this.m,
      front_axle_kg: front,
      rear_axle_kg: rear,
      cg_x_m: this.mx / this.m,
      cg_height_m: this.mz / this.m,
      front_share: front / this.m,
      lateral: this.track
        ? { cg_y_m: this.my / this.m, left_kg: w.front_left + w.rear_left, right_kg: w.front_right + w.rear_right, wheels_kg: { ...w } }
        : null,
    };
  }
}

/** Axle shares of one item (E8 rule: rear = m x / L, front = m − rear). */
export function itemAxleLoads(massKg: number, xM: number, wheelbaseM: number): { front_kg: number; rear_kg: number } {
  const rear = (massKg * xM) / wheelbaseM;
  return { front_kg: massKg - rear, rear_kg: rear };
}

export interface BuildUpLine {
  kind: 'removed' | 'added' | 'driver' | 'occupant' | 'payload' | 'tank';
  name: string;
  group: string;
  /** Signed: negative for what was removed, kg. */
  mass_kg: number;
  x_m: number;
  cg_height_m: number;
  y_m: number | null;
  front_axle_kg: number;
  rear_axle_kg: number;
  /** Which state first includes the line. */
  stage: 'conversion' | 'unladen' | 'laden';
}

export interface GroupSubtotal {
  group: string;
  items: number;
  mass_kg: number;
  front_axle_kg: number;
  rear_axle_kg: number;
}

/** The change of each quantity between two totals (no lateral part). */
export type Change = Omit<MassTotals, 'lateral'>;

export interface BuildUpResult {
  wheelbase_m: number;
  occupant_mass_kg: number | null;
  occupant_basis: string | null;
  baseline: MassTotals;
  /** Baseline − removed + added, tanks as weighed (no driver). */
  converted: MassTotals;
  unladen: MassTotals;
  laden: MassTotals;
  lines: BuildUpLine[];
  groups: GroupSubtotal[];
  /** converted − baseline, unladen − baseline, laden − baseline. */
  changes: { converted: Change; unladen: Change; laden: Change };
  /** Standard uncertainty of each state's CG height carried over from the baseline's, m (null if none given). */
  cg_height_uncertainty_m: { baseline: number | null; converted: number | null; unladen: number | null; laden: number | null };
  warnings: Warning[];
}

function change(a: MassTotals, b: MassTotals): Change {
  return {
    mass_kg: b.mass_kg - a.mass_kg,
    front_axle_kg: b.front_axle_kg - a.front_axle_kg,
    rear_axle_kg: b.rear_axle_kg - a.rear_axle_kg,
    cg_x_m: b.cg_x_m - a.cg_x_m,
    cg_height_m: b.cg_height_m - a.cg_height_m,
    front_share: b.front_share - a.front_share,
  };
}

/** The build-up of a design (wheelbase from vehicle.wheelbase_m), with every state and the table lines. */
export function buildUp(b: BuildUp, wheelbaseM: number, path = 'build_up'): BuildUpResult {
  const L = wheelbaseM;
  const track = b.track_m ?? null;
  const warnings: Warning[] = [];
  const base = b.baseline;
  const sum = new MassSum(L, track);
  const m0 = base.front_axle_kg + base.rear_axle_kg;
  // The baseline as one point mass at its CG. With corner weights (scaled per axle to the axle masses)
  // the wheel loads are the measured ones and the lateral position follows from them:
  // y = (right − left) / m0 × track / 2.
  let scaled: WheelLoads | null = null;
  if (base.wheels_kg && track) {
    const w = base.wheels_kg;
    for (const [axle, l, r] of [['front', w.front_left, w.front_right], ['rear', w.rear_left, w.rear_right]] as const) {
      const axleKg = axle === 'front' ? base.front_axle_kg : base.rear_axle_kg;
      if (Math.abs(l + r - axleKg) > Math.max(5, 0.01 * axleKg)) {
        warnings.push({
          code: 'WARN_BUILD_UP_WHEELS_DIFFER',
          path: `${path}.baseline.wheels_kg`,
          message: `${axle} wheels ${l} + ${r} = ${l + r} kg differ from ${axle}_axle_kg ${axleKg} kg by more than 1 % (5 kg at least); the axle masses are used, the wheels only for the left/right split`,
        });
      }
    }
    const f = base.front_axle_kg / (w.front_left + w.front_right);
    const r = base.rear_axle_kg / (w.rear_left + w.rear_right);
    scaled = { front_left: w.front_left * f, front_right: w.front_right * f, rear_left: w.rear_left * r, rear_right: w.rear_right * r };
  }
  const baseY = scaled && track ? ((scaled.front_right + scaled.rear_right - scaled.front_left - scaled.rear_left) / m0) * (track / 2) : 0;
  sum.add({ mass_kg: m0, x_m: (L * base.rear_axle_kg) / m0, cg_height_m: base.cg_height_m, y_m: baseY });
  if (scaled) sum.wheels = { ...scaled };
  const baseline = sum.totals();

  const lines: BuildUpLine[] = [];
  const line = (kind: BuildUpLine['kind'], p: MassPoint & { name: string }, group: string, sign: 1 | -1, stage: BuildUpLine['stage']) => {
    const a = itemAxleLoads(sign * p.mass_kg, p.x_m, L);
    lines.push({
      kind,
      name: p.name,
      group,
      mass_kg: sign * p.mass_kg,
      x_m: p.x_m,
      cg_height_m: p.cg_height_m,
      y_m: p.y_m ?? null,
      front_axle_kg: a.front_kg,
      rear_axle_kg: a.rear_kg,
      stage,
    });
  };
  const item = (it: BuildUpItem, sign: 1 | -1) => {
    sum.add(it, sign);
    line(sign < 0 ? 'removed' : 'added', it, it.group ?? (sign < 0 ? 'removed' : 'added'), sign, 'conversion');
  };
  for (const it of b.removed ?? []) item(it, -1);
  for (const it of b.added ?? []) item(it, 1);
  const converted = sum.totals();

  const occKg = b.occupant ? occupantMass(b.occupant.basis, b.occupant.mass_kg) : null;
  const tankDelta = (fill: (t: NonNullable<BuildUp['tanks']>[number]) => number, stage: BuildUpLine['stage']) => {
    for (const t of b.tanks ?? []) {
      const d = (fill(t) - t.fill_weighed) * t.full_kg;
      if (d === 0) continue;
      const p = { name: `${t.name} (${Math.round(t.fill_weighed * 100)} % → ${Math.round(fill(t) * 100)} %)`, mass_kg: Math.abs(d), x_m: t.x_m, cg_height_m: t.cg_height_m, y_m: t.y_m };
      sum.add(p, d > 0 ? 1 : -1);
      line('tank', p, 'tanks', d > 0 ? 1 : -1, stage);
    }
  };
  tankDelta((t) => t.fill_unladen ?? t.fill_weighed, 'unladen');
  const seats = b.seats ?? [];
  const driver = seats.find((s) => s.driver);
  if (driver && occKg !== null) {
    const p = { name: driver.name, mass_kg: occKg, x_m: driver.x_m, cg_height_m: driver.cg_height_m, y_m: driver.y_m };
    sum.add(p);
    line('driver', p, 'occupants', 1, 'unladen');
  } else {
    warnings.push({
      code: 'WARN_BUILD_UP_NO_DRIVER',
      path: `${path}.seats`,
      message: 'no driver seat (seats[].driver: true) with an occupant mass; the unladen state from the build-up carries no driver',
    });
  }
  const unladen = sum.totals();

  for (const s of seats) {
    if (s.driver || occKg === null) continue;
    const p = { name: s.name, mass_kg: occKg, x_m: s.x_m, cg_height_m: s.cg_height_m, y_m: s.y_m };
    sum.add(p);
    line('occupant', p, 'occupants', 1, 'laden');
  }
  if (b.payload) {
    const p = { name: 'payload', ...b.payload };
    sum.add(p);
    line('payload', p, 'payload', 1, 'laden');
  }
  tankDelta(() => 1, 'laden');
  const laden = sum.totals();

  const groups: GroupSubtotal[] = [];
  for (const l of lines) {
    let g = groups.find((x) => x.group === l.group);
    if (!g) groups.push((g = { group: l.group, items: 0, mass_kg: 0, front_axle_kg: 0, rear_axle_kg: 0 }));
    g.items += 1;
    g.mass_kg += l.mass_kg;
    g.front_axle_kg += l.front_axle_kg;
    g.rear_axle_kg += l.rear_axle_kg;
  }

  for (const [name, t] of [['converted', converted], ['unladen', unladen], ['laden', laden]] as const) {
    if (!(t.mass_kg > 0) || t.front_axle_kg <= 0 || t.rear_axle_kg <= 0) {
      warnings.push({
        code: 'WARN_BUILD_UP_IMPOSSIBLE',
        path,
        message: `the ${name} state of the build-up has mass ${t.mass_kg.toFixed(1)} kg, front axle ${t.front_axle_kg.toFixed(1)} kg, rear axle ${t.rear_axle_kg.toFixed(1)} kg: a mass or axle load is not positive; check the items removed and their positions`,
      });
    }
  }
  const u0 = base.cg_height_uncertainty_m ?? null;
  // Only the baseline's CG-height uncertainty is carried over; its weight in the state is m0 / m.
  const carry = (t: MassTotals) => (u0 === null ? null : (u0 * m0) / t.mass_kg);
  return {
    wheelbase_m: L,
    occupant_mass_kg: occKg,
    occupant_basis: b.occupant?.basis ?? null,
    baseline,
    converted,
    unladen,
    laden,
    lines,
    groups,
    changes: { converted: change(baseline, converted), unladen: change(baseline, unladen), laden: change(baseline, laden) },
    cg_height_uncertainty_m: { baseline: u0, converted: carry(converted), unladen: carry(unladen), laden: carry(laden) },
    warnings,
  };
}

// ---------------------------------------------------------------------------------------------
// Load states from the build-up: filled in before the design is parsed (core/validate.ts).

function isObj(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

export interface BuildUpResolution {
  /** The input with the figures of every `from_build_up` state filled in. */
  input: unknown;
  issues: FieldIssue[];
  warnings: Warning[];
  /** Paths whose "is required" errors the filling stands for (the build-up itself is invalid). */
  suppress: string[];
}

/**
 * Fills mass_kg, front_axle_kg, cg_height_m (and derived_from, cg_height_derived_from,
 * cg_height_uncertainty_m when absent) of each load state that names `from_build_up`. A figure listed
 * in the state's `overrides` is kept as written; any other figure is replaced by the build-up's, with a
 * warning when the written one differed. The input is not modified.
 */
export function resolveBuildUp(input: unknown): BuildUpResolution {
  const out: BuildUpResolution = { input, issues: [], warnings: [], suppress: [] };
  if (!isObj(input) || !Array.isArray(input.load_states)) return out;
  const states = input.load_states as unknown[];
  const wanting = states.map((s, i) => (isObj(s) && typeof s.from_build_up === 'string' ? i : -1)).filter((i) => i >= 0);
  if (wanting.length === 0) return out; // states entered by hand are left exactly as written
  const copy = { ...input, load_states: states.map((s) => (isObj(s) ? { ...s } : s)) };
  out.input = copy;
  const wheelbase = isObj(input.vehicle) ? input.vehicle.wheelbase_m : undefined;
  const parsed = input.build_up === undefined ? null : BuildUp.safeParse(input.build_up);
  const block = parsed?.success ? parsed.data : null;
  if (block === null || typeof wheelbase !== 'number' || !(wheelbase >= 0.5 && wheelbase <= 10)) {
    for (const i of wanting) {
      const s = copy.load_states[i] as Record<string, unknown>;
      if (input.build_up === undefined) {
        out.issues.push({ path: `load_states[${i}].from_build_up`, message: `"${String(s.from_build_up)}" needs a build_up block in the design (see docs/design-file.md, "build_up")` });
      }
      for (const k of ['mass_kg', 'front_axle_kg', 'cg_height_m']) if (s[k] === undefined) out.suppress.push(`load_states[${i}].${k}`);
    }
    return out;
  }
  const r = buildUp(block, wheelbase);
  for (const i of wanting) {
    const s = copy.load_states[i] as Record<string, unknown>;
    const which = s.from_build_up === 'laden' ? 'laden' : s.from_build_up === 'unladen' ? 'unladen' : null;
    if (which === null) continue; // the schema reports the bad value
    const t = r[which];
    if (!(t.mass_kg > 0) || !(t.front_axle_kg > 0) || !(t.rear_axle_kg > 0)) {
      out.issues.push({
        path: `load_states[${i}].from_build_up`,
        message: `the build-up's ${which} state is not a vehicle: mass ${t.mass_kg.toFixed(1)} kg, front axle ${t.front_axle_kg.toFixed(1)} kg, rear axle ${t.rear_axle_kg.toFixed(1)} kg (check build_up.removed: masses and positions)`,
      });
      for (const k of ['mass_kg', 'front_axle_kg', 'cg_height_m']) out.suppress.push(`load_states[${i}].${k}`);
      continue;
    }
    const keep = new Set(Array.isArray(s.overrides) ? (s.overrides as unknown[]) : []);
    const figures: Record<string, number> = { mass_kg: t.mass_kg, front_axle_kg: t.front_axle_kg, cg_height_m: t.cg_height_m };
    for (const [k, v] of Object.entries(figures)) {
      if (keep.has(k)) {
        if (s[k] === undefined) out.issues.push({ path: `load_states[${i}].${k}`, message: `is listed in overrides but not given; write the value to keep, or remove "${k}" from overrides` });
        continue;
      }
      if (typeof s[k] === 'number' && Math.abs((s[k] as number) - v) > 1e-9 * Math.max(1, Math.abs(v))) {
        out.warnings.push({
          code: 'WARN_BUILD_UP_REPLACED',
          path: `load_states[${i}].${k}`,
          message: `${String(s[k])} was replaced by the build-up's ${which} value ${v.toFixed(k === 'cg_height_m' ? 3 : 1)}; list "${k}" in overrides to keep a figure of your own`,
        });
      }
      s[k] = v;
    }
    const massFromBuildUp = !keep.has('mass_kg') && !keep.has('front_axle_kg');
    if (s.derived_from === undefined) s.derived_from = massFromBuildUp ? 'build_up' : 'entered';
    if (s.cg_height_derived_from === undefined) s.cg_height_derived_from = keep.has('cg_height_m') ? 'entered' : 'build_up';
    const u = r.cg_height_uncertainty_m[which];
    if (s.cg_height_uncertainty_m === undefined && !keep.has('cg_height_m') && u !== null) s.cg_height_uncertainty_m = u;
  }
  out.warnings.push(...r.warnings);
  return out;
}

/** What the evaluate result echoes about where a state's figures come from. */
export interface LoadStateOrigin {
  derived_from: DerivedFrom;
  cg_height_derived_from: DerivedFrom;
  cg_height_uncertainty_m: number | null;
  from_build_up: 'unladen' | 'laden' | null;
}

export function loadStateOrigin(s: {
  derived_from?: DerivedFrom | undefined;
  cg_height_derived_from?: DerivedFrom | undefined;
  cg_height_uncertainty_m?: number | undefined;
  from_build_up?: 'unladen' | 'laden' | undefined;
}): LoadStateOrigin {
  const d = s.derived_from ?? (s.from_build_up ? 'build_up' : 'entered');
  return {
    derived_from: d,
    cg_height_derived_from: s.cg_height_derived_from ?? d,
    cg_height_uncertainty_m: s.cg_height_uncertainty_m ?? null,
    from_build_up: s.from_build_up ?? null,
  };
}
