/**
 * Words for people: one table of human labels for every code the core emits (rule and check ids, scenarios,
 * failure modes, warnings, pitfalls, provenance sources, hardware defaults, verdict statuses, valve and brake
 * types, shoe arrangements, load-state kinds, build-up and axle-lift words). The command line, the workbench and
 * the evidence packet name codes only through this module; test/report/labels.test.ts walks every code the core
 * can emit and fails when one has no label.
 */
import {
  BRAKE_TYPES,
  BUILD_UP_STATES,
  type CheckScenario,
  CG_HEIGHT_SOURCES,
  DERIVED_FROM,
  type FirstAxle,
  type LoadKind,
  OCCUPANT_BASES,
  OVERRIDABLE_FIGURES,
  PROVENANCE_SOURCES,
  RULE_SETS,
  type RuleStatus,
  SCENARIO_LABELS,
  type ValveFailureMode,
  VEHICLE_CATEGORIES,
  type VerdictOverall,
} from '../core/index.ts';
import { SYSTEM_STATUSES } from '../core/cases-schema.ts';
import { SHOE_ARRANGEMENTS } from '../core/drum-brake-factor.ts';

type Words<K extends string> = Readonly<Record<K, string>>;

/** Look a code up in a table without reaching the prototype (codes may come from a file). */
function lookup<K extends string>(table: Words<K>, code: string): string | undefined {
  return Object.hasOwn(table, code) ? table[code as K] : undefined;
}

/** A code no table knows, in words: underscores, hyphens and slashes become spaces, unit suffixes go. */
export function plainWords(code: string): string {
  return code
    .replace(/^(WARN|PITFALL|CORE_ERR|APP_ERR)_/, '')
    .replace(/_(kg|mm|mm3|bar|n|m|kmh|ms2|pct|nm|kw|s|c|k)$/i, '')
    .replace(/[_/]+|-(?=[a-z])/g, ' ')
    .toLowerCase()
    .trim();
}

// ---------------------------------------------------------------- rules

/** The rule sets (editions) in short words. */
export const RULE_SET_LABELS: Words<string> = {
  'eu-appendix': '71/320/EEC Appendix (distribution of braking)',
  performance: '71/320/EEC / UN R13 performance',
  'un-r13h': 'UN R13-H',
  fmvss135: 'FMVSS No. 135',
};

/** Every rule id a design or the checks can name, in the requirement's own words. */
export const RULE_LABELS: Words<string> = {
  'eu-appendix/efficiency': 'braking efficiency line (71/320/EEC Appendix)',
  'eu-appendix/lock-order': 'front axle locks first (71/320/EEC Appendix)',
  'performance/service': 'service braking (71/320/EEC / UN R13)',
  'performance/secondary': 'secondary braking, one circuit failed (71/320/EEC / UN R13)',
  'performance/booster-failure': 'booster failed, no assist (71/320/EEC / UN R13)',
  'performance/parking': 'parking brake on the gradient (71/320/EEC / UN R13)',
  'performance/residual': 'residual braking, part of the transmission failed (71/320/EEC / UN R13)',
  'performance/hot': 'hot brakes after the heating sequence (71/320/EEC / UN R13)',
  'performance/towing-service': 'service braking when towing (71/320/EEC / UN R13)',
  'performance/parking-combination': 'parking brake holds the combination (71/320/EEC / UN R13)',
  'un-r13h/efficiency': 'braking efficiency line (UN R13-H)',
  'un-r13h/lock-order': 'front axle locks first (UN R13-H)',
  'un-r13h/service': 'service braking (UN R13-H)',
  'un-r13h/secondary': 'service-transmission failure (UN R13-H)',
  'un-r13h/parking': 'parking brake on the gradient (UN R13-H)',
  'un-r13h/hot': 'hot brakes after the heating sequence (UN R13-H)',
  'un-r13h/regen-distribution': 'distribution kept with regeneration acting (UN R13-H)',
  'un-r13h/regen-failure-warning': 'regeneration failure signalled (UN R13-H)',
  'un-r13h/antilock-fitted': 'antilock fitted and working (UN R13-H)',
  'un-r13h/stability-control-fitted': 'stability control fitted and working (UN R13-H)',
  'un-r13h/parking-combination': 'parking brake holds the combination (UN R13-H)',
  'fmvss135/lock-sequence': 'front wheels lock before or with the rear (FMVSS No. 135)',
  'fmvss135/cold-effectiveness': 'cold effectiveness stop (FMVSS No. 135)',
  'fmvss135/circuit-failure': 'hydraulic circuit failure stop (FMVSS No. 135)',
  'fmvss135/booster-failure': 'power assist inoperative stop (FMVSS No. 135)',
  'fmvss135/parking': 'parking brake on the gradient (FMVSS No. 135)',
  'fmvss135/proportioning-failure': 'variable proportioning failed stop (FMVSS No. 135)',
  'fmvss135/antilock-failure': 'antilock failed stop (FMVSS No. 135)',
  // the failed distribution valve is reported like a check (core/verdict.ts)
  'valve-failure': 'failure of the distribution valve (71/320/EEC Appendix point 6)',
};

