import { Matrix as MlMatrix, inverse } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { steadyStateKalman } from '../kalman.js';
import { controllabilityRank, observabilityRank } from '../structure.js';
import { maxAbs, maxAbsDifference, randomMatrix, seededRandom } from './seeded-random.js';

describe('controllability and observability ranks', () => {
  it('are full for seeded random pairs up to 50 states', () => {
    const random = seededRandom(71);
    for (const n of [2, 10, 50]) {
      const A = randomMatrix(random, n, n, 1 / Math.sqrt(n));
      expect(controllabilityRank(A, randomMatrix(random, n, 1))).toBe(n);
      expect(observabilityRank(A, randomMatrix(random, 2, n))).toBe(n);
    }
  });

  it('see a mode the input cannot reach and a repeated mode one input cannot split', () => {
    expect(
      controllabilityRank(
        [
          [0.5, 0],
          [0, 0.6],
        ],
        [[1], [0]],
      ),
    ).toBe(1);
    expect(
      controllabilityRank(
        [
          [0.5, 0],
          [0, 0.5],
        ],
        [[1], [1]],
      ),
    ).toBe(1);
    expect(
      controllabilityRank(
        [
          [0.5, 0],
          [0, 0.5],
        ],
        [
          [1, 0],
          [0, 1],
        ],
      ),
    ).toBe(2);
    expect(
      observabilityRank(
        [
          [0.5, 0],
          [0, 0.6],
        ],
        [[0, 1]],
      ),
    ).toBe(1);
    expect(
      controllabilityRank(
        [
          [0.5, 0],
          [0, 0.6],
        ],
        [[0], [0]],
      ),
    ).toBe(0);
  });

  it('keep an uncontrollable part hidden by a similarity transform (4 of 6 reachable)', () => {
    const random = seededRandom(72);
    // [[A11, A12], [0, A22]] with B = [B1; 0]: only the first 4 states are reachable
    const A = randomMatrix(random, 6, 6, 0.4);
    for (let i = 4; i < 6; i++) for (let j = 0; j < 4; j++) A[i][j] = 0;
    const B = randomMatrix(random, 6, 1);
    B[4][0] = 0;
    B[5][0] = 0;
    const S = new MlMatrix(randomMatrix(random, 6, 6)).add(MlMatrix.eye(6, 6).mul(3));
    const At = S.mmul(new MlMatrix(A)).mmul(inverse(S)).to2DArray();
    const Bt = S.mmul(new MlMatrix(B)).to2DArray();
    expect(controllabilityRank(At, Bt)).toBe(4);
  });
});

describe('steadyStateKalman', () => {
  it('solves the filtering Riccati equation on seeded detectable systems, unstable ones included', () => {
    const random = seededRandom(73);
    for (const [n, p] of [
      [2, 1],
      [5, 2],
      [12, 3],
    ]) {
      const A = randomMatrix(random, n, n, 1.3 / Math.sqrt(n));
      const C = randomMatrix(random, p, n);
      const G = new MlMatrix(randomMatrix(random, n, n));
      const Q = G.mmul(G.transpose()).mul(0.1);
      const R = MlMatrix.eye(p, p).mul(0.5);
      const { K, P } = steadyStateKalman(A, C, Q.to2DArray(), R.to2DArray());
      const a = new MlMatrix(A);
      const c = new MlMatrix(C);
      const p_ = new MlMatrix(P);
      const S = c.mmul(p_).mmul(c.transpose()).add(R);
      const gain = a.mmul(p_).mmul(c.transpose()).mmul(inverse(S));
      const rhs = a.mmul(p_).mmul(a.transpose()).sub(gain.mmul(c).mmul(p_).mmul(a.transpose())).add(Q);
      expect(maxAbsDifference(rhs.to2DArray(), P)).toBeLessThan(1e-9 * Math.max(1, maxAbs(P)));
      const expectedK = p_.mmul(c.transpose()).mmul(inverse(S));
      expect(maxAbsDifference(expectedK.to2DArray(), K)).toBeLessThan(1e-10 * Math.max(1, maxAbs(K)));
    }
  });

  // The refusal of an undetectable pair is checked once, in tests/reference/kalman.test.ts.

  it('refuses an R that is not positive definite', () => {
    expect(() => steadyStateKalman([[0.5]], [[1]], [[1]], [[0]])).toThrow(/R must be symmetric positive definite/);
  });
});
