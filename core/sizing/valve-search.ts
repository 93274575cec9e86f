/**
 * Rear-valve settings for a design whose load states no fixed split can serve: a search over the
 * valve's parameters for the best smallest margin over every rule and load state, with the brakes as
 * they are. Margins are exact per setting (core/sizing/rule-margin.ts on the installed distribution);
 * the searched grid is only the set of settings tried, refined around the best one.
 *  - limiting: knee 5…150 bar;
 *  - proportioning: knee 5…120 bar × ratio 0.05…1 (the margin map for the heat map);
 *  - load-sensing: ratio 0.05…1 and, per rear static axle load of the load states, its own knee
 *    (the table's points sit at the states' rear axle loads; states with the same load share one),
 *    stated as a valve reading the static rear axle load (senses "static").
 * The chosen setting is then checked with the full model and the issue-4 curve checks.
 */
import { axleLoadModel } from '../axle-loads.ts';
import { PA_PER_BAR } from '../constants.ts';
import type { DesignFile, RearValve } from '../design.ts';
import { segments } from '../distribution.ts';
import { installedDistribution } from '../installed-distribution.ts';
import type { ValveLaw } from '../valves/index.ts';
import { stateModel } from '../state-model.ts';
import { designMargins, type RuleMargin } from './design-margins.ts';
import { type Geometry, geometryOf, ruleMargin } from './rule-margin.ts';
import { balanceBarPressureRatio } from './sizing-schema.ts';
import type { SizingRule } from './sizing-rules.ts';

interface StateHydraulics {
  geometry: Geometry;
  P: number;
  G1: number;
  G2: number;
  threshold1: number;
  threshold2: number;
  rearKg: number;
}

function hydraulicsOf(design: DesignFile): { states: StateHydraulics[]; lambda: number } {
  const h = design.hydraulics;
  const lambda = h.balance_bar ? balanceBarPressureRatio(h.master_cylinder_bore_mm, h.balance_bar) : 1;
  return {
    lambda,
    states: design.load_states.map((st) => {
      const s = stateModel(design, st);
      const loads = axleLoadModel(st.mass_kg, st.front_axle_kg, st.cg_height_m, design.vehicle.wheelbase_m);
      return { geometry: geometryOf(loads), P: loads.P, G1: s.G1, G2: s.G2, threshold1: s.threshold1, threshold2: s.threshold2, rearKg: st.mass_kg - st.front_axle_kg };
    }),
  };
}

/** Smallest margin over the rules for the states in `which`, each with its own valve law (rear-line knee, Pa). */
function marginWith(rules: readonly SizingRule[], hs: StateHydraulics[], lambda: number, lawOf: (i: number) => ValveLaw, which?: ReadonlySet<number>): number {
  let m = Infinity;
  const segsOf = new Map<number, ReturnType<typeof segments>>();
  for (const r of rules) {
    for (const i of r.states) {
      if (which && !which.has(i)) continue;
      let segs = segsOf.get(i);
      if (!segs) {
        const s = hs[i]!;
        const law = lawOf(i);
        segs = segments(installedDistribution({ P: s.P, G1: s.G1, G2: s.G2, threshold1: s.threshold1, threshold2: s.threshold2, valve: { knee: law.knee / lambda, ratio: law.ratio } }));
        segsOf.set(i, segs);
      }
      const v = ruleMargin(r.compiled, hs[i]!.geometry, segs);
      if (v < m) m = v;
    }
  }
  return m;
}

function range(lo: number, hi: number, step: number): number[] {
  const n = Math.round((hi - lo) / step);
  return Array.from({ length: n + 1 }, (_, k) => Math.round((lo + k * step) * 1e9) / 1e9);
}

export interface MarginMap {
  knee_bar: number[];
  ratio: number[];
  /** smallest_margin[i][j]: ratio[i], knee_bar[j]; null where a range reaches lift-off. */
  smallest_margin: (number | null)[][];
  chosen: { knee_bar: number; ratio: number };
  /** Cells whose smallest margin is ≥ 0 (the feasible region). */
  feasible_cells: number;
}

export interface ValveCandidate {
  valve: RearValve;
  smallest_margin: number | null;
  passes: boolean;
  margins: RuleMargin[];
}

export interface ValveSearch {
  /** The best of the three kinds (by the full-model smallest margin), or null when none improves on the design. */
  recommended: ValveCandidate | null;
  limiting: ValveCandidate;
  proportioning: ValveCandidate;
  load_sensing: ValveCandidate;
  map: MarginMap;
  path: 'hydraulics.rear_valve';
}

const finite = (x: number) => (Number.isFinite(x) ? x : null);

function verify(design: DesignFile, rules: readonly SizingRule[], valve: RearValve): ValveCandidate {
  const copy = structuredClone(design);
  copy.hydraulics.rear_valve = valve;
  const dm = designMargins(copy, rules);
  return { valve, smallest_margin: dm.smallest_margin, passes: dm.passes, margins: dm.margins };
}

function roundTo(x: number, step: number): number {
  return Math.round(x / step) * step;
}

