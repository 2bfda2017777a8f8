import { describe, expect, it } from 'vitest';
import { multiply, identity } from '../dense.js';
import { stepResponse, stepResponseSeries, steadyStateGain } from '../step-response.js';
import { transitionMatrix } from '../transition.js';
import { maxAbs, maxAbsDifference, randomMatrix, seededRandom } from './seeded-random.js';

/** Scales a random matrix to spectral radius below 1 by a norm bound (‖A‖∞ ≤ 0.95). */
function contraction(random: () => number, n: number): number[][] {
  const A = randomMatrix(random, n, n);
  const norm = Math.max(...A.map((row) => row.reduce((s, x) => s + Math.abs(x), 0)));
  return A.map((row) => row.map((x) => (0.95 * x) / norm));
}

describe('transitionMatrix', () => {
  it('satisfies A^(j+k) = A^j A^k on seeded random matrices (relative 1e-12)', () => {
    const random = seededRandom(11);
    for (const n of [1, 2, 5, 12, 30]) {
      const A = randomMatrix(random, n, n, 1 / Math.sqrt(n));
      for (const [j, k] of [
        [0, 3],
        [1, 1],
        [3, 4],
        [7, 9],
        [16, 17],
      ]) {
        const whole = transitionMatrix(A, j + k);
        const split = multiply(transitionMatrix(A, j), transitionMatrix(A, k));
        expect(maxAbsDifference(whole, split)).toBeLessThanOrEqual(1e-12 * Math.max(1, maxAbs(whole)));
      }
    }
  });

  it('gives A^0 = I and A^1 = A', () => {
    const A = randomMatrix(seededRandom(2), 4, 4);
    expect(transitionMatrix(A, 0)).toEqual(identity(4));
    expect(maxAbsDifference(transitionMatrix(A, 1), A)).toBe(0);
  });

  it('rejects a non-square A and a negative or fractional k', () => {
    expect(() => transitionMatrix([[1, 2]], 2)).toThrow(/A must be square/);
    expect(() => transitionMatrix([[1]], -1)).toThrow(/k must be an integer/);
    expect(() => transitionMatrix([[1]], 1.5)).toThrow(/k must be an integer/);
  });
});

describe('stepResponse', () => {
  it('satisfies H(n+1) = A H(n) + B and matches the series form (relative 1e-12)', () => {
    const random = seededRandom(5);
    for (const [n, m] of [
      [1, 1],
      [3, 2],
      [10, 4],
      [25, 3],
    ]) {
      const A = contraction(random, n);
      const B = randomMatrix(random, n, m);
      const series = stepResponseSeries(A, B, 70);
      for (const k of [0, 1, 2, 5, 31, 64, 69]) {
        const Hk = stepResponse(A, B, k);
        const next = stepResponse(A, B, k + 1);
        const recursion = multiply(A, Hk).map((row, i) => row.map((x, j) => x + B[i][j]));
        expect(maxAbsDifference(next, recursion)).toBeLessThanOrEqual(1e-12 * Math.max(1, maxAbs(next)));
        expect(maxAbsDifference(Hk, series[k])).toBeLessThanOrEqual(1e-12 * Math.max(1, maxAbs(Hk)));
      }
    }
  });

  it('is zero at n = 0 and B at n = 1', () => {
    const A = [
      [0.5, 0.1],
      [0, 0.2],
    ];
    const B = [[1], [2]];
    expect(stepResponse(A, B, 0)).toEqual([[0], [0]]);
    expect(stepResponse(A, B, 1)).toEqual(B);
  });

  it('tends to the steady-state gain for a stable A', () => {
    const random = seededRandom(8);
    const A = contraction(random, 6);
    const B = randomMatrix(random, 6, 2);
    const gain = steadyStateGain(A, B);
    expect(gain).not.toBeNull();
    expect(maxAbsDifference(stepResponse(A, B, 2000), gain ?? [])).toBeLessThan(1e-10);
  });

  it('returns null gain for an integrating mode, and checks B rows', () => {
    expect(
      steadyStateGain(
        [
          [1, 0.1],
          [0, 1],
        ],
        [[0.005], [0.1]],
      ),
    ).toBeNull();
    expect(steadyStateGain([[1]], [[1]])).toBeNull();
    expect(() => stepResponse([[0.5]], [[1], [2]], 3)).toThrow(/B has 2 rows, expected 1/);
  });
});
