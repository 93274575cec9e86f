/**
 * Pedal force for a master-cylinder pressure (design-file spec): F = p A_mc / (i_pedal · i_booster)
 * up to the booster runout pressure; above it the booster adds nothing more, so each further pascal
 * costs A_mc / i_pedal. Pressure p in Pa (gauge), force in N.
 */
import { pistonArea } from './brake-gain.ts';
import type { Hydraulics } from './design.ts';

export interface PedalModel {
  /** Master-cylinder piston area, m². */
  area: number;
  pedalRatio: number;
  boosterRatio: number;
  /** Booster runout pressure, Pa; Infinity when none is given. */
  runout: number;
}

export function pedalModel(boreMm: number, pedalRatio: number, boosterRatio: number, runoutBar?: number): PedalModel {
  return {
    area: pistonArea(boreMm * 1e-3),
    pedalRatio,
    boosterRatio,
    runout: runoutBar === undefined ? Infinity : runoutBar * 1e5,
  };
}

export function pedalForce(m: PedalModel, p: number): number {
  if (p <= m.runout) return (p * m.area) / (m.pedalRatio * m.boosterRatio);
  return (m.runout * m.area) / (m.pedalRatio * m.boosterRatio) + ((p - m.runout) * m.area) / m.pedalRatio;
}

/** Master-cylinder pressure produced by a pedal force, Pa (inverse of pedalForce). */
export function pressureForPedalForce(m: PedalModel, force: number): number {
  const atRunout = (m.runout * m.area) / (m.pedalRatio * m.boosterRatio);
  if (force <= atRunout) return (force * m.pedalRatio * m.boosterRatio) / m.area;
  return m.runout + ((force - atRunout) * m.pedalRatio) / m.area;
}

/**
 * The pedal model of a design's hydraulics: the one pedal-to-pressure path for every check (service,
 * secondary, booster failed, failed valve, pedal travel, roller tester, sizing). With a balance bar
 * the pushrod force F splits s·F to the front master cylinder of area A_f, so the front line pressure
 * is p = s·F / A_f: the pedal sees an equivalent area A_f / s, i.e. a bore d_f / √s. `assisted: false`
 * is the booster-failed pedal (ratio 1, no runout).
 */
export function hydraulicPedalModel(
  h: Pick<Hydraulics, 'master_cylinder_bore_mm' | 'pedal_ratio' | 'booster_ratio' | 'booster_runout_bar' | 'balance_bar'>,
  opts: { assisted: boolean } = { assisted: true },
): PedalModel {
  const bar = h.balance_bar;
  const bore = bar ? h.master_cylinder_bore_mm / Math.sqrt(bar.setting_front_share) : h.master_cylinder_bore_mm;
  return opts.assisted ? pedalModel(bore, h.pedal_ratio, h.booster_ratio, h.booster_runout_bar) : pedalModel(bore, h.pedal_ratio, 1);
}
