/**
 * The sizing panel on the workbench (views/panels/sizing.ts) and its apply / undo operation
 * (form/sizing-apply.ts): applying the recommended part writes it into the form, the design then
 * passes the curve rules in every load state, and "Undo" restores the replaced value.
 * Failing design (test data): the demo van with a 66 mm rear piston and no valve fails lock order. No outside
 * values here: the rules are those of core/rules, whose sources are cited in test/core/rules.
 */
import { describe, expect, it } from 'vitest';
import { demoDesign, type DesignFile, sizeDesign } from '../../core/index.ts';
import { designToValues, readForm } from '../../form/design-form.ts';
import { applySizingOp, SIZING_UNDO_FIELD, sizingOp } from '../../form/sizing-apply.ts';
import { update } from '../../server/routes/workbench.ts';
import { buildApp } from '../../server/app.ts';
import { fieldsWithMessages } from '../../views/pages/workbench.ts';

function failing(): DesignFile {
  const d = demoDesign();
  d.hydraulics.rear_valve = { type: 'none' };
  d.axles.rear.brake = { ...d.axles.rear.brake, piston_diameters_mm: [66] } as DesignFile['axles']['rear']['brake'];
  return d;
}

describe('sizing panel', () => {
  it('shows the band, the options with Apply buttons and the robustness histogram', async () => {
    // the panel is deferred: the recompute carries its placeholder, its own request (POST /workbench/panel/sizing)
    // renders it; the Monte Carlo runs only when the "Run robustness analysis" button posts _robust=1
    const out = update(designToValues(failing(), 'metric'));
    expect(String(out.body)).toContain('id="panel-sizing"');
    expect(String(out.body)).toContain('id="deferred-sizing" hx-post="/workbench/panel/sizing"');
    const app = buildApp();
    try {
      const ask = (extra: Record<string, string>) =>
        app.inject({ method: 'POST', url: '/workbench/panel/sizing', headers: { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true' }, payload: new URLSearchParams({ ...designToValues(failing(), 'metric'), ...extra }).toString() });
      const plain = await ask({});
      expect(plain.statusCode).toBe(200);
      expect(plain.body).toContain('chart-sizing-band-data');
      expect(plain.body).not.toContain('chart-sizing-histogram-data');
      expect(plain.body).toContain('Run robustness analysis');
      const body = (await ask({ _robust: '1' })).body;
      expect(body).toContain('chart-sizing-band-data');
      expect(body).toContain('chart-sizing-histogram-data');
      expect(body).toMatch(/name="_op" value="size:apply:axles\.(front|rear)\.brake\.piston_diameters_mm=/);
    } finally {
      await app.close();
    }
  });

  it('writes the part changes in the page\'s unit system: inches on a US page, millimetres on a metric one', async () => {
    // 1 in = 25.4 mm exactly (NIST SP 811 (2008), appendix B.9): the 66 mm rear piston reads 2.60 in
    const app = buildApp();
    try {
      const rows = async (units: 'metric' | 'us') => {
        const res = await app.inject({ method: 'POST', url: '/workbench/panel/sizing', headers: { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true' }, payload: new URLSearchParams({ ...designToValues(failing(), units), _units: units }).toString() });
        const table = /<table class="sizing-options data">[\s\S]*?<\/table>/.exec(res.body)?.[0] ?? '';
        return [...table.matchAll(/<th scope="row">([^<]*)<\/th>/g)].map((m) => m[1]!);
      };
      const us = await rows('us');
      expect(us.length).toBeGreaterThan(0);
      expect(us.filter((t) => t.startsWith('rear')).every((t) => t.includes('2.60 in →'))).toBe(true);
      expect(us.some((t) => /\bmm\b/.test(t))).toBe(false);
      const metric = await rows('metric');
      expect(metric.filter((t) => t.startsWith('rear')).every((t) => t.includes('66.0 mm →'))).toBe(true);
      expect(metric.some((t) => /\bin\b/.test(t))).toBe(false);
    } finally {
      await app.close();
    }
  });

  it('Apply writes the recommended part; the design then passes; Undo restores the old value', () => {
    const d = failing();
    const r = sizeDesign(d, { samples: 200 });
    const opt = r.recommended_option!;
    const before = designToValues(d, 'metric');
    const applied = applySizingOp(before, sizingOp(opt.path, opt.value), 'metric');
    const after = readForm(applied, 'metric');
    expect(after.ok).toBe(true);
    if (!after.ok) return;
    expect(sizeDesign(after.design, { samples: 200 }).current.passes).toBe(true);
    const old = (d.axles[opt.axle].brake as { piston_diameters_mm: number[] }).piston_diameters_mm;
    expect(applied[SIZING_UNDO_FIELD]).toBe(`${opt.path}=${JSON.stringify(old)}`);
    // the page round trip: the answer carries the new value, the undo slot and the Undo button
    const out = update({ ...before, _op: sizingOp(opt.path, opt.value) });
    expect(out.status).toBe(200);
    const body = String(out.body);
    expect(body).toContain(`name="${SIZING_UNDO_FIELD}"`);
    expect(body).toMatch(/Undo \(restore/);
    // undo: apply the replaced value
    const undo = applied[SIZING_UNDO_FIELD]!;
    const eq = undo.indexOf('=');
    const back = readForm(applySizingOp(applied, sizingOp(undo.slice(0, eq), JSON.parse(undo.slice(eq + 1))), 'metric'), 'metric');
    expect(back.ok && back.design).toEqual(readForm(before, 'metric').ok && (readForm(before, 'metric') as { design: unknown }).design);
  });

  it('the tolerances inputs have fields for the valve knee and ratio and the thresholds; the ranking names inputs in words', async () => {
    // round trip: the fields carry the design's tolerances back unchanged (the US page shows the thresholds in psi)
    const d = demoDesign();
    d.tolerances = { valve_knee_pct: 12, valve_ratio_pct: 4, threshold_front_bar: 0.2, threshold_rear_bar: 0.7 };
    for (const units of ['metric', 'us'] as const) {
      const values = designToValues(d, units);
      const { names, labels } = fieldsWithMessages(values, units);
      for (const k of ['valve_knee_pct', 'valve_ratio_pct', 'threshold_front_bar', 'threshold_rear_bar']) expect(names.has(`tolerances.${k}`)).toBe(true);
      expect(labels.get('tolerances.threshold_rear_bar')).toBe('Threshold pressure, rear brakes ±');
      const back = readForm(values, units);
      expect(back.ok).toBe(true);
      if (!back.ok) return;
      expect(back.design.tolerances!.valve_knee_pct).toBe(12);
      expect(back.design.tolerances!.valve_ratio_pct).toBe(4);
      expect(back.design.tolerances!.threshold_front_bar).toBeCloseTo(0.2, 6);
      expect(back.design.tolerances!.threshold_rear_bar).toBeCloseTo(0.7, 6);
    }
    const app = buildApp();
    try {
      const body = (await app.inject({ method: 'POST', url: '/workbench/panel/sizing', headers: { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true' }, payload: new URLSearchParams({ ...designToValues(d, 'metric'), _robust: '1' }).toString() })).body;
      expect(body).toContain('<th scope="row">rear valve knee pressure</th>');
      expect(body).toContain('<th scope="row">threshold pressure, rear brakes</th>');
      expect(body).not.toMatch(/<th scope="row">(valve_knee|threshold_rear|pad_friction_front)<\/th>/);
    } finally {
      await app.close();
    }
  });

  it('an apply to a path no proposal uses is refused with APP_ERR_UNKNOWN_OPERATION', () => {
    expect(() => update({ ...designToValues(demoDesign(), 'metric'), _op: 'size:apply:vehicle.wheelbase_m=9' })).toThrow(/Unknown operation/);
  });
});
