import { expect } from 'vitest';
import { seededUniform } from '../../simulator/src/lib/seeded-random.js';

/** Deterministic uniform generator on [0, 1) (mulberry32), so every cross-check sees the same matrices. */
export const seededRandom = seededUniform;

/** rows×columns matrix with entries uniform on [−scale, scale). */
export function randomMatrix(random: () => number, rows: number, columns: number, scale = 1): number[][] {
  return Array.from({ length: rows }, () => Array.from({ length: columns }, () => scale * (2 * random() - 1)));
}

/** |actual − expected| ≤ tolerance, with both values in the failure message. */
export function expectWithin(actual: number, expected: number, tolerance: number): void {
  const ok = Math.abs(actual - expected) <= tolerance;
  expect(ok, `${actual} differs from ${expected} by more than ${tolerance}`).toBe(true);
}

/** Element-wise |X − Y| ≤ tolerance · max(1, max|Y|): relative to the size of the reference. */
export function expectMatrixClose(actual: number[][], expected: number[][], relativeTolerance: number): void {
  expect(actual.length).toBe(expected.length);
  const scale = Math.max(1, ...expected.flat().map(Math.abs));
  actual.forEach((row, i) => {
    expect(row.length).toBe(expected[i].length);
    row.forEach((x, j) => expectWithin(x, expected[i][j], relativeTolerance * scale));
  });
}

/** A printed table value: within half a unit of its last printed digit, e.g. 26.6 → ±0.05. */
export function expectMatchesPrinted(actual: number, printed: string): void {
  const decimals = printed.includes('.') ? printed.split('.')[1].length : 0;
  expectWithin(actual, Number(printed), 0.5 * 10 ** -decimals);
}

/** Sorts complex numbers by real part, then imaginary part (for spectra whose real parts differ clearly). */
export function sortComplex<T extends { re: number; im: number }>(values: T[]): T[] {
  return [...values].sort((a, b) => a.re - b.re || a.im - b.im);
}

/**
 * Pairs each expected eigenvalue with the nearest not yet used computed one and checks the distance;
 * robust where sorting is not (equal real parts that differ only by rounding).
 */
export function expectSameSpectrum(
  actual: { re: number; im: number }[],
  expected: { re: number; im: number }[],
  tolerance: number,
): void {
  expect(actual).toHaveLength(expected.length);
  const unused = [...actual];
  for (const e of expected) {
    let best = 0;
    unused.forEach((a, i) => {
      if (Math.hypot(a.re - e.re, a.im - e.im) < Math.hypot(unused[best].re - e.re, unused[best].im - e.im)) best = i;
    });
    const [nearest] = unused.splice(best, 1);
    const distance = Math.hypot(nearest.re - e.re, nearest.im - e.im);
    expect(distance, `eigenvalue ${e.re} + ${e.im}i: nearest computed is ${distance} away`).toBeLessThanOrEqual(
      tolerance,
    );
  }
}
