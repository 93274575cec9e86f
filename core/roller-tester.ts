/**
 * What a roller brake tester will read, per axle and load state (design-file block `tester`).
 * Estimates only.
 *
 * On the rollers the vehicle stands still, one axle at a time; the axle carries its static load P_i
 * (no load transfer). The wheels slip on the rollers once the axle's brake force reaches μ_roller · P_i,
 * so that is the largest force the tester can record (roller adhesion about 0.85: practitioner reports,
 * no published source). The brake force at line pressure follows the installed brakes:
 * front T1 = G1 (p − threshold1), rear T2 = G2 (valve(p) − threshold2).
 * The tester records, per axle, the smaller of the slip force and the force at the pedal-force limit
 * (default: the category's service-brake pedal limit, 500 N M1 / 700 N others, 71/320/EEC Annex II
 * 2.1.1, partly verified; verify against the current official text). Service-brake percentage =
 * (recorded front + rear) / (test mass · g) · 100, the roller tester's efficiency (UK MOT practice:
 * total roller brake effort ÷ test weight); required 50 % by default (the UK MOT service-brake
 * figure: practitioner reports, no published source).
 */
import { G_N, PA_PER_BAR } from './constants.ts';
import type { DesignFile } from './design.ts';
import { pedalForce, pressureForPedalForce } from './pedal-force.ts';
import { forcesAtPressure } from './brake-force.ts';
import { masterPressureForRear } from './valves/index.ts';
import type { StateModel } from './state-model.ts';

export const TESTER_DEFAULTS = {
  /** Practitioner reports, no published source. */
  roller_adhesion: 0.85,
  /** UK MOT service brake ≥ 50 %: practitioner reports, no published source. */
  required_pct: 50,
} as const;

export interface TesterAxle {
  axle: 'front' | 'rear';
  static_load_n: number;
  /** μ_roller · static load: the most the tester can record before the wheels slip, N. */
  slip_force_n: number;
  /** Master-cylinder pressure and pedal force at which the wheels slip (null if the brakes never get there). */
  slip_pressure_bar: number | null;
  slip_pedal_force_n: number | null;
  /** Force the tester records: the slip force, or the force at the pedal limit if that comes first, N. */
  recorded_force_n: number;
  limited_by: 'slip' | 'pedal_limit';
}

export interface TesterResult {
  estimate: true;
  roller_adhesion: number;
  test_mass_kg: number;
  required_pct: number;
  pedal_force_limit_n: number;
  axles: TesterAxle[];
  /** Service-brake percentage the tester would compute against the test mass. */
  predicted_pct: number;
  /** Pedal force at which the installed brakes would reach the required percentage with no slip (null: beyond reach). */
  pedal_force_for_required_n: number | null;
  /** Percentage shown at the moment the rear wheels start to slip (front and rear brake forces at that pressure). */
  pct_when_rear_slips: number | null;
  /** The rear wheels slip before the installed brakes reach the required percentage. */
  rear_slips_before_required: boolean;
  flag: string | null;
}

/** Installed axle brake forces at master pressure p (Pa), N. */
function axleForces(s: StateModel, p: number): { front: number; rear: number } {
  return forcesAtPressure(s, s.valve, p);
}

/** Master pressure at which the two axles' brake forces together reach F (N), Pa; Infinity when never. */
function pressureForTotal(s: StateModel, F: number): number {
  let lo = 0;
  let hi = 1e5;
  const tot = (p: number) => {
    const f = axleForces(s, p);
    return f.front + f.rear;
  };
  while (tot(hi) < F) {
    hi *= 2;
    if (hi > 1e10) return Infinity;
  }
  for (let i = 0; i < 100 && hi - lo > 1e-6; i++) {
    const mid = (lo + hi) / 2;
    if (tot(mid) >= F) hi = mid;
    else lo = mid;
  }
  return hi;
}

export function pedalLimitFor(category: DesignFile['vehicle']['category']): number {
  return category === 'M1' ? 500 : 700;
}

