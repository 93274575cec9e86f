/**
 * fast-check generators of valid, realistic design files for the property tests (not a test file).
 * Ranges are typical of passenger cars to light trucks ("common practice, no source"): wheelbase
 * 2.2–4.5 m, mass 800–5000 kg, static front share 0.38–0.62, CG height 0.35–1.1 m; front thresholds
 * 0–1 bar, rear 0–5 bar (as the task asks); every rear-valve type.
 */
import fc from 'fast-check';
import type { DesignFile } from '../../core/design.ts';

const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

const discBrake = (thresholdMax: number) =>
  fc.record({
    type: fc.constant('disc' as const),
    caliper: fc.constantFrom('sliding' as const, 'fixed' as const),
    piston_diameters_mm: fc.array(num(30, 60), { minLength: 1, maxLength: 4 }),
    effective_radius_m: num(0.08, 0.17),
    pad_friction: num(0.3, 0.5),
    threshold_pressure_bar: num(0, thresholdMax),
  })
  // a fixed (opposed-piston) caliper lists the pistons of both sides: an even count (the schema refuses odd)
  .map((b) => (b.caliper === 'fixed' && b.piston_diameters_mm.length % 2 === 1 ? { ...b, piston_diameters_mm: [...b.piston_diameters_mm, ...b.piston_diameters_mm] } : b));

const drumBrake = (thresholdMax: number) =>
  fc.record({
    type: fc.constant('drum' as const),
    wheel_cylinder_diameter_mm: num(15, 28),
    drum_radius_m: num(0.1, 0.16),
    brake_factor: num(1, 4),
    threshold_pressure_bar: num(0, thresholdMax),
  });

const rearValve = fc.oneof(
  fc.constant({ type: 'none' as const }),
  fc.record({ type: fc.constant('limiting' as const), knee_bar: num(5, 80) }),
  fc.record({ type: fc.constant('proportioning' as const), knee_bar: num(5, 80), ratio: num(0.1, 1) }),
  fc
    .record({
      type: fc.constant('load_sensing' as const),
      ratio: num(0.1, 1),
      start: num(300, 2000),
      steps: fc.array(fc.tuple(num(50, 800), num(5, 80)), { minLength: 1, maxLength: 4 }),
      senses: fc.constantFrom(undefined, 'static' as const, 'dynamic' as const),
    })
    .map(({ type, ratio, start, steps, senses }) => {
      let kg = start;
      // the knee rises (or stays) with the rear axle load, as the schema requires
      const bars = steps.map(([, bar]) => bar).sort((a, b) => a - b);
      const table: [number, number][] = steps.map(([dk], i) => {
        kg += dk;
        return [kg, bars[i]!];
      });
      return { type, ratio, knee_bar_at_rear_axle_kg: table, ...(senses ? { senses } : {}) };
    }),
);

const loadState = (i: number, wheelbase: number) =>
  fc.record({ mass: num(800, 5000), share: num(0.38, 0.62), h: num(0.35, Math.min(1.1, 0.45 * wheelbase)) }).map(({ mass, share, h }) => ({
    id: `s${i}`,
    label: `State ${i}`,
    kind: (i === 0 ? 'unladen' : i === 1 ? 'laden' : 'other') as 'unladen' | 'laden' | 'other',
    mass_kg: mass,
    front_axle_kg: mass * share,
    cg_height_m: h,
  }));

export const arbitraryDesign: fc.Arbitrary<DesignFile> = num(2.2, 4.5).chain((wheelbase) =>
  fc.record({
    format: fc.constant('lockstep-design/1' as const),
    name: fc.constant('Property-test design'),
    vehicle: fc.record({
      category: fc.constantFrom('M1' as const, 'N1' as const, 'N2' as const),
      wheelbase_m: fc.constant(wheelbase),
      abs: fc.boolean(),
      drive: fc.constantFrom('front' as const, 'rear' as const, 'all' as const),
    }),
    load_states: fc.integer({ min: 1, max: 3 }).chain((n) => fc.tuple(...Array.from({ length: n }, (_, i) => loadState(i, wheelbase)))),
    axles: fc.record({
      front: fc.record({ tyre_radius_m: num(0.28, 0.42), brake: discBrake(1) }),
      rear: fc.record({ tyre_radius_m: num(0.28, 0.42), brake: fc.oneof(discBrake(5), drumBrake(5)) }),
    }),
    hydraulics: fc.record(
      {
        master_cylinder_bore_mm: num(19, 32),
        pedal_ratio: num(3, 5),
        booster_ratio: num(1, 8),
        booster_runout_bar: num(40, 120),
        circuit_split: fc.constantFrom('front_rear' as const, 'diagonal' as const),
        rear_valve: rearValve,
      },
      { requiredKeys: ['master_cylinder_bore_mm', 'pedal_ratio', 'booster_ratio', 'circuit_split', 'rear_valve'] },
    ),
  }),
);
