/**
 * Text sections for the limits: traction, stopping, roller tester (per load state), regeneration and
 * brake heat (per design). Every figure here is an engineering estimate.
 */
import type { EvaluationResult, LoadStateResult } from '../core/index.ts';
import { fmt, textTable } from './table.ts';

const IND = '    ';

function tractionLines(s: LoadStateResult): string[] {
  const byDrive = (drive: string, k: number) => s.traction.find((t) => t.drive === drive && t.adhesion === k);
  const own = s.traction.find((t) => t.is_design_drive)?.drive ?? 'rear';
  const ks = [...new Set(s.traction.map((t) => t.adhesion))];
  const mark = (d: string) => (d === own ? `${d} drive*` : `${d} drive`);
  const rows = ks.map((k) => [
    fmt(k, 2),
    fmt(byDrive('front', k)?.max_acceleration_g, 3),
    fmt(byDrive('rear', k)?.max_acceleration_g, 3),
    fmt(byDrive('all', k)?.max_acceleration_g, 3),
    fmt(byDrive(own, k)?.max_gradient_pct, 1),
    fmt(byDrive(own, k)?.drive_axle_load_on_gradient_n, 0),
  ]);
  return [
    `  Traction limits (largest acceleration in g with load transfer; * = this design's drive):`,
    textTable(['adhesion k', mark('front'), mark('rear'), mark('all'), 'start gradient %*', 'drive axle load N*'], rows, IND),
  ];
}

function stoppingLines(s: LoadStateResult): string[] {
  const st = s.stopping;
  const pairs = new Map<string, { no?: (typeof st.rows)[number]; abs?: (typeof st.rows)[number] }>();
  for (const r of st.rows) {
    const key = `${r.speed_kmh}|${r.adhesion}`;
    const e = pairs.get(key) ?? {};
    if (r.mode === 'abs') e.abs = r;
    else e.no = r;
    pairs.set(key, e);
  }
  const rows = [...pairs.values()].map(({ no, abs }) => [
    fmt(no?.speed_kmh ?? abs?.speed_kmh, 0),
    fmt(no?.adhesion ?? abs?.adhesion, 2),
    no ? `${fmt(no.braking_rate, 3)} ${no.first_axle ?? ''}` : '—',
    fmt(no?.total_m, 1),
    fmt(no?.total_ft, 0),
    fmt(abs?.braking_rate, 3),
    fmt(abs?.total_m, 1),
    fmt(abs?.total_ft, 0),
  ]);
  return [
    `  Stopping distance (reaction ${fmt(st.reaction_time_s, 2)} s, build-up ${fmt(st.build_up_time_s, 2)} s; ` +
      `${st.design_has_abs ? 'ABS fitted: the ABS columns apply, no-ABS is the failed-ABS case' : 'no ABS fitted: the no-ABS columns apply'}):`,
    textTable(['km/h', 'k', 'no ABS: z, locks', 'total m', 'ft', `ABS: z (${st.abs_adhesion_factor}·k)`, 'total m', 'ft'], rows, IND),
    ...st.notes.map((n) => `${IND}${n}`),
  ];
}

function testerLines(s: LoadStateResult): string[] {
  const t = s.tester;
  const out = [
    `  Roller brake tester (roller adhesion ${t.roller_adhesion}, test mass ${fmt(t.test_mass_kg, 0)} kg, pedal limit ${fmt(t.pedal_force_limit_n, 0)} N):`,
    textTable(
      ['axle', 'static load N', 'slip force N', 'slip at bar', 'slip at pedal N', 'recorded N', 'limited by'],
      t.axles.map((a) => [
        a.axle,
        fmt(a.static_load_n, 0),
        fmt(a.slip_force_n, 0),
        fmt(a.slip_pressure_bar, 1),
        fmt(a.slip_pedal_force_n, 0),
        fmt(a.recorded_force_n, 0),
        a.limited_by === 'slip' ? 'wheel slip' : 'pedal limit',
      ]),
      IND,
    ),
    `${IND}Service-brake reading: ${fmt(t.predicted_pct, 1)} % of the test mass (required ${t.required_pct} %)` +
      (t.pedal_force_for_required_n !== null ? `; the brakes reach ${t.required_pct} % at ${fmt(t.pedal_force_for_required_n, 0)} N pedal force without slip` : ''),
  ];
  if (t.flag) out.push(`${IND}Flag: ${t.flag}`);
  return out;
}

