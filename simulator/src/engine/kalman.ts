import { CholeskyDecomposition, EigenvalueDecomposition, Matrix as MlMatrix, solve } from 'ml-matrix';
import { fromMl, toMl } from './dense.js';
import { assertColumns, assertRows, assertSquare } from './shape.js';
import type { Matrix } from './types.js';

/** The steady-state (stationary) Kalman filter of `x(k+1) = A x + w`, `y = C x + v`. */
export interface SteadyStateKalman {
  /** n×p measurement-update gain `K = P Cᵀ (C P Cᵀ + R)^{-1}`: `x̂⁺ = x̂⁻ + K (y − C x̂⁻)`. */
  K: Matrix;
  /** n×n steady prior (one-step-predicted) error covariance, in state units squared. */
  P: Matrix;
}

const MAX_DOUBLINGS = 64;
const RELATIVE_CHANGE = 1e-13;

/**
 * Steady-state Kalman gain from the filtering discrete algebraic Riccati equation
 * `P = A P Aᵀ − A P Cᵀ (C P Cᵀ + R)^{-1} C P Aᵀ + Q`.
 *
 * Solved by the structure-preserving doubling algorithm (E. K.-W. Chu, H.-Y. Fan, W.-W. Lin,
 * C.-S. Wang, Int. J. Control 77(8), 2004), applied to the dual pair `(Aᵀ, Cᵀ)`: with
 * `A₀ = Aᵀ, G₀ = Cᵀ R^{-1} C, H₀ = Q` and `W = I + G H`,
 * `A ← A W^{-1} A`, `G ← G + A W^{-1} G Aᵀ`, `H ← H + Aᵀ H W^{-1} A`; iteration j equals 2^j steps of
 * the Riccati recursion, and H converges quadratically to P.
 *
 * Throws when R is not positive definite; when the iteration does not settle — P grows without
 * bound when a mode on or outside the unit circle is driven by Q but unseen by C (undetectable pair);
 * or when the resulting filter's error would grow (an unstable mode with no process noise in Q).
 *
 * @param A - n×n state matrix
 * @param C - p×n output matrix
 * @param Q - n×n process-noise covariance (state units squared, per sample; symmetric, ≥ 0)
 * @param R - p×p measurement-noise covariance (output units squared; symmetric, > 0)
 */
export function steadyStateKalman(A: Matrix, C: Matrix, Q: Matrix, R: Matrix): SteadyStateKalman {
  const n = assertSquare('steadyStateKalman', 'A', A);
  const p = assertColumns('steadyStateKalman', 'C', C, n, 'the order of A');
  assertRows('steadyStateKalman', 'Q', Q, n, 'the order of A');
  assertSquare('steadyStateKalman', 'Q', Q);
  assertRows('steadyStateKalman', 'R', R, p, 'the rows of C');
  assertSquare('steadyStateKalman', 'R', R);
  const r = toMl(R);
  if (!r.isSymmetric() || !new CholeskyDecomposition(r).isPositiveDefinite()) {
    throw new RangeError('steadyStateKalman: R must be symmetric positive definite');
  }
  const c = toMl(C);
  const P = doubling(toMl(A).transpose(), c.transpose().mmul(solve(r, c)), toMl(Q));
  const symmetric = P.clone().add(P.transpose()).mul(0.5);
  const innovation = c.mmul(symmetric).mmul(c.transpose()).add(r);
  const K = solve(innovation, c.mmul(symmetric)).transpose();
  assertStableError(toMl(A), K, c);
  return { K: fromMl(K), P: fromMl(symmetric) };
}

/**
 * The prior error evolves as `e(k+1) = A (I − K C) e(k)` (without noise). The recursion started from
 * P = 0 settles on a solution with growing error when Q does not drive an unstable mode (that mode's
 * variance stays 0); such a filter would never correct that mode, so it is refused.
 */
function assertStableError(A: MlMatrix, K: MlMatrix, C: MlMatrix): void {
  const n = A.rows;
  const errorDynamics = A.mmul(MlMatrix.eye(n).sub(K.mmul(C)));
  const evd = new EigenvalueDecomposition(errorDynamics);
  const radius = Math.max(...evd.realEigenvalues.map((re, i) => Math.hypot(re, evd.imaginaryEigenvalues[i])));
  if (radius > 1 + 1e-9) {
    throw new Error(
      `steadyStateKalman: the filter error would grow (spectral radius ${radius.toPrecision(6)} of A(I − KC)); ` +
        'Q must drive every mode outside the unit circle with some process noise',
    );
  }
}

function doubling(A0: MlMatrix, G0: MlMatrix, H0: MlMatrix): MlMatrix {
  const n = A0.rows;
  let [A, G, H] = [A0, G0, H0];
  for (let j = 0; j < MAX_DOUBLINGS; j++) {
    const W = MlMatrix.eye(n).add(G.mmul(H));
    const WinvA = solve(W, A);
    const nextH = H.clone().add(A.transpose().mmul(H).mmul(WinvA));
    const nextG = G.clone().add(A.mmul(solve(W, G.mmul(A.transpose()))));
    A = A.mmul(WinvA);
    const change = MlMatrix.sub(nextH, H).norm('frobenius');
    const size = nextH.norm('frobenius');
    if (!Number.isFinite(change) || !Number.isFinite(size)) break;
    [G, H] = [nextG, nextH];
    if (change <= RELATIVE_CHANGE * size) return H;
  }
  throw new Error(
    'steadyStateKalman: the Riccati equation did not converge; check that (A, C) is detectable ' +
      '(every mode on or outside the unit circle must show in the outputs) and that Q and R are covariances',
  );
}
