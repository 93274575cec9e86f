/**
 * Document sections of the limits at grip and heat: per load state traction, stopping distance and the roller
 * tester; per design regenerative braking and brake heat. Every figure is an engineering estimate.
 */
import type { EvaluationResult, LoadStateResult, UnitSystem } from '../core/index.ts';
import * as F from './format.ts';
import { FIRST_AXLE_LABELS, heatCaseLabel, limitedByLabel, REGEN_BLENDING_LABELS, ruleLabel, RULE_STATUS_LABELS } from './labels.ts';
import { col, type Row, type Section, text } from './model.ts';

const DRIVES = ['front', 'rear', 'all'] as const;
const STATUS_LETTER: Record<'V' | 'P' | 'M', keyof typeof RULE_STATUS_LABELS> = { V: 'verified', P: 'partial', M: 'memory' };

/** Section `traction-<i>`: largest acceleration per drive layout; start gradient and drive-axle load of the design's drive. */
export function tractionSection(s: LoadStateResult, i: number, units: UnitSystem): Section {
  const at = (d: string, k: number) => s.traction.find((t) => t.drive === d && t.adhesion === k);
  const own = s.traction.find((t) => t.is_design_drive)?.drive ?? 'rear';
  const ks = [...new Set(s.traction.map((t) => t.adhesion))];
  return {
    id: `traction-${i}`,
    title: `Traction limits, ${s.label}`,
    blocks: [
      {
        kind: 'table',
        id: `traction-table-${i}`,
        title: `${s.label}: largest acceleration (g, with load transfer) per drive layout; * = this design's ${own}-wheel drive`,
        columns: [
          col('Adhesion k'),
          ...DRIVES.map((d) => col(`${d === 'all' ? 'all-wheel' : `${d}-wheel`} drive${d === own ? ' *' : ''}`, 'g')),
          col('* acceleration', F.unitOf('deceleration', units)),
          col('* start gradient', '%'),
          col('* drive axle load', F.unitOf('force', units)),
          col('* limited by'),
        ],
        rows: ks.map((k) => {
          const o = at(own, k);
          return {
            cells: [
              F.adhesion(k),
              ...DRIVES.map((d) => F.format('utilisation', at(d, k)?.max_acceleration_g, units)),
              F.format('deceleration', o?.max_acceleration_ms2, units, { unit: false }),
              F.format('percent', o?.max_gradient_pct, units, { from: 'pct', unit: false }),
              F.format('force', o?.drive_axle_load_on_gradient_n, units, { unit: false }),
              o ? limitedByLabel(o.limited_by) : F.DASH,
            ],
          };
        }),
      },
    ],
  };
}

/** Section `stopping-<i>`: total stopping distance without and with ABS per speed and surface (metric: in feet too). */
export function stoppingSection(s: LoadStateResult, i: number, units: UnitSystem): Section {
  const st = s.stopping;
  const pairs = new Map<string, { no?: (typeof st.rows)[number]; abs?: (typeof st.rows)[number] }>();
  for (const r of st.rows) {
    const key = `${r.speed_kmh}|${r.adhesion}`;
    const e = pairs.get(key) ?? {};
    if (r.mode === 'abs') e.abs = r;
    else e.no = r;
    pairs.set(key, e);
  }
  const du = F.unitOf('distance', units);
  const alsoFt = units === 'metric';
  const dist = (v: number | undefined) => F.format('distance', v, units, { unit: false });
  const ft = (v: number | undefined) => F.format('distance', v, 'us', { unit: false });
  return {
    id: `stopping-${i}`,
    title: `Stopping distance, ${s.label}`,
    blocks: [
      text(
        `Reaction ${F.time(st.reaction_time_s)}, build-up ${F.time(st.build_up_time_s)}; ` +
          (st.design_has_abs ? 'ABS is fitted: the ABS columns apply, no ABS is the failed-ABS case.' : 'no ABS fitted: the no-ABS columns apply; the ABS columns show what ABS would give.'),
      ),
      {
        kind: 'table',
        id: `stopping-table-${i}`,
        title: `${s.label}: total stopping distance (${du}) without and with ABS`,
        columns: [
          col('Speed', F.unitOf('speed', units)),
          col('Adhesion k'),
          col('No ABS: z at first lock, axle'),
          col('No ABS: total', du),
          ...(alsoFt ? [col('No ABS: total', 'ft')] : []),
          col(`ABS: z (${F.ratio(st.abs_adhesion_factor)} × k)`),
          col('ABS: total', du),
          ...(alsoFt ? [col('ABS: total', 'ft')] : []),
        ],
        rows: [...pairs.values()].map(({ no, abs }) => ({
          cells: [
            F.format('speed', no?.speed_kmh ?? abs?.speed_kmh, units, { from: 'km/h', unit: false }),
            F.adhesion(no?.adhesion ?? abs?.adhesion),
            no ? `${F.brakingRate(no.braking_rate)}${no.first_axle ? ` ${FIRST_AXLE_LABELS[no.first_axle as keyof typeof FIRST_AXLE_LABELS] ?? ''}` : ''}` : F.DASH,
            dist(no?.total_m),
            ...(alsoFt ? [ft(no?.total_m)] : []),
            F.brakingRate(abs?.braking_rate),
            dist(abs?.total_m),
            ...(alsoFt ? [ft(abs?.total_m)] : []),
          ],
        })),
      },
      ...st.notes.map((n) => text(n, { hint: true })),
    ],
  };
}