/** A rule or rule-set id in words; the core's title when no label is written (never the id itself). */
export function ruleLabel(id: string): string {
  const l = lookup(RULE_LABELS, id) ?? lookup(RULE_SET_LABELS, id);
  if (l !== undefined) return l;
  for (const s of RULE_SETS) {
    const r = s.rules.find((x) => x.id === id);
    if (r) return r.title;
  }
  return plainWords(id);
}

/** Ways a curve rule is met (core/rules branch ids). */
export const BRANCH_LABELS: Words<string> = {
  primary: 'the main requirement',
  'efficiency-line': 'the efficiency line',
  'inversion-allowance': 'the allowed inversion of the curves',
  corridor: 'the corridor of the curves',
};

export const branchLabel = (id: string): string => lookup(BRANCH_LABELS, id) ?? plainWords(id);

// ---------------------------------------------------------------- scenarios and failure modes

/** Check scenarios (core SCENARIO_LABELS; "as designed" written out). */
export const SCENARIO_WORDS: Words<CheckScenario> = { ...SCENARIO_LABELS, as_designed: 'as designed' };

export const FAILURE_MODE_LABELS: Words<ValveFailureMode> = {
  passes_full_pressure: 'valve stuck open, full pressure to the rear',
  blocks_rear: 'valve stuck shut, no rear braking',
  linkage_broken_lowest_knee: 'linkage broken, valve at its lowest knee',
  linkage_broken_highest_knee: 'linkage broken, valve at its highest knee',
};

/** Every scenario of a verdict item (core/verdict.ts CheckRef): check scenarios, valve failure modes, regeneration. */
export const ITEM_SCENARIO_LABELS: Words<string> = { ...SCENARIO_WORDS, ...FAILURE_MODE_LABELS, with_regeneration: 'with regeneration acting' };

/** A scenario of a check or verdict item in words. */
export function scenarioLabel(code: string): string {
  return lookup(ITEM_SCENARIO_LABELS, code) ?? plainWords(code);
}

/** What limited a deceleration (valve failure, roller tester, regeneration). */
export const LIMITED_BY_LABELS: Words<string> = {
  pedal_force: 'pedal-force limit',
  wheel_lock: 'wheel lock',
  rear_lift_off: 'rear-axle lift-off',
  slip: 'wheel slip',
  pedal_limit: 'pedal-force limit',
  // traction (core/traction.ts TractionLimitedBy)
  front_axle: 'front axle grip',
  rear_axle: 'rear axle grip',
  both_axles: 'grip of both axles',
  front_lift: 'front wheels lift',
  no_grip: 'no grip',
};
export const limitedByLabel = (code: string): string => lookup(LIMITED_BY_LABELS, code) ?? plainWords(code);