export function searchValve(design: DesignFile, rules: readonly SizingRule[]): ValveSearch {
  const { states, lambda } = hydraulicsOf(design);
  const lawAll = (law: ValveLaw) => () => law;
  const bar = (x: number) => x * PA_PER_BAR;

  // limiting
  let lim = { knee: 5, m: -Infinity };
  for (const k of range(5, 150, 0.5)) {
    const m = marginWith(rules, states, lambda, lawAll({ knee: bar(k), ratio: 0 }));
    if (m > lim.m) lim = { knee: k, m };
  }
  for (const k of range(Math.max(1, lim.knee - 0.5), lim.knee + 0.5, 0.01)) {
    const m = marginWith(rules, states, lambda, lawAll({ knee: bar(k), ratio: 0 }));
    if (m > lim.m) lim = { knee: k, m };
  }

  // proportioning: the map, then a finer look around the best cell
  const knees = range(5, 120, 2.5);
  const ratios = range(0.05, 1, 0.05);
  const grid: (number | null)[][] = [];
  let prop = { knee: knees[0]!, ratio: ratios[0]!, m: -Infinity };
  let feasible = 0;
  for (const r of ratios) {
    const row: (number | null)[] = [];
    for (const k of knees) {
      const m = marginWith(rules, states, lambda, lawAll({ knee: bar(k), ratio: r }));
      row.push(finite(m));
      if (m >= 0) feasible++;
      if (m > prop.m) prop = { knee: k, ratio: r, m };
    }
    grid.push(row);
  }
  const coarse = { ...prop };
  for (const r of range(Math.max(0.01, coarse.ratio - 0.05), Math.min(1, coarse.ratio + 0.05), 0.005)) {
    for (const k of range(Math.max(1, coarse.knee - 2.5), coarse.knee + 2.5, 0.25)) {
      const m = marginWith(rules, states, lambda, lawAll({ knee: bar(k), ratio: r }));
      if (m > prop.m) prop = { knee: k, ratio: r, m };
    }
  }

  // load-sensing: one knee per distinct rear axle load, chosen per group for each ratio
  const loads = [...new Set(states.map((s) => s.rearKg))].sort((a, b) => a - b);
  const groupOf = states.map((s) => loads.indexOf(s.rearKg));
  let ls = { ratio: 0.3, knees: loads.map(() => 20), m: -Infinity };
  const lsAt = (ratio: number, kneeGrid: (g: number) => number[]) => {
    const chosen: number[] = [];
    let total = Infinity;
    loads.forEach((_, g) => {
      const members = new Set(states.flatMap((_, i) => (groupOf[i] === g ? [i] : [])));
      let best = { k: 20, m: -Infinity };
      for (const k of kneeGrid(g)) {
        const m = marginWith(rules, states, lambda, lawAll({ knee: bar(k), ratio }), members);
        if (m > best.m) best = { k, m };
      }
      chosen.push(best.k);
      total = Math.min(total, best.m);
    });
    return { ratio, knees: chosen, m: total };
  };
  for (const r of ratios) {
    const c = lsAt(r, () => range(5, 120, 1));
    if (c.m > ls.m) ls = c;
  }
  const lsCoarse = { ...ls };
  for (const r of range(Math.max(0.01, lsCoarse.ratio - 0.05), Math.min(1, lsCoarse.ratio + 0.05), 0.005)) {
    const c = lsAt(r, (g) => range(Math.max(1, lsCoarse.knees[g]! - 1), lsCoarse.knees[g]! + 1, 0.05));
    if (c.m > ls.m) ls = c;
  }

  const limiting = verify(design, rules, { type: 'limiting', knee_bar: roundTo(lim.knee, 0.01) });
  const proportioning = verify(design, rules, { type: 'proportioning', knee_bar: roundTo(prop.knee, 0.01), ratio: roundTo(prop.ratio, 0.001) });
  const table: [number, number][] = loads.map((kg, g) => [kg, roundTo(ls.knees[g]!, 0.01)]);
  // The table is searched on the static rear axle loads, so the setting is stated and verified as a valve
  // reading the static load (senses "static"); a travel-sensing valve follows the load transfer while
  // braking and needs its own check with senses "dynamic".
  const load_sensing = verify(design, rules, { type: 'load_sensing', ratio: roundTo(ls.ratio, 0.001), senses: 'static', knee_bar_at_rear_axle_kg: table });
  const all = [limiting, proportioning, load_sensing].filter((c) => c.smallest_margin !== null);
  all.sort((a, b) => Number(b.passes) - Number(a.passes) || b.smallest_margin! - a.smallest_margin!);
  return {
    recommended: all[0] ?? null,
    limiting,
    proportioning,
    load_sensing,
    map: { knee_bar: knees, ratio: ratios, smallest_margin: grid, chosen: { knee_bar: roundTo(prop.knee, 0.01), ratio: roundTo(prop.ratio, 0.001) }, feasible_cells: feasible },
    path: 'hydraulics.rear_valve',
  };
}


