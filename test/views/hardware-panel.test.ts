// Sources: issue 9 contract (the page shows the pedal-travel margin, the failed-valve cases and the
// pitfalls beside the verdict); OWASP XSS Prevention Cheat Sheet rule #1 (user text escaped in HTML).
// Failed-valve rule 71/320/EEC Annex II Appendix point 6 is [P]: the verify note must be shown.
// Unit: 1 in = 25.4 mm exactly (NIST SP 811 B.8).
import { describe, expect, it } from 'vitest';
import { demoDesign, evaluate, VERIFY_NOTE } from '../../core/index.ts';
import { designToValues, readForm } from '../../form/design-form.ts';
import { hardwareInputs, hardwarePanel, pedalTravelChart, pitfallsPanel } from '../../views/panels/hardware.ts';
import type { ResultContext } from '../../views/panels/index.ts';

function ctx(patch?: (d: ReturnType<typeof demoDesign>) => void, units: 'metric' | 'us' = 'metric'): ResultContext {
  const design = structuredClone(demoDesign());
  patch?.(design);
  return { design, result: evaluate(design, { curves: true }), units, warnings: [] };
}

describe('hardware panels', () => {
  it('demo: failed-valve table with the verify note, pedal-travel table and chart, no pitfall', () => {
    const c = ctx();
    const page = hardwarePanel.results!(c).html;
    expect(page).toContain('linkage broken, valve at its lowest knee');
    expect(page).toContain(VERIFY_NOTE);
    expect(page).toContain('Pedal travel and fluid volume');
    expect(page).toContain('data-chart="chart-d-data"');
    expect(pitfallsPanel.results!(c).html).toContain('None of the listed pitfalls applies');
  });
  it('a pitfall shows its message and source, user-facing text escaped', () => {
    const c = ctx((d) => {
      d.conversion = { bias_adjuster: 'driver_adjustable' };
      d.load_states[0]!.label = 'un<b>laden'; // a load state is named by its label
    });
    expect(pitfallsPanel.results!(c).html).toContain('PITFALL_BIAS_ADJUSTER_REACHABLE');
    expect(pitfallsPanel.results!(c).html).toContain('source: UK IVA');
    const page = hardwarePanel.results!(c).html;
    expect(page).toContain('un&lt;b&gt;laden');
    expect(page).not.toContain('un<b>laden');
  });
  it('the chart converts travel to inches in US units and draws the travel available', () => {
    const c = ctx(undefined, 'us');
    const spec = pedalTravelChart(c);
    const avail = spec.data.find((t) => (t as { name: string }).name === 'travel available') as { y: number[] };
    // hand-derived: default 140 mm / 25.4 = 5.512 in
    expect(avail.y[0]).toBeCloseTo(5.512, 3);
  });
  it('inputs: empty optional fields leave the design unchanged; a chosen value reaches the design', () => {
    const values = designToValues(demoDesign(), 'metric');
    const rendered = new Set<string>();
    const form = hardwareInputs({ values, units: 'metric', errors: new Map(), structural: new Set(), rendered }).html;
    expect(form).toContain('name="conversion.bias_adjuster"');
    expect(rendered.has('hardware.pedal_travel_available_mm')).toBe(true);
    // the fields render empty for the demo, and reading the form back adds no block
    const back = readForm({ ...values, 'hardware.pedal_travel_available_mm': '', 'conversion.bias_adjuster': '' }, 'metric');
    expect(back.ok && back.design.hardware === undefined && back.design.conversion === undefined).toBe(true);
    const set = readForm({ ...values, 'hardware.pedal_travel_available_mm': '120', 'conversion.bias_adjuster': 'driver_adjustable' }, 'metric');
    expect(set.ok).toBe(true);
    if (set.ok) {
      expect(set.design.hardware?.pedal_travel_available_mm).toBe(120);
      expect(set.design.conversion?.bias_adjuster).toBe('driver_adjustable');
    }
  });
  it('inputs: pedal travel typed in inches in US units is stored in mm', () => {
    const values = designToValues(demoDesign(), 'us');
    // hand-derived: 5 in · 25.4 = 127 mm (NIST SP 811 B.8)
    const r = readForm({ ...values, 'hardware.pedal_travel_available_mm': '5' }, 'us');
    expect(r.ok && r.design.hardware?.pedal_travel_available_mm).toBeCloseTo(127, 6);
  });
});
