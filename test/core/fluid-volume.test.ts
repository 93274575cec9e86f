// Sources: hand-derived arithmetic shown beside each check (piston area πd²/4, volume = area × travel,
// pressure from the design-file spec "Physics": T = G p with G from brake-gain, zP = T1 + T2).
// Targets: service Type-0 d_m 5.0 m/s² for N1 (71/320 Annex II 2.1.1 [P]);
// secondary braking 2.2 m/s² for N (R13 Rev.4 Annex 4 2.2 [V]).
// Tandem master-cylinder model: the one documented in core/fluid-volume.ts (a failed chamber uses up
// its stroke first) — common practice, no source. Balance bar: the pivot divides the bar in the ratio of the
// force shares, so its travel is s·x_front + (1 − s)·x_rear (lever statics, common practice, no source); rear
// master pressure λ·p with λ = ((1 − s)/s)(d_f/d_r)² (force balance on the bar, docs/design-file.md).
import { describe, expect, it } from 'vitest';
import {
  axleFluid,
  axleVolume,
  balanceBarTravel,
  demoDesign,
  type DesignFile,
  pedalTravel,
  pressureForRate,
  pushrodTravel,
  readDesign,
  stateModels,
} from '../../core/index.ts';
import { simpleSystemInput } from './hand-cases.ts';

/** The simple hand-check system of test/core/hand-cases.ts with its hydraulic hardware stated. */
function simpleDesign(): DesignFile {
  const input = {
    ...simpleSystemInput(),
    hardware: {
      front: { running_clearance_mm: 0.2, knock_back_mm: 0, expansion_per_bar_mm3: 10, fluid_volume_mm3: 20000 },
      rear: { shoe_travel_mm: 0.5, expansion_per_bar_mm3: 10, fluid_volume_mm3: 20000 },
      fluid_bulk_modulus_bar: 10000,
      master_cylinder: { primary_stroke_mm: 16, secondary_stroke_mm: 14, dead_travel_mm: 1, primary_feeds: 'front' },
      pedal_travel_available_mm: 150,
      pedal_travel_warn_pct: 60,
    },
  };
  const r = readDesign(input);
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}

describe('axle fluid volume', () => {
  it('disc: clearance volume = 2 calipers × piston area × (clearance + knock-back)', () => {
    const d = simpleDesign();
    const f = axleFluid(d.axles.front.brake, d.hardware!.front, 10000e5);
    // hand-derived: π/4 · 50² = 1963.495 mm²; 2 · 1963.495 · 0.2 mm = 785.398 mm³
    expect(f.clearance * 1e9).toBeCloseTo(785.398, 2);
    // hand-derived: 10 mm³/bar + 20000 mm³ / 10000 bar = 12 mm³/bar = 12e-9 m³ / 1e5 Pa
    expect(f.compliance).toBeCloseTo(12e-14, 20);
    // hand-derived: at 50 bar 785.398 + 12 · 50 = 1385.398 mm³
    expect(axleVolume(f, 50e5) * 1e9).toBeCloseTo(1385.398, 2);
    expect(axleVolume(f, 0)).toBe(0);
  });
  it('drum: clearance volume = 2 wheels × 2 pistons × wheel-cylinder area × shoe travel', () => {
    const d = simpleDesign();
    const f = axleFluid(d.axles.rear.brake, d.hardware!.rear, 10000e5);
    // hand-derived: π/4 · 20² = 314.159 mm²; 4 · 314.159 · 0.5 = 628.319 mm³
    expect(f.clearance * 1e9).toBeCloseTo(628.319, 2);
  });
  it('knock-back adds to the disc piston travel', () => {
    const d = simpleDesign();
    const f = axleFluid(d.axles.front.brake, { running_clearance_mm: 0.2, knock_back_mm: 0.1 }, 10000e5);
    // hand-derived: 2 · 1963.495 · 0.3 = 1178.097 mm³
    expect(f.clearance * 1e9).toBeCloseTo(1178.097, 2);
  });
});

