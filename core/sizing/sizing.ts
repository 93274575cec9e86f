/**
 * The sizing assistant (`lockstep-sizing/1`): which fixed front/rear split works for every load state
 * and selected curve rule, which parts give it, whether a rear valve is needed, the balance-bar
 * setting for twin master cylinders, the master-cylinder bore, and how robust the answer is.
 * Method notes: docs/sizing.md.
 */
import { CAUTION, VERIFY_NOTE } from '../caution.ts';
import type { DesignFile } from '../design.ts';
import { stateModel } from '../state-model.ts';
import { rearValveFamily } from '../valves/index.ts';
import { frontShareAtLowPressure } from '../distribution.ts';
import { applySizingChange } from './apply-change.ts';
import { designMargins, type DesignMargins } from './design-margins.ts';
import { type BoreSizing, masterCylinderBore } from './master-cylinder-bore.ts';
import { monteCarlo, type MonteCarlo, robustnessModel, sensitivity, type Sensitivity, worstCorner, type Corner, DEFAULT_SAMPLES, DEFAULT_SEED } from './robustness.ts';
import { balanceBarSettingForRatio, type Tolerances } from './sizing-schema.ts';
import { sizingCurveRules, sizingRuleSelection, type SizingRule } from './sizing-rules.ts';
import { type PartOption, partOptions, recommendedSplit, splitMargin } from './split-options.ts';
import { type IntervalSet, intersect, splitBand, type RuleBand } from './split-band.ts';
import { searchValve, type ValveCandidate, type ValveSearch } from './valve-search.ts';

export interface BalanceBarSizing {
  front_bore_mm: number;
  rear_bore_mm: number;
  current_setting_front_share: number;
  /** Settings whose fixed split lies in the band (thresholds left out), or null when the band is empty. */
  setting_range: { min: number; max: number } | null;
  /** Setting for the recommended front share: the one to lock the bar at. */
  recommended_setting_front_share: number;
  /** Full-model check of the design with the bar locked at the recommended setting. */
  with_recommended: DesignMargins;
  warning: string;
  path: 'hydraulics.balance_bar.setting_front_share';
}

export interface SizingResult {
  format: 'lockstep-sizing/1';
  design_name: string;
  rules: string[];
  /** The common band of fixed front shares (the interval holding the recommended share), or null when empty. */
  band: { min_front_share: number; max_front_share: number } | null;
  /** Every interval of the common band (several when a rule's alternatives leave a gap). */
  band_intervals: IntervalSet;
  per_rule: RuleBand[];
  /** Front share of the braking force at low pressure, first load state (null when the axles never both brake). */
  current_front_share: number | null;
  current_front_share_per_state: { load_state: string; front_share: number | null }[];
  recommended_front_share: number | null;
  /** Smallest margin of a fixed split at the recommended share (adhesion units). */
  recommended_split_margin: number | null;
  current: DesignMargins;
  options: PartOption[];
  /** The option to fit: the best passing catalogue size (the computed exact size only when no stock size passes), or null. */
  recommended_option: PartOption | null;
  master_cylinder: BoreSizing | null;
  valve: (ValveCandidate & { kind: string }) | null;
  valve_search: ValveSearch | null;
  balance_bar: BalanceBarSizing | null;
  robustness: {
    /** Which design the robustness figures are for: the design as it is when it passes, else the recommended proposal. */
    applies_to: string;
    samples: number;
    seed: number;
    distribution: 'normal' | 'uniform';
    tolerances: Required<Tolerances>;
    tolerances_source: string;
    probability_of_failure: number;
    probability_standard_error: number;
    p05_margin: number | null;
    median_margin: number | null;
    histogram: MonteCarlo['histogram'];
    worst_corner: Corner;
    failing_corners: number;
    corners: number;
    nominal_margin: number | null;
    sensitivity: Sensitivity[];
    most_influential: string | null;
  };
  messages: string[];
  verify_note?: string;
  caution: string;
}

export interface SizingOptions {
  samples?: number;
  seed?: number;
  /** Rule selection (default: the design's `rules` or the default selection). */
  rules?: readonly string[];
  max_line_pressure_bar?: number;
  /** Skip the Monte Carlo (the page asks for fewer samples). */
}

