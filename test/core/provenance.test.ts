// Provenance true by construction (issue 14, point 2): an entry speaks for the value it was recorded for.
// The states are the project's own definition (core/provenance.ts); the figures are the demo's entries.
// The valve gauge values are worked by hand from the valve characteristic of the design-file spec
// (rear = knee + ratio·(front − knee) above the knee, knee linear in the rear axle load between table points:
// the usual load-sensing valve characteristic, common practice, no source).
// The MFDD example is worked by hand from d = (vb² − ve²) / (25.92·(se − sb)) (UN R13 Annex 4 para 1.1.1, from memory).
import { describe, expect, it } from 'vitest';
import { decelerationAtPedalForce, demoDesign, inputSource, mfddOf, testResultsOutcome, valveGauge } from '../../core/index.ts';

describe('inputSource', () => {
  const prov = { 'load_states[0].front_axle_kg': { source: 'measured' as const, value: 1420, note: 'weighbridge' } };
  it('keeps an entry recorded for the value as it stands', () => {
    expect(inputSource(prov, 'load_states[0].front_axle_kg', 1420)).toMatchObject({ state: 'recorded', source: 'measured', note: 'weighbridge' });
  });
  it('drops the source of a changed value and says what it was recorded for', () => {
    expect(inputSource(prov, 'load_states[0].front_axle_kg', 1500)).toEqual({ state: 'changed', source: null, note: '', recorded_value: 1420 });
  });
  it('flags an entry without its value, states nothing for an input without entry', () => {
    expect(inputSource({ 'vehicle.wheelbase_m': { source: 'maker' } }, 'vehicle.wheelbase_m', 3.665).state).toBe('unconfirmed');
    expect(inputSource(prov, 'vehicle.wheelbase_m', 3.665).state).toBe('not_stated');
  });
  it('says "calculated" for figures of the build-up and "axle lift" for a measured CG height, whatever an entry claims', () => {
    const states = [{ derived_from: 'build_up', cg_height_derived_from: 'measured' }];
    expect(inputSource(prov, 'load_states[0].front_axle_kg', 1420, states)).toMatchObject({ state: 'build_up', source: 'calculated' });
    expect(inputSource(prov, 'load_states[0].cg_height_m', 0.78, states).state).toBe('axle_lift');
  });
  it('reads no entry through the prototype', () => {
    expect(inputSource({}, '__proto__', 1).state).toBe('not_stated');
    expect(inputSource({}, 'constructor', 1).state).toBe('not_stated');
  });
});

describe('valveGauge (the demo: load-sensing, ratio 0.5, knee 20 bar at 1200 kg and 48 bar at 1900 kg rear axle load)', () => {
  const g = valveGauge(demoDesign());
  it('reads the knee at each state\'s static rear axle load and the rear pressure at 20…100 bar', () => {
    expect(g.valve_type).toBe('load_sensing');
    expect(g.front_pa).toEqual([20e5, 40e5, 60e5, 80e5, 100e5]);
    // unladen: rear axle 2720 − 1420 = 1300 kg -> knee 20 + 28·100/700 = 24 bar; at 60 bar: 24 + 0.5·36 = 42 bar
    const un = g.rows.find((r) => r.load_state === 'unladen')!;
    expect(un.knee_pa / 1e5).toBeCloseTo(24, 9);
    expect(un.rear_pa.map((p) => p / 1e5)).toEqual([20, 32, 42, 52, 62].map((x) => expect.closeTo(x, 9)));
    // laden: 3500 − 1610 = 1890 kg -> knee 20 + 28·690/700 = 47.6 bar; at 100 bar: 47.6 + 0.5·52.4 = 73.8 bar
    const la = g.rows.find((r) => r.load_state === 'laden')!;
    expect(la.knee_pa / 1e5).toBeCloseTo(47.6, 9);
    expect(la.rear_pa[4]! / 1e5).toBeCloseTo(73.8, 9);
    expect(la.rear_pa[1]! / 1e5).toBeCloseTo(40, 9); // below the knee the rear line follows the front
  });
  it('gives the front pressure itself without a valve', () => {
    const d = demoDesign();
    d.hydraulics.rear_valve = { type: 'none' };
    expect(valveGauge(d).rows[0]!.rear_pa).toEqual([20e5, 40e5, 60e5, 80e5, 100e5]);
  });
});

describe('measured test results', () => {
  it('MFDD from the four readings, null for readings that cannot be one', () => {
    expect(mfddOf({ speed_b_kmh: 64, speed_e_kmh: 8, distance_b_m: 10, distance_e_m: 40 })).toBeCloseTo(4032 / 777.6, 9);
    expect(mfddOf({ speed_b_kmh: 64, speed_e_kmh: 8, distance_b_m: 40, distance_e_m: 10 })).toBeNull();
  });
  it('compares with the N1 service figure (5.0 m/s² at 80 km/h, 0.15v + v²/130 m) and the prediction', () => {
    const d = demoDesign();
    d.test_results = { road: [{ load_state: 'laden', test: 'service', pedal_force_n: 300, mfdd_ms2: 4.9 }, { load_state: 'laden', test: 'service', mfdd_ms2: 5.6, stopping_distance_m: 70 }] };
    const o = testResultsOutcome(d, [])!;
    // 71/320/EEC Annex II 2.1.1 as applied by the performance rules: N1 5.0 m/s², distance 0.15·80 + 80²/130 = 61.23 m
    expect(o.road[0]!.distance_limit_m).toBeCloseTo(12 + 6400 / 130, 9);
    expect(o.road[0]!.meets).toBe(false); // 4.9 below the required deceleration
    expect(o.road[1]!.meets).toBe(false); // 70 m beyond the distance limit
    expect(o.meets).toBe(false);
    expect(o.road[0]!.predicted_ms2).toBeCloseTo(decelerationAtPedalForce(d, 'laden', 300)!, 12);
    expect(o.road[0]!.difference_ms2).toBeCloseTo(4.9 - o.road[0]!.predicted_ms2!, 12);
  });
});