/** First axle to lock (core/lock-order.ts). */
export const FIRST_AXLE_LABELS: Words<FirstAxle> = { front: 'front', rear: 'rear', both: 'both together', none: 'rear lifts off' };

export const DRIVE_LABELS: Words<'front' | 'rear' | 'all'> = { front: 'front-wheel drive', rear: 'rear-wheel drive', all: 'all-wheel drive' };
export const STOPPING_MODE_LABELS: Words<'no_abs' | 'abs'> = { no_abs: 'without ABS', abs: 'with ABS' };
export const REGEN_BLENDING_LABELS: Words<'regen_first' | 'fixed_proportion'> = {
  regen_first: 'regeneration first, friction fills in',
  fixed_proportion: 'fixed proportion added to the friction force',
};
export const REGEN_FLAG_LABELS: Words<'surface_lock' | 'curve_check'> = {
  surface_lock: 'driven axle locks first',
  curve_check: 'regulation curve check fails',
};
export const REGEN_BASIS_LABELS: Words<'full_force_passes' | 'bisection' | 'no_rule_to_keep'> = {
  full_force_passes: 'the full regenerative force keeps the checks passing',
  bisection: 'largest force found by search',
  no_rule_to_keep: 'every curve check fails without regeneration already',
};

// ---------------------------------------------------------------- warnings and pitfalls

/** Every warning code of the core, as a short title (the message says the rest). */
export const WARNING_LABELS: Words<string> = {
  WARN_LIFT_ANGLE_SMALL: 'lift angle small',
  WARN_LIFT_NO_CHANGE: 'axle load did not change when lifted',
  WARN_LIFTS_DISAGREE: 'lift readings disagree',
  WARN_LIFT_ONE_END: 'lifted at one end only',
  WARN_FEW_LIFTS: 'few lift readings',
  WARN_CG_BELOW_WHEEL_CENTRE: 'CG height below the wheel centre',
  WARN_CG_UNCERTAINTY_LARGE: 'CG height uncertain',
  WARN_ANGLE_UNCERTAINTY_MISSING: 'lift-angle uncertainty not given',
  WARN_BUILD_UP_WHEELS_DIFFER: 'wheel loads differ from the build-up',
  WARN_BUILD_UP_NO_DRIVER: 'no driver in the build-up',
  WARN_BUILD_UP_IMPOSSIBLE: 'build-up gives an impossible load state',
  WARN_BUILD_UP_REPLACED: 'build-up replaced entered figures',
  WARN_CG_HIGH: 'CG high for the wheelbase',
  WARN_PAD_FRICTION_HIGH: 'pad friction high',
  WARN_BRAKE_FACTOR_HIGH: 'brake factor high',
  WARN_NO_UNLADEN: 'no unladen load state',
  WARN_NO_LADEN: 'no laden load state',
  WARN_LADEN_LIGHTER: 'laden state lighter than unladen',
  WARN_HARDWARE_KEY_UNUSED: 'hardware figure not used',
  WARN_PEDAL_TRAVEL_SHARE: 'much of the pedal travel used',
  WARN_PEDAL_TRAVEL_EXHAUSTED: 'pedal travel exhausted',
  WARN_FAILED_CIRCUIT_TARGET_UNREACHED: 'failed circuit does not reach the deceleration',
  WARN_REAR_LIFT_OFF: 'rear axle lifts off',
  WARN_AT_BEYOND_LIFT_OFF: 'braking rate beyond rear lift-off',
  WARN_LIFT_BEFORE_LOCK: 'rear lifts off before a wheel locks',
  WARN_MASS_OVER_RATING: 'mass over its rating',
  WARN_AXLE_OVER_RATING: 'axle load over its rating',
  WARN_FRONT_SHARE_LOW: 'front axle share below the minimum',
};