const BAR_WARNING =
  'Some inspection regimes refuse a brake-bias adjuster the driver can reach (UK IVA practice: one inspector accepted a bar set so the front locks first and then pinned; practitioner reports, no published source): lock the bar at the fixed setting and make the adjuster unreachable from the seat.';

function balanceBarSizing(design: DesignFile, rules: readonly SizingRule[], band: IntervalSet, phi: number | null): BalanceBarSizing | null {
  const bar = design.hydraulics.balance_bar;
  if (!bar || phi === null) return null;
  // fixed split of a bar: φ = G1 / (G1 + λ G2), λ = ((1 − s)/s)(A_f/A_r), thresholds left out
  const own = stateModel({ ...design, hydraulics: { ...design.hydraulics, balance_bar: undefined } }, design.load_states[0]!);
  const df = design.hydraulics.master_cylinder_bore_mm;
  const settingFor = (f: number) => balanceBarSettingForRatio(df, bar.rear_bore_mm, (own.G1 * (1 - f)) / (f * own.G2));
  const lo = band.find(([a, b]) => phi >= a && phi <= b) ?? band[0];
  const rec = Math.round(settingFor(phi) * 1e4) / 1e4;
  const locked = structuredClone(design);
  locked.hydraulics.balance_bar = { ...bar, setting_front_share: rec, driver_adjustable: false };
  return {
    front_bore_mm: df,
    rear_bore_mm: bar.rear_bore_mm,
    current_setting_front_share: bar.setting_front_share,
    setting_range: lo ? { min: settingFor(Math.max(lo[0], 1e-6)), max: settingFor(Math.min(lo[1], 1 - 1e-6)) } : null,
    recommended_setting_front_share: rec,
    with_recommended: designMargins(locked, rules),
    warning: bar.driver_adjustable ? `The adjuster is marked driver-adjustable. ${BAR_WARNING}` : BAR_WARNING,
    path: 'hydraulics.balance_bar.setting_front_share',
  };
}


