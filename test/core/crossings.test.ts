/**
 * Crossings of the ideal distribution and the critical braking rate.
 * Sources: 71/320/EEC Annex II Appendix point 2 (φ = front share of the braking force, ψ = P1/P,
 * χ = h/E) and point 3.1 (the installed curve crosses the ideal where f1 = f2; for a fixed share φ the
 * crossing is at z = (φ − ψ)/χ), 71/320/EEC Annex II Appendix point 2;
 * design-file spec "Physics" (crossings in (0, 1.5] below lift-off, critical = lowest + to − crossing);
 * hand derivations in the comments.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { utilisation } from '../../core/adhesion-utilisation.ts';
import { axleLoadModel } from '../../core/axle-loads.ts';
import { crossings } from '../../core/crossings.ts';
import { demoDesign } from '../../core/demo.ts';
import type { DesignFile } from '../../core/design.ts';
import type { Distribution } from '../../core/distribution.ts';
import { evaluate, stateModels } from '../../core/evaluate.ts';
import { arbitraryDesign } from './arbitrary-design.ts';
import { limiting, loads, proportioning } from './hand-cases.ts';

const num = (min: number, max: number) => fc.double({ min, max, noNaN: true });

function fixedSplit(P: number, phi: number): Distribution {
  return { P, z: [0, 1], t1: [0, phi * P], t2: [0, (1 - phi) * P] };
}

describe('fixed front share φ (Appendix point 3.1)', () => {
  it('the critical braking rate equals (φ − ψ)/χ, or none when that is not in (0, min(1.5, lift-off)))', () => {
    fc.assert(
      fc.property(num(500, 40000), num(0.3, 0.7), num(0.3, 1.2), num(2, 5), num(0.2, 0.95), (m, share, h, E, phi) => {
        const model = axleLoadModel(m, m * share, h, E);
        const c = crossings(model, fixedSplit(model.P, phi));
        const expected = (phi - model.psi) / model.chi;
        if (expected > 1e-6 && expected < Math.min(1.5, model.zLift) - 1e-6) {
          expect(c.critical).not.toBeNull();
          expect(c.critical!).toBeCloseTo(expected, 9);
          expect(c.rates).toHaveLength(1);
        } else if (expected <= -1e-6 || expected >= Math.min(1.5, model.zLift) + 1e-6) {
          expect(c.critical).toBeNull();
          expect(c.rates).toHaveLength(0);
        }
      }),
      { numRuns: 500 },
    );
  });

  it('through a whole design: 3 front and 2 rear equal pistons, no valve, no thresholds → φ = 0.6', () => {
    // hand-derived: identical sliding calipers except the piston count, so G1 : G2 = 3 : 2, φ = 0.6.
    // State: 2000 kg, front 900 kg → ψ = 0.45; h = 0.5 m, E = 2.5 m → χ = 0.2; (φ − ψ)/χ = 0.15/0.2 = 0.75.
    const d = demoDesign();
    const disc = (n: number) => ({ type: 'disc' as const, caliper: 'sliding' as const, piston_diameters_mm: Array(n).fill(40), effective_radius_m: 0.12, pad_friction: 0.4, threshold_pressure_bar: 0 });
    const design: DesignFile = {
      ...d,
      vehicle: { ...d.vehicle, wheelbase_m: 2.5 },
      load_states: [{ id: 'a', label: 'A', kind: 'laden', mass_kg: 2000, front_axle_kg: 900, cg_height_m: 0.5 }],
      axles: { front: { tyre_radius_m: 0.3, brake: disc(3) }, rear: { tyre_radius_m: 0.3, brake: disc(2) } },
      hydraulics: { ...d.hydraulics, rear_valve: { type: 'none' } },
    };
    const r = evaluate(design).load_states[0]!;
    expect(r.front_share_low_pressure).toBeCloseTo(0.6, 12);
    expect(r.critical_braking_rate).toBeCloseTo(0.75, 10);
    expect(r.critical_braking_rates).toHaveLength(1);
  });
});

describe('hand-derived crossings with valves (hand-cases.ts: ψ = 0.5, χ = 0.25, φ = 0.6, lift-off z = 2)', () => {
  it('limiting valve, knee at z = 0.5: crossings 0.4, 1 − √0.2, 1 + √0.2; critical 0.4', () => {
    // Below the knee the share is φ = 0.6: (φ − ψ)/χ = 0.1/0.25 = 0.4, front over-braked before (+ to −).
    // Above the knee T2 = 0.2P, T1 = P(z − 0.2): D/P = T1/P − z N1/P = z − 0.2 − z(0.5 + 0.25z)
    //   = −0.25z² + 0.5z − 0.2 = 0 → z² − 2z + 0.8 = 0 → z = 1 ± √0.2 = 0.5527864, 1.4472136,
    //   both in (0.5, 1.5]; D < 0 between 0.5 and 0.5528 (− to +), > 0 up to 1.4472 (+ to −).
    const c = crossings(loads, limiting);
    expect(c.rates).toHaveLength(3);
    expect(c.rates[0]).toBeCloseTo(0.4, 12);
    expect(c.rates[1]).toBeCloseTo(1 - Math.sqrt(0.2), 12);
    expect(c.rates[2]).toBeCloseTo(1 + Math.sqrt(0.2), 12);
    expect(c.critical).toBeCloseTo(0.4, 12);
  });

  it('proportioning valve 30 bar / 0.25 (knee at z = 0.3): one crossing (10 + √39.52)/14; it is the critical rate', () => {
    // Below the knee φ = 0.6 would cross at 0.4, but the knee (z = 0.3) comes first: no crossing there.
    // Above: z = 0.007x + 0.09 (x = master bar), T1/P = 0.006x = (6/7)(z − 0.09).
    // D/P = (6/7)(z − 0.09) − z(0.5 + 0.25z) = 0 → ×28: 7z² − 10z + 2.16 = 0
    //   → z = (10 ± √39.52)/14 = 0.26525 (below the knee: not on this piece) or 1.163321.
    const c = crossings(loads, proportioning);
    expect(c.rates).toHaveLength(1);
    expect(c.rates[0]).toBeCloseTo((10 + Math.sqrt(39.52)) / 14, 12);
    expect(c.critical).toBeCloseTo((10 + Math.sqrt(39.52)) / 14, 12);
  });

  it('a crossing from − to + alone is not a critical rate (rear first at low z, front above)', () => {
    // Fixed split φ = 0.3 < ψ = 0.5 cannot cross; take instead rear-only braking up to z = 0.1 then φ = 0.9:
    // T1/P = 0 for z ≤ 0.1 and 0.9(z − 0.1) above. D/P = 0.9(z − 0.1) − z(0.5 + 0.25z) = 0
    //   → 0.25z² − 0.4z + 0.09 = 0 → z = (0.4 ± √(0.16 − 0.09))/0.5 = 0.8 ± 2√0.07 = 0.270850, 1.329150.
    // Rear first below 0.2709 (− to + there), front first to 1.3292 (+ to −): critical is 1.3292.
    const P = loads.P;
    const d: Distribution = { P, z: [0, 0.1, 1], t1: [0, 0, 0.9 * 0.9 * P], t2: [0, 0.1 * P, 0.1 * P + 0.1 * 0.9 * P] };
    const c = crossings(loads, d);
    expect(c.rates).toHaveLength(2);
    expect(c.rates[0]).toBeCloseTo(0.8 - 2 * Math.sqrt(0.07), 12);
    expect(c.critical).toBeCloseTo(0.8 + 2 * Math.sqrt(0.07), 12);
  });
});

describe('properties over random valid designs (fast-check)', () => {
  it('every reported crossing is a sign change of f1 − f2, ascending, in (0, 1.5] below lift-off; none missed on a fine grid', () => {
    fc.assert(
      fc.property(arbitraryDesign, (design) => {
        for (const s of stateModels(design)) {
          const c = crossings(s.loads, s.dist);
          const zMax = Math.min(1.5, s.loads.zLift);
          const diff = (z: number) => {
            const u = utilisation(s.loads, s.dist, z);
            return u.front! - u.rear!;
          };
          for (let i = 0; i < c.rates.length; i++) {
            const r = c.rates[i]!;
            expect(r).toBeGreaterThan(0);
            expect(r).toBeLessThanOrEqual(zMax);
            if (i > 0) expect(r).toBeGreaterThan(c.rates[i - 1]!);
            const eps = Math.min(1e-6, r / 4, (zMax - r) / 4);
            const left = diff(r - eps);
            const right = diff(r + eps);
            expect(Math.sign(left) * Math.sign(right)).toBe(-1);
          }
          // the critical rate is the first + to − crossing
          const firstPlusToMinus = c.rates.find((r) => diff(r - Math.min(1e-6, r / 4)) > 0);
          expect(c.critical).toBe(firstPlusToMinus ?? null);
          // no sign change on a grid of 300 steps goes unreported
          const n = 300;
          let prev = diff(zMax / n / 2);
          for (let i = 1; i < n; i++) {
            const z = (zMax * (i + 0.5)) / n;
            const cur = diff(z);
            if (Math.abs(prev) > 1e-9 && Math.abs(cur) > 1e-9 && Math.sign(prev) !== Math.sign(cur)) {
              const lo = (zMax * (i - 0.5)) / n;
              expect(c.rates.some((r) => r >= lo - 1e-9 && r <= z + 1e-9)).toBe(true);
            }
            prev = cur;
          }
        }
      }),
      { numRuns: 200 },
    );
  });
});
