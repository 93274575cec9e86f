/**
 * Plot series of the limit lines (core/checks/limit-series.ts) for chart B, checked against the
 * lines of 71/320/EEC Annex II Appendix point 3.1.1 (source of every expected line).
 */
import { describe, expect, it } from 'vitest';
import { limitSeries } from '../../../core/checks/limit-series.ts';

describe('limitSeries', () => {
  it('N1: efficiency line ends at (0.61, 0.80); corridor k = z ± 0.08 on 0.15–0.30 and k = 2z − 0.42 on 0.50–0.61', () => {
    const s = limitSeries('N1', ['eu-appendix']);
    const eff = s.find((x) => x.rule === 'eu-appendix/efficiency' && x.axle === 'rear')!;
    expect(eff.braking_rate).toEqual([0.1, 0.61]);
    expect(eff.adhesion[0]).toBeCloseTo(0.2, 12); // 0.20 + (0.10 − 0.10)/0.85
    expect(eff.adhesion[1]).toBeCloseTo(0.8, 12); // 0.20 + 0.51/0.85
    const upper = s.find((x) => x.branch === 'corridor' && x.axle === 'front' && x.kind === 'upper')!;
    expect(upper.adhesion[0]).toBeCloseTo(0.23, 12);
    const last = s.find((x) => x.branch === 'corridor' && x.braking_rate[0] === 0.5)!;
    expect(last.adhesion[0]).toBeCloseTo(0.58, 12);
    expect(last.adhesion[1]).toBeCloseTo(0.8, 12);
  });

  it('M1: the inversion line k = z + 0.05 over 0.30–0.45; no lines from rule sets that do not cover the category', () => {
    const s = limitSeries('M1');
    const inv = s.find((x) => x.branch === 'inversion-allowance')!;
    expect(inv.braking_rate).toEqual([0.3, 0.45]);
    expect(inv.adhesion[1]).toBeCloseTo(0.5, 12);
    expect(limitSeries('N3', ['un-r13h'])).toEqual([]);
    // other categories: z ≥ 0.30 + 0.74 (k − 0.38) gives k = 0.38 at z = 0.30 and k = 0.38 + 0.31/0.74 at 0.61
    const rel = limitSeries('N3', ['eu-appendix']).find((x) => x.braking_rate[0] === 0.3)!;
    expect(rel.adhesion[0]).toBeCloseTo(0.38, 12);
    expect(rel.adhesion[1]).toBeCloseTo(0.38 + 0.31 / 0.74, 12);
    expect(rel.status).toBe('memory');
  });
});