/** Section `tester-<i>`: the roller brake tester prediction. */
export function testerSection(s: LoadStateResult, i: number, units: UnitSystem): Section {
  const t = s.tester;
  const fu = F.unitOf('force', units);
  const n = (kind: F.Kind, v: number | null, from?: F.FromUnit) => F.format(kind, v, units, { unit: false, ...(from ? { from } : {}) });
  const low = t.predicted_pct < t.required_pct;
  return {
    id: `tester-${i}`,
    title: `Roller brake tester, ${s.label}`,
    blocks: [
      {
        kind: 'table',
        id: `tester-table-${i}`,
        title: `${s.label}: roller tester (roller adhesion ${F.adhesion(t.roller_adhesion)}, test mass ${F.mass(t.test_mass_kg, units)}, pedal limit ${F.pedalForce(t.pedal_force_limit_n, units)})`,
        columns: [col('Axle'), col('Static load', fu), col('Slip force', fu), col('Slips at', F.unitOf('pressure', units)), col('Slips at pedal', F.unitOf('pedal_force', units)), col('Recorded', fu), col('Limited by')],
        rows: t.axles.map((a) => ({
          cells: [a.axle, n('force', a.static_load_n), n('force', a.slip_force_n), n('pressure', a.slip_pressure_bar, 'bar'), n('pedal_force', a.slip_pedal_force_n), n('force', a.recorded_force_n), limitedByLabel(a.limited_by)],
        })),
      },
      text(
        `Service-brake reading: ${F.percent(t.predicted_pct)} of the test mass (required ${F.percent(t.required_pct)})` +
          (t.pedal_force_for_required_n !== null ? `; the brakes reach ${F.percent(t.required_pct)} at ${F.pedalForce(t.pedal_force_for_required_n, units)} pedal force without slip` : ''),
        { tone: low ? 'fail' : 'ok' },
      ),
      ...(t.flag ? [text(`Flag: ${t.flag}`, { tone: 'fail' })] : []),
    ],
  };
}

const LOCK_CODE: Record<string, string> = { front: 'F', rear: 'R', both: 'B', none: '–' };

