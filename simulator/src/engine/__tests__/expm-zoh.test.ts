import { describe, expect, it } from 'vitest';
import { identity, multiply } from '../dense.js';
import { matrixExponential } from '../expm.js';
import { discretizeZoh } from '../zoh.js';
import { blockDiagonal, maxAbs, maxAbsDifference, randomMatrix, seededRandom } from './seeded-random.js';

describe('matrixExponential', () => {
  it('maps a block-diagonal matrix to the block-diagonal of exponentials (relative 1e-12)', () => {
    const random = seededRandom(31);
    for (const scale of [0.1, 1, 4, 20]) {
      const X = randomMatrix(random, 3, 3, scale);
      const Y = randomMatrix(random, 4, 4, scale);
      const whole = matrixExponential(blockDiagonal(X, Y));
      const parts = blockDiagonal(matrixExponential(X), matrixExponential(Y));
      expect(maxAbsDifference(whole, parts)).toBeLessThanOrEqual(1e-12 * Math.max(1, maxAbs(parts)));
    }
  });

  it('satisfies e^X e^{−X} = I and (e^{X/2})² = e^X on seeded matrices', () => {
    const random = seededRandom(32);
    for (const n of [1, 4, 15]) {
      const X = randomMatrix(random, n, n, 2 / Math.sqrt(n));
      const E = matrixExponential(X);
      const inverse = matrixExponential(X.map((row) => row.map((x) => -x)));
      expect(maxAbsDifference(multiply(E, inverse), identity(n))).toBeLessThan(1e-12);
      const half = matrixExponential(X.map((row) => row.map((x) => x / 2)));
      expect(maxAbsDifference(multiply(half, half), E)).toBeLessThanOrEqual(1e-12 * maxAbs(E));
    }
  });

  it('gives I for the zero matrix and refuses non-finite entries', () => {
    expect(
      matrixExponential([
        [0, 0],
        [0, 0],
      ]),
    ).toEqual(identity(2));
    expect(() => matrixExponential([[NaN]])).toThrow(/finite/);
    expect(() => matrixExponential([[1, 2]])).toThrow(/square/);
  });
});

describe('discretizeZoh', () => {
  it('discretises a diagonal system mode by mode: a = e^{λT}, b = (e^{λT} − 1)/λ · bc (relative 1e-13)', () => {
    const lambdas = [-3, -0.5, -1e-9, 0, 0.2];
    const bc = [2, -1, 0.5, 3, 1];
    const T = 0.7;
    const Ac = lambdas.map((l, i) => lambdas.map((_, j) => (i === j ? l : 0)));
    const { A, B } = discretizeZoh(
      Ac,
      bc.map((b) => [b]),
      T,
    );
    lambdas.forEach((l, i) => {
      const a = Math.exp(l * T);
      // expm1 keeps (e^{λT} − 1)/λ accurate for λ near 0; its limit at λ = 0 is T
      const b = l === 0 ? T * bc[i] : (Math.expm1(l * T) / l) * bc[i];
      expect(A[i][i]).toBeCloseTo(a, 13);
      expect(Math.abs(B[i][0] - b)).toBeLessThanOrEqual(1e-13 * Math.abs(b));
      A[i].forEach((x, j) => j !== i && expect(x).toBe(0));
    });
  });

  it('keeps the steady-state gain: (I − A)^{-1}B = −Ac^{-1} Bc for a stable Ac', () => {
    // scalar lag with gain K: dx/dt = (−x + K u)/τ
    const K = 3;
    const tau = 4;
    const { A, B } = discretizeZoh([[-1 / tau]], [[K / tau]], 0.5);
    expect(B[0][0] / (1 - A[0][0])).toBeCloseTo(K, 13);
  });

  it('checks shapes and the sample period', () => {
    expect(() => discretizeZoh([[0]], [[1], [1]], 1)).toThrow(/Bc has 2 rows/);
    expect(() => discretizeZoh([[0]], [[1]], 0)).toThrow(/samplePeriodS/);
  });
});
