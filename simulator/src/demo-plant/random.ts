/**
 * Seeded random numbers for the demo plant, so that a run can be replayed: the same seed gives the
 * same noise, the same operator moves and the same readings.
 */
import { seededUniform } from '../lib/seeded-random.js';

export { seededUniform };

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
