/**
 * The shape of a rule set. Rules are data: ranges, limit lines, corridors, figures, which categories
 * and load states they cover, and where they come from (document, paragraph, how sure we are of the
 * text). The generic checkers in core/checks read these records; a new edition or a corrected
 * coefficient is a change here, not in the checkers.
 */
/** Vehicle categories of the regulations (M passenger, N goods; 1 to 3 by mass), the design file's `vehicle.category`. */
export const VEHICLE_CATEGORIES = ['M1', 'M2', 'M3', 'N1', 'N2', 'N3'] as const;
export type Category = (typeof VEHICLE_CATEGORIES)[number];

/** How sure we are of the requirement's text (verified / partly verified / from memory). */
export type RuleStatus = 'verified' | 'partial' | 'memory';

export type LoadKind = 'unladen' | 'laden' | 'other';

export interface RuleSource {
  /** Regulation or directive, edition included where known. */
  document: string;
  /** Paragraph / point / annex reference as printed in the regulation. */
  paragraph: string;
}

/** A straight line in the adhesion-utilisation diagram: k = intercept + slope · z. */
export interface Line {
  intercept: number;
  slope: number;
}

/**
 * The regulations write the limit lines as "z ≥ a + b·(k − c)"; solved for k this is
 * k ≤ c + (z − a)/b (71/320/EEC Annex II Appendix points 2 and 3.1.1).
 */
export function lineFromRegulationForm(a: number, b: number, c: number): Line {
  return { intercept: c - a / b, slope: 1 / b };
}

/** k = z + offset (a parallel to the line of ideal adhesion utilisation k = z). */
export function parallelToIdeal(offset: number): Line {
  return { intercept: offset, slope: 1 };
}

export type RuleAxle = 'front' | 'rear';

/**
 * One condition on the adhesion-utilisation curves at every z of a piece. Each one is a "margin form"
 * that must be ≥ 0: front_above_rear f1 − f2; at_most line − f; at_least f − line.
 */
export type Constraint =
  | { type: 'front_above_rear' }
  | { type: 'at_most'; axle: RuleAxle; line: Line }
  | { type: 'at_least'; axle: RuleAxle; line: Line };

/** A z range on which every clause must hold; a clause holds where any one of its constraints holds. */
export interface Piece {
  z: readonly [number, number];
  all_of: readonly (readonly Constraint[])[];
}

/** One way of meeting a curve rule (the main requirement, or an alternative the text accepts instead). */
export interface Branch {
  id: string;
  label: string;
  status: RuleStatus;
  pieces: readonly Piece[];
}

export interface RuleBase {
  id: string;
  /** The rule set this record belongs to (an edition). */
  rule_set: string;
  title: string;
  source: RuleSource;
  status: RuleStatus;
  /** Vehicle categories the record covers; the first record matching the design's category is used. */
  categories: readonly Category[];
  /** Load-state kinds checked; "all" = every load state of the design. */
  load_states: 'all' | readonly LoadKind[];
  /** Highest laden mass (kg) the rule covers, where the document limits it by mass. */
  max_mass_kg?: number;
  /** Shown with the verdict: what the rule is for and how the margin reads. */
  note?: string;
}

/** A rule on the adhesion-utilisation curves f1(z), f2(z). Passes when any branch passes. */
export interface CurveRule extends RuleBase {
  kind: 'curve';
  /** Lock-order rules do not apply when ABS directly controls the wheels of every axle. */
  abs_exempt: boolean;
  branches: readonly Branch[];
  /** Set when this record stands in for another one (the M1 requirement on a light N1 vehicle): the record replaced, shown for information. */
  replaces?: CurveRule;
  /** Which requirement applies and why, where the design decides it (light N1 vehicles). */
  requirement_words?: string;
}

/** Stopping distance limit s ≤ a·v + b·v² (v in km/h, s in m). */
export interface DistanceFormula {
  v_coeff: number;
  v2_coeff: number;
}