function regenLines(r: EvaluationResult): string[] {
  const g = r.regen;
  if (!g) return [];
  const out = [
    'Regenerative braking (estimate):',
    `  ${g.blending === 'regen_first' ? 'Regeneration first, friction fills in' : `Fixed proportion ${g.proportion} of the friction force added`}; ` +
      `${fmt(g.front_share * 100, 0)} % of it on the front axle. Largest force ${fmt(g.max_force_n, 0)} N up to ${fmt(g.base_speed_kmh, 1)} km/h, ` +
      `constant power ${fmt(g.max_power_kw, 0)} kW above; fades from ${fmt(g.fade_start_kmh, 0)} to ${fmt(g.cutoff_kmh, 0)} km/h.`,
    `  Lock-order range: ${g.rule.category}, rear must not lock first for z ${g.rule.z_from}–${g.rule.z_to} on k ${g.rule.k_from}–${g.rule.k_to} ` +
      `(${g.rule.source} [${g.rule.status}]; ${g.rule.note}).`,
  ];
  for (const st of g.load_states) {
    out.push(`  Load state "${st.id}": first lock per surface, zero regeneration and at each speed (F = front, R = rear, B = both; ! = not allowed):`);
    const code = (l: { first_axle: string; allowed: boolean; braking_rate: number }) =>
      `${{ front: 'F', rear: 'R', both: 'B', none: '-' }[l.first_axle] ?? '?'}${fmt(l.braking_rate, 2)}${l.allowed ? '' : '!'}`;
    out.push(
      textTable(
        ['k', 'no regen', ...st.at_speeds.map((c) => `${c.speed_kmh} km/h (${fmt(c.regen_force_n, 0)} N)`), 'largest allowed N', 'motor N m'],
        st.zero_regen.lock.map((l, i) => {
          const lim = st.limits[i]!;
          return [
            fmt(l.adhesion, 2),
            code(l),
            ...st.at_speeds.map((c) => code(c.lock[i]!)),
            lim.in_rule_range ? (lim.max_force_n === null ? 'no limit' : fmt(lim.max_force_n, 0)) : 'outside range',
            lim.in_rule_range && lim.max_motor_torque_nm !== null ? fmt(lim.max_motor_torque_nm, 1) : '',
          ];
        }),
        IND,
      ),
    );
  }
  for (const st of g.load_states) {
    if (st.checks.length === 0) continue;
    out.push(`  Load state "${st.id}": regulation curve checks with zero regeneration and at each speed (margin in adhesion units):`);
    const rules = [...new Set(st.checks.map((c) => c.rule))];
    const speeds = [null, ...st.at_speeds.map((c) => c.speed_kmh)];
    out.push(
      textTable(
        ['rule', ...speeds.map((v) => (v === null ? 'no regen' : `${v} km/h`))],
        rules.map((id) => [
          id + (st.checks.find((c) => c.rule === id)?.verify_note ? ' (verify)' : ''),
          ...speeds.map((v) => {
            const c = st.checks.find((x) => x.rule === id && x.speed_kmh === v);
            return c ? `${c.passed ? 'pass' : 'FAIL'} ${fmt(c.worst_margin, 3)}` : '—';
          }),
        ]),
        IND,
      ),
    );
    const F = st.max_force_passing_checks_n;
    const failing = st.failing_without_regen.length ? ` (${st.failing_without_regen.join(', ')} fails without regeneration already and is left out)` : '';
    out.push(
      st.max_force_basis === 'no_rule_to_keep'
        ? `${IND}Every curve check fails without regeneration already: no regenerative force to find.`
        : `${IND}Largest regenerative force keeping the passing curve checks passing${failing}: ` +
            (F === null ? `the full ${fmt(g.max_force_n, 0)} N` : `${fmt(F, 0)} N (${fmt((F * g.tyre_radius_m) / g.gear_ratio, 1)} N m at the motor)`),
    );
  }
  const surface = g.flags.filter((f) => f.kind === 'surface_lock');
  const byCase = new Map<string, number[]>();
  for (const f of surface) {
    const key = `${f.load_state} at ${f.speed_kmh} km/h`;
    byCase.set(key, [...(byCase.get(key) ?? []), f.adhesion ?? NaN]);
  }
  if (byCase.size) {
    out.push('  Regeneration makes the driven axle lock first inside the lock-order range (front first without it):');
    for (const [key, ks] of byCase) out.push(`    ${key}: on adhesion ${ks.map((k) => fmt(k, 2)).join(', ')}`);
  } else {
    out.push('  Regeneration does not make the driven axle lock first inside the lock-order range at the speeds analysed.');
  }
  for (const n of g.notes) out.push(`  ${n}`);
  return out;
}

