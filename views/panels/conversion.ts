/**
 * Conversion results: the mass build-up (table with group subtotals and before/after), the margins
 * against the ratings per load state, and where each CG height comes from (axle lift, build-up, entered).
 */
import { buildUp, type BuildUpResult, type MassTotals } from '../../core/index.ts';
import { designLiftDefaults, startingLiftValues } from '../../form/axle-lift-form.ts';
import { axleLiftBlock } from '../axle-lift-view.ts';
import * as F from '../../report/format.ts';
import { DERIVED_FROM_LABELS, OCCUPANT_BASIS_LABELS } from '../../report/labels.ts';
import { warningItems } from '../../report/states.ts';
import { itemsHtml } from './document.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel, ResultContext } from './panel.ts';

const STAGE_WORDS = { conversion: 'conversion', unladen: 'unladen', laden: 'laden' } as const;
const SOURCE_WORDS: Readonly<Record<string, string>> = DERIVED_FROM_LABELS;
const sourceWords = (code: string | undefined): string => (code !== undefined && Object.hasOwn(SOURCE_WORDS, code) ? SOURCE_WORDS[code]! : 'entered');

function buildUpBlock(ctx: ResultContext, b: BuildUpResult): SafeHtml {
  const u = ctx.units;
  const m = { label: F.unitOf('mass', u) };
  const len = { label: F.unitOf('length', u) };
  const mass = (v: number) => F.format('mass', v, u, { unit: false, signed: true }).replace(/^±/, '');
  const plain = (v: number | null | undefined) => F.format('mass', v, u, { unit: false });
  const lenv = (v: number | null | undefined) => F.format('length', v, u, { unit: false });
  const states: Array<[string, MassTotals, MassTotals | null]> = [
    ['Base vehicle as weighed', b.baseline, null],
    ['After conversion (no driver)', b.converted, b.baseline],
    ['Unladen (from build-up)', b.unladen, b.baseline],
    ['Laden (from build-up)', b.laden, b.baseline],
  ];
  return html`<h3>Mass build-up</h3>
<p class="hint">Positions from the front axle centre, rearward positive (ahead of the front axle negative); heights above the ground. Removed items count negative.${b.occupant_mass_kg !== null ? html` Occupant mass ${F.mass(b.occupant_mass_kg, u)} (${b.occupant_basis !== null && Object.hasOwn(OCCUPANT_BASIS_LABELS, b.occupant_basis) ? OCCUPANT_BASIS_LABELS[b.occupant_basis as keyof typeof OCCUPANT_BASIS_LABELS] : 'own figure'}).` : ''}</p>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">Item</th><th scope="col">Group</th><th scope="col">In state</th><th scope="col">Mass<br><span class="unit">${m.label}</span></th><th scope="col">x<br><span class="unit">${len.label}</span></th><th scope="col">Height<br><span class="unit">${len.label}</span></th><th scope="col">Front axle<br><span class="unit">${m.label}</span></th><th scope="col">Rear axle<br><span class="unit">${m.label}</span></th></tr></thead>
<tbody>${b.lines.map(
    (l) => html`<tr><td>${l.name}</td><td>${l.group}</td><td>${STAGE_WORDS[l.stage]}</td><td>${mass(l.mass_kg)}</td><td>${lenv(l.x_m)}</td><td>${lenv(l.cg_height_m)}</td><td>${mass(l.front_axle_kg)}</td><td>${mass(l.rear_axle_kg)}</td></tr>`,
  )}</tbody></table></div>
<h4>Subtotals per group</h4>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">Group</th><th scope="col">Items</th><th scope="col">Mass<br><span class="unit">${m.label}</span></th><th scope="col">Front axle<br><span class="unit">${m.label}</span></th><th scope="col">Rear axle<br><span class="unit">${m.label}</span></th></tr></thead>
<tbody>${b.groups.map(
    (g) => html`<tr><td>${g.group}</td><td>${g.items}</td><td>${mass(g.mass_kg)}</td><td>${mass(g.front_axle_kg)}</td><td>${mass(g.rear_axle_kg)}</td></tr>`,
  )}</tbody></table></div>
<h4>Before and after</h4>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">State</th><th scope="col">Mass<br><span class="unit">${m.label}</span></th><th scope="col">Front axle<br><span class="unit">${m.label}</span></th><th scope="col">Rear axle<br><span class="unit">${m.label}</span></th><th scope="col">Front share<br><span class="unit">%</span></th><th scope="col">CG behind front axle<br><span class="unit">${len.label}</span></th><th scope="col">CG height<br><span class="unit">${len.label}</span></th>${b.baseline.lateral ? html`<th scope="col">Left / right<br><span class="unit">${m.label}</span></th>` : ''}</tr></thead>
<tbody>${states.map(([name, t, ref]) => {
    const d = (kind: F.Kind, v: number, r: number | undefined, from?: F.FromUnit) =>
      ref && r !== undefined
        ? html`${F.format(kind, v, u, { unit: false, ...(from ? { from } : {}) })} <span class="delta">(${F.format(kind, v - r, u, { unit: false, signed: true, ...(from ? { from } : {}) })})</span>`
        : F.format(kind, v, u, { unit: false, ...(from ? { from } : {}) });
    return html`<tr><th scope="row">${name}</th><td>${d('mass', t.mass_kg, ref?.mass_kg)}</td><td>${d('mass', t.front_axle_kg, ref?.front_axle_kg)}</td><td>${d('mass', t.rear_axle_kg, ref?.rear_axle_kg)}</td><td>${d('percent', t.front_share, ref?.front_share, 'ratio')}</td><td>${d('length', t.cg_x_m, ref?.cg_x_m)}</td><td>${d('length', t.cg_height_m, ref?.cg_height_m)}</td>${t.lateral ? html`<td>${plain(t.lateral.left_kg)} / ${plain(t.lateral.right_kg)}</td>` : ''}</tr>`;
  })}</tbody></table></div>
${b.warnings.length ? itemsHtml(warningItems(b.warnings, [], 'build-up-warnings')) : ''}`;
}

