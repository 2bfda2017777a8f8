/**
 * The one seeded uniform generator of the project: the demo plant's noise, benches and tests draw
 * from it, so a seed always means the same numbers.
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
