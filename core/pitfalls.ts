/**
 * Pitfall warnings: things converters report getting wrong and inspectors ask about
 * (inspection regimes and converters' reports; common practice). Each warning names the
 * practice or regime it comes from. They use the optional `base_vehicle` and `conversion` blocks and
 * fire only on facts the design states; a design without those blocks raises none.
 */
import { systemWorks } from './cases-schema.ts';
import type { DesignFile } from './design.ts';

export interface Pitfall {
  code: string;
  /** Field a person would look at or change. */
  path: string;
  message: string;
  /** Practice or regime the warning comes from. */
  source: string;
}

/** Tyre rolling-radius change that triggers a brake reassessment, as a share of the base radius. */
export const TYRE_RADIUS_CHANGE_LIMIT = 0.07;

const SRC = {
  tyre: 'NSW (Australia) RMS "Brake assessment manual" v1.0 (2013), Table 1: a wheel or tyre diameter change of more than 7 % either way calls for a brake assessment',
  bias: 'UK IVA practice: a brake-bias adjuster within the driver\'s reach fails; one inspector accepted a balance bar set so the front locks first and then pinned (practitioner reports, no published source)',
  abs: 'NSW (Australia) RMS "Brake assessment manual" v1.0 (2013): no certificate when the modification disables ESC; NZTA entry certification, brakes (https://vehicleinspection.nzta.govt.nz/virms/entry-certification/i-and-c/brakes): a fitted ABS needs a technician\'s declaration; examiners expect ABS and ESP to keep working (practitioner reports, no published source)',
  lsv: 'Practitioner reports, no published source: helper springs, air assistance, lifting or lowering stop a load-sensing valve from reading the load, and its linkage must be reset',
  split: 'NSW (Australia) RMS "Brake assessment manual" v1.0 (2013), Table 1: changing a diagonal split to a front/rear split calls for a brake assessment',
  drumMc: 'Practitioner reports, no published source: calipers take more fluid than drums, so a master cylinder from a drum system may lack displacement; drum residual valves (about 0.7 bar) do not suit discs',
  booster: 'NSW (Australia) RMS "Brake assessment manual" v1.0 (2013), Table 1: removing the booster calls for a brake assessment; the plate test at 500 N with the booster disconnected is a practitioner report, no published source',
  vacuum: 'EV-conversion practice: without engine vacuum an electric vacuum pump and a reservoir are needed (practitioner reports, no published source)',
  retained: 'An antilock, stability or distribution controller is calibrated for the base vehicle\'s brakes, tyres, masses and suspension (practitioner reports and common practice, no published source)',
} as const;

const SYSTEM_NAMES = { abs: 'antilock (ABS)', esc: 'stability control (ESC)', ebd: 'electronic brake-force distribution (EBD)' } as const;

/** What the conversion changed that a controller kept from the base vehicle was set up for. */
function changesForRetained(design: DesignFile): string[] {
  const base = design.base_vehicle;
  const out: string[] = [];
  for (const axle of ['front', 'rear'] as const) {
    const type = axle === 'front' ? base?.front_brake_type : base?.rear_brake_type;
    if (type !== undefined && type !== design.axles[axle].brake.type) out.push(`${axle} brakes changed from ${type} to ${design.axles[axle].brake.type}`);
    const r = axle === 'front' ? base?.front_tyre_radius_m : base?.rear_tyre_radius_m;
    if (r !== undefined && Math.abs(design.axles[axle].tyre_radius_m / r - 1) > TYRE_RADIUS_CHANGE_LIMIT) out.push(`${axle} tyre radius changed`);
  }
  if (base?.circuit_split !== undefined && base.circuit_split !== design.hydraulics.circuit_split) out.push('circuit split changed');
  if (design.conversion?.suspension_modified === true) out.push('suspension modified');
  const baseMass = design.heat?.base_vehicle_mass_kg;
  const heaviest = Math.max(...design.load_states.map((s) => s.mass_kg));
  if (baseMass !== undefined && heaviest > baseMass * 1.1) out.push(`heaviest load state ${heaviest} kg against the base vehicle's ${baseMass} kg`);
  return out;
}

/** Pitfalls from the `systems` block (ABS, ESC, EBD status): removed, not working, or kept on changed hardware. */
function systemPitfalls(design: DesignFile, already: readonly Pitfall[]): Pitfall[] {
  const out: Pitfall[] = [];
  const changes = changesForRetained(design);
  for (const k of ['abs', 'esc', 'ebd'] as const) {
    const st = design.systems?.[k];
    if (st === undefined) continue;
    const name = SYSTEM_NAMES[k];
    const covered = already.some((p) => p.code === (k === 'abs' ? 'PITFALL_ABS_LOST' : k === 'esc' ? 'PITFALL_STABILITY_CONTROL_LOST' : ''));
    if ((st === 'removed' || st === 'not_working') && !covered) {
      out.push({
        code: st === 'removed' ? 'PITFALL_SYSTEM_REMOVED' : 'PITFALL_SYSTEM_NOT_WORKING',
        path: `systems.${k}`,
        message:
          `${name} ${st === 'removed' ? 'was removed by the conversion' : 'is fitted but does not work'}: the checks treat the vehicle as without it, ` +
          'and many regimes will not certify a conversion that loses what the base vehicle had',
        source: SRC.abs,
      });
    }
    if (st === 'retained' && changes.length > 0) {
      out.push({
        code: 'PITFALL_SYSTEM_RETAINED_CHANGED',
        path: `systems.${k}`,
        message: `${name} is kept from the base vehicle but the conversion changed what it was set up for (${changes.join('; ')}): ask its maker or prove it by test`,
        source: SRC.retained,
      });
    }
  }
  return out;
}

