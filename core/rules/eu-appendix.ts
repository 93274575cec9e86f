/**
 * Rule set `eu-appendix`: 71/320/EEC Annex II Appendix, "Distribution of braking effort among
 * vehicle axles" (the UN R13 Annex 10 family), two-axle motor vehicles, every load state.
 * Text version: legislation.gov.uk point-in-time version of 01/01/2007. Paraphrased in
 * our own notes; the status of each paragraph is listed in docs/sources.md.
 */
import { type Branch, type CurveRule, lineFromRegulationForm, parallelToIdeal, type RuleSet } from './rule-types.ts';

const DOC = '71/320/EEC Annex II Appendix';

/** 3.1.1: z ≥ 0.10 + 0.85·(k − 0.20) for 0.2 ≤ k ≤ 0.8, i.e. f ≤ 0.20 + (z − 0.10)/0.85 for z 0.10…0.61. */
export const EFFICIENCY_LINE = lineFromRegulationForm(0.1, 0.85, 0.2);
export const EFFICIENCY_Z: readonly [number, number] = [0.1, 0.61];

export const EFFICIENCY_BRANCHES: readonly Branch[] = [
  {
    id: 'efficiency-line',
    label: 'neither axle above the line z = 0.10 + 0.85 (k − 0.20)',
    status: 'partial',
    pieces: [
      {
        z: EFFICIENCY_Z,
        all_of: [[{ type: 'at_most', axle: 'front', line: EFFICIENCY_LINE }], [{ type: 'at_most', axle: 'rear', line: EFFICIENCY_LINE }]],
      },
    ],
  },
];

const FRONT_ABOVE_REAR = { type: 'front_above_rear' } as const;
const BAND = 0.08;

/** M1: front above rear for z 0.15…0.80; between 0.30 and 0.45 the rear may exceed the front while f2 ≤ z + 0.05 (diagram 1A). */
export const M1_LOCK_BRANCHES: readonly Branch[] = [
  { id: 'primary', label: 'front curve above rear curve, z 0.15–0.80', status: 'verified', pieces: [{ z: [0.15, 0.8], all_of: [[FRONT_ABOVE_REAR]] }] },
  {
    id: 'inversion-allowance',
    label: 'front above rear, except z 0.30–0.45 where the rear curve stays at or below k = z + 0.05',
    status: 'verified',
    pieces: [
      { z: [0.15, 0.3], all_of: [[FRONT_ABOVE_REAR]] },
      { z: [0.3, 0.45], all_of: [[FRONT_ABOVE_REAR, { type: 'at_most', axle: 'rear', line: parallelToIdeal(0.05) }]] },
      { z: [0.45, 0.8], all_of: [[FRONT_ABOVE_REAR]] },
    ],
  },
];

/** Both curves between k = z − 0.08 and k = z + 0.08 (the rear curve may lie below z − 0.08 when `rearMayBeLow`). */
function band(rearMayBeLow: boolean) {
  const upper = parallelToIdeal(BAND);
  const lower = parallelToIdeal(-BAND);
  const clauses = [
    [{ type: 'at_most', axle: 'front', line: upper }],
    [{ type: 'at_least', axle: 'front', line: lower }],
    [{ type: 'at_most', axle: 'rear', line: upper }],
  ] as const;
  return rearMayBeLow ? [...clauses] : [...clauses, [{ type: 'at_least', axle: 'rear', line: lower }] as const];
}

/** N1: front above rear for z 0.15…0.50, or the corridor of footnote (2) / diagram 1C. */
export const N1_LOCK_BRANCHES: readonly Branch[] = [
  { id: 'primary', label: 'front curve above rear curve, z 0.15–0.50', status: 'verified', pieces: [{ z: [0.15, 0.5], all_of: [[FRONT_ABOVE_REAR]] }] },
  {
    id: 'corridor',
    label: 'both curves within z ± 0.08 for z 0.15–0.30 (rear may be lower); rear ≤ z + 0.08 for 0.30–0.50; rear ≤ 2z − 0.42 for 0.50–0.61',
    status: 'verified',
    pieces: [
      { z: [0.15, 0.3], all_of: band(true) },
      { z: [0.3, 0.5], all_of: [[{ type: 'at_most', axle: 'rear', line: parallelToIdeal(BAND) }]] },
      // z ≥ 0.5·k + 0.21, i.e. k ≤ 2z − 0.42
      { z: [0.5, 0.61], all_of: [[{ type: 'at_most', axle: 'rear', line: lineFromRegulationForm(0.21, 0.5, 0) }]] },
    ],
  },
];

/** Other power-driven categories: front above rear for z 0.15…0.30, or the corridor of diagram 1B. */
export const OTHER_LOCK_BRANCHES: readonly Branch[] = [
  { id: 'primary', label: 'front curve above rear curve, z 0.15–0.30', status: 'verified', pieces: [{ z: [0.15, 0.3], all_of: [[FRONT_ABOVE_REAR]] }] },
  {
    id: 'corridor',
    label: 'both curves within z ± 0.08 for z 0.15–0.30; above 0.30 the rear satisfies z ≥ 0.30 + 0.74 (k − 0.38)',
    // the ±0.08 band is [V]; the 0.74/0.38 relation is from memory
    status: 'memory',
    pieces: [
      { z: [0.15, 0.3], all_of: band(false) },
      { z: [0.3, 0.61], all_of: [[{ type: 'at_most', axle: 'rear', line: lineFromRegulationForm(0.3, 0.74, 0.38) }]] },
    ],
  },
];

const LOCK_NOTE = 'margin = front minus rear adhesion utilisation (adhesion units) on the branch that decided';

export const euAppendixEfficiency: CurveRule = {
  kind: 'curve',
  id: 'eu-appendix/efficiency',
  rule_set: 'eu-appendix',
  title: 'Braking efficiency line',
  source: { document: DOC, paragraph: 'point 3.1.1 (coefficient 0.85)' },
  status: 'partial',
  categories: ['M1', 'M2', 'M3', 'N1', 'N2', 'N3'],
  load_states: 'all',
  abs_exempt: true,
  note: 'margin = limit line minus the higher adhesion utilisation (adhesion units)',
  branches: EFFICIENCY_BRANCHES,
};

function lockRule(categories: CurveRule['categories'], paragraph: string, branches: readonly Branch[], status: CurveRule['status']): CurveRule {
  return {
    kind: 'curve',
    id: 'eu-appendix/lock-order',
    rule_set: 'eu-appendix',
    title: 'Front axle locks first (front curve above rear)',
    source: { document: DOC, paragraph },
    status,
    categories,
    load_states: 'all',
    abs_exempt: true,
    note: LOCK_NOTE,
    branches,
  };
}

export const euAppendix: RuleSet = {
  id: 'eu-appendix',
  title: '71/320/EEC Annex II Appendix (UN R13 Annex 10 family): distribution of braking among the axles',
  rules: [
    euAppendixEfficiency,
    lockRule(['M1'], 'point 3.1.1, M1 requirement (diagram 1A)', M1_LOCK_BRANCHES, 'verified'),
    lockRule(['N1'], 'point 3.1.1, N1 requirement and footnote (2) (diagram 1C)', N1_LOCK_BRANCHES, 'verified'),
    lockRule(['M2', 'M3', 'N2', 'N3'], 'point 3.1.1, other categories (diagram 1B)', OTHER_LOCK_BRANCHES, 'verified'),
  ],
};
