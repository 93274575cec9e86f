/**
 * A small seeded pseudo-random generator for the robustness analysis, so that a Monte Carlo run is
 * reproducible from its seed (the core never calls Math.random).
 *  - mulberry32: a 32-bit state generator (public-domain construction, constants from memory),
 *    uniform on [0, 1) with 2^-32 resolution; ample for probability estimates of the order 1e-3.
 *  - standard normal draws by the Box–Muller transform (both values of each pair are used).
 */

export interface Prng {
  /** Uniform on [0, 1). */
  uniform(): number;
  /** Standard normal (mean 0, standard deviation 1). */
  normal(): number;
}

export function mulberry32(seed: number): Prng {
  let a = seed >>> 0;
  let spare = NaN;
  const uniform = (): number => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = (): number => {
    if (spare === spare) {
      const v = spare;
      spare = NaN;
      return v;
    }
    let u1 = uniform();
    while (u1 <= 0) u1 = uniform();
    const u2 = uniform();
    const r = Math.sqrt(-2 * Math.log(u1));
    const th = 2 * Math.PI * u2;
    spare = r * Math.sin(th);
    return r * Math.cos(th);
  };
  return { uniform, normal };
}