/** Every pitfall code of the core (core/pitfalls.ts), as a short title. */
export const PITFALL_LABELS: Words<string> = {
  PITFALL_ABS_LOST: 'antilock lost in the conversion',
  PITFALL_BIAS_ADJUSTER_REACHABLE: 'bias adjuster within the driver\'s reach',
  PITFALL_BOOSTER_NO_VACUUM: 'booster without a vacuum source',
  PITFALL_BOOSTER_REMOVED: 'booster removed',
  PITFALL_DRUM_MASTER_CYLINDER: 'master cylinder for drums on discs',
  PITFALL_LOAD_SENSING_SUSPENSION: 'load-sensing valve and changed suspension',
  PITFALL_SPLIT_CHANGED: 'circuit split changed',
  PITFALL_STABILITY_CONTROL_LOST: 'stability control lost in the conversion',
  PITFALL_SYSTEM_NOT_WORKING: 'braking aid not working',
  PITFALL_SYSTEM_REMOVED: 'braking aid removed',
  PITFALL_SYSTEM_RETAINED_CHANGED: 'braking aid kept with changed brakes',
  PITFALL_TYRE_RADIUS_CHANGED: 'tyre size changed',
};

export const warningLabel = (code: string): string => lookup(WARNING_LABELS, code) ?? plainWords(code);
export const pitfallLabel = (code: string): string => lookup(PITFALL_LABELS, code) ?? plainWords(code);

// ---------------------------------------------------------------- design words

type ProvenanceSource = (typeof PROVENANCE_SOURCES)[number];
export const PROVENANCE_LABELS: Words<ProvenanceSource> = {
  measured: 'measured',
  maker: "maker's figure",
  donor: 'from the donor vehicle',
  calculated: 'calculated',
  assumed: 'assumed',
};

export const VERDICT_LABELS: Words<VerdictOverall> = { pass: 'pass', fail: 'fail', incomplete: 'incomplete' };

/** How sure the rule's text is (verified / partly verified / from memory). */
export const RULE_STATUS_LABELS: Words<RuleStatus> = {
  verified: 'verified',
  partial: 'partly verified',
  memory: 'from memory',
};

/** A check's verdict word by state. */
export const CHECK_STATUS_LABELS: Words<'pass' | 'fail' | 'not_checked' | 'not_applicable' | 'advisory_fail'> = {
  pass: 'pass',
  fail: 'FAIL',
  not_checked: 'NOT CHECKED',
  not_applicable: 'not applicable',
  advisory_fail: 'fails (for information)',
};

export const VALVE_TYPE_LABELS: Words<string> = {
  none: 'no rear valve',
  limiting: 'pressure-limiting valve',
  proportioning: 'proportioning valve',
  load_sensing: 'load-sensing valve',
};
/** A valve type in words; a type the table does not know is written plainly, never as "no valve". */
export const valveTypeLabel = (code: string): string => lookup(VALVE_TYPE_LABELS, code) ?? `${plainWords(code)} valve`;