/** Section `regen`: the regenerative braking estimate; null without a regen block. */
export function regenSection(r: EvaluationResult, units: UnitSystem): Section | null {
  const g = r.regen;
  if (!g) return null;
  const label = (id: string) => r.load_states.find((s) => s.id === id)?.label ?? id;
  const blend = g.blending === 'regen_first' ? REGEN_BLENDING_LABELS.regen_first : `fixed proportion ${F.ratio(g.proportion)} of the friction force added`;
  const blocks: Section['blocks'] = [
    text(
      `${blend[0]!.toUpperCase()}${blend.slice(1)}; ${F.percentOfRatio(g.front_share)} of it on the front axle. Largest force ${F.force(g.max_force_n, units)} up to ${F.speed(g.base_speed_kmh, units)}, ` +
        `then constant power ${F.power(g.max_power_kw)}; fades from ${F.speed(g.fade_start_kmh, units)} to ${F.speed(g.cutoff_kmh, units)}.`,
    ),
    text(
      `Lock-order range (${g.rule.category}): the rear must not lock first for z ${F.zRange([g.rule.z_from, g.rule.z_to])} on k ${F.adhesion(g.rule.k_from)}–${F.adhesion(g.rule.k_to)} ` +
        `(${g.rule.source}, ${RULE_STATUS_LABELS[STATUS_LETTER[g.rule.status]]}; ${g.rule.note}).`,
      { hint: true },
    ),
  ];
  for (const st of g.load_states) {
    blocks.push({
      kind: 'table',
      id: `regen-lock-${st.id}`,
      title: `${label(st.id)}: first lock per surface without regeneration and at each speed (F front, R rear, B both; ✗ not allowed), and the largest regenerative force that keeps the lock allowed`,
      columns: [
        col('k'),
        col('No regeneration'),
        ...st.at_speeds.map((c) => col(`${F.speed(c.speed_kmh, units)} (${F.force(c.regen_force_n, units)})`)),
        col('Largest allowed', F.unitOf('force', units)),
        col('Motor torque', F.unitOf('torque', units)),
      ],
      rows: st.zero_regen.lock.map((l, i): Row => {
        const lim = st.limits[i]!;
        const code = (x: { first_axle: string; allowed: boolean; braking_rate: number }) => ({
          text: `${LOCK_CODE[x.first_axle] ?? '?'} ${F.brakingRate(x.braking_rate)}${x.allowed ? '' : ' ✗'}`,
          tone: x.allowed ? ('neutral' as const) : ('fail' as const),
        });
        return {
          cells: [
            F.adhesion(l.adhesion),
            code(l),
            ...st.at_speeds.map((c) => code(c.lock[i]!)),
            lim.in_rule_range ? (lim.max_force_n === null ? 'no limit' : F.format('force', lim.max_force_n, units, { unit: false })) : 'outside range',
            lim.in_rule_range && lim.max_motor_torque_nm !== null ? F.format('torque', lim.max_motor_torque_nm, units, { unit: false }) : '',
          ],
        };
      }),
    });
    if (st.checks.length === 0) continue;
    const rules = [...new Set(st.checks.map((c) => c.rule))];
    const speeds = [null, ...st.at_speeds.map((c) => c.speed_kmh)];
    blocks.push({
      kind: 'table',
      id: `regen-checks-${st.id}`,
      title: `${label(st.id)}: regulation curve checks without regeneration and at each speed (margin in adhesion units)`,
      columns: [col('Check'), ...speeds.map((v) => col(v === null ? 'No regeneration' : F.speed(v, units)))],
      rows: rules.map((id) => ({
        cells: [
          { text: ruleLabel(id), code: id, ...(st.checks.find((c) => c.rule === id)?.verify_note ? { verify: st.checks.find((c) => c.rule === id)!.verify_note! } : {}) },
          ...speeds.map((v) => {
            const c = st.checks.find((x) => x.rule === id && x.speed_kmh === v);
            return c ? { text: `${c.passed ? 'pass' : 'FAIL'} ${F.margin(c.worst_margin, 'adhesion', units).replace(' (adhesion)', '')}`, tone: c.passed ? ('ok' as const) : ('fail' as const) } : F.DASH;
          }),
        ],
      })),
    });
    const Fmax = st.max_force_passing_checks_n;
    const failing = st.failing_without_regen.length ? ` (${st.failing_without_regen.map(ruleLabel).join(', ')} fails without regeneration already and is left out)` : '';
    blocks.push(
      text(
        st.max_force_basis === 'no_rule_to_keep'
          ? 'Every curve check fails without regeneration already: no regenerative force to find.'
          : `Largest regenerative force keeping the passing curve checks passing${failing}: ` +
              (Fmax === null ? `the full ${F.force(g.max_force_n, units)}` : `${F.force(Fmax, units)} (${F.torque((Fmax * g.tyre_radius_m) / g.gear_ratio, units)} at the motor)`),
      ),
    );
  }
  const byCase = new Map<string, number[]>();
  for (const f of g.flags) {
    if (f.kind !== 'surface_lock' || f.adhesion === null) continue;
    const key = `${label(f.load_state)} at ${F.speed(f.speed_kmh, units)}`;
    byCase.set(key, [...(byCase.get(key) ?? []), f.adhesion]);
  }
  if (byCase.size) {
    blocks.push({
      kind: 'items',
      id: 'regen-flags',
      title: 'Regeneration makes the driven axle lock first inside the lock-order range (the front locks first without it):',
      items: [...byCase].map(([key, ks]) => ({ text: `${key}: on adhesion ${F.list('adhesion', ks)}`, tone: 'warn' as const })),
    });
  } else {
    blocks.push(text('Regeneration does not make the driven axle lock first inside the lock-order range at the speeds analysed.', { tone: 'ok' }));
  }
  for (const n of g.notes) blocks.push(text(n, { hint: true }));
  return { id: 'regen', title: 'Regenerative braking (estimate)', blocks };
}

