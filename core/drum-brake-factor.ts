/**
 * Drum brake factor C* (total drum drag over one actuating force) as a function of lining friction μ
 * for the common shoe arrangements, for the robustness analysis (how a change of friction moves the
 * split). Simple rigid-shoe geometry, formulas of the textbook kind, from memory: a shoe pivoted at one
 * end, actuated at the other with lever arm h about the pivot, the resultant normal force acting at arm
 * c about the pivot; with H = h/r and K = c/r (r drum radius):
 *   leading shoe  C_L = μ·H / (K − μ)   (friction moment adds to the actuating moment: self-energising)
 *   trailing shoe C_T = μ·H / (K + μ)
 *   leading-trailing (simplex):  C* = C_L + C_T = 2·μ·H·K / (K² − μ²)
 *   two-leading (duplex):        C* = 2·C_L = 2·μ·H / (K − μ)
 *   duo-servo: the primary (leading) shoe's output pushes the secondary, which gets the actuating force
 *   plus the primary's drag: C* = C_L + C_L·(1 + C_L) = C_L·(2 + C_L).
 * K = 1 (normal-force arm equal to the drum radius) is taken as the simple geometry (from memory, common
 * practice, no source); H then follows from the design's nominal C* at the nominal friction, so only the
 * shape of C*(μ) comes from the formula. Not valid near μ = K (self-locking): friction is capped at 0.9 K.
 */
export const SHOE_ARRANGEMENTS = ['leading_trailing', 'two_leading', 'duo_servo'] as const;
export type ShoeArrangement = (typeof SHOE_ARRANGEMENTS)[number];

/** Nominal lining friction the design's brake factor is taken to hold at (common practice, no source). */
export const NOMINAL_LINING_FRICTION = 0.38;
const K = 1;

/** C* for H = 1 at friction μ. */
function shape(arr: ShoeArrangement, mu: number): number {
  const m = Math.min(mu, 0.9 * K);
  const lead = m / (K - m);
  switch (arr) {
    case 'leading_trailing':
      return (2 * m * K) / (K * K - m * m);
    case 'two_leading':
      return 2 * lead;
    case 'duo_servo':
      // C_L(2 + C_L) with C_L = μH/(K − μ): not linear in H, so H is solved from the nominal below
      return lead;
  }
}

/** C*(μ) for an arrangement, scaled so that C*(NOMINAL_LINING_FRICTION) = nominal. */
export function brakeFactorAtFriction(arr: ShoeArrangement, nominal: number, mu: number): number {
  const mu0 = NOMINAL_LINING_FRICTION;
  if (arr !== 'duo_servo') return (nominal * shape(arr, mu)) / shape(arr, mu0);
  // C* = C_L(2 + C_L): C_L at the nominal from C_L² + 2 C_L − C* = 0, then H = C_L (K − μ0)/μ0
  const cl0 = -1 + Math.sqrt(1 + nominal);
  const H = cl0 / shape(arr, mu0);
  const cl = H * shape(arr, mu);
  return cl * (2 + cl);
}