export const BRAKE_TYPE_LABELS: Words<(typeof BRAKE_TYPES)[number]> = { disc: 'disc brake', drum: 'drum brake' };
export const CALIPER_LABELS: Words<'sliding' | 'fixed'> = { sliding: 'sliding caliper', fixed: 'fixed caliper' };
export const SHOE_ARRANGEMENT_LABELS: Words<(typeof SHOE_ARRANGEMENTS)[number]> = {
  leading_trailing: 'leading–trailing shoes',
  two_leading: 'two leading shoes',
  duo_servo: 'duo-servo shoes',
};
export const CIRCUIT_SPLIT_LABELS: Words<'front_rear' | 'diagonal'> = { front_rear: 'front / rear split', diagonal: 'diagonal split' };
export const LOAD_KIND_LABELS: Words<LoadKind> = { unladen: 'unladen', laden: 'laden', other: 'other load' };
export const CATEGORY_LABELS: Words<(typeof VEHICLE_CATEGORIES)[number]> = {
  M1: 'M1 (passenger car)',
  M2: 'M2 (bus up to 5 t)',
  M3: 'M3 (bus over 5 t)',
  N1: 'N1 (goods vehicle up to 3.5 t)',
  N2: 'N2 (goods vehicle up to 12 t)',
  N3: 'N3 (goods vehicle over 12 t)',
};
export const SYSTEM_STATUS_LABELS: Words<(typeof SYSTEM_STATUSES)[number]> = {
  not_fitted: 'not fitted',
  fitted: 'fitted',
  retained: 'retained',
  not_working: 'fitted, not working',
  removed: 'removed',
};
export const BIAS_ADJUSTER_LABELS: Words<'none' | 'locked' | 'driver_adjustable'> = {
  none: 'none',
  locked: 'locked',
  driver_adjustable: 'adjustable by the driver',
};
export const BOOSTER_SOURCE_LABELS: Words<'engine_vacuum' | 'electric_vacuum_pump' | 'hydraulic_pump' | 'electric_booster' | 'none'> = {
  engine_vacuum: 'engine vacuum',
  electric_vacuum_pump: 'electric vacuum pump',
  hydraulic_pump: 'hydraulic pump',
  electric_booster: 'electric booster',
  none: 'no booster',
};
export const VALVE_SENSES_LABELS: Words<'static' | 'dynamic'> = { static: 'static load', dynamic: 'load while braking' };
export const PARKING_CONTROL_LABELS: Words<'hand' | 'foot'> = { hand: 'hand control', foot: 'foot control' };

// ---------------------------------------------------------------- build-up and axle-lift words

export const DERIVED_FROM_LABELS: Words<(typeof DERIVED_FROM)[number]> = {
  build_up: 'mass build-up',
  measured: 'measured',
  entered: 'entered by hand',
};
export const BUILD_UP_STATE_LABELS: Words<(typeof BUILD_UP_STATES)[number]> = { unladen: 'unladen', laden: 'laden' };
export const CG_HEIGHT_SOURCE_LABELS: Words<(typeof CG_HEIGHT_SOURCES)[number]> = {
  measured: 'measured',
  maker: "maker's figure",
  estimated: 'estimated',
  assumed: 'assumed',
};
export const OCCUPANT_BASIS_LABELS: Words<(typeof OCCUPANT_BASES)[number]> = {
  'eu-75': '75 kg per occupant (EU)',
  'au-nsw-68': '68 kg per occupant (NSW)',
  'uk-mot-63.5': '63.5 kg per occupant (UK)',
  'us-154-lb': '154 lb per occupant (US)',
  custom: 'own figure',
};
export const OVERRIDDEN_FIGURE_LABELS: Words<(typeof OVERRIDABLE_FIGURES)[number]> = {
  mass_kg: 'mass',
  front_axle_kg: 'front axle load',
  cg_height_m: 'CG height',
};
export const RAISED_AXLE_LABELS: Words<'front' | 'rear'> = { front: 'front axle raised', rear: 'rear axle raised' };
export const AXLE_LABELS: Words<'front' | 'rear'> = { front: 'front', rear: 'rear' };

// ---------------------------------------------------------------- hardware defaults and design paths

