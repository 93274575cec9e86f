/**
 * Master-cylinder bore for the service pedal-force target. The pressure a load state needs for the
 * required deceleration (core/checks/performance-check.ts: the higher of the stated minimum and the
 * distance-implied one) does not depend on the bore; the pedal force for it does, in proportion to the
 * bore area (core/pedal-force.ts: F = p·A/(i_pedal·i_booster), unassisted above runout, both ∝ A).
 * So the largest bore that keeps the pedal force at most (1 − pedal_force_margin) of the rule's limit
 * in every load state is bore·√(target / F). A smaller bore raises the line pressure a full pedal
 * force makes; the smallest bore keeps that pressure under max_line_pressure (default 120 bar, common
 * practice, no source). Candidates are the catalogue bores in that window.
 */
import { G_N, PA_PER_BAR } from '../constants.ts';
import { pressureAtBrakingRate } from '../checks/circuit-failure.ts';
import { requiredDeceleration, testSurfaceFor } from '../checks/performance-check.ts';
import type { DesignFile } from '../design.ts';
import { firstLock } from '../lock-order.ts';
import { hydraulicPedalModel, pedalForce, pressureForPedalForce } from '../pedal-force.ts';
import { stateModel } from '../state-model.ts';
import { catalogueSizes } from './catalogue.ts';
import { serviceRule } from './sizing-rules.ts';

/** Highest line pressure a full service application should make, bar (common practice, no source). */
export const DEFAULT_MAX_LINE_PRESSURE_BAR = 120;
/** Share of the pedal-force limit kept in reserve (common practice, no source). */
export const DEFAULT_PEDAL_FORCE_MARGIN = 0.15;

export interface BoreCandidate {
  label: string;
  series: 'metric' | 'inch';
  bore_mm: number;
  source: string;
  /** Highest pedal force over the load states for the required deceleration, N. */
  pedal_force_n: number;
  /** Line pressure at the rule's pedal-force limit, bar. */
  pressure_at_limit_bar: number;
  meets: boolean;
}

export interface BoreSizing {
  rule: string;
  /** Required deceleration, m/s², and the pedal force target, N. */
  required_deceleration_ms2: number;
  pedal_force_limit_n: number;
  pedal_force_target_n: number;
  max_line_pressure_bar: number;
  current_bore_mm: number;
  /** Highest of the load states' pressures for the required deceleration, bar (does not depend on the bore). */
  pressure_for_required_bar: number;
  /** Window of bores that meet both conditions, mm (null edges when none). */
  max_bore_mm: number | null;
  min_bore_mm: number | null;
  /** Every catalogue bore, evaluated; `meets` marks the ones inside the window. */
  candidates: BoreCandidate[];
  /** Why no bore works, or what to know. */
  notes: string[];
  /** Design-file path the "apply" action writes. */
  path: 'hydraulics.master_cylinder_bore_mm';
}

export interface BoreOptions {
  max_line_pressure_bar?: number;
  pedal_force_margin?: number;
  rules?: readonly string[];
}

export function masterCylinderBore(design: DesignFile, opts: BoreOptions = {}): BoreSizing | null {
  const rule = serviceRule(design, opts.rules);
  if (!rule) return null;
  const pMaxBar = opts.max_line_pressure_bar ?? DEFAULT_MAX_LINE_PRESSURE_BAR;
  const margin = opts.pedal_force_margin ?? DEFAULT_PEDAL_FORCE_MARGIN;
  const req = requiredDeceleration(rule.figures);
  const zReq = req.required_ms2 / G_N;
  const k = testSurfaceFor(design, rule).k;
  const h = design.hydraulics;
  const bore = h.master_cylinder_bore_mm;
  const target = (1 - margin) * rule.figures.max_pedal_force_n;
  const notes: string[] = [];
  let pReq = 0;
  let ratio = Infinity; // target force / needed force, lowest over the states
  for (const st of design.load_states) {
    const s = stateModel(design, st);
    if (!design.vehicle.abs) {
      const lock = firstLock(s.loads, s.dist, k);
      if (lock.first_axle !== 'none' && lock.braking_rate < zReq) {
        notes.push(`${st.id}: a wheel locks at braking rate ${lock.braking_rate.toFixed(4)} on the ${k} test surface, below the required ${zReq.toFixed(4)}; no bore changes that`);
        continue;
      }
    }
    const p = pressureAtBrakingRate(s.dist, zReq);
    if (!Number.isFinite(p)) {
      notes.push(`${st.id}: the brakes never reach the required braking rate ${zReq.toFixed(3)}`);
      continue;
    }
    pReq = Math.max(pReq, p);
    ratio = Math.min(ratio, target / pedalForce(s.pedal, p));
  }
  if (pReq > pMaxBar * PA_PER_BAR) {
    notes.push(`the required deceleration needs ${(pReq / PA_PER_BAR).toFixed(1)} bar, above the ${pMaxBar} bar maximum: the brakes need more gain (larger pistons or discs), not another bore`);
  }
  // the pedal's equivalent area is proportional to the front bore area (also with a balance bar)
  const maxBore = Number.isFinite(ratio) ? bore * Math.sqrt(ratio) : null;
  const forceAt = (b: number) => pedalForce(hydraulicPedalModel({ ...h, master_cylinder_bore_mm: b }), pReq);
  const pressureAtLimit = (b: number) => pressureForPedalForce(hydraulicPedalModel({ ...h, master_cylinder_bore_mm: b }), rule.figures.max_pedal_force_n) / PA_PER_BAR;
  // pressure at the limit ∝ 1/A above and below runout only piecewise: find the smallest bore by bisection
  let minBore: number | null = null;
  if (pressureAtLimit(60) <= pMaxBar) {
    let lo = 5;
    let hi = 60;
    for (let i = 0; i < 80; i++) {
      const mid = 0.5 * (lo + hi);
      if (pressureAtLimit(mid) <= pMaxBar) hi = mid;
      else lo = mid;
    }
    minBore = hi;
  }
  if (h.balance_bar) notes.push('balance bar: scale the rear master cylinder bore by the same factor as the front one to keep the split');
  const candidates: BoreCandidate[] = catalogueSizes('master_cylinder')
    .map((c) => {
      const f = forceAt(c.diameter_mm);
      const pl = pressureAtLimit(c.diameter_mm);
      return {
        label: c.label,
        series: c.series,
        bore_mm: c.diameter_mm,
        source: c.source,
        pedal_force_n: f,
        pressure_at_limit_bar: pl,
        meets: maxBore !== null && c.diameter_mm <= maxBore * (1 + 1e-12) && (minBore === null ? false : c.diameter_mm >= minBore),
      };
    });
  if (maxBore !== null && minBore !== null && maxBore < minBore) notes.push(`no bore meets both: the pedal-force target needs at most ${maxBore.toFixed(1)} mm, the ${pMaxBar} bar limit at least ${minBore.toFixed(1)} mm`);
  return {
    rule: rule.id,
    required_deceleration_ms2: req.required_ms2,
    pedal_force_limit_n: rule.figures.max_pedal_force_n,
    pedal_force_target_n: target,
    max_line_pressure_bar: pMaxBar,
    current_bore_mm: bore,
    pressure_for_required_bar: pReq / PA_PER_BAR,
    max_bore_mm: maxBore,
    min_bore_mm: minBore,
    candidates,
    notes,
    path: 'hydraulics.master_cylinder_bore_mm',
  };
}
