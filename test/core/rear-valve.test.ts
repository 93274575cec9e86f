/**
 * Rear-valve characteristics.
 * Source: design-file spec "Physics" (none p; limiting min(p, knee); proportioning p up to the knee,
 * knee + ratio(p − knee) above; load sensing like proportioning with the knee read off the rear static
 * axle load, linear between table points, held flat outside); hand derivations in the comments.
 */
import { describe, expect, it } from 'vitest';
import { demoDesign } from '../../core/demo.ts';
import type { DesignFile } from '../../core/design.ts';
import { loadSensingKneeBar, masterPressureForRear, rearPressure, valveLaw } from '../../core/valves/index.ts';
import { stateModel } from '../../core/state-model.ts';

describe('valve laws', () => {
  it('none passes the master pressure', () => {
    const law = valveLaw({ type: 'none' }, 1000);
    expect(rearPressure(law, 123e5)).toBe(123e5);
  });

  it('limiting: min(p, knee)', () => {
    const law = valveLaw({ type: 'limiting', knee_bar: 35 }, 1000);
    expect(rearPressure(law, 20e5)).toBe(20e5);
    expect(rearPressure(law, 80e5)).toBe(35e5);
    expect(masterPressureForRear(law, 40e5)).toBe(Infinity); // never reached
  });

  it('proportioning: knee 28 bar, ratio 0.3 → at 60 bar the rear sees 28 + 0.3 · 32 = 37.6 bar', () => {
    const law = valveLaw({ type: 'proportioning', knee_bar: 28, ratio: 0.3 }, 1000);
    expect(rearPressure(law, 20e5)).toBe(20e5);
    expect(rearPressure(law, 60e5)).toBeCloseTo(37.6e5, 6);
    expect(masterPressureForRear(law, 37.6e5)).toBeCloseTo(60e5, 6);
  });
});

describe('load-sensing knee', () => {
  const table: [number, number][] = [
    [1100, 18],
    [1950, 42],
  ];
  it('interpolates linearly: 1500 kg → 18 + 24 · 400/850 = 29.294118 bar', () => {
    expect(loadSensingKneeBar(table, 1500)).toBeCloseTo(18 + (24 * 400) / 850, 12);
  });
  it('is held flat outside the table and exact at its points', () => {
    expect(loadSensingKneeBar(table, 500)).toBe(18);
    expect(loadSensingKneeBar(table, 1100)).toBe(18);
    expect(loadSensingKneeBar(table, 1950)).toBe(42);
    expect(loadSensingKneeBar(table, 3000)).toBe(42);
  });
  it('three points: 1500 kg between [1200, 20] and [1800, 50] → 35 bar (hand-derived: 20 + 30 · 300/600)', () => {
    const t3: [number, number][] = [
      [800, 10],
      [1200, 20],
      [1800, 50],
    ];
    expect(loadSensingKneeBar(t3, 1500)).toBeCloseTo(35, 12);
    expect(loadSensingKneeBar(t3, 1000)).toBeCloseTo(15, 12);
  });
  it('a load state reads its knee from its own rear static axle load (mass − front axle)', () => {
    // 3000 kg with 1500 kg on the front → 1500 kg rear → 29.294118 bar with the table above.
    const d: DesignFile = {
      ...demoDesign(),
      load_states: [
        { id: 'u', label: 'U', kind: 'unladen', mass_kg: 2000, front_axle_kg: 1200, cg_height_m: 0.7 },
        { id: 'l', label: 'L', kind: 'laden', mass_kg: 3000, front_axle_kg: 1500, cg_height_m: 0.8 },
      ],
      hydraulics: { ...demoDesign().hydraulics, rear_valve: { type: 'load_sensing', ratio: 0.3, knee_bar_at_rear_axle_kg: table } },
    };
    expect(stateModel(d, d.load_states[0]!).valve.knee).toBe(18e5); // 800 kg rear: below the table, flat
    expect(stateModel(d, d.load_states[1]!).valve.knee).toBeCloseTo((18 + (24 * 400) / 850) * 1e5, 6);
    expect(stateModel(d, d.load_states[1]!).valve.ratio).toBe(0.3);
  });
});