describe('tandem master cylinder', () => {
  const mc = { area: (Math.PI / 4) * 0.02 ** 2, primaryStroke: 0.016, secondaryStroke: 0.014, deadTravel: 0.001 };
  const A = mc.area * 1e6; // 314.159 mm²
  it('both circuits: pushrod travel = both pistons (dead travel + volume / area)', () => {
    // hand-derived: (1 + 628.319/314.159) + (1 + 314.159/314.159) = 3 + 2 = 5 mm
    const x = pushrodTravel(mc, 2 * A * 1e-9, A * 1e-9, 'none');
    expect(x.travel * 1e3).toBeCloseTo(5, 9);
    expect(x.bottomed).toBe(false);
  });
  it('primary lost: its whole stroke is used before the secondary builds pressure', () => {
    // hand-derived: 16 + 1 + 314.159/314.159 = 18 mm
    expect(pushrodTravel(mc, 0, A * 1e-9, 'primary').travel * 1e3).toBeCloseTo(18, 9);
  });
  it('secondary lost: the floating piston bottoms first, then the primary builds pressure', () => {
    // hand-derived: 14 + 1 + 2 = 17 mm
    expect(pushrodTravel(mc, 2 * A * 1e-9, 0, 'secondary').travel * 1e3).toBeCloseTo(17, 9);
  });
  it('a piston that needs more than its stroke bottoms', () => {
    // hand-derived: 1 + 15 · 314.159/314.159 = 16 mm > 14 mm secondary stroke
    expect(pushrodTravel(mc, 0, 15 * A * 1e-9, 'none').bottomed).toBe(true);
  });
});

