import numeric from 'numeric';
import jStat from 'jstat';
import { describe, it } from 'vitest';
import { chiSquareQuantile, discretizeZoh, normalQuantile } from '@shadowloop/simulator/engine';
import { expectWithin, randomMatrix, seededRandom } from './support.js';

/** Cross-checks of sampling and distributions against independent libraries. */

describe('zero-order hold against numeric ODE integration (no matrix exponential)', () => {
  it('columns of A and B from integrating dx/dt = Ac x + Bc u over one period (1e-8)', () => {
    // A's column j is x(T) from x(0) = e_j with u = 0; B's column j is x(T) from x(0) = 0 with u = e_j
    const random = seededRandom(305);
    const T = 0.5;
    for (const [n, m, singular] of [
      [3, 1, false],
      [6, 2, true],
    ] as const) {
      const Ac = randomMatrix(random, n, n, 1);
      if (singular) Ac.forEach((row) => (row[0] = 0)); // an integrator: Ac has a zero column
      const Bc = randomMatrix(random, n, m, 1);
      const { A, B } = discretizeZoh(Ac, Bc, T);
      const integrate = (x0: number[], u: number[]) =>
        numeric
          .dopri(
            0,
            T,
            x0,
            (_t, x) =>
              Ac.map((row, i) => row.reduce((s, a, k) => s + a * x[k], 0) + Bc[i].reduce((s, b, j) => s + b * u[j], 0)),
            1e-13,
            100_000,
          )
          .at(T);
      const unit = (size: number, j: number) => Array.from({ length: size }, (_, i) => (i === j ? 1 : 0));
      for (let j = 0; j < n; j++) {
        const column = integrate(unit(n, j), new Array<number>(m).fill(0));
        column.forEach((v, i) => expectWithin(A[i][j], v, 1e-8));
      }
      for (let j = 0; j < m; j++) {
        const column = integrate(new Array<number>(n).fill(0), unit(m, j));
        column.forEach((v, i) => expectWithin(B[i][j], v, 1e-8));
      }
    }
  });
});

describe('distributions against jstat', () => {
  it('chi-square and normal quantiles agree to 1e-9 relative (jstat’s own accuracy)', () => {
    for (const dof of [1, 2, 3, 4, 7, 12, 50]) {
      for (const p of [0.01, 0.5, 0.9, 0.95, 0.99, 0.999]) {
        const reference = jStat.chisquare.inv(p, dof);
        expectWithin(chiSquareQuantile(p, dof), reference, 1e-9 * reference);
      }
    }
    for (const p of [1e-8, 0.001, 0.2, 0.5, 0.8, 0.975, 0.999999]) {
      const reference = jStat.normal.inv(p, 0, 1);
      expectWithin(normalQuantile(p), reference, 1e-9 * Math.max(1, Math.abs(reference)));
    }
  });
});
