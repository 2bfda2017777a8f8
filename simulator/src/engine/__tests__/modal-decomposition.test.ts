import { describe, expect, it } from 'vitest';
import { multiplyVector } from '../dense.js';
import { modalDecomposition } from '../modal-decomposition.js';
import { transitionMatrix } from '../transition.js';
import { randomMatrix, seededRandom } from './seeded-random.js';

describe('modalDecomposition', () => {
  it('sums to A^k x0 for every k (seeded matrices with complex pairs, relative 1e-10)', () => {
    const random = seededRandom(41);
    let pairs = 0;
    for (const n of [2, 5, 12, 30]) {
      const A = randomMatrix(random, n, n, 1.1 / Math.sqrt(n));
      const x0 = Array.from({ length: n }, () => 2 * random() - 1);
      const steps = 25;
      const modes = modalDecomposition(A, x0, steps);
      pairs += modes.filter((m) => m.conjugatePair).length;
      for (let k = 0; k <= steps; k++) {
        const expected = multiplyVector(transitionMatrix(A, k), x0);
        const scale = Math.max(1, ...expected.map(Math.abs));
        expected.forEach((x, i) => {
          const sum = modes.reduce((s, m) => s + m.contribution[k][i], 0);
          expect(Math.abs(sum - x)).toBeLessThanOrEqual(1e-10 * scale);
        });
      }
    }
    expect(pairs).toBeGreaterThan(5);
  });

  it('uses coefficients α = vᵀx0 with vᵀw = 1: x0 = Σ α w (+ conjugates)', () => {
    const random = seededRandom(42);
    const A = randomMatrix(random, 6, 6);
    const x0 = [1, -2, 0.5, 3, 0, 1];
    const modes = modalDecomposition(A, x0, 0);
    x0.forEach((x, i) => {
      const sum = modes.reduce((s, m) => {
        const { re, im } = m.eigenvector[i];
        const real = m.coefficient.re * re - m.coefficient.im * im;
        return s + (m.conjugatePair ? 2 * real : real);
      }, 0);
      expect(sum).toBeCloseTo(x, 12);
    });
  });

  it('refuses a defective matrix with a clear message', () => {
    expect(() =>
      modalDecomposition(
        [
          [0.9, 1],
          [0, 0.9],
        ],
        [1, 1],
        3,
      ),
    ).toThrow(/defective.*transitionMatrix/);
  });

  it('checks the length of x0', () => {
    expect(() => modalDecomposition([[0.5]], [1, 2], 3)).toThrow(/x0 must have length 1/);
  });
});
