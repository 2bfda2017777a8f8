import { describe, expect, it } from 'vitest';
import { analyzeModes, transitionMatrix } from '@shadowloop/simulator/engine';
import { expectMatrixClose, expectWithin, seededRandom, sortComplex } from './support.js';
import { randomBasis, similarity } from './test-matrices.js';

describe('Jordan blocks and defective matrices', () => {
  it('powers of a 3×3 Jordan block: J^k has λ^k, kλ^{k−1}, C(k,2)λ^{k−2}', () => {
    // closed form by the binomial theorem on λI + N with N³ = 0; λ = 0.9, k = 25 (1e-12 relative)
    const [lambda, k] = [0.9, 25];
    const J = [
      [lambda, 1, 0],
      [0, lambda, 1],
      [0, 0, lambda],
    ];
    const [d0, d1, d2] = [lambda ** k, k * lambda ** (k - 1), ((k * (k - 1)) / 2) * lambda ** (k - 2)];
    expectMatrixClose(
      transitionMatrix(J, k),
      [
        [d0, d1, d2],
        [0, d0, d1],
        [0, 0, d0],
      ],
      1e-12,
    );
  });

  it('size-2 Jordan block under a similarity: flagged, eigenvalues within 1e-6', () => {
    // closed form: S diag(J₂(0.8), 0.3, −0.5) S⁻¹ has the double eigenvalue 0.8 with one eigenvector.
    // A solver returns a double defective eigenvalue to about √ε·‖A‖, hence the 1e-6 tolerance.
    const random = seededRandom(101);
    for (let trial = 0; trial < 5; trial++) {
      const S = randomBasis(random, 4);
      const J = [
        [0.8, 1, 0, 0],
        [0, 0.8, 0, 0],
        [0, 0, 0.3, 0],
        [0, 0, 0, -0.5],
      ];
      const A = similarity(S, J);
      const result = analyzeModes(A, 1);
      expect(result.defective).toBe(true);
      const double = result.modes.filter((m) => Math.hypot(m.eigenvalue.re - 0.8, m.eigenvalue.im) < 1e-6);
      expect(double).toHaveLength(2);
      const others = sortComplex(result.modes.map((m) => m.eigenvalue)).filter((v) => Math.abs(v.re - 0.8) > 1e-3);
      expectWithin(others[0].re, -0.5, 1e-9);
      expectWithin(others[1].re, 0.3, 1e-9);
    }
  });

  it('size-3 Jordan block: flagged, eigenvalues within 1e-4 (ε^(1/3) ≈ 6e-6 times the similarity condition)', () => {
    // closed form: S J₃(−0.6) S⁻¹ has the triple eigenvalue −0.6
    const random = seededRandom(102);
    const S = randomBasis(random, 3);
    const result = analyzeModes(
      similarity(S, [
        [-0.6, 1, 0],
        [0, -0.6, 1],
        [0, 0, -0.6],
      ]),
      1,
    );
    expect(result.defective).toBe(true);
    result.modes.forEach((m) => expect(Math.hypot(m.eigenvalue.re + 0.6, m.eigenvalue.im)).toBeLessThan(1e-4));
  });

  it('stability of the textbook integrators: one integrator marginal, double integrator unstable', () => {
    // by definition: λ = 1 simple is bounded (marginal); a Jordan block at λ = 1 grows like k
    expect(analyzeModes([[1]], 1).stability).toBe('marginal');
    expect(
      analyzeModes(
        [
          [1, 0.1],
          [0, 1],
        ],
        0.1,
      ).stability,
    ).toBe('unstable');
    // a pure delay chain (nilpotent shift) settles in n samples: stable, and defective
    const shift = analyzeModes(
      [
        [0, 1, 0],
        [0, 0, 1],
        [0, 0, 0],
      ],
      1,
    );
    expect(shift.stability).toBe('stable');
    expect(shift.defective).toBe(true);
  });
});
