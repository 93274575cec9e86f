// Limits panel (views/panels/limits.ts).
// Sources: issue 7 contract (each of traction, regeneration, stopping, heat and tester on the page, a chart of limit
// acceleration against adhesion for the three layouts with the design's own highlighted); OWASP XSS Prevention
// Cheat Sheet rule #1 (user text escaped in HTML); 1 ft = 0.3048 m exactly (NIST SP 811 B.8).
import { describe, expect, it } from 'vitest';
import { demoDesign, evaluate } from '../../core/index.ts';
import { designToValues, readForm } from '../../form/design-form.ts';
import { limitsInputs, limitsPanel, tractionChart } from '../../views/panels/limits.ts';
import type { ResultContext } from '../../views/panels/index.ts';

function ctx(patch?: (d: ReturnType<typeof demoDesign>) => void, units: 'metric' | 'us' = 'metric'): ResultContext {
  const design = structuredClone(demoDesign());
  patch?.(design);
  return { design, result: evaluate(design, { curves: true }), units, warnings: [] };
}

describe('limits panel', () => {
  it('demo: all five sections and the four charts', () => {
    const page = limitsPanel.results!(ctx()).html;
    for (const h of ['Traction', 'Regenerative braking', 'Stopping distance', 'Roller brake tester', 'Brake heat']) expect(page).toContain(`<h3>${h}</h3>`);
    for (const id of ['chart-l1', 'chart-l2', 'chart-l3', 'chart-l4']) expect(page).toContain(`data-chart="${id}-data"`);
    expect(page).toContain('Engineering estimates');
  });
  it('the traction chart draws three layouts per load state and highlights the design drive', () => {
    const c = ctx();
    const spec = tractionChart(c.result);
    const traces = spec.data as { name: string; line: { width: number }; y: number[] }[];
    expect(traces.length).toBe(3 * c.result.load_states.length);
    const own = traces.filter((t) => t.name.includes('(this design)'));
    expect(own.length).toBe(c.result.load_states.length);
    expect(own.every((t) => t.name.startsWith('rear-wheel drive') && t.line.width > 2)).toBe(true);
    // all-wheel drive with an ideal split reaches μ g: the trace equals the adhesion list
    const awd = traces.find((t) => t.name.startsWith('all-wheel drive'))!;
    expect(awd.y).toEqual(c.result.adhesion_coefficients);
  });
  it('without regen and heat blocks the panel says so; user text is escaped', () => {
    const page = limitsPanel.results!(
      ctx((d) => {
        delete d.regen;
        delete d.heat;
        d.load_states[0]!.label = 'Un<b>laden';
      }),
    ).html;
    expect(page).toContain('No regenerative braking is entered');
    expect(page).toContain('No rotor masses are entered');
    expect(page).toContain('Un&lt;b&gt;laden');
    expect(page).not.toContain('Un<b>laden');
  });
  it('US units: stopping distances in ft', () => {
    const c = ctx(undefined, 'us');
    const page = limitsPanel.results!(c).html;
    expect(page).toContain('stopping distance (ft)');
    const row = c.result.load_states[0]!.stopping.rows.find((r) => r.mode === 'no_abs')!;
    expect(page).toContain((row.total_m / 0.3048).toFixed(1));
  });
  it('inputs: the demo regen torque shows; a changed value reaches the design; cleared blocks disappear', () => {
    const values = designToValues(demoDesign(), 'metric');
    const rendered = new Set<string>();
    const form = limitsInputs({ values, units: 'metric', errors: new Map(), structural: new Set(), rendered }).html;
    expect(form).toContain('name="regen.max_motor_torque_nm" value="90"');
    const set = readForm({ ...values, 'regen.max_motor_torque_nm': '60', 'tester.roller_adhesion': '0.7' }, 'metric');
    expect(set.ok && set.design.regen?.max_motor_torque_nm === 60 && set.design.tester?.roller_adhesion === 0.7).toBe(true);
    const cleared = Object.fromEntries(Object.entries(values).filter(([k]) => !k.startsWith('heat.')));
    const back = readForm(cleared, 'metric');
    expect(back.ok && back.design.heat === undefined).toBe(true);
  });
});