/** Section `heat`: one stop and the Type-I-like sequence; null without a heat block. */
export function heatSection(r: EvaluationResult, units: UnitSystem): Section | null {
  const h = r.heat;
  if (!h) return null;
  const ti = h.type_i;
  const label = (id: string) => r.load_states.find((s) => s.id === id)?.label ?? heatCaseLabel(id);
  const kj = F.unitOf('energy', units);
  const n = (kind: F.Kind, v: number | null, from?: F.FromUnit) => F.format(kind, v, units, { unit: false, ...(from ? { from } : {}) });
  const blocks: Section['blocks'] = [
    text(`Rotors ${F.mass(h.front_rotor_kg, units)} front, ${F.mass(h.rear_rotor_kg, units)} rear, each.`),
    {
      kind: 'table',
      id: 'heat-stop',
      title: `One stop from ${F.speed(h.single_stop.speed_kmh, units)} at ${F.deceleration(h.single_stop.deceleration_ms2, units)} (estimate)`,
      columns: [col('Case'), col('Mass', F.unitOf('mass', units)), col('Energy', kj), col('Front share', '%'), col('Per front brake', kj), col('Per rear brake', kj), col('Front rotor rise', F.unitOf('temperature_rise', units)), col('Rear rotor rise', F.unitOf('temperature_rise', units))],
      rows: h.single_stop.rows.map((x) => ({
        cells: [
          label(x.case),
          n('mass', x.mass_kg),
          n('energy', x.energy_j),
          F.format('percent', x.front_share, units, { from: 'ratio', unit: false }),
          n('energy', x.front_brake_energy_j),
          n('energy', x.rear_brake_energy_j),
          n('temperature_rise', x.front_rotor_rise_k),
          n('temperature_rise', x.rear_rotor_rise_k),
        ],
      })),
    },
    text(
      `Type-I-like sequence, load state ${label(ti.load_state)}: ${ti.cycles} brakings from ${F.speed(ti.v1_kmh, units)} to ${F.speed(ti.v2_kmh, units)} at ${F.deceleration(ti.deceleration_ms2, units)}, ` +
        `one every ${F.time(ti.interval_s)}, ambient ${F.temperature(h.ambient_c, units)}, cooling ${F.ratio(h.cooling_coefficient_per_s)} 1/s.`,
    ),
    text(
      `This vehicle: front rotor peaks at ${F.temperature(ti.vehicle.front_final_peak_c, units)}, rear ${F.temperature(ti.vehicle.rear_final_peak_c, units)} after the last braking` +
        (ti.base_vehicle
          ? `; the same brakes on the base vehicle (${F.mass(ti.base_vehicle.mass_kg, units)}): front ${F.temperature(ti.base_vehicle.front_final_peak_c, units)}, rear ${F.temperature(ti.base_vehicle.rear_final_peak_c, units)}`
          : '') +
        '.',
    ),
    ...h.notes.map((x) => text(x, { hint: true })),
  ];
  return { id: 'heat', title: 'Brake heat (estimate)', blocks };
}

/** Every limits section in order: per load state traction, stopping, tester; then regeneration and heat. */
export function limitsSection(r: EvaluationResult, units: UnitSystem): Section[] {
  const out: Section[] = [];
  r.load_states.forEach((s, i) => out.push(tractionSection(s, i, units), stoppingSection(s, i, units), testerSection(s, i, units)));
  const regen = regenSection(r, units);
  if (regen) out.push(regen);
  const heat = heatSection(r, units);
  if (heat) out.push(heat);
  return out;
}