describe('pedal travel of the simple system', () => {
  const d = simpleDesign();
  const r = pedalTravel(d, stateModels(d));
  const state = r.states[0]!;
  const service = state.cases.find((c) => c.case === 'service')!.point!;

  it('service case at 5.0 m/s² matches the hand arithmetic', () => {
    // hand-derived: G1 = 4 · 0.4 · 1963.495e-6 m² · 0.12/0.3 = 125.664 N/bar; G2 = 2 · 2 · 314.159e-6 · 0.12/0.3 = 50.265 N/bar;
    // z P = 5.0 m/s² · 2000 kg = 10000 N, so p = 10000 / 175.929 = 56.841 bar (no valve: rear at p too)
    expect(service.master_pressure_bar).toBeCloseTo(56.841, 2);
    // front 785.398 + 12 · 56.841 = 1467.491 mm³; rear 628.319 + 12 · 56.841 = 1310.411 mm³
    expect(service.circuit_volume_mm3.front).toBeCloseTo(1467.491, 1);
    expect(service.circuit_volume_mm3.rear).toBeCloseTo(1310.411, 1);
    // pushrod (1 + 1467.491/314.159) + (1 + 1310.411/314.159) = 5.6712 + 5.1712 = 10.8423 mm; pedal × 4 = 43.369 mm
    expect(service.pushrod_travel_mm).toBeCloseTo(10.8423, 3);
    expect(service.pedal_travel_mm).toBeCloseTo(43.369, 2);
    // 43.369 / 150 = 28.9 %, margin 106.6 mm
    expect(service.share_of_available_pct).toBeCloseTo(28.91, 1);
    expect(service.margin_mm).toBeCloseTo(106.63, 1);
    expect(r.defaults_used).toEqual([]);
    expect(r.warnings).toEqual([]);
  });

  it('front (primary) circuit failed: rear only to 2.2 m/s²', () => {
    const c = state.cases.find((x) => x.case === 'front_circuit_failed')!;
    // hand-derived: 2.2 · 2000 = 4400 N = 50.265 N/bar · p, p = 87.535 bar; rear volume 628.319 + 12 · 87.535 = 1678.741 mm³;
    // pushrod 16 + 1 + 1678.741/314.159 = 22.3436 mm; pedal 89.374 mm
    expect(c.point!.master_pressure_bar).toBeCloseTo(87.535, 2);
    expect(c.point!.circuit_volume_mm3.front).toBe(0);
    expect(c.point!.pushrod_travel_mm).toBeCloseTo(22.3436, 3);
    expect(c.point!.pedal_travel_mm).toBeCloseTo(89.374, 2);
  });

  it('rear (secondary) circuit failed: front only to 2.2 m/s²', () => {
    const c = state.cases.find((x) => x.case === 'rear_circuit_failed')!;
    // hand-derived: 4400 / 125.664 = 35.014 bar; 785.398 + 12 · 35.014 = 1205.567 mm³; 14 + 1 + 3.8374 = 18.8374 mm; × 4 = 75.350 mm
    expect(c.point!.master_pressure_bar).toBeCloseTo(35.014, 2);
    expect(c.point!.pushrod_travel_mm).toBeCloseTo(18.8374, 3);
    expect(c.point!.pedal_travel_mm).toBeCloseTo(75.35, 2);
  });

  it('the series rises with braking rate and starts with the pedal at rest', () => {
    const sv = state.series.find((s) => s.case === 'service')!;
    expect(sv.braking_rate[0]).toBe(0);
    expect(sv.pedal_travel_mm[0]).toBe(0);
    for (let i = 1; i < sv.pedal_travel_mm.length; i++) expect(sv.pedal_travel_mm[i]!).toBeGreaterThan(sv.pedal_travel_mm[i - 1]!);
  });

  it('warns when the service test takes more than the set share of the travel', () => {
    const tight = simpleDesign();
    // hand-derived: 43.369 mm is 62 % of 70 mm, above the 60 % default share (common practice, no source)
    tight.hardware!.pedal_travel_available_mm = 70;
    delete tight.hardware!.pedal_travel_warn_pct;
    const t = pedalTravel(tight, stateModels(tight));
    expect(t.warn_pct).toBe(60);
    expect(t.defaults_used).toContain('hardware.pedal_travel_warn_pct');
    expect(t.warnings.map((w) => w.code)).toContain('WARN_PEDAL_TRAVEL_SHARE');
    // at 80 mm (54 %) it stays quiet
    tight.hardware!.pedal_travel_available_mm = 80;
    expect(pedalTravel(tight, stateModels(tight)).warnings.map((w) => w.code)).not.toContain('WARN_PEDAL_TRAVEL_SHARE');
  });

  it('flags a master cylinder that runs out of stroke', () => {
    const short = simpleDesign();
    // hand-derived: the secondary (rear) piston needs 1 + 1310.411/314.159 = 5.17 mm; a 5 mm stroke bottoms
    short.hardware!.master_cylinder!.secondary_stroke_mm = 5;
    const t = pedalTravel(short, stateModels(short));
    expect(t.states[0]!.cases[0]!.point!.bottomed).toBe(true);
    expect(t.warnings.map((w) => w.code)).toContain('WARN_PEDAL_TRAVEL_EXHAUSTED');
  });

  it('diagonal split: each circuit takes half of each axle', () => {
    const diag = simpleDesign();
    diag.hydraulics.circuit_split = 'diagonal';
    const t = pedalTravel(diag, stateModels(diag));
    const p = t.states[0]!.cases[0]!.point!;
    // hand-derived: (1467.491 + 1310.411) / 2 = 1388.951 mm³ per circuit
    expect(p.circuit_volume_mm3.diagonal_1).toBeCloseTo(1388.951, 1);
    expect(p.circuit_volume_mm3.diagonal_2).toBeCloseTo(1388.951, 1);
  });

  it('a disc-only key on a drum axle is reported, not silently ignored', () => {
    const odd = simpleDesign();
    odd.hardware!.rear!.running_clearance_mm = 0.3;
    const t = pedalTravel(odd, stateModels(odd));
    expect(t.warnings.map((w) => w.path)).toContain('hardware.rear.running_clearance_mm');
  });
});

describe('the demo', () => {
  it('lists every default it used and raises no pedal-travel warning', () => {
    const d = demoDesign();
    const t = pedalTravel(d, stateModels(d));
    expect(t.defaults_used).toContain('hardware.pedal_travel_available_mm');
    expect(t.warnings).toEqual([]);
  });
});