const RATING_CODES = ['WARN_AXLE_OVER_RATING', 'WARN_MASS_OVER_RATING', 'WARN_FRONT_SHARE_LOW'];

function ratingWarningList(ctx: ResultContext): SafeHtml | '' {
  const ws = ctx.result.load_states.flatMap((s) => s.warnings.filter((w) => RATING_CODES.includes(w.code)));
  return ws.length ? itemsHtml(warningItems(ws, ctx.result.load_states.map((s) => s.label), 'rating-warnings')) : '';
}

function ratingsBlock(ctx: ResultContext): SafeHtml {
  const r = ctx.design.ratings;
  if (!r) return html`<p class="hint">Enter the ratings (maximum permitted mass and axle masses, minimum front-axle share) to see the margins per load state.</p>`;
  const m = { label: F.unitOf('mass', ctx.units) };
  const cell = (margin: number | null | undefined) =>
    margin === null || margin === undefined ? html`<td>${F.DASH}</td>` : html`<td>${F.format('mass_margin', margin, ctx.units, { unit: false, signed: true })}${margin < 0 ? ' (over)' : ''}</td>`;
  return html`<h3>Margins against the ratings</h3>
<p class="hint">Rating minus the load state's figure; negative means over the rating.</p>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">Load state</th><th scope="col">Total mass<br><span class="unit">${m.label}</span></th><th scope="col">Front axle<br><span class="unit">${m.label}</span></th><th scope="col">Rear axle<br><span class="unit">${m.label}</span></th><th scope="col">Front share<br><span class="unit">%</span></th><th scope="col">Above minimum share<br><span class="unit">points</span></th></tr></thead>
<tbody>${ctx.result.load_states.map((s) => {
    const g = s.ratings;
    const share = g?.front_share_margin_pct;
    return html`<tr><th scope="row">${s.label}</th>${cell(g?.mass_margin_kg)}${cell(g?.front_axle_margin_kg)}${cell(g?.rear_axle_margin_kg)}<td>${F.format('percent', g?.front_axle_share_pct, ctx.units, { from: 'pct', unit: false })}</td>${share === null || share === undefined ? html`<td>${F.DASH}</td>` : html`<td>${F.format('percent', share, ctx.units, { from: 'pct', unit: false, signed: true })}${share < 0 ? ' (below)' : ''}</td>`}</tr>`;
  })}</tbody></table></div>
${ratingWarningList(ctx)}`;
}

function cgSourcesBlock(ctx: ResultContext): SafeHtml {
  const len = { label: F.unitOf('length', ctx.units) };
  const lenv = (v: number | null | undefined) => F.format('length', v, ctx.units, { unit: false });
  return html`<h3>Where the figures come from</h3>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">Load state</th><th scope="col">Masses from</th><th scope="col">CG height<br><span class="unit">${len.label}</span></th><th scope="col">Standard uncertainty<br><span class="unit">${len.label}</span></th><th scope="col">CG height from</th></tr></thead>
<tbody>${ctx.result.load_states.map(
    (s) => html`<tr><th scope="row">${s.label}</th><td>${sourceWords(s.derived_from)}</td><td>${lenv(s.cg_height_m)}</td><td>${lenv(s.cg_height_uncertainty_m)}</td><td>${sourceWords(s.cg_height_derived_from ?? s.derived_from)}</td></tr>`,
  )}</tbody></table></div>
<h3>Measuring the CG height by axle lift</h3>
<p class="hint">Weigh the vehicle level, then raise one axle in steps (at least about 600 mm in all, suspension locked, brakes off) and read the scales under the axle that stays down; repeat with the other axle raised. Enter the readings below: the result gives the CG height, its standard uncertainty and the budget of what limits it, and "Apply to load state" writes the CG height and its uncertainty into that load state, marked as measured. The command line makes the same computation from a file of readings (lockstep cg-lift).</p>
${liftBlock(ctx)}`;
}

/** The axle-lift tool, starting from the design's wheelbase and unladen axle loads (which it then follows). */
function liftBlock(ctx: ResultContext): SafeHtml {
  const defaults = designLiftDefaults(ctx.design.vehicle.wheelbase_m, ctx.result.load_states, ctx.units);
  return axleLiftBlock({ units: ctx.units, values: { ...startingLiftValues(ctx.units), ...defaults }, designDefaults: defaults });
}

export function conversionResults(ctx: ResultContext): SafeHtml {
  const b = ctx.design.build_up ? buildUp(ctx.design.build_up, ctx.design.vehicle.wheelbase_m) : null;
  return html`${b ? buildUpBlock(ctx, b) : html`<p class="hint">Enter a mass build-up (base vehicle as weighed, items removed and added, seats, payload, tanks) to derive the unladen and laden states from the conversion.</p>`}
${ratingsBlock(ctx)}
${cgSourcesBlock(ctx)}`;
}

export const conversionPanel: Panel = { id: 'conversion', title: 'Conversion: masses, ratings, CG height', results: conversionResults };
