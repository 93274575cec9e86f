/**
 * The limits of a design at grip and heat, as they go into the evaluation result: per load state the
 * traction limits, stopping distances and roller-tester prediction; for the design the regeneration
 * analysis and the brake-heat estimate (null when the file has no `regen` / `heat` block).
 */
import { heatAnalysis, type HeatResult } from './brake-heat.ts';
import type { DesignFile } from './design.ts';
import { regenAnalysis, type RegenResult } from './regen.ts';
import { testerFor, type TesterResult } from './roller-tester.ts';
import type { StateModel } from './state-model.ts';
import { defaultBuildUpTime, STOPPING_DEFAULTS, type StopRow, stoppingTable } from './stopping.ts';
import { type TractionLimit, tractionTable } from './traction.ts';

export interface StoppingResult {
  estimate: true;
  reaction_time_s: number;
  build_up_time_s: number;
  abs_adhesion_factor: number;
  /** The design file says ABS is fitted: the `abs` rows apply to it, the `no_abs` rows to a failed ABS. */
  design_has_abs: boolean;
  rows: StopRow[];
  notes: string[];
}

export interface StateLimits {
  traction: TractionLimit[];
  stopping: StoppingResult;
  tester: TesterResult;
}

export function stateLimits(design: DesignFile, s: StateModel, adhesions: readonly number[]): StateLimits {
  const t = design.traction ?? {};
  const st = design.stopping ?? {};
  const reaction = st.reaction_time_s ?? STOPPING_DEFAULTS.reaction_time_s;
  const buildUp = st.build_up_time_s ?? defaultBuildUpTime(design.vehicle.category);
  const absFactor = st.abs_adhesion_factor ?? STOPPING_DEFAULTS.abs_adhesion_factor;
  const notes = [
    st.reaction_time_s === undefined
      ? `Reaction time ${reaction} s: one of the conventions in use (0.67 s, 1.5 s and 2.5 s are all used); set your own.`
      : `Reaction time ${reaction} s (user value).`,
    st.build_up_time_s === undefined
      ? `Brake build-up ${buildUp} s, a linear rise of deceleration: twice the ${design.vehicle.category === 'M1' ? '0.1·v' : '0.15·v'} allowance of the Type-0 stopping-distance formula (71/320/EEC Annex II 2.1.1).`
      : `Brake build-up ${buildUp} s, a linear rise of deceleration (user value).`,
    `With ABS: braking rate = ${absFactor} × adhesion (an assumption${st.abs_adhesion_factor === undefined ? ', from memory' : ', user value'}). ` +
      'Without ABS: the braking rate at which the first axle locks (no regeneration).',
  ];
  return {
    traction: tractionTable(s.loads, design.vehicle.drive, adhesions, {
      allWheelFrontShare: t.all_wheel_front_share ?? null,
      rollingResistance: t.rolling_resistance ?? 0,
    }),
    stopping: {
      estimate: true,
      reaction_time_s: reaction,
      build_up_time_s: buildUp,
      abs_adhesion_factor: absFactor,
      design_has_abs: design.vehicle.abs,
      rows: stoppingTable(s.loads, s.dist, adhesions, {
        speedsKmh: st.speeds_kmh ?? STOPPING_DEFAULTS.speeds_kmh,
        reactionS: reaction,
        buildUpS: buildUp,
        absFactor,
      }),
      notes,
    },
    tester: testerFor(design, s),
  };
}

export interface DesignLimits {
  regen: RegenResult | null;
  heat: HeatResult | null;
}

export function designLimits(design: DesignFile, models: readonly StateModel[], adhesions: readonly number[]): DesignLimits {
  return { regen: regenAnalysis(design, models, adhesions), heat: heatAnalysis(design, models) };
}