describe('pressureForRate: smallest master pressure for a braking rate with some circuits working', () => {
  // hand-derived from zP = f·G1·max(0, p − p_th1) + r·G2·max(0, p2 − p_th2) (design-file spec "Physics"),
  // p2 = min(p, knee) for a limiting valve; f, r = share of each axle the working circuits feed.
  const base = simpleDesign();
  const design: DesignFile = {
    ...base,
    axles: {
      front: { ...base.axles.front, brake: { ...base.axles.front.brake, threshold_pressure_bar: 0.5 } },
      rear: { ...base.axles.rear, brake: { ...base.axles.rear.brake, threshold_pressure_bar: 2 } },
    },
    hydraulics: { ...base.hydraulics, rear_valve: { type: 'limiting', knee_bar: 30 } },
  };
  const s = stateModels(design)[0]!;
  const P = s.loads.P;
  it('front circuit only: p = p_th1 + zP/G1', () => {
    expect(pressureForRate(s, 1, 0, 0.3)! / (0.5e5 + (0.3 * P) / s.G1)).toBeCloseTo(1, 12);
  });
  it('rear circuit only behind the limiting valve: p = p_th2 + zP/G2 up to the knee, unreachable beyond', () => {
    const zKnee = (s.G2 * (30e5 - 2e5)) / P;
    expect(pressureForRate(s, 0, 1, 0.5 * zKnee)! / (2e5 + (0.5 * zKnee * P) / s.G2)).toBeCloseTo(1, 12);
    expect(pressureForRate(s, 0, 1, 1.01 * zKnee)).toBeNull();
  });
  it('both circuits above the knee: the front alone adds rate, p = p_th1 + (zP − G2(knee − p_th2))/G1', () => {
    const zKnee = (s.G1 * (30e5 - 0.5e5) + s.G2 * (30e5 - 2e5)) / P;
    const z = zKnee + 0.1;
    const expected = 0.5e5 + (z * P - s.G2 * (30e5 - 2e5)) / s.G1;
    expect(pressureForRate(s, 1, 1, z)! / expected).toBeCloseTo(1, 12);
    expect(pressureForRate(s, 1, 1, 0)).toBe(0);
  });
});

