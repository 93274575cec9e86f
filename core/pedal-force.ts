/**
 * Pedal force for a master-cylinder pressure (design-file spec): F = p A_mc / (i_pedal · i_booster)
 * up to the booster runout pressure; above it the booster adds nothing more, so each further pascal
 * costs A_mc / i_pedal. Pressure p in Pa (gauge), force in N.
 */
import { pistonArea } from './brake-gain.ts';

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
