/**
 * `lockstep size FILE [--json] [--samples N] [--seed S] [--rules id,...] [--max-line-pressure-bar P]`:
 * the sizing assistant (core/sizing). Exit 0 when the design passes as it is or a proposed change
 * passes every selected rule in every load state, 1 when nothing proposed passes, 2 invalid input.
 */
import { parseArgs } from 'node:util';
import { readDesign, rearValveFamily, valveSettings } from '../../core/index.ts';
import { sizeDesign, type SizingResult } from '../../core/sizing/sizing.ts';
import { cliErrors } from '../errors.ts';
import { readJsonFile } from '../read-json.ts';
import * as F from '../../report/format.ts';
import { partChangeText } from '../../report/part-change.ts';
import { textTable } from '../table.ts';
import type { CommandOutput } from '../output.ts';
import { parseRuleSelection } from './evaluate.ts';

const USAGE = 'usage: lockstep size FILE [--json] [--samples N] [--seed S] [--rules id,...] [--max-line-pressure-bar P]';

function integer(name: string, text: string, min: number, max: number): number {
  const v = Number(text);
  if (!/^\d+$/.test(text.trim()) || !Number.isSafeInteger(v) || v < min || v > max) {
    throw cliErrors.usage(`${name}: "${text}" is not allowed; give a whole number from ${min} to ${max}`);
  }
  return v;
}

function positive(name: string, text: string, min: number, max: number, unit: string): number {
  const v = Number(text);
  if (text.trim() === '' || !Number.isFinite(v) || v < min || v > max) throw cliErrors.usage(`${name}: "${text}" is not allowed; give a number from ${min} to ${max} ${unit}`);
  return v;
}

/** True when the design as it is, or some proposal, passes every selected rule in every load state. */
export function sizingFindsPass(r: SizingResult): boolean {
  return r.current.passes || r.options.some((o) => o.passes) || (r.valve?.passes ?? false) || (r.balance_bar?.with_recommended.passes ?? false);
}

const pct = F.percentOfRatio;
const margin = F.adhesionMargin;
/** The command's text is in metric units (it has no units option). */
const UNITS = 'metric' as const;