export function pitfalls(design: DesignFile): Pitfall[] {
  const out: Pitfall[] = [];
  const base = design.base_vehicle;
  const conv = design.conversion;
  const h = design.hydraulics;

  for (const axle of ['front', 'rear'] as const) {
    const was = axle === 'front' ? base?.front_tyre_radius_m : base?.rear_tyre_radius_m;
    const now = design.axles[axle].tyre_radius_m;
    if (was !== undefined) {
      const change = now / was - 1;
      if (Math.abs(change) > TYRE_RADIUS_CHANGE_LIMIT) {
        out.push({
          code: 'PITFALL_TYRE_RADIUS_CHANGED',
          path: `axles.${axle}.tyre_radius_m`,
          message:
            `${axle} tyre rolling radius ${now} m is ${change > 0 ? '+' : ''}${(change * 100).toFixed(1)} % from the base vehicle's ${was} m ` +
            `(more than ±${(TYRE_RADIUS_CHANGE_LIMIT * 100).toFixed(0)} %): brake torque per unit of braking force changes; expect a brake reassessment`,
          source: SRC.tyre,
        });
      }
    }
  }

  if (conv?.bias_adjuster === 'driver_adjustable') {
    out.push({
      code: 'PITFALL_BIAS_ADJUSTER_REACHABLE',
      path: 'conversion.bias_adjuster',
      message: 'the driver can reach the front/rear bias adjuster: set it so the front axle locks first and lock or pin it',
      source: SRC.bias,
    });
  }

  if (base?.abs === true && !design.vehicle.abs) {
    out.push({
      code: 'PITFALL_ABS_LOST',
      path: 'vehicle.abs',
      message: 'the base vehicle had antilock brakes but they do not work in the conversion: many regimes will not certify it',
      source: SRC.abs,
    });
  }
  const escStatus = design.systems?.esc;
  const escWorking = escStatus !== undefined ? systemWorks(escStatus) : conv?.stability_control_working;
  if (base?.stability_control === true && escWorking !== true) {
    out.push({
      code: 'PITFALL_STABILITY_CONTROL_LOST',
      path: escStatus !== undefined ? 'systems.esc' : 'conversion.stability_control_working',
      message:
        escWorking === false
          ? 'the base vehicle had stability control but it does not work in the conversion: some regimes refuse a certificate'
          : 'the base vehicle had stability control and the design does not state that it still works (conversion.stability_control_working)',
      source: SRC.abs,
    });
  }

  if (h.rear_valve.type === 'load_sensing' && conv?.suspension_modified === true) {
    out.push({
      code: 'PITFALL_LOAD_SENSING_SUSPENSION',
      path: 'hydraulics.rear_valve',
      message:
        'a load-sensing valve on modified suspension no longer reads the load as designed: reset or re-set its linkage ' +
        'for the new ride height and check the rear pressure with gauges before and after the valve, laden and unladen',
      source: SRC.lsv,
    });
  }

  if (base?.circuit_split === 'diagonal' && h.circuit_split === 'front_rear') {
    out.push({
      code: 'PITFALL_SPLIT_CHANGED',
      path: 'hydraulics.circuit_split',
      message: 'the diagonal split of the base vehicle became a front/rear split: with the front circuit lost only the rear brakes remain',
      source: SRC.split,
    });
  }

  const discAxles = (['front', 'rear'] as const).filter((a) => design.axles[a].brake.type === 'disc');
  const swapped = discAxles.filter((a) => (a === 'front' ? base?.front_brake_type : base?.rear_brake_type) === 'drum');
  const drumMc = conv?.master_cylinder_from_drum_system === true || (swapped.length > 0 && conv?.master_cylinder_replaced !== true);
  if (discAxles.length > 0 && drumMc) {
    out.push({
      code: 'PITFALL_DRUM_MASTER_CYLINDER',
      path: 'hydraulics.master_cylinder_bore_mm',
      message:
        (swapped.length > 0 && conv?.master_cylinder_from_drum_system !== true
          ? `drums were changed to discs (${swapped.join(', ')}) and the master cylinder is not stated as replaced`
          : 'discs are fitted and the master cylinder came from a drum system') +
        ': check its displacement against the calipers (see the pedal-travel result) and remove any drum residual valve',
      source: SRC.drumMc,
    });
  }

  if (base?.booster === true && h.booster_ratio === 1) {
    out.push({
      code: 'PITFALL_BOOSTER_REMOVED',
      path: 'hydraulics.booster_ratio',
      message: 'the base vehicle had a brake booster and the design has none: pedal forces rise by the booster ratio',
      source: SRC.booster,
    });
  }
  if (h.booster_ratio > 1) {
    const src = conv?.booster_source;
    const gone = src === 'none' || (src === 'engine_vacuum' && conv?.engine_removed === true);
    const unstated = src === undefined && conv?.engine_removed === true;
    if (gone || unstated) {
      out.push({
        code: 'PITFALL_BOOSTER_NO_VACUUM',
        path: 'conversion.booster_source',
        message: unstated
          ? 'the engine was removed and the design does not state what powers the booster: an electric vacuum pump and reservoir are needed'
          : 'the booster has no working vacuum or power source: without it the pedal force rises by the booster ratio; fit an electric vacuum pump and reservoir',
        source: SRC.vacuum,
      });
    }
  }
  out.push(...systemPitfalls(design, out));
  return out;
}
