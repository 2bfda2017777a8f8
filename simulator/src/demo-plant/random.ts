/**
 * Seeded random numbers for the demo plant, so that a run can be replayed: the same seed gives the
 * same noise, the same operator moves and the same readings.
 */

/** Uniform on [0, 1) (mulberry32, a 32-bit generator with a full period of 2^32). */
export function seededUniform(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), a | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Standard normal deviates by the Box–Muller transform (G. E. P. Box, M. E. Muller, Ann. Math.
 * Statist. 29(2), 1958): each pair of uniforms gives two independent normals; the second is kept
 * for the next call, so nothing is allocated per draw.
 */
export function seededNormal(seed: number): () => number {
  const uniform = seededUniform(seed);
  let spare = 0;
  let hasSpare = false;
  return () => {
    if (hasSpare) {
      hasSpare = false;
      return spare;
    }
    const u1 = 1 - uniform(); // (0, 1]: the logarithm stays finite
    const u2 = uniform();
    const radius = Math.sqrt(-2 * Math.log(u1));
    spare = radius * Math.sin(2 * Math.PI * u2);
    hasSpare = true;
    return radius * Math.cos(2 * Math.PI * u2);
  };
}

/** A uniform draw on [0, 1) fixed by (seed, index): the same index always gives the same value. */
export function uniformAt(seed: number, index: number): number {
  return seededUniform((Math.imul(seed >>> 0, 0x9e3779b1) ^ Math.imul(index >>> 0, 0x85ebca6b)) >>> 0)();
}
