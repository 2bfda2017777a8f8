import { Matrix as MlMatrix, solve } from 'ml-matrix';
import { fromMl, toMl } from './dense.js';
import { assertSquare } from './shape.js';
import type { Matrix } from './types.js';

/** Degree of the diagonal Padé approximant (Higham 2005). */
const PADE_DEGREE = 13;

/**
 * Largest 1-norm for which the degree-13 Padé approximant of e^X has backward error below the unit
 * roundoff: θ_13 (N. J. Higham, "The scaling and squaring method for the matrix exponential
 * revisited", SIAM J. Matrix Anal. Appl. 26(4), 2005, Table 2.3).
 */
const THETA_13 = 5.371920351148152;

/** Padé coefficients c_j = (2m−j)! m! / ((2m)! j! (m−j)!), j = 0 … m. */
const PADE_COEFFICIENTS: number[] = (() => {
  const m = PADE_DEGREE;
  const c = [1];
  for (let j = 1; j <= m; j++) c.push((c[j - 1] * (m - j + 1)) / ((2 * m - j + 1) * j));
  return c;
})();

/**
 * Matrix exponential `e^M = Σ M^k / k!` by scaling and squaring with a degree-13 Padé approximant
 * (Higham 2005): scale by 2^-s so that ‖M/2^s‖₁ ≤ θ_13, evaluate `r_13 = (V − U)^{-1}(V + U)`
 * with U the odd and V the even part, then square s times.
 *
 * @param M - n×n real matrix with finite entries (for a continuous model, `Ac·T`, dimensionless)
 * @returns n×n matrix `e^M`
 */
export function matrixExponential(M: Matrix): Matrix {
  const n = assertSquare('matrixExponential', 'M', M);
  if (!M.every((row) => row.every(Number.isFinite))) {
    throw new RangeError('matrixExponential: M has an entry that is not a finite number');
  }
  const norm = toMl(M)
    .abs()
    .sum('column')
    .reduce((a, b) => Math.max(a, b), 0);
  const squarings = norm > THETA_13 ? Math.ceil(Math.log2(norm / THETA_13)) : 0;
  const X = toMl(M).mul(2 ** -squarings);
  let result = padeApproximant(X, n);
  for (let i = 0; i < squarings; i++) result = result.mmul(result);
  return fromMl(result);
}

function padeApproximant(X: MlMatrix, n: number): MlMatrix {
  const c = PADE_COEFFICIENTS;
  const I = MlMatrix.eye(n);
  const X2 = X.mmul(X);
  const X4 = X2.mmul(X2);
  const X6 = X4.mmul(X2);
  const combine = (terms: [number, MlMatrix][]): MlMatrix => {
    const sum = MlMatrix.zeros(n, n);
    for (const [coefficient, P] of terms) sum.add(MlMatrix.mul(P, coefficient));
    return sum;
  };
  const oddHigh = X6.mmul(
    combine([
      [c[13], X6],
      [c[11], X4],
      [c[9], X2],
    ]),
  );
  const U = X.mmul(
    oddHigh.add(
      combine([
        [c[7], X6],
        [c[5], X4],
        [c[3], X2],
        [c[1], I],
      ]),
    ),
  );
  const evenHigh = X6.mmul(
    combine([
      [c[12], X6],
      [c[10], X4],
      [c[8], X2],
    ]),
  );
  const V = evenHigh.add(
    combine([
      [c[6], X6],
      [c[4], X4],
      [c[2], X2],
      [c[0], I],
    ]),
  );
  return solve(MlMatrix.sub(V, U), MlMatrix.add(V, U));
}