/** The words of design-file keys (the last part of a path), unit suffix dropped. */
export const FIELD_LABELS: Words<string> = {
  fluid_bulk_modulus_bar: 'fluid bulk modulus',
  running_clearance_mm: 'pad running clearance',
  knock_back_mm: 'pad knock-back',
  shoe_travel_mm: 'shoe travel',
  expansion_per_bar_mm3: 'hose and caliper expansion',
  fluid_volume_mm3: 'fluid volume',
  primary_stroke_mm: 'primary piston stroke',
  secondary_stroke_mm: 'secondary piston stroke',
  dead_travel_mm: 'dead travel',
  primary_feeds: 'axle the primary circuit feeds',
  pedal_travel_available_mm: 'pedal travel available',
  pedal_travel_warn_pct: 'pedal travel warning share',
  pad_friction: 'pad friction',
  pad_friction_front: 'front pad friction',
  pad_friction_rear: 'rear pad friction',
  tyre_radius: 'tyre radius',
  tyre_radius_m: 'tyre radius',
  cg_height: 'CG height',
  cg_height_m: 'CG height',
  front_axle_load: 'front axle load',
  front_axle_kg: 'front axle load',
  mass_kg: 'mass',
  valve_knee: 'rear valve knee pressure',
  valve_ratio: 'rear valve ratio',
  threshold_front: 'front threshold pressure',
  threshold_rear: 'rear threshold pressure',
  wheelbase_m: 'wheelbase',
  knee_bar: 'knee pressure',
  knee_bar_at_rear_axle_kg: 'knee pressure per rear axle load (kg, bar)',
  ratio: 'ratio above the knee',
  load_states: 'load states',
  load_state: 'load state',
  hardware: 'hardware',
  master_cylinder: 'master cylinder',
  hydraulics: 'hydraulics',
  axles: 'axles',
  brake: 'brake',
  rear_valve: 'rear valve',
  vehicle: 'vehicle',
  front: 'front',
  rear: 'rear',
};

/** A hardware default key (core/fluid-volume.ts defaults_used, a design path) in words: "rear pad running clearance". */
export function defaultLabel(path: string): string {
  const parts = path.split('.').filter((p) => p !== 'hardware');
  const last = parts.pop() ?? '';
  const axle = parts.find((p) => p === 'front' || p === 'rear');
  const base = lookup(FIELD_LABELS, last) ?? plainWords(last);
  return axle ? `${axle} ${base}` : base;
}

/**
 * A design-file path in words: `load_states[1].cg_height_m` → "load state 2: CG height" (with the load state's
 * label when given). Never returns the path itself.
 */
export function pathLabel(path: string, stateLabels: readonly string[] = []): string {
  if (path === '') return 'the design';
  const out: string[] = [];
  const segs = path.split('.');
  if (segs.length > 1 && segs[0] === 'hardware') segs.shift();
  for (const seg of segs) {
    const m = /^([A-Za-z_]+)\[(\d+)\]$/.exec(seg);
    if (m) {
      const i = Number(m[2]);
      if (m[1] === 'load_states') out.push(stateLabels[i] !== undefined ? `load state "${stateLabels[i]}"` : `load state ${i + 1}`);
      else out.push(`${lookup(FIELD_LABELS, m[1]!) ?? plainWords(m[1]!)} ${i + 1}`);
    } else {
      out.push(lookup(FIELD_LABELS, seg) ?? plainWords(seg));
    }
  }
  return out.join(', ');
}

/** Load states the checks derive themselves (core/checks lightly-loaded.ts, towing.ts). */
export const DERIVED_STATE_LABELS: Words<string> = {
  'lightly-loaded': 'lightly loaded vehicle',
  'lightly-loaded-derived': 'lightly loaded vehicle',
  towing: 'towing the trailer',
};
export const derivedStateLabel = (id: string): string => lookup(DERIVED_STATE_LABELS, id) ?? plainWords(id);

/** Pedal-travel cases (core/fluid-volume.ts): the service brake, or one circuit failed. */
export function travelCaseLabel(code: string): string {
  if (code === 'service') return 'service brake';
  const m = /^(.+)_circuit_failed$/.exec(code);
  if (m) return `${circuitLabel(m[1]!)} failed`;
  return plainWords(code);
}

/** Heat-stop cases (core/brake-heat.ts). */
export const HEAT_CASE_LABELS: Words<string> = { vehicle: 'this vehicle', base_vehicle: 'base vehicle', laden: 'laden', unladen: 'unladen' };
export const heatCaseLabel = (code: string): string => lookup(HEAT_CASE_LABELS, code) ?? plainWords(code);

/** A hydraulic circuit (core/fluid-volume.ts circuitsOf): "front circuit", "diagonal circuit 1". */
export function circuitLabel(id: string): string {
  const m = /^diagonal_(\d)$/.exec(id);
  return m ? `diagonal circuit ${m[1]}` : `${plainWords(id)} circuit`;
}
