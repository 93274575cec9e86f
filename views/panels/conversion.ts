/**
 * Conversion results: the mass build-up (table with group subtotals and before/after), the margins
 * against the ratings per load state, and where each CG height comes from (axle lift, build-up, entered).
 */
import { buildUp, type BuildUpResult, type MassTotals } from '../../core/index.ts';
import { designLiftDefaults, startingLiftValues } from '../../form/axle-lift-form.ts';
import { axleLiftBlock } from '../axle-lift-view.ts';
import { fixed, shownUnit } from '../format.ts';
import { html, type SafeHtml } from '../html.ts';
import type { Panel, ResultContext } from './panel.ts';

const STAGE_WORDS = { conversion: 'conversion', unladen: 'unladen', laden: 'laden' } as const;
const SOURCE_WORDS: Record<string, string> = { build_up: 'mass build-up', measured: 'measured', entered: 'entered by hand' };

function signed(v: number, digits: number): string {
  const s = fixed(v, digits);
  return v > 0 && s !== '–' ? `+${s}` : s;
}

function buildUpBlock(ctx: ResultContext, b: BuildUpResult): SafeHtml {
  const m = shownUnit('mass', ctx.units);
  const len = shownUnit('length', ctx.units);
  const md = ctx.units === 'us' ? 0 : 1;
  const ld = ctx.units === 'us' ? 1 : 3;
  const states: Array<[string, MassTotals, MassTotals | null]> = [
    ['Base vehicle as weighed', b.baseline, null],
    ['After conversion (no driver)', b.converted, b.baseline],
    ['Unladen (from build-up)', b.unladen, b.baseline],
    ['Laden (from build-up)', b.laden, b.baseline],
  ];
  return html`<h3>Mass build-up</h3>
<p class="hint">Positions from the front axle centre, rearward positive (ahead of the front axle negative); heights above the ground. Removed items count negative.${b.occupant_mass_kg !== null ? html` Occupant mass ${fixed(m.from(b.occupant_mass_kg), md)} ${m.label} (basis ${b.occupant_basis}).` : ''}</p>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">Item</th><th scope="col">Group</th><th scope="col">In state</th><th scope="col">Mass<br><span class="unit">${m.label}</span></th><th scope="col">x<br><span class="unit">${len.label}</span></th><th scope="col">Height<br><span class="unit">${len.label}</span></th><th scope="col">Front axle<br><span class="unit">${m.label}</span></th><th scope="col">Rear axle<br><span class="unit">${m.label}</span></th></tr></thead>
<tbody>${b.lines.map(
    (l) => html`<tr><td>${l.name}</td><td>${l.group}</td><td>${STAGE_WORDS[l.stage]}</td><td>${signed(m.from(l.mass_kg), md)}</td><td>${fixed(len.from(l.x_m), ld)}</td><td>${fixed(len.from(l.cg_height_m), ld)}</td><td>${signed(m.from(l.front_axle_kg), md)}</td><td>${signed(m.from(l.rear_axle_kg), md)}</td></tr>`,
  )}</tbody></table></div>
<h4>Subtotals per group</h4>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">Group</th><th scope="col">Items</th><th scope="col">Mass<br><span class="unit">${m.label}</span></th><th scope="col">Front axle<br><span class="unit">${m.label}</span></th><th scope="col">Rear axle<br><span class="unit">${m.label}</span></th></tr></thead>
<tbody>${b.groups.map(
    (g) => html`<tr><td>${g.group}</td><td>${g.items}</td><td>${signed(m.from(g.mass_kg), md)}</td><td>${signed(m.from(g.front_axle_kg), md)}</td><td>${signed(m.from(g.rear_axle_kg), md)}</td></tr>`,
  )}</tbody></table></div>
<h4>Before and after</h4>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">State</th><th scope="col">Mass<br><span class="unit">${m.label}</span></th><th scope="col">Front axle<br><span class="unit">${m.label}</span></th><th scope="col">Rear axle<br><span class="unit">${m.label}</span></th><th scope="col">Front share<br><span class="unit">%</span></th><th scope="col">CG behind front axle<br><span class="unit">${len.label}</span></th><th scope="col">CG height<br><span class="unit">${len.label}</span></th>${b.baseline.lateral ? html`<th scope="col">Left / right<br><span class="unit">${m.label}</span></th>` : ''}</tr></thead>
<tbody>${states.map(([name, t, ref]) => {
    const d = (v: number, r: number | undefined, conv: (x: number) => number, digits: number) =>
      ref && r !== undefined ? html`${fixed(conv(v), digits)} <span class="delta">(${signed(conv(v) - conv(r), digits)})</span>` : fixed(conv(v), digits);
    return html`<tr><th scope="row">${name}</th><td>${d(t.mass_kg, ref?.mass_kg, m.from, md)}</td><td>${d(t.front_axle_kg, ref?.front_axle_kg, m.from, md)}</td><td>${d(t.rear_axle_kg, ref?.rear_axle_kg, m.from, md)}</td><td>${d(t.front_share, ref?.front_share, (x) => 100 * x, 1)}</td><td>${d(t.cg_x_m, ref?.cg_x_m, len.from, ld)}</td><td>${d(t.cg_height_m, ref?.cg_height_m, len.from, ld)}</td>${t.lateral ? html`<td>${fixed(m.from(t.lateral.left_kg), md)} / ${fixed(m.from(t.lateral.right_kg), md)}</td>` : ''}</tr>`;
  })}</tbody></table></div>
${b.warnings.length ? html`<ul class="warnings">${b.warnings.map((w) => html`<li><code>${w.code}</code> ${w.message}</li>`)}</ul>` : ''}`;
}

