/**
 * Lines of the braking-force diagram, in braking forces over vehicle weight (x = T1/P front, y = T2/P rear), for a
 * load state with static front share ψ = P1/P and χ = h/E (CG height over wheelbase). Pure, dimensionless.
 *
 * Axle loads while braking at rate z: N1 = P(ψ + χz), N2 = P(1 − ψ − χz), with z = x + y (the axle-load law of
 * core/axle-loads.ts). Hence
 *   ideal distribution at z (both axles at adhesion z):  x = z(ψ + χz),  y = z(1 − ψ − χz);
 *   front axle locks at adhesion k (T1 = k N1):          x = k(ψ + χy) / (1 − kχ);
 *   rear axle locks at adhesion k (T2 = k N2):           y = k(1 − ψ − χx) / (1 + kχ).
 * The lock lines are straight lines of the diagram (common practice, no source: derived here from the load law).
 */

export interface DiagramLine {
  x: [number, number];
  y: [number, number];
}

/** The point of the ideal distribution at braking rate z. */
export function idealPointPerWeight(psi: number, chi: number, z: number): { x: number; y: number } {
  return { x: z * (psi + z * chi), y: z * (1 - psi - z * chi) };
}

/** The front-lock line at adhesion k from y = 0 to y = yMax; null when kχ ≥ 1 (the front never locks). */
export function frontLockLine(psi: number, chi: number, k: number, yMax: number): DiagramLine | null {
  if (k * chi >= 1) return null;
  return { x: [(k * psi) / (1 - k * chi), (k * (psi + chi * yMax)) / (1 - k * chi)], y: [0, yMax] };
}

/** The rear-lock line at adhesion k from x = 0 to x = xMax. */
export function rearLockLine(psi: number, chi: number, k: number, xMax: number): DiagramLine {
  return { x: [0, xMax], y: [(k * (1 - psi)) / (1 + k * chi), (k * (1 - psi - chi * xMax)) / (1 + k * chi)] };
}