export function testerPrediction(
  s: StateModel,
  opts: { rollerAdhesion: number; testMassKg: number; requiredPct: number; pedalLimitN: number; stateKind: string },
): TesterResult {
  const mu = opts.rollerAdhesion;
  const pLimit = pressureForPedalForce(s.pedal, opts.pedalLimitN);
  const atLimit = axleForces(s, pLimit);
  // Front: G1 (p − threshold1) = μ P1.
  const frontSlipP = s.threshold1 + (mu * s.loads.P1) / s.G1;
  // Rear: G2 (p2 − threshold2) = μ P2, p2 = valve(p).
  const rearSlipP = masterPressureForRear(s.valve, s.threshold2 + (mu * s.loads.P2) / s.G2);
  const axle = (which: 'front' | 'rear', load: number, slipP: number, forceAtLimit: number): TesterAxle => {
    const slip = mu * load;
    const reaches = Number.isFinite(slipP) && slipP <= pLimit;
    return {
      axle: which,
      static_load_n: load,
      slip_force_n: slip,
      slip_pressure_bar: Number.isFinite(slipP) ? slipP / PA_PER_BAR : null,
      slip_pedal_force_n: Number.isFinite(slipP) ? pedalForce(s.pedal, slipP) : null,
      recorded_force_n: reaches ? slip : Math.min(slip, forceAtLimit),
      limited_by: reaches ? 'slip' : 'pedal_limit',
    };
  };
  const axles = [axle('front', s.loads.P1, frontSlipP, atLimit.front), axle('rear', s.loads.P2, rearSlipP, atLimit.rear)];
  const W = opts.testMassKg * G_N;
  const predicted = ((axles[0]!.recorded_force_n + axles[1]!.recorded_force_n) / W) * 100;
  const pReq = pressureForTotal(s, (opts.requiredPct / 100) * W);
  const pedalReq = Number.isFinite(pReq) ? pedalForce(s.pedal, pReq) : null;
  let pctRear: number | null = null;
  if (Number.isFinite(rearSlipP)) {
    const f = axleForces(s, rearSlipP);
    pctRear = ((f.front + f.rear) / W) * 100;
  }
  const rearEarly = Number.isFinite(rearSlipP) && rearSlipP < pReq;
  let flag: string | null = null;
  if (rearEarly && predicted < opts.requiredPct) {
    flag =
      `the rear wheels will slip on the rollers at about ${axles[1]!.slip_pedal_force_n!.toFixed(0)} N pedal force, when the brakes give ` +
      `${pctRear!.toFixed(1)} % of the test mass; the tester would show ${predicted.toFixed(1)} % against ${opts.requiredPct} % required` +
      (opts.stateKind === 'unladen' ? ': plan a laden or load-simulated roller test, or a road test with a decelerometer' : '');
  } else if (predicted < opts.requiredPct) {
    flag = `the tester would show ${predicted.toFixed(1)} % against ${opts.requiredPct} % required`;
  }
  return {
    estimate: true,
    roller_adhesion: mu,
    test_mass_kg: opts.testMassKg,
    required_pct: opts.requiredPct,
    pedal_force_limit_n: opts.pedalLimitN,
    axles,
    predicted_pct: predicted,
    pedal_force_for_required_n: pedalReq,
    pct_when_rear_slips: pctRear,
    rear_slips_before_required: rearEarly,
    flag,
  };
}

/** Test mass: the user's, else the heaviest load state (the maximum mass the vehicle is rated for). */
export function testerMass(design: DesignFile): number {
  return design.tester?.test_mass_kg ?? Math.max(...design.load_states.map((s) => s.mass_kg));
}

export function testerFor(design: DesignFile, s: StateModel): TesterResult {
  const t = design.tester ?? {};
  return testerPrediction(s, {
    rollerAdhesion: t.roller_adhesion ?? TESTER_DEFAULTS.roller_adhesion,
    testMassKg: testerMass(design),
    requiredPct: t.required_pct ?? TESTER_DEFAULTS.required_pct,
    pedalLimitN: t.pedal_force_limit_n ?? pedalLimitFor(design.vehicle.category),
    stateKind: s.state.kind,
  });
}