describe('pedal travel with a balance bar', () => {
  // The simple system with two single master cylinders: front 20 mm, rear 25 mm, 60 % of the pushrod force to
  // the front; strokes 16 mm (front) and 14 mm (rear). hand-derived: λ = (0.4/0.6) · (20/25)² = 0.426667.
  const base = simpleDesign();
  const r0 = readDesign({
    ...base,
    hydraulics: { ...base.hydraulics, balance_bar: { rear_bore_mm: 25, setting_front_share: 0.6 } },
    hardware: { ...base.hardware, master_cylinder: { primary_stroke_mm: 16, secondary_stroke_mm: 14, dead_travel_mm: 1 } },
  });
  if (!r0.ok) throw new Error(JSON.stringify(r0.errors));
  const d = r0.design;
  const r = pedalTravel(d, stateModels(d));
  const cases = r.states[0]!.cases;

  it('pivot travel = s · x_front + (1 − s) · x_rear; a lost cylinder runs to its stop', () => {
    const mc = { area: 1, primaryStroke: 0.016, secondaryStroke: 0.014, deadTravel: 0.001 };
    const bar = { frontArea: 2e-4, rearArea: 4e-4, frontShare: 0.25 };
    // hand-derived: x_f = 0.001 + 2e-6/2e-4 = 0.011 m, x_r = 0.001 + 2e-6/4e-4 = 0.006 m; 0.25 · 0.011 + 0.75 · 0.006 = 0.00725 m
    expect(balanceBarTravel(mc, bar, 2e-6, 2e-6, 'none').travel).toBeCloseTo(0.00725, 12);
    // front lost: 0.25 · 0.016 + 0.75 · 0.006 = 0.0085 m
    expect(balanceBarTravel(mc, bar, 0, 2e-6, 'primary').travel).toBeCloseTo(0.0085, 12);
    // rear lost: 0.25 · 0.011 + 0.75 · 0.014 = 0.01325 m
    expect(balanceBarTravel(mc, bar, 2e-6, 0, 'secondary').travel).toBeCloseTo(0.01325, 12);
    // front needs 0.001 + 4e-6/2e-4 = 0.021 m > 0.016 m stroke
    expect(balanceBarTravel(mc, bar, 4e-6, 0, 'none').bottomed).toBe(true);
  });

  it('service at 5.0 m/s²: rear volume at the real rear pressure, each cylinder by its own bore', () => {
    const c = cases.find((x) => x.case === 'service')!.point!;
    // hand-derived: G2 referred = 50.265 · 0.426667 = 21.4466 N/bar; p = 10000 / (125.664 + 21.4466) = 67.976 bar;
    // rear line 0.426667 · 67.976 = 29.003 bar
    expect(c.master_pressure_bar).toBeCloseTo(67.976, 2);
    expect(c.rear_pressure_bar).toBeCloseTo(29.003, 2);
    // front 785.398 + 12 · 67.976 = 1601.113 mm³; rear 628.319 + 12 · 29.003 = 976.357 mm³
    expect(c.circuit_volume_mm3.front).toBeCloseTo(1601.113, 1);
    expect(c.circuit_volume_mm3.rear).toBeCloseTo(976.357, 1);
    // x_f = 1 + 1601.113/314.159 = 6.0965 mm; x_r = 1 + 976.357/490.874 = 2.9890 mm; pivot 0.6 · 6.0965 + 0.4 · 2.9890 = 4.8535 mm; × 4
    expect(c.pushrod_travel_mm).toBeCloseTo(4.8535, 3);
    expect(c.pedal_travel_mm).toBeCloseTo(19.414, 2);
  });

  it('front circuit failed: the front cylinder runs its 16 mm, the rear reaches 2.2 m/s² alone', () => {
    const c = cases.find((x) => x.case === 'front_circuit_failed')!.point!;
    // hand-derived: rear line 4400 / 50.265 = 87.535 bar (front-referred 205.161 bar); rear 628.319 + 12 · 87.535 = 1678.741 mm³;
    // x_r = 1 + 1678.741/490.874 = 4.4199 mm; pivot 0.6 · 16 + 0.4 · 4.4199 = 11.3680 mm; pedal 45.472 mm
    expect(c.rear_pressure_bar).toBeCloseTo(87.535, 2);
    expect(c.master_pressure_bar).toBeCloseTo(205.161, 2);
    expect(c.pushrod_travel_mm).toBeCloseTo(11.368, 3);
    expect(c.pedal_travel_mm).toBeCloseTo(45.472, 2);
  });

  it('rear circuit failed: the rear cylinder runs its 14 mm, the front reaches 2.2 m/s² alone', () => {
    const c = cases.find((x) => x.case === 'rear_circuit_failed')!.point!;
    // hand-derived: 4400 / 125.664 = 35.014 bar; x_f = 1 + 1205.567/314.159 = 4.8374 mm; pivot 0.6 · 4.8374 + 0.4 · 14 = 8.5025 mm
    expect(c.master_pressure_bar).toBeCloseTo(35.014, 2);
    expect(c.pushrod_travel_mm).toBeCloseTo(8.5025, 3);
    expect(c.pedal_travel_mm).toBeCloseTo(34.01, 2);
    // hand-derived: both cylinders at their stops: 0.6 · 16 + 0.4 · 14 = 15.2 mm
    expect(r.master_cylinder_total_stroke_mm).toBeCloseTo(15.2, 9);
  });

  it('reports primary_feeds as unused with a bar, and the schema refuses a bar on a diagonal split', () => {
    const withFeeds = readDesign({ ...d, hardware: { ...d.hardware, master_cylinder: { ...d.hardware!.master_cylinder, primary_feeds: 'rear' } } });
    if (!withFeeds.ok) throw new Error(JSON.stringify(withFeeds.errors));
    const w = pedalTravel(withFeeds.design, stateModels(withFeeds.design)).warnings;
    expect(w.map((x) => [x.code, x.path])).toContainEqual(['WARN_HARDWARE_KEY_UNUSED', 'hardware.master_cylinder.primary_feeds']);
    const diagonal = readDesign({ ...d, hydraulics: { ...d.hydraulics, circuit_split: 'diagonal' } });
    expect(diagonal.ok).toBe(false);
    if (!diagonal.ok) expect(diagonal.errors.map((e) => e.path)).toEqual(['hydraulics.circuit_split']);
  });
});
