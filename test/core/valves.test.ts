/**
 * The rear-valve registry and the one force law.
 * Source: design-file spec "Physics" (T = G·max(0, p − threshold); the rear line at valve(p)); failure modes of
 * the distribution device per 71/320/EEC Annex II Appendix point 6; hand arithmetic in the comments.
 */
import { describe, expect, it } from 'vitest';
import {
  axleBrakeForce,
  failedValves,
  forcesAtPressure,
  parsePath,
  RearValve,
  rearValveFamily,
  totalForceAtPressure,
  VALVE_FAILURE_MODES,
  VALVE_FAMILIES,
  valveFamily,
  valveLaw,
  valveSettings,
} from '../../core/index.ts';

/** A family's start values as a valve object (keys may be table cells such as `knee_bar_at_rear_axle_kg[1][0]`). */
function startValve(type: string, start: Readonly<Record<string, number>>): Record<string, unknown> {
  const v: Record<string, unknown> = { type };
  for (const [k, x] of Object.entries(start)) {
    const path = parsePath(k);
    let cur = v as Record<string | number, unknown>;
    path.slice(0, -1).forEach((key, i) => {
      cur[key] ??= typeof path[i + 1] === 'number' ? [] : {};
      cur = cur[key] as Record<string | number, unknown>;
    });
    cur[path.at(-1)!] = x;
  }
  return v;
}

describe('the valve registry', () => {
  it('lists each type once, and every type of the design file has a module', () => {
    const types = VALVE_FAMILIES.map((f) => f.type);
    expect(new Set(types).size).toBe(types.length);
    expect(types).toEqual(['none', 'limiting', 'proportioning', 'load_sensing']);
    expect(valveFamily('no_such_valve')).toBeUndefined();
    expect(() => rearValveFamily({ type: 'no_such_valve' } as never)).toThrow(expect.objectContaining({ code: 'CORE_ERR_UNKNOWN_VALVE' }));
  });

  for (const f of VALVE_FAMILIES) {
    it(`${f.type}: its start values make a valid valve, and its failed states are its declared modes`, () => {
      const r = RearValve.safeParse(startValve(f.type, f.start));
      expect(r.success).toBe(true);
      const v = r.data!;
      expect(failedValves(v).map((x) => x.mode)).toEqual(f.failureModes.map((m) => m.mode));
      for (const m of f.failureModes) expect(VALVE_FAILURE_MODES.map((x) => x.mode)).toContain(m.mode);
      expect(f.name).not.toMatch(/_/);
      for (const i of f.inputs) expect(Object.keys(v).some((k) => k === i.key) || i.kind === 'choice').toBe(true);
    });
  }

  it('the start values give the laws of the design-file spec', () => {
    // proportioning start: knee 28 bar = 2.8e6 Pa, ratio 0.3; load sensing at 1500 kg: 18 + (42 − 18)·400/800 = 30 bar
    expect(valveLaw(RearValve.parse(startValve('proportioning', valveFamily('proportioning')!.start)), 1000)).toEqual({ knee: 2.8e6, ratio: 0.3 });
    expect(valveLaw(RearValve.parse(startValve('load_sensing', valveFamily('load_sensing')!.start)), 1500).knee).toBeCloseTo(3.0e6, 6);
  });

  it('a valve’s settings carry their quantity and unit from the quantity table', () => {
    const s = valveSettings({ type: 'load_sensing', ratio: 0.3, knee_bar_at_rear_axle_kg: [[1100, 18]] });
    expect(s.map((x) => [x.path, x.value, x.meta.unit])).toEqual([
      ['ratio', 0.3, '1'],
      ['knee_bar_at_rear_axle_kg[0][0]', 1100, 'kg'],
      ['knee_bar_at_rear_axle_kg[0][1]', 18, 'bar'],
    ]);
  });
});

describe('the force law G·max(0, p − threshold)', () => {
  const axles = { G1: 2e-3, G2: 1e-3, threshold1: 1e5, threshold2: 5e5 };
  it('no force below the threshold, linear above it', () => {
    expect(axleBrakeForce(2e-3, 0.5e5, 1e5)).toBe(0);
    expect(axleBrakeForce(2e-3, 11e5, 1e5)).toBeCloseTo(2000, 9); // 2e-3 N/Pa × 10 bar
  });
  it('both axles through a proportioning valve: knee 20 bar, ratio 0.5, master 40 bar', () => {
    // rear line 20 + 0.5·20 = 30 bar; front 2e-3 × 39e5 = 7800 N; rear 1e-3 × 25e5 = 2500 N
    const law = { knee: 20e5, ratio: 0.5 };
    const f = forcesAtPressure(axles, law, 40e5);
    expect(f.p2).toBeCloseTo(30e5, 6);
    expect(f.front).toBeCloseTo(7800, 6);
    expect(f.rear).toBeCloseTo(2500, 6);
    expect(totalForceAtPressure(axles, law, 40e5)).toBeCloseTo(10300, 6);
  });
});
