// ml-matrix comes with the engine's workspace (simulator/package.json), as the engine's own linear algebra.
import { CholeskyDecomposition, Matrix as MlMatrix } from 'ml-matrix';

type Rows = number[][];

const isMatrix = (value: unknown, rows: number, columns: number): value is Rows =>
  Array.isArray(value) &&
  value.length === rows &&
  value.every((row) => Array.isArray(row) && row.length === columns && row.every(Number.isFinite));

/**
 * S⁻¹ for the nis rule, from a model version's stored correction `{mode, Q, R, K, P}` and its C
 * (null: C = I). With the steady-state Kalman correction the innovation y − C x̂⁻ has covariance
 * S = C P Cᵀ + R, P the prior error covariance (Y. Bar-Shalom, X. R. Li, T. Kirubarajan, Estimation
 * with Applications to Tracking and Navigation, 2001, §5.2). Null for other corrections, for
 * shapes that do not fit, and when S is not positive definite.
 */
export function innovationCovInverseOf(correction: unknown, C: unknown): Rows | null {
  if (!correction || typeof correction !== 'object') return null;
  const { mode, P, R } = correction as { mode?: unknown; P?: unknown; R?: unknown };
  if (mode !== 'kalman' || !Array.isArray(P)) return null;
  const n = P.length;
  if (!isMatrix(P, n, n)) return null;
  const output = C === null || C === undefined ? MlMatrix.eye(n).to2DArray() : C;
  const p = Array.isArray(output) ? output.length : 0;
  if (p === 0 || !isMatrix(output, p, n) || !isMatrix(R, p, p)) return null;
  const c = new MlMatrix(output);
  const S = c.mmul(new MlMatrix(P)).mmul(c.transpose()).add(new MlMatrix(R));
  const symmetric = S.clone().add(S.transpose()).mul(0.5);
  const cholesky = new CholeskyDecomposition(symmetric);
  if (!cholesky.isPositiveDefinite()) return null;
  const inverse = cholesky.solve(MlMatrix.eye(p)).to2DArray();
  return inverse.every((row) => row.every(Number.isFinite)) ? inverse : null;
}
