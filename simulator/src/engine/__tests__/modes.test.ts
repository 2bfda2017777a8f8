import { Matrix as MlMatrix, inverse } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { analyzeModes, describeMode } from '../modes.js';
import { blockDiagonal, randomMatrix, seededRandom } from './seeded-random.js';

describe('analyzeModes', () => {
  it('sorts modes by magnitude, largest first, and reports the spectral radius', () => {
    const result = analyzeModes(randomMatrix(seededRandom(4), 12, 12, 0.3), 2);
    const magnitudes = result.modes.map((m) => m.magnitude);
    expect(magnitudes).toEqual([...magnitudes].sort((a, b) => b - a));
    expect(result.spectralRadius).toBe(magnitudes[0]);
  });

  it('classifies stable, marginal and unstable models', () => {
    expect(
      analyzeModes(
        [
          [0.5, 0.2],
          [0, -0.3],
        ],
        1,
      ).stability,
    ).toBe('stable');
    expect(analyzeModes([[1]], 1).stability).toBe('marginal');
    expect(
      analyzeModes(
        [
          [1, 0],
          [0, 1],
        ],
        1,
      ).stability,
    ).toBe('marginal');
    expect(
      analyzeModes(
        [
          [0, -1],
          [1, 0],
        ],
        1,
      ).stability,
    ).toBe('marginal');
    expect(
      analyzeModes(
        [
          [-1, 0],
          [0, 0.5],
        ],
        1,
      ).stability,
    ).toBe('marginal');
    expect(analyzeModes([[1.01]], 1).stability).toBe('unstable');
    // a Jordan block on the unit circle grows like k
    expect(
      analyzeModes(
        [
          [1, 1],
          [0, 1],
        ],
        1,
      ).stability,
    ).toBe('unstable');
  });

  it('finds a Jordan block on the unit circle hidden by a similarity transform', () => {
    const random = seededRandom(9);
    const S = new MlMatrix(randomMatrix(random, 4, 4)).add(MlMatrix.eye(4, 4).mul(2));
    const J = new MlMatrix(
      blockDiagonal(
        [
          [1, 1],
          [0, 1],
        ],
        [[0.5]],
        [[-0.2]],
      ),
    );
    const A = S.mmul(J).mmul(inverse(S)).to2DArray();
    const result = analyzeModes(A, 1);
    expect(result.defective).toBe(true);
    expect(result.stability).toBe('unstable');
  });

  it('flags defective matrices without crashing and keeps repeated eigenvalues within 1e-6', () => {
    const random = seededRandom(10);
    for (const lambda of [0.9, -0.5, 0]) {
      const S = new MlMatrix(randomMatrix(random, 5, 5)).add(MlMatrix.eye(5, 5).mul(2));
      const J = new MlMatrix(
        blockDiagonal(
          [
            [lambda, 1],
            [0, lambda],
          ],
          [
            [0.3, 0],
            [0, 0.1],
          ],
          [[0.6]],
        ),
      );
      const result = analyzeModes(S.mmul(J).mmul(inverse(S)).to2DArray(), 1);
      expect(result.defective).toBe(true);
      expect(result.eigenvectorCondition).toBeGreaterThan(1e6);
      const near = result.modes.filter((m) => Math.hypot(m.eigenvalue.re - lambda, m.eigenvalue.im) < 1e-6);
      expect(near).toHaveLength(2);
    }
  });

  it('survives badly scaled and exactly singular matrices', () => {
    const scaled = analyzeModes(
      [
        [1e-8, 1e8],
        [1e-8, 0.5],
      ],
      1,
    );
    expect(Number.isFinite(scaled.spectralRadius)).toBe(true);
    const zero = analyzeModes(
      [
        [0, 0],
        [0, 0],
      ],
      1,
    );
    expect(zero.spectralRadius).toBe(0);
    expect(zero.modes[0]).toMatchObject({ timeConstantS: null, naturalFrequencyRadS: null, dampingRatio: null });
    const nilpotent = analyzeModes(
      [
        [0, 1],
        [0, 0],
      ],
      1,
    );
    expect(nilpotent.defective).toBe(true);
    expect(nilpotent.stability).toBe('stable');
    expect(Number.isFinite(nilpotent.eigenvectorCondition)).toBe(true);
  });

  it('describes special eigenvalues: λ = 1, negative real, complex', () => {
    expect(describeMode({ re: 1, im: 0 }, 1)).toMatchObject({
      timeConstantS: null,
      naturalFrequencyRadS: 0,
      dampingRatio: null,
      periodSamples: null,
    });
    const negative = describeMode({ re: -0.5, im: 0 }, 2);
    expect(negative.periodSamples).toBe(2);
    expect(negative.timeConstantS).toBeCloseTo(2 / Math.log(2), 14);
    const complex = describeMode({ re: 0, im: 0.5 }, 1);
    expect(complex.periodSamples).toBeCloseTo(4, 14);
  });

  it('rejects a non-positive sample period', () => {
    expect(() => analyzeModes([[0.5]], 0)).toThrow(/samplePeriodS/);
  });
});
