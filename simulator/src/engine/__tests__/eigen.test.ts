import { Matrix as MlMatrix, inverse } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { eigenSystem } from '../eigen.js';
import { maxAbsDifference, randomMatrix, seededRandom } from './seeded-random.js';

/** Real block-diagonal Λ that pairs with the real eigenvector basis: `A V = V Λ`. */
function realEigenvalueBlocks(values: { re: number; im: number }[]): number[][] {
  const n = values.length;
  const L = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let j = 0; j < n; j++) {
    L[j][j] = values[j].re;
    if (values[j].im > 0) {
      L[j][j + 1] = values[j].im;
      L[j + 1][j] = -values[j].im;
      L[j + 1][j + 1] = values[j].re;
      j++;
    }
  }
  return L;
}

describe('eigen-decomposition', () => {
  it('reconstructs A = W Λ W^{-1} when not defective (relative 1e-10, seeded up to 50×50)', () => {
    const random = seededRandom(21);
    for (const n of [2, 3, 7, 20, 50]) {
      const A = randomMatrix(random, n, n);
      const system = eigenSystem(A);
      expect(system.defective).toBe(false);
      const V = system.basis;
      const rebuilt = V.mmul(new MlMatrix(realEigenvalueBlocks(system.values))).mmul(inverse(V));
      expect(maxAbsDifference(rebuilt.to2DArray(), A)).toBeLessThan(1e-10 * n);
    }
  });

  it('returns unit eigenvectors with the largest component real and positive', () => {
    const system = eigenSystem(randomMatrix(seededRandom(3), 6, 6));
    system.values.forEach((v, j) => {
      if (v.im < 0) return;
      const re = system.basis.getColumn(j);
      const im = v.im > 0 ? system.basis.getColumn(j + 1) : re.map(() => 0);
      const norm = Math.sqrt(re.reduce((s, r, i) => s + r * r + im[i] * im[i], 0));
      expect(norm).toBeCloseTo(1, 14);
      const pivot = re.reduce(
        (best, _, i) => (Math.hypot(re[i], im[i]) > Math.hypot(re[best], im[best]) ? i : best),
        0,
      );
      expect(re[pivot]).toBeGreaterThan(0);
      expect(Math.abs(im[pivot])).toBeLessThan(1e-15);
    });
  });
});
