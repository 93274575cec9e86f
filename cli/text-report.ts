/** The human-readable form of `lockstep evaluate`: the verdict, one block per load state, then checks and the caution. */
import type { EvaluationResult, LoadStateResult } from '../core/index.ts';
import { fmt, textTable } from './table.ts';
import { pedalTravelSection, pitfallSection, valveFailureSection } from './hardware-report.ts';
import { checksSection } from './checks-report.ts';
import { limitsSection } from './limits-report.ts';
import { conversionLines } from './conversion-report.ts';
import { verdictSection } from './verdict-report.ts';

function stateBlock(s: LoadStateResult): string {
  const out: string[] = [];
  out.push(`Load state "${s.id}" (${s.label}, ${s.kind}): ${fmt(s.mass_kg, 0)} kg, front axle ${fmt(s.front_axle_kg, 0)} kg, CG height ${fmt(s.cg_height_m, 3)} m`);
  out.push(...conversionLines(s));
  out.push(
    `  Static axle loads: front ${fmt(s.front_axle_static_n, 1)} N, rear ${fmt(s.rear_axle_static_n, 1)} N ` +
      `(front share ${fmt(s.static_front_share * 100, 1)} %)`,
  );
  if (s.front_share_low_pressure !== null) {
    out.push(`  Installed front share of braking force at low pressure: ${fmt(s.front_share_low_pressure * 100, 1)} %`);
  }
  out.push(
    s.critical_braking_rate === null
      ? '  Critical braking rate: none (the rear axle never uses more adhesion than the front below z = 1.5 and below lift-off)'
      : `  Critical braking rate: z = ${fmt(s.critical_braking_rate, 4)} (above it the rear axle locks first)`,
  );
  if (s.critical_braking_rates.length > 1 || (s.critical_braking_rates.length === 1 && s.critical_braking_rate === null)) {
    out.push(`  Every crossing of the ideal: z = ${s.critical_braking_rates.map((z) => fmt(z, 4)).join(', ')}`);
  }
  out.push(`  Rear-axle lift-off at z = ${fmt(s.rear_lift_off_braking_rate, 3)}`);
  out.push('  Lock order per surface (braking efficiency = z at first lock / adhesion):');
  out.push(
    textTable(
      ['adhesion k', 'locks first', 'z at first lock', 'efficiency'],
      s.lock.map((l) => [fmt(l.adhesion, 2), l.first_axle, fmt(l.braking_rate, 4), fmt(l.efficiency, 3)]),
      '    ',
    ),
  );
  out.push('  At braking rates (forces per axle, N; utilisation f = T/N; pressures in bar):');
  out.push(
    textTable(
      ['z', 'N1', 'N2', 'T1', 'T2', 'f1', 'f2', 'p front', 'p rear', 'pedal N'],
      s.at.map((a) => [
        fmt(a.braking_rate, 3),
        fmt(a.front_axle_load_n, 0),
        fmt(a.rear_axle_load_n, 0),
        fmt(a.front_force_n, 0),
        fmt(a.rear_force_n, 0),
        fmt(a.front_utilisation, 3),
        fmt(a.rear_utilisation, 3),
        fmt(a.front_pressure_bar, 1),
        fmt(a.rear_pressure_bar, 1),
        fmt(a.pedal_force_n, 0),
      ]),
      '    ',
    ),
  );
  for (const w of s.warnings) out.push(`  Warning: ${w.message}`);
  return out.join('\n');
}

export function textReport(r: EvaluationResult): string {
  const out: string[] = [];
  out.push(`Lockstep ${r.lockstep_version}: ${r.design_name}`);
  out.push('');
  out.push(...verdictSection(r.verdict), '');
  for (const w of r.warnings) out.push(`Warning: ${w.path ? `${w.path}: ` : ''}${w.message}`);
  if (r.warnings.length) out.push('');
  const pit = pitfallSection(r);
  if (pit.length) out.push(...pit, '');
  for (const s of r.load_states) {
    out.push(stateBlock(s));
    out.push('');
  }
  out.push(...valveFailureSection(r), '', ...pedalTravelSection(r), '');
  out.push(...limitsSection(r), '');
  const checks = checksSection(r);
  if (checks.length) out.push(...checks, '');
  out.push(`CAUTION: ${r.caution}`);
  return out.join('\n');
}
