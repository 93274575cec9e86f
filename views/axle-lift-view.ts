/**
 * The axle-lift tool of the conversion panel: a form that posts a `lockstep-axle-lift/1` file
 * (docs/axle-lift.md) to POST /workbench/cg-lift, and the fragment that answers it.
 */
import { type AxleLiftResultFile, CAUTION, type FieldIssue } from '../core/index.ts';
import { fixed } from './format.ts';
import { html, type SafeHtml } from './html.ts';

const SOURCE_WORDS: Record<string, string> = {
  scale_resolution: 'scale readings (resolution)',
  lift_height: 'lift heights',
  lift_angle: 'lift angles',
  wheelbase: 'wheelbase',
  wheel_centre_height: 'wheel-centre height',
};

const PLACEHOLDER = `{
  "format": "lockstep-axle-lift/1",
  "wheelbase_m": …, "wheel_centre_height_m": …,
  "level": { "front_axle_kg": …, "rear_axle_kg": … },
  "lifts": [ { "raised_axle": "rear", "lift_height_m": …, "front_axle_kg": … },
             { "raised_axle": "front", "lift_height_m": …, "rear_axle_kg": … } ],
  "scale_resolution_kg": …, "lift_height_uncertainty_m": …, "wheelbase_uncertainty_m": …
}`;

export function axleLiftForm(): SafeHtml {
  return html`<form class="cg-lift" hx-post="/workbench/cg-lift" hx-target="#cg-lift-result" hx-swap="innerHTML" aria-label="CG height by axle lift">
<label for="cg-lift-input">Axle-lift readings (a <code>lockstep-axle-lift/1</code> file: lengths in m, masses in kg, angles in degrees)</label>
<textarea id="cg-lift-input" name="axle_lift" rows="9" spellcheck="false" placeholder="${PLACEHOLDER}"></textarea>
<p><button type="submit">Compute CG height</button></p>
</form>
<div id="cg-lift-result" aria-live="polite"></div>`;
}

export function axleLiftErrors(message: string, code: string, errors: readonly FieldIssue[] = []): SafeHtml {
  return html`<div class="status invalid" role="status"><p><strong>Check input</strong> ${message} <code>${code}</code></p>
${errors.length ? html`<ul class="problems">${errors.map((e) => html`<li>${e.path ? html`<code>${e.path}</code>: ` : ''}${e.message}</li>`)}</ul>` : ''}</div>`;
}

export function axleLiftFragment(r: AxleLiftResultFile): SafeHtml {
  const snippet = JSON.stringify({
    cg_height_m: Number(r.cg_height_m.toFixed(3)),
    cg_height_uncertainty_m: Number(r.standard_uncertainty_m.toFixed(3)),
    cg_height_derived_from: 'measured',
    overrides: ['cg_height_m'],
  });
  return html`<table class="numbers"><tbody>
<tr><th scope="row">CG height above ground</th><td>${fixed(r.cg_height_m, 3)} m</td></tr>
<tr><th scope="row">Standard uncertainty (k = 1)</th><td>${fixed(r.standard_uncertainty_m, 3)} m</td></tr>
<tr><th scope="row">CG behind the front axle</th><td>${fixed(r.cg_to_front_axle_m, 3)} m</td></tr>
<tr><th scope="row">Vehicle mass (level)</th><td>${fixed(r.mass_kg, 1)} kg</td></tr>
${r.scatter_uncertainty_m !== null ? html`<tr><th scope="row">Scatter of the lifts about the fit</th><td>${fixed(r.scatter_uncertainty_m, 3)} m</td></tr>` : ''}
</tbody></table>
<h4>Each lift alone</h4>
<div class="scroll"><table class="numbers"><thead><tr><th scope="col">Lift</th><th scope="col">Raised</th><th scope="col">Axle read</th><th scope="col">Angle<br><span class="unit">°</span></th><th scope="col">Change<br><span class="unit">kg</span></th><th scope="col">h<br><span class="unit">m</span></th><th scope="col">u(h)<br><span class="unit">m</span></th></tr></thead>
<tbody>${r.lifts.map((l) => html`<tr><td>${l.index + 1}</td><td>${l.raised_axle}</td><td>${l.read_axle}</td><td>${fixed(l.lift_angle_deg, 2)}</td><td>${fixed(l.reading_change_kg, 1)}</td><td>${fixed(l.cg_height_m, 3)}</td><td>${fixed(l.standard_uncertainty_m, 3)}</td></tr>`)}</tbody></table></div>
<h4>Uncertainty budget</h4>
<div class="scroll"><table class="numbers"><thead><tr><th scope="col">Source</th><th scope="col">Contribution<br><span class="unit">m</span></th><th scope="col">Share of variance<br><span class="unit">%</span></th></tr></thead>
<tbody>${r.budget.by_source.map((b) => html`<tr><td>${SOURCE_WORDS[b.source] ?? b.source}</td><td>${fixed(b.contribution_m, 4)}</td><td>${fixed(100 * b.variance_share, 1)}</td></tr>`)}</tbody></table></div>
${r.budget.largest_source ? html`<p>Largest contribution: ${SOURCE_WORDS[r.budget.largest_source]} (single input: ${r.budget.largest_input}).</p>` : ''}
${r.warnings.length ? html`<ul class="warnings">${r.warnings.map((w) => html`<li><code>${w.code}</code> ${w.message}</li>`)}</ul>` : ''}
<p>To apply it, add to the load state it was measured in: <code>${snippet}</code></p>
<p class="hint">${CAUTION}</p>`;
}
