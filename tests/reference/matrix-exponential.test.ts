import { describe, it } from 'vitest';
import { analyzeModes, matrixExponential } from '@shadowloop/simulator/engine';
import { expectMatchesPrinted, expectMatrixClose, expectWithin } from './support.js';

describe('matrix exponential against published and closed-form values', () => {
  const moler = [
    [-49, 24],
    [-64, 31],
  ];

  it('Moler–Van Loan 2×2 example, written to 12 digits and to the 6 the paper prints', () => {
    // C. Moler and C. Van Loan, "Nineteen Dubious Ways to Compute the Exponential of a Matrix,
    // Twenty-Five Years Later", SIAM Review 45(1), 2003: the example on which the Taylor series fails.
    // 6-digit values from memory of the paper; 12-digit values from the closed form below.
    const E = matrixExponential(moler);
    const printed = [
      ['-0.735758758145', '0.551819099658', '-0.735759', '0.551819'],
      ['-1.471517599088', '1.103638240716', '-1.471518', '1.103638'],
    ];
    printed.forEach(([twelve0, twelve1, six0, six1], i) => {
      expectMatchesPrinted(E[i][0], twelve0);
      expectMatchesPrinted(E[i][1], twelve1);
      expectMatchesPrinted(E[i][0], six0);
      expectMatchesPrinted(E[i][1], six1);
    });
  });

  it('Moler–Van Loan 2×2 example against its eigen closed form (1e-13 relative)', () => {
    // closed form: eigenvectors (3, 4) for −17 and (1, 2) for −1, so
    // e^A = [[3e^{−17} − 2e^{−1}, 1.5e^{−1} − 1.5e^{−17}], [4e^{−17} − 4e^{−1}, 3e^{−1} − 2e^{−17}]]
    const [a, b] = [Math.exp(-17), Math.exp(-1)];
    expectMatrixClose(
      matrixExponential(moler),
      [
        [3 * a - 2 * b, 1.5 * b - 1.5 * a],
        [4 * a - 4 * b, 3 * b - 2 * a],
      ],
      1e-13,
    );
  });

  it('Moler–Van Loan example has eigenvalues −17 and −1', () => {
    // closed form: characteristic polynomial λ² + 18λ + 17 = (λ + 17)(λ + 1); tolerance 1e-12
    const values = analyzeModes(moler, 1).modes.map((m) => m.eigenvalue);
    expectWithin(values[0].re, -17, 1e-12);
    expectWithin(values[1].re, -1, 1e-12);
    values.forEach((v) => expectWithin(v.im, 0, 0));
  });

  it('upper triangular 2×2 with nearly equal eigenvalues', () => {
    // the triangular 2×2 case discussed by Moler & Van Loan (2003), closed form
    // e^{[[λ, α], [0, μ]]} = [[e^λ, α(e^λ − e^μ)/(λ − μ)], [0, e^μ]]; the difference quotient is
    // evaluated as e^μ·expm1(λ − μ)/(λ − μ) so that the reference itself does not cancel
    const [lambda, mu, alpha] = [-1, -1.0001, 10];
    const quotient = (Math.exp(mu) * Math.expm1(lambda - mu)) / (lambda - mu);
    expectMatrixClose(
      matrixExponential([
        [lambda, alpha],
        [0, mu],
      ]),
      [
        [Math.exp(lambda), alpha * quotient],
        [0, Math.exp(mu)],
      ],
      1e-13,
    );
  });

  it('nilpotent matrix: the series stops, e^N = I + N + N²/2', () => {
    // closed form for N strictly upper triangular 3×3
    const [a, b, c] = [2, -3, 0.5];
    expectMatrixClose(
      matrixExponential([
        [0, a, b],
        [0, 0, c],
        [0, 0, 0],
      ]),
      [
        [1, a, b + (a * c) / 2],
        [0, 1, c],
        [0, 0, 1],
      ],
      1e-15,
    );
  });

  it('rotation generator with a large angle (needs squaring): e^{[[0, −θ], [θ, 0]]} is a rotation by θ', () => {
    // closed form; θ = 10 rad
    const theta = 10;
    const [c, s] = [Math.cos(theta), Math.sin(theta)];
    expectMatrixClose(
      matrixExponential([
        [0, -theta],
        [theta, 0],
      ]),
      [
        [c, -s],
        [s, c],
      ],
      1e-13,
    );
  });

  it('Jordan block: e^{[[a, 1], [0, a]]} = e^a [[1, 1], [0, 1]]', () => {
    // closed form; a = −0.7
    const e = Math.exp(-0.7);
    expectMatrixClose(
      matrixExponential([
        [-0.7, 1],
        [0, -0.7],
      ]),
      [
        [e, e],
        [0, e],
      ],
      1e-15,
    );
  });

  it('widely spread diagonal: every entry to 1e-13 relative', () => {
    // closed form e^{diag(d)} = diag(e^d), with d = −30 and 5 (scaled by 2^-s and squared back)
    const E = matrixExponential([
      [-30, 0],
      [0, 5],
    ]);
    expectWithin(E[0][0], Math.exp(-30), 1e-13 * Math.exp(-30));
    expectWithin(E[1][1], Math.exp(5), 1e-13 * Math.exp(5));
  });
});
