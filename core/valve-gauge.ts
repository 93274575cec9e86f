/**
 * The valve check for gauge tests: with pressure gauges on a front and a rear line, the vehicle standing
 * in a load state, the rear line should read what the installed valve law gives for each front (input)
 * pressure. The law is the engine's own (core/valves/valve-law.ts `rearPressure` on the state model's valve, knee
 * read at the static rear axle load, as on a standing vehicle), so the table matches every other result.
 * Pressures in Pa inside; the table is in bar, the unit a workshop gauge reads (converted at this edge
 * because the gauge points are chosen in bar).
 */
import { PA_PER_BAR } from './constants.ts';
import type { DesignFile } from './design.ts';
import { rearPressure } from './valves/index.ts';
import { stateModel } from './state-model.ts';

/** Front line pressures of the gauge test, bar (common practice, no source). */
export const GAUGE_POINTS_BAR: readonly number[] = [20, 40, 60, 80, 100];

export interface ValveGaugeRow {
  load_state: string;
  /** The valve's knee at this load state's static rear axle load, Pa (Infinity: no valve). */
  knee_pa: number;
  /** dp2/dp above the knee. */
  ratio: number;
  /** Expected rear line pressure at each gauge point, Pa. */
  rear_pa: number[];
}

export interface ValveGauge {
  valve_type: DesignFile['hydraulics']['rear_valve']['type'];
  front_pa: number[];
  rows: ValveGaugeRow[];
}

export function valveGauge(design: DesignFile, pointsBar: readonly number[] = GAUGE_POINTS_BAR): ValveGauge {
  const front = pointsBar.map((b) => b * PA_PER_BAR);
  return {
    valve_type: design.hydraulics.rear_valve.type,
    front_pa: front,
    rows: design.load_states.map((st) => {
      const m = stateModel(design, st);
      return {
        load_state: st.id,
        knee_pa: m.valve.knee * m.rearMasterRatio,
        ratio: m.valve.ratio,
        rear_pa: front.map((p) => m.rearMasterRatio * rearPressure(m.valve, p)),
      };
    }),
  };
}