export function sizeDesign(design: DesignFile, opts: SizingOptions = {}): SizingResult {
  const rules = sizingCurveRules(design, opts.rules);
  const selection = rules.map((r) => r.compiled.rule.id);
  const messages: string[] = [];
  if (rules.length === 0) messages.push('No curve rule of the selection covers this vehicle and its load states: there is nothing to size against.');
  if (design.vehicle.abs && rules.some((r) => r.compiled.rule.abs_exempt)) {
    messages.push('ABS is fitted: the lock-order rules do not apply to the working system; the split is sized for the ABS-failed vehicle.');
  }
  const band = splitBand(design, rules);
  let rec = rules.length > 0 ? recommendedSplit(design, rules, band.intervals) : null;
  // When the selected rules leave the front share unbounded above (lock-order rules only), the largest margin
  // sits at φ → 1 (no rear brakes). The recommendation then also keeps the 71/320 efficiency line, advisory.
  if (rec && rules.length > 0 && rec.phi > 0.99 && !rules.some((r) => r.compiled.rule.id.endsWith('/efficiency'))) {
    const advisory = sizingCurveRules(design, [...sizingRuleSelection(design, opts.rules), 'eu-appendix/efficiency']);
    const within = intersect(band.intervals, splitBand(design, advisory).intervals);
    if (within.length > 0) {
      const r2 = recommendedSplit(design, advisory, within);
      rec = { phi: r2.phi, margin: splitMargin(design, rules, r2.phi) };
      messages.push('The selected rules do not bound the front share from above; the recommended share also keeps the 71/320/EEC efficiency line (advisory, not a selected rule).');
    }
  }
  const phi = rec && Number.isFinite(rec.phi) ? rec.phi : null;
  const holding = phi === null ? undefined : (band.intervals.find(([a, b]) => phi >= a - 1e-12 && phi <= b + 1e-12) ?? band.intervals[0]);
  if (band.intervals.length === 0 && rules.length > 0) {
    messages.push('No fixed front/rear split passes every selected rule in every load state (the band is empty). A rear valve is searched instead.');
  }
  const models = design.load_states.map((s) => stateModel(design, s));
  const shares = models.map((m) => ({ load_state: m.state.id, front_share: frontShareAtLowPressure(m.dist) }));
  const current = designMargins(design, rules);
  const options = phi !== null ? partOptions(design, rules, phi) : [];
  const noPassingOption = !current.passes && !options.some((o) => o.passes);
  const valve_search = rules.length > 0 && (band.intervals.length === 0 || noPassingOption) ? searchValve(design, rules) : null;
  if (valve_search && band.intervals.length > 0) messages.push('No part change alone passes with the present rear valve; rear-valve settings were searched too.');
  const valveRec = valve_search?.recommended ?? null;
  if (valve_search && valveRec && !valveRec.passes) messages.push('No rear-valve setting searched passes every rule in every load state; the best one found is shown.');
  // robustness of the answer: the design as it is when it passes, else the proposal the assistant recommends
  const recOption = options.find((o) => o.passes && o.series !== 'exact') ?? options.find((o) => o.passes) ?? null;
  const barRec = balanceBarSizing(design, rules, band.intervals, phi);
  let assessed = design;
  let appliesTo = 'the design as it is';
  if (!current.passes) {
    if (recOption) {
      assessed = applySizingChange(design, recOption.path, recOption.value);
      appliesTo = `the design with the recommended change: ${recOption.change}`;
    } else if (valveRec?.passes) {
      assessed = applySizingChange(design, 'hydraulics.rear_valve', valveRec.valve);
      appliesTo = `the design with the recommended rear valve (${rearValveFamily(valveRec.valve).name})`;
    } else if (barRec?.with_recommended.passes) {
      assessed = applySizingChange(design, barRec.path, barRec.recommended_setting_front_share);
      appliesTo = 'the design with the balance bar locked at the recommended setting';
    } else appliesTo = 'the design as it is (no proposal passes)';
  }
  const rm = robustnessModel(assessed, rules);
  const mc = monteCarlo(rm, opts.samples ?? DEFAULT_SAMPLES, opts.seed ?? DEFAULT_SEED);
  const corners = worstCorner(rm);
  const sens = sensitivity(rm);
  const statuses = rules.map((r) => r.compiled.rule.status);
  return {
    format: 'lockstep-sizing/1',
    design_name: design.name,
    rules: selection,
    band: holding && rules.length > 0 ? { min_front_share: holding[0], max_front_share: holding[1] } : null,
    band_intervals: rules.length > 0 ? band.intervals : [],
    per_rule: band.per_rule,
    current_front_share: shares[0]?.front_share ?? null,
    current_front_share_per_state: shares,
    recommended_front_share: phi,
    recommended_split_margin: rec && Number.isFinite(rec.margin) ? rec.margin : null,
    current,
    options,
    recommended_option: recOption,
    master_cylinder: masterCylinderBore(design, { rules: opts.rules, max_line_pressure_bar: opts.max_line_pressure_bar }),
    valve: valveRec ? { ...valveRec, kind: valveRec.valve.type } : null,
    valve_search,
    balance_bar: barRec,
    robustness: {
      applies_to: appliesTo,
      samples: mc.samples,
      seed: mc.seed,
      distribution: mc.distribution,
      tolerances: rm.tol,
      tolerances_source: design.tolerances ? 'design file (defaults for the keys it leaves out)' : 'defaults: pad friction ± 15 % (replacement friction material, New Zealand Gazette notice 2004-au85); valve knee, valve ratio and threshold pressures from memory; CG height, front axle load and tyre radius common practice, no source',
      probability_of_failure: mc.probability_of_failure,
      probability_standard_error: mc.probability_standard_error,
      p05_margin: mc.p05_margin,
      median_margin: mc.median_margin,
      histogram: mc.histogram,
      worst_corner: corners.worst,
      failing_corners: corners.failing_corners,
      corners: corners.corners,
      nominal_margin: sens.nominal,
      sensitivity: sens.ranking,
      most_influential: sens.ranking[0] && sens.ranking[0].effect > 0 ? sens.ranking[0].input : null,
    },
    messages,
    ...(statuses.some((s) => s !== 'verified') ? { verify_note: VERIFY_NOTE } : {}),
    caution: CAUTION,
  };
}