const RATING_CODES = ['WARN_AXLE_OVER_RATING', 'WARN_MASS_OVER_RATING', 'WARN_FRONT_SHARE_LOW'];

function ratingWarningList(ctx: ResultContext): SafeHtml | '' {
  const ws = ctx.result.load_states.flatMap((s) => s.warnings.filter((w) => RATING_CODES.includes(w.code)));
  return ws.length ? html`<ul class="warnings">${ws.map((w) => html`<li><code>${w.code}</code> ${w.message}</li>`)}</ul>` : '';
}

function ratingsBlock(ctx: ResultContext): SafeHtml {
  const r = ctx.design.ratings;
  if (!r) return html`<p class="hint">Add a <code>ratings</code> block (maximum permitted mass and axle masses, minimum front-axle share) to see the margins per load state.</p>`;
  const m = shownUnit('mass', ctx.units);
  const md = ctx.units === 'us' ? 0 : 1;
  const cell = (margin: number | null | undefined) =>
    margin === null || margin === undefined ? html`<td>–</td>` : html`<td>${signed(m.from(margin), md)}${margin < 0 ? ' (over)' : ''}</td>`;
  return html`<h3>Margins against the ratings</h3>
<p class="hint">Rating minus the load state's figure; negative means over the rating.</p>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">Load state</th><th scope="col">Total mass<br><span class="unit">${m.label}</span></th><th scope="col">Front axle<br><span class="unit">${m.label}</span></th><th scope="col">Rear axle<br><span class="unit">${m.label}</span></th><th scope="col">Front share<br><span class="unit">%</span></th><th scope="col">Above minimum share<br><span class="unit">points</span></th></tr></thead>
<tbody>${ctx.result.load_states.map((s) => {
    const g = s.ratings;
    const share = g?.front_share_margin_pct;
    return html`<tr><th scope="row">${s.label}</th>${cell(g?.mass_margin_kg)}${cell(g?.front_axle_margin_kg)}${cell(g?.rear_axle_margin_kg)}<td>${fixed(g?.front_axle_share_pct, 1)}</td>${share === null || share === undefined ? html`<td>–</td>` : html`<td>${signed(share, 1)}${share < 0 ? ' (below)' : ''}</td>`}</tr>`;
  })}</tbody></table></div>
${ratingWarningList(ctx)}`;
}

function cgSourcesBlock(ctx: ResultContext): SafeHtml {
  const len = shownUnit('length', ctx.units);
  const ld = ctx.units === 'us' ? 1 : 3;
  return html`<h3>Where the figures come from</h3>
<div class="scroll"><table class="numbers data"><thead><tr><th scope="col">Load state</th><th scope="col">Masses from</th><th scope="col">CG height<br><span class="unit">${len.label}</span></th><th scope="col">Standard uncertainty<br><span class="unit">${len.label}</span></th><th scope="col">CG height from</th></tr></thead>
<tbody>${ctx.result.load_states.map(
    (s) => html`<tr><th scope="row">${s.label}</th><td>${SOURCE_WORDS[s.derived_from ?? 'entered'] ?? s.derived_from}</td><td>${fixed(len.from(s.cg_height_m), ld)}</td><td>${s.cg_height_uncertainty_m === null || s.cg_height_uncertainty_m === undefined ? '–' : fixed(len.from(s.cg_height_uncertainty_m), ld)}</td><td>${SOURCE_WORDS[s.cg_height_derived_from ?? 'entered'] ?? s.cg_height_derived_from}</td></tr>`,
  )}</tbody></table></div>
<h3>Measuring the CG height by axle lift</h3>
<p class="hint">Weigh the vehicle level, then raise one axle in steps (at least about 600 mm in all, suspension locked, brakes off) and read the scales under the axle that stays down; repeat with the other axle raised. Enter the readings below: the result gives the CG height, its standard uncertainty and the budget of what limits it (docs/axle-lift.md), and "Apply to load state" writes it into that load state (<code>cg_height_m</code>, <code>cg_height_uncertainty_m</code>, <code>cg_height_derived_from: "measured"</code>, <code>overrides: ["cg_height_m"]</code>). The same computation runs from a file with <code>npx lockstep cg-lift FILE</code>.</p>
${liftBlock(ctx)}`;
}

/** The axle-lift tool, starting from the design's wheelbase and unladen axle loads (which it then follows). */
function liftBlock(ctx: ResultContext): SafeHtml {
  const defaults = designLiftDefaults(ctx.design.vehicle.wheelbase_m, ctx.result.load_states, ctx.units);
  return axleLiftBlock({ units: ctx.units, values: { ...startingLiftValues(ctx.units), ...defaults }, designDefaults: defaults });
}

export function conversionResults(ctx: ResultContext): SafeHtml {
  const b = ctx.design.build_up ? buildUp(ctx.design.build_up, ctx.design.vehicle.wheelbase_m) : null;
  return html`${b ? buildUpBlock(ctx, b) : html`<p class="hint">Add a <code>build_up</code> block (base vehicle as weighed, items removed and added, seats, payload, tanks) to derive the unladen and laden states from the conversion (docs/build-up.md).</p>`}
${ratingsBlock(ctx)}
${cgSourcesBlock(ctx)}`;
}

export const conversionPanel: Panel = { id: 'conversion', title: 'Conversion: masses, ratings, CG height', results: conversionResults };