export interface DecelerationFigures {
  /** Prescribed test speed, km/h. */
  speed_kmh: number;
  /** Minimum mean fully developed deceleration, m/s². */
  min_deceleration_ms2?: number;
  /** Highest control (pedal) force allowed, N. */
  max_pedal_force_n: number;
  /** Lowest pedal force of the test range, N, where the text gives one. */
  min_pedal_force_n?: number;
  /** Stopping-distance limit; absent where the document gives only a fixed distance. */
  distance?: DistanceFormula;
  /** A fixed stopping-distance limit, m (e.g. "within 70 m"). */
  max_distance_m?: number;
}

/**
 * A braking-performance rule computed from the hardware model.
 * service: intact system; secondary: one hydraulic circuit failed; booster_failure: no assist.
 */
export interface DecelerationRule extends RuleBase {
  kind: 'service' | 'secondary' | 'booster_failure';
  figures: DecelerationFigures;
  /** The test surface the text names; absent: the dry-road default of the performance checks. */
  test_surface?: TestSurface;
}

export interface ParkingRule extends RuleBase {
  kind: 'parking';
  /** Gradient held facing up and down, per cent (rise per 100 m run). */
  gradient_pct: number;
  /** Control-force limits, N. */
  max_hand_force_n: number;
  max_foot_force_n: number;
  test_surface?: TestSurface;
}

/**
 * The surface a performance rule is judged on. `adhesion` is the tyre–road adhesion coefficient the
 * checks use (the design's `test_adhesion` overrides it); `words` say where the figure comes from.
 */
export interface TestSurface {
  adhesion: number;
  words: string;
}

export type Rule = CurveRule | DecelerationRule | ParkingRule | CaseRule;

export interface RuleSet {
  id: string;
  title: string;
  /** Every record of the set; several records may share an id, one per category group. */
  rules: readonly Rule[];
}

// ---- rule records for the inspection cases of issue 18 (residual braking, hot performance, the FMVSS 135
// failure stops, R13-H regeneration categories, towing, ABS/ESC presence); the checkers are in core/checks/cases.ts


/** Residual braking after failure of part of the transmission: laden and unladen figures differ. */
export interface ResidualRule extends RuleBase {
  kind: 'residual';
  laden: DecelerationFigures;
  unladen: DecelerationFigures;
  /** How sure we are of the unladen figures (the rule's status covers the laden ones). */
  unladen_status: RuleStatus;
}

/** A stop with the variable-proportioning system (valve or EBD) failed, or with the antilock failed. */
export interface FailureStopRule extends RuleBase {
  kind: 'valve_failure_stop' | 'abs_failure_stop';
  figures: DecelerationFigures;
}

/**
 * Hot performance after the Type-I heating sequence: the hot stop must reach `prescribed_share` of the
 * prescribed (cold) deceleration of `figures` and `cold_share` of the cold result.
 */
export interface HotRule extends RuleBase {
  kind: 'hot';
  figures: DecelerationFigures;
  prescribed_share: number;
  cold_share: number;
}

/** R13-H regeneration category: distribution with regeneration on (B), failure signalled. */
export interface RegenCategoryRule extends RuleBase {
  kind: 'regen_distribution' | 'regen_failure_warning';
}

/** A braking aid the document requires to be fitted and working. */
export interface SystemFittedRule extends RuleBase {
  kind: 'system_fitted';
  system: 'abs' | 'esc';
}

/** Service braking of the towing vehicle with its trailer: nose load on the hitch, unbraked trailer mass to stop. */
export interface TowingServiceRule extends RuleBase {
  kind: 'towing_service';
  figures: DecelerationFigures;
}

/** The towing vehicle's parking brake holds the whole combination on a gradient. */
export interface CombinationParkingRule extends RuleBase {
  kind: 'combination_parking';
  gradient_pct: number;
  max_hand_force_n: number;
  max_foot_force_n: number;
}

export type CaseRule = ResidualRule | FailureStopRule | HotRule | RegenCategoryRule | SystemFittedRule | TowingServiceRule | CombinationParkingRule;

export const CASE_RULE_KINDS: readonly CaseRule['kind'][] = [
  'residual',
  'valve_failure_stop',
  'abs_failure_stop',
  'hot',
  'regen_distribution',
  'regen_failure_warning',
  'system_fitted',
  'towing_service',
  'combination_parking',
];