export function sizingText(r: SizingResult): string {
  const out: string[] = [];
  out.push(`Sizing assistant: ${r.design_name}`);
  out.push(`Rules: ${r.rules.join(', ') || 'none'}`);
  out.push('');
  out.push('Fixed front/rear split (front share of the braking force, thresholds and valves left out):');
  out.push(
    textTable(
      ['rule', 'load state', 'passing front share', 'status'],
      r.per_rule.map((p) => [p.rule, p.load_state, p.intervals.length ? p.intervals.map(([a, b]) => `${pct(a)} – ${pct(b)}`).join(', ') : 'none', p.verify_note ? `${p.status}: ${p.verify_note}` : p.status]),
    ),
  );
  out.push('');
  if (r.band) out.push(`Band that passes everything: ${pct(r.band.min_front_share)} – ${pct(r.band.max_front_share)}${r.band_intervals.length > 1 ? ` (and ${r.band_intervals.length - 1} more interval(s))` : ''}`);
  else out.push('Band that passes everything: EMPTY — no fixed split passes every rule in every load state.');
  out.push(`Current design: front share ${pct(r.current_front_share)} at low pressure; smallest margin ${margin(r.current.smallest_margin)} (${r.current.passes ? 'passes' : 'FAILS'} with the full model)`);
  out.push(`Recommended front share: ${pct(r.recommended_front_share)} (smallest margin of that fixed split ${margin(r.recommended_split_margin)})`);
  out.push('');
  if (r.options.length) {
    out.push('Parts that move the split there (each checked with the full model):');
    out.push(
      textTable(
        ['change', 'series', 'front share', 'smallest margin', 'verdict'],
        r.options.map((o) => [partChangeText(o, UNITS), o.series, pct(o.front_share), margin(o.smallest_margin), o.passes ? 'passes' : 'fails']),
      ),
    );
    out.push('  Catalogue sizes: common practice, no source.');
    out.push('');
  }
  const mc = r.master_cylinder;
  if (mc) {
    out.push(`Master cylinder (${mc.rule}): ${F.deceleration(mc.required_deceleration_ms2, UNITS)} needs ${F.pressure(mc.pressure_for_required_bar, UNITS, 'bar')}; pedal-force target ${F.pedalForce(mc.pedal_force_target_n, UNITS)} (limit ${F.pedalForce(mc.pedal_force_limit_n, UNITS)}); line pressure at the limit ≤ ${F.pressure(mc.max_line_pressure_bar, UNITS, 'bar')} (common practice)`);
    out.push(`  bore window: ${F.shortLength(mc.min_bore_mm, UNITS)} – ${F.shortLength(mc.max_bore_mm, UNITS)} (now ${F.shortLength(mc.current_bore_mm, UNITS)})`);
    const ok = mc.candidates.filter((c) => c.meets);
    if (ok.length) out.push(textTable(['bore', F.headWithUnit('pedal force', 'pedal_force', UNITS), F.headWithUnit('pressure at limit', 'pressure', UNITS)], ok.map((c) => [c.label, F.format('pedal_force', c.pedal_force_n, UNITS, { unit: false }), F.format('pressure', c.pressure_at_limit_bar, UNITS, { from: 'bar', unit: false })])));
    for (const n of mc.notes) out.push(`  note: ${n}`);
    out.push('');
  }
  if (r.valve) {
    const v = r.valve.valve;
    // the valve from its type's module, its numbers with the unit and label of the quantity table (core/valves/)
    const desc = [rearValveFamily(v).name, ...valveSettings(v).map((st) => `${st.meta.label.charAt(0).toLowerCase()}${st.meta.label.slice(1)} ${F.fieldValue(st.meta, st.value, UNITS)}`)].join(', ');
    out.push(`Rear valve: ${desc}; smallest margin ${margin(r.valve.smallest_margin)} (${r.valve.passes ? 'passes' : 'fails'})`);
    if (r.valve_search) out.push(`  proportioning map: ${r.valve_search.map.feasible_cells} of ${r.valve_search.map.knee_bar.length * r.valve_search.map.ratio.length} knee × ratio cells pass`);
    out.push('');
  }
  if (r.balance_bar) {
    const b = r.balance_bar;
    out.push(`Balance bar: lock at ${pct(b.recommended_setting_front_share)} of the pushrod force to the front (now ${pct(b.current_setting_front_share)}); band of settings ${b.setting_range ? `${pct(b.setting_range.min)} – ${pct(b.setting_range.max)}` : 'none'}`);
    out.push(`  ${b.warning}`);
    out.push('');
  }
  const rb = r.robustness;
  out.push(`Robustness of ${rb.applies_to}`);
  out.push(`  (${rb.samples} samples, seed ${rb.seed}, ${rb.distribution}; tolerances: pad friction ±${F.percent(rb.tolerances.pad_friction_front_pct)} front / ±${F.percent(rb.tolerances.pad_friction_rear_pct)} rear, CG height ±${F.length(rb.tolerances.cg_height_m, UNITS)}, front axle ±${F.mass(rb.tolerances.front_axle_kg, UNITS)}, tyre radius ±${F.percent(rb.tolerances.tyre_radius_pct)}, rear valve knee ±${F.percent(rb.tolerances.valve_knee_pct)} and ratio ±${F.percent(rb.tolerances.valve_ratio_pct)}, threshold pressure ±${F.pressure(rb.tolerances.threshold_front_bar, UNITS, 'bar')} front / ±${F.pressure(rb.tolerances.threshold_rear_bar, UNITS, 'bar')} rear):`);
  out.push(`  probability that a rule fails in some load state: ${pct(rb.probability_of_failure)} (± ${pct(rb.probability_standard_error)})`);
  out.push(`  5th-percentile smallest margin: ${margin(rb.p05_margin)}; worst corner: ${margin(rb.worst_corner.smallest_margin)} (${rb.failing_corners} of ${rb.corners} corners fail)`);
  out.push(`  matters most: ${rb.most_influential ? rb.sensitivity[0]!.label : F.DASH} (${rb.sensitivity.map((s) => `${s.label} ${F.utilisation(s.effect)}`).join('; ')})`);
  out.push('');
  for (const m of r.messages) out.push(`Note: ${m}`);
  if (r.verify_note) out.push(`Rules marked partly verified or from memory: ${r.verify_note}.`);
  out.push(`Caution: ${r.caution}`);
  return out.join('\n');
}

export function sizeCommand(argv: string[], out: CommandOutput): number {
  const { values, positionals } = parseArgs({
    args: argv,
    options: {
      json: { type: 'boolean', default: false },
      samples: { type: 'string' },
      seed: { type: 'string' },
      rules: { type: 'string' },
      'max-line-pressure-bar': { type: 'string' },
    },
    allowPositionals: true,
    strict: true,
  });
  if (positionals.length !== 1) throw cliErrors.usage(USAGE);
  const file = positionals[0]!;
  const samples = values.samples === undefined ? undefined : integer('--samples', values.samples, 1, 10_000_000);
  const seed = values.seed === undefined ? undefined : integer('--seed', values.seed, 0, 4294967295);
  const rules = values.rules === undefined ? undefined : parseRuleSelection(values.rules);
  const pMax = values['max-line-pressure-bar'] === undefined ? undefined : positive('--max-line-pressure-bar', values['max-line-pressure-bar'], 10, 400, 'bar');
  const reading = readDesign(readJsonFile(file));
  if (!reading.ok) throw cliErrors.invalid(file, reading.errors.map((e) => `${e.path || '(file)'}: ${e.message}`));
  const result = sizeDesign(reading.design, { samples, seed, rules, max_line_pressure_bar: pMax });
  out.stdout(values.json ? JSON.stringify(result, null, 2) : sizingText(result));
  return sizingFindsPass(result) ? 0 : 1;
}
