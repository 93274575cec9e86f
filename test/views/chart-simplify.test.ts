/**
 * simplifyLine (views/chart.ts): straight runs of a sampled curve travel as their end points; curved parts and
 * gaps are kept. Expected points are hand-derived below.
 */
import { describe, expect, it } from 'vitest';
import { simplifyLine } from '../../views/chart.ts';

describe('simplifyLine', () => {
  it('a line with one knee keeps only its ends and the knee', () => {
    // hand-derived: y = 2x up to x = 0.5 (y = 1), then y = 1 + 0.5(x − 0.5): breakpoints (0,0), (0.5,1), (1,1.25)
    const x = Array.from({ length: 101 }, (_, i) => i / 100);
    const y = x.map((v) => (v <= 0.5 ? 2 * v : 1 + 0.5 * (v - 0.5)));
    const s = simplifyLine(x, y);
    expect(s.x).toEqual([0, 0.5, 1]);
    expect(s.y[0]).toBe(0);
    expect(s.y[1]).toBeCloseTo(1, 12);
    expect(s.y[2]).toBeCloseTo(1.25, 12);
  });

  it('a parabola keeps its points (no chord is within 1e-5 of the span)', () => {
    // hand-derived: the middle of a chord of y = x² over Δx = 0.1 is off the curve by (Δx/2)² = 0.0025 ≫ 1e-5
    const x = Array.from({ length: 11 }, (_, i) => i / 10);
    const s = simplifyLine(x, x.map((v) => v * v));
    expect(s.x).toEqual(x);
  });

  it('keeps gaps (null) and the points on both sides of them', () => {
    const s = simplifyLine([0, 1, 2, null, 3, 4, 5], [0, 1, 2, null, 3, 4, 5]);
    expect(s.x).toEqual([0, 2, null, 3, 5]);
    expect(s.y).toEqual([0, 2, null, 3, 5]);
  });
});