function heatLines(r: EvaluationResult): string[] {
  const h = r.heat;
  if (!h) return [];
  const ti = h.type_i;
  const out = [
    `Brake heat (estimate; rotors ${fmt(h.front_rotor_kg, 1)} kg front, ${fmt(h.rear_rotor_kg, 1)} kg rear, each):`,
    `  One stop from ${fmt(h.single_stop.speed_kmh, 0)} km/h at ${fmt(h.single_stop.deceleration_ms2, 1)} m/s²:`,
    textTable(
      ['case', 'mass kg', 'energy kJ', 'front share', 'per front brake kJ', 'per rear brake kJ', 'front rise K', 'rear rise K'],
      h.single_stop.rows.map((x) => [
        x.case,
        fmt(x.mass_kg, 0),
        fmt(x.energy_j / 1e3, 1),
        fmt(x.front_share, 3),
        fmt(x.front_brake_energy_j / 1e3, 1),
        fmt(x.rear_brake_energy_j / 1e3, 1),
        fmt(x.front_rotor_rise_k, 1),
        fmt(x.rear_rotor_rise_k, 1),
      ]),
      IND,
    ),
    `  Type-I-like sequence, load state "${ti.load_state}": ${ti.cycles} brakings ${fmt(ti.v1_kmh, 0)} → ${fmt(ti.v2_kmh, 0)} km/h at ${ti.deceleration_ms2} m/s², one every ${ti.interval_s} s, ` +
      `ambient ${h.ambient_c} °C, cooling ${h.cooling_coefficient_per_s} 1/s:`,
    `    this vehicle: front rotor peaks at ${fmt(ti.vehicle.front_final_peak_c, 0)} °C, rear ${fmt(ti.vehicle.rear_final_peak_c, 0)} °C after the last braking`,
  ];
  if (ti.base_vehicle) {
    out.push(
      `    same brakes on the base vehicle (${fmt(ti.base_vehicle.mass_kg, 0)} kg): front ${fmt(ti.base_vehicle.front_final_peak_c, 0)} °C, rear ${fmt(ti.base_vehicle.rear_final_peak_c, 0)} °C`,
    );
  }
  for (const n of h.notes) out.push(`  ${n}`);
  return out;
}

/** The limits section: per load state, then regeneration and heat. Empty lines separate the blocks. */
export function limitsSection(r: EvaluationResult): string[] {
  const out: string[] = ['Limits at grip and heat (engineering estimates):'];
  for (const s of r.load_states) {
    out.push(`Load state "${s.id}":`, ...tractionLines(s), ...stoppingLines(s), ...testerLines(s), '');
  }
  const regen = regenLines(r);
  if (regen.length) out.push(...regen, '');
  const heat = heatLines(r);
  if (heat.length) out.push(...heat, '');
  if (out[out.length - 1] === '') out.pop();
  return out;
}
