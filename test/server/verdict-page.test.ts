// The workbench's top verdict (issue 12 point 1): above every result, green ("ov-is-pass") only when the one verdict of
// core/verdict.ts is "pass", each failing or not-checked item linked to its row in the checks table.
// Source: the project's verdict rule (issue 12), no outside value. Designs: the demo (core/demo.ts; fails on purpose
// with its regeneration at the lower speeds, unladen and laden), the demo
// without regeneration (every check passes) and without its parking brake (the parking check cannot be made).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { demoDesign, type DesignFile, evaluate } from '../../core/index.ts';
import { buildApp } from '../../server/app.ts';
import { designToValues } from '../../form/design-form.ts';
import { formBody, openPage, postForm } from './form-post.ts';

let app: FastifyInstance;
let shape = '';
beforeAll(async () => {
  app = buildApp();
  await app.ready();
  shape = (await openPage(app)).shape;
});
afterAll(async () => {
  await app.close();
});

async function pageFor(d: DesignFile): Promise<string> {
  const r = await postForm(app, '/workbench/update', formBody(shape, designToValues(d, 'metric')));
  expect(r.statusCode).toBe(200);
  return r.body;
}
/** The overall-verdict section and what comes before it in the results. */
function top(body: string): { section: string; before: string } {
  const results = body.slice(body.indexOf('<div id="results"'));
  const start = results.indexOf('<section class="overall-verdict');
  const end = results.indexOf('</section>', start);
  return { section: results.slice(start, end), before: results.slice(0, start) };
}

describe('the top verdict of the workbench', () => {
  it('says FAIL for the demo, first in the results, each failing item linked to a row that exists', async () => {
    const body = await pageFor(demoDesign());
    const { section, before } = top(body);
    expect(before).not.toMatch(/<section|<table|chart/); // nothing of the results comes before it
    expect(section).toContain('ov-is-fail');
    expect(section).not.toContain('ov-is-pass');
    expect(section).toContain('<span class="ov-badge">FAIL</span>');
    const v = evaluate(demoDesign()).verdict;
    const links = [...section.matchAll(/<a href="#([^"]+)">/g)].map((m) => m[1]!);
    expect(links).toEqual(v.failed.map((f) => f.anchor));
    for (const id of links) expect(body).toContain(`<tr class="check-fail" id="${id}">`);
    // the lock-order cards are not green while the design fails
    expect(body).not.toMatch(/<article class="verdict ok"/);
  });

  it('says PASS (green) only for a design whose every check passes', async () => {
    const d = demoDesign();
    delete d.regen;
    const { section } = top(await pageFor(d));
    expect(section).toContain('ov-is-pass');
    expect(section).toContain('PASS: every check that applies passes');
    expect(section).not.toMatch(/FAIL|NOT CHECKED/);
  });

  it('says INCOMPLETE, not pass, when the parking brake is not described, and names it in words', async () => {
    const d = demoDesign();
    delete d.regen;
    delete d.parking_brake;
    const body = await pageFor(d);
    const { section } = top(body);
    expect(section).toContain('ov-is-incomplete');
    expect(section).toMatch(/NOT CHECKED<\/strong> Laden to 3500 kg: Parking brake holds the laden vehicle on 18 %: not checked: needs the parking brake \(which axle/);
    const id = /<a href="#([^"]+)">/.exec(section)![1]!;
    expect(body).toContain(`<tr class="check-nc" id="${id}">`);
  });

  it('the parking-brake inputs are on the page, and filling them in makes the check: axle, control, mechanism', async () => {
    const page = (await openPage(app)).body;
    for (const n of ['axle', 'control', 'control_force_n', 'holding_force_n', 'lever_ratio', 'efficiency', 'brake_factor', 'effective_radius_m']) {
      expect(page).toContain(`name="parking_brake.${n}"`);
    }
    const d = demoDesign();
    delete d.regen;
    const values = { ...designToValues(d, 'metric'), 'parking_brake.lever_ratio': '', 'parking_brake.efficiency': '', 'parking_brake.brake_factor': '', 'parking_brake.effective_radius_m': '' };
    // the axle and control stated, no holding force and no mechanism: the capacity cannot be checked
    const r = await postForm(app, '/workbench/update', formBody(shape, values));
    expect(top(r.body).section).toMatch(/not checked: needs the parking brake(&#39;|')s holding force at the tyres, or its mechanism/);
  });

  it('the sticky bar carries the same verdict in short, and says "not current" while an input is wrong (issue 15 point 1)', async () => {
    const bar = (body: string) => body.slice(body.indexOf('<div id="verdict-bar"'), body.indexOf('</div>', body.indexOf('<div id="verdict-bar"')));
    const v = evaluate(demoDesign()).verdict;
    const failing = bar(await pageFor(demoDesign()));
    expect(failing).toContain('hx-swap-oob="true"');
    expect(failing).toContain(`<a class="vb vb-fail" href="#overall-verdict"><strong>FAIL</strong> ${v.counts.failed} failing · 0 not checked</a>`);
    const passing = structuredClone(demoDesign()) as DesignFile;
    delete passing.regen;
    expect(bar(await pageFor(passing))).toContain('<strong>PASS</strong> 0 failing');
    const values = designToValues(demoDesign(), 'metric');
    values['vehicle.wheelbase_m'] = '-1';
    const r = await postForm(app, '/workbench/update', formBody(shape, values));
    expect(r.statusCode).toBe(422);
    expect(bar(r.body)).toContain('Verdict not current');
    expect(bar(r.body)).not.toMatch(/FAIL|PASS/);
  });
});
