/**
 * The generic curve checker (core/checks/curve-check.ts) against an independent dense scan of the
 * closed-form utilisations (cross-check only) on random two-piece distributions, and against
 * hand-derived values. Rule data: 71/320/EEC Annex II Appendix point 3.1.1 (eu-appendix).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { frontAxleLoad, rearAxleLoad } from '../../../core/axle-loads.ts';
import { checkBranch, checkCurveRule, curveRulePasses } from '../../../core/checks/curve-check.ts';
import { forcesAt, type Distribution } from '../../../core/distribution.ts';
import { euAppendix, M1_LOCK_BRANCHES, N1_LOCK_BRANCHES } from '../../../core/rules/eu-appendix.ts';
import type { Branch, CurveRule } from '../../../core/rules/rule-types.ts';
import { axleLoadModel } from '../../../core/axle-loads.ts';
import { fixedSplit, loads, P, scanMin } from './fixed-split.ts';

/** Random two-piece distributions: front share φ up to z_k, then the rear force grows at `rearSlope` of the total. */
const twoPieceArb = fc.tuple(
  fc.double({ min: 0.35, max: 0.65, noNaN: true }), // ψ
  fc.double({ min: 0.1, max: 0.35, noNaN: true }), // χ
  fc.double({ min: 0.2, max: 0.8, noNaN: true }), // z_k
  fc.double({ min: 0.0, max: 1.0, noNaN: true }), // rear slope above z_k
  fc.double({ min: 0.35, max: 0.8, noNaN: true }), // φ
);
function twoPiece([psi, chi, zk, rearSlope, phi]: [number, number, number, number, number]) {
  const m = axleLoadModel(1000, 1000 * psi, chi * 2.5, 2.5);
  const t2k = (1 - phi) * zk * m.P;
  const d: Distribution = {
    P: m.P,
    z: [0, zk, 1],
    t1: [0, phi * zk * m.P, m.P - t2k - rearSlope * (1 - zk) * m.P],
    t2: [0, t2k, t2k + rearSlope * (1 - zk) * m.P],
  };
  return { m, d };
}

function marginAt(branch: Branch, d: Distribution, m: typeof loads, z: number): number | null {
  const piece = branch.pieces.find((p) => z >= p.z[0] && z <= p.z[1]);
  if (!piece) return null;
  const f = forcesAt(d, z);
  const u1 = f.front / frontAxleLoad(m, z);
  const u2 = f.rear / rearAxleLoad(m, z);
  let worst = Infinity;
  for (const clause of piece.all_of) {
    let best = -Infinity;
    for (const c of clause) {
      const v =
        c.type === 'front_above_rear'
          ? u1 - u2
          : c.type === 'at_most'
            ? c.line.intercept + c.line.slope * z - (c.axle === 'front' ? u1 : u2)
            : (c.axle === 'front' ? u1 : u2) - c.line.intercept - c.line.slope * z;
      best = Math.max(best, v);
    }
    worst = Math.min(worst, best);
  }
  return worst;
}

describe('checkBranch: exact per piece, cross-checked by a dense scan', () => {
  it('property: the exact worst margin is never above the scan minimum, and within 1e-5 of it', () => {
    const branches = [...M1_LOCK_BRANCHES, ...N1_LOCK_BRANCHES, ...euAppendix.rules.filter((r): r is CurveRule => r.kind === 'curve').flatMap((r) => r.branches)];
    fc.assert(
      fc.property(
        twoPieceArb,
        fc.integer({ min: 0, max: branches.length - 1 }),
        (args, bi) => {
          const { m, d } = twoPiece(args);
          const zk = args[2];
          const b = branches[bi]!;
          const v = checkBranch(b, m, d);
          if (v.lift_off_in_range || v.worst_margin === null) return;
          let scan = Infinity;
          for (const p of b.pieces) {
            const one = { ...b, pieces: [p] };
            scan = Math.min(scan, scanMin((z) => marginAt(one, d, m, z)!, p.z[0], Math.min(p.z[1], m.zLift * 0.999), 4000).min);
            // the grid plus the distribution's kink (a grid alone can step over a corner minimum)
            if (zk >= p.z[0] && zk <= p.z[1]) scan = Math.min(scan, marginAt(one, d, m, zk)!);
          }
          expect(v.worst_margin).toBeLessThanOrEqual(scan + 1e-12);
          expect(v.worst_margin).toBeGreaterThan(scan - 1e-5);
          // failing ranges: margin negative at their midpoints, and the verdict agrees with the sign of the worst margin
          for (const [a, c] of v.failing_ranges) expect(marginAt(b, d, m, (a + c) / 2)!).toBeLessThan(0);
          expect(v.passed).toBe(v.worst_margin >= -1e-9);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('rear-axle lift-off inside the range counts as failing above it', () => {
    // ψ = 0.7, χ = 0.5: lift-off at z = (1 − ψ)/χ = 0.6 < 0.80 (M1 range end)
    const m = axleLoadModel(1000, 700, 1.25, 2.5);
    const d: Distribution = { P: m.P, z: [0, 1], t1: [0, 0.9 * m.P], t2: [0, 0.1 * m.P] };
    const v = checkCurveRule(euAppendix.rules.find((r) => r.id === 'eu-appendix/lock-order' && r.categories.includes('M1')) as CurveRule, m, d);
    expect(v.passed).toBe(false);
    const last = v.failing_ranges[v.failing_ranges.length - 1]!;
    expect(last[1]).toBe(0.8);
    expect(last[0]).toBeLessThanOrEqual(0.6 + 1e-9);
    expect(v.branches[0]!.lift_off_in_range).toBe(true);
  });

  it('a margin of exactly zero at a range end passes (φ = 0.6 crosses at z* = 0.50, the N1 range end)', () => {
    const v = checkBranch(N1_LOCK_BRANCHES[0]!, loads, fixedSplit(0.6));
    expect(v.passed).toBe(true);
    expect(Math.abs(v.worst_margin!)).toBeLessThan(1e-12);
    expect(P).toBeGreaterThan(0);
  });
});

describe('curveRulePasses: the pass/fail shortcut gives the verdict of the full check', () => {
  const rules = euAppendix.rules.filter((r): r is CurveRule => r.kind === 'curve');

  it('property: equals checkCurveRule(...).passed on random two-piece distributions', () => {
    fc.assert(
      fc.property(
        twoPieceArb,
        fc.integer({ min: 0, max: rules.length - 1 }),
        (args, ri) => {
          const { m, d } = twoPiece(args);
          const rule = rules[ri]!;
          expect(curveRulePasses(rule, m, d)).toBe(checkCurveRule(rule, m, d).passed);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('agrees on both sides of the N1 lock-order edge of a fixed split (φ 0.536 passes, 0.535 fails; eu-appendix tests, hand-derived)', () => {
    const lockN1 = rules.find((r) => r.id === 'eu-appendix/lock-order' && r.categories.includes('N1'))!;
    for (const phi of [0.535, 0.536, 0.5355, 0.6, 0.4]) {
      expect(curveRulePasses(lockN1, loads, fixedSplit(phi))).toBe(checkCurveRule(lockN1, loads, fixedSplit(phi)).passed);
    }
    expect(curveRulePasses(lockN1, loads, fixedSplit(0.536))).toBe(true);
    expect(curveRulePasses(lockN1, loads, fixedSplit(0.535))).toBe(false);
  });
});
