import { EigenvalueDecomposition, Matrix as MlMatrix, SingularValueDecomposition } from 'ml-matrix';
import { toMl } from './dense.js';
import type { Complex, Matrix } from './types.js';

/**
 * Eigen-decomposition of a real square matrix, `A W = W Λ`, from ml-matrix's EVD (Hessenberg + shifted
 * QR, real Schur form). Complex eigenvalues come in conjugate pairs with the positive imaginary part
 * first; their eigenvectors are `re ± i·im` from a column pair.
 */
export interface EigenSystem {
  /** Eigenvalues in the solver's order; each pair `a+ib, a−ib` adjacent, `+` first. */
  values: Complex[];
  /**
   * Real basis `V` (n×n): column j is the eigenvector for a real eigenvalue, or for a pair at
   * j, j+1 the real and imaginary parts of the eigenvector of `values[j]`. Each eigenvector has unit
   * 2-norm and its largest component real and positive.
   */
  basis: MlMatrix;
  /** 2-norm condition number of the unit-column complex eigenvector matrix, capped at 1/ε. */
  condition: number;
  /** True when `condition` exceeds {@link DEFECTIVE_CONDITION}. */
  defective: boolean;
}

/**
 * Eigenvector condition above which A counts as defective (no full set of eigenvectors). A Jordan
 * block of size 2, after rounding, yields eigenvectors at an angle of about √ε, a condition near
 * 1e8; larger blocks give more. Random well-posed matrices of order ≤ 50 stay below 1e3.
 */
export const DEFECTIVE_CONDITION = 1e6;

/** Largest reportable condition: beyond 1/ε the eigenvector matrix is singular to working precision. */
export const CONDITION_CAP = 1 / Number.EPSILON;

/** Computes the eigen-decomposition of `A` (assumed square and finite). */
export function eigenSystem(A: Matrix): EigenSystem {
  const evd = new EigenvalueDecomposition(toMl(A));
  const re = evd.realEigenvalues;
  const im = evd.imaginaryEigenvalues;
  const basis = evd.eigenvectorMatrix.clone();
  const values: Complex[] = re.map((r, j) => ({ re: r, im: im[j] }));
  for (let j = 0; j < values.length; j++) {
    if (im[j] !== 0) {
      normalisePair(basis, j);
      j++;
    } else {
      normaliseColumn(basis, j);
    }
  }
  const condition = unitaryEquivalentCondition(basis, values);
  return { values, basis, condition, defective: condition > DEFECTIVE_CONDITION };
}

/**
 * Condition of the complex eigenvector matrix W with unit columns, computed on a real matrix:
 * for a pair, `√2·[re, im] = [w, w̄]·U` with U unitary, so scaling pair columns by √2 leaves the
 * singular values of W unchanged.
 */
export function unitaryEquivalentCondition(basis: MlMatrix, values: Complex[], columns?: number[]): number {
  const selected = columns ?? values.map((_, j) => j);
  const scaled = new MlMatrix(basis.rows, selected.length);
  selected.forEach((j, c) => {
    const factor = values[j].im !== 0 ? Math.SQRT2 : 1;
    for (let i = 0; i < basis.rows; i++) scaled.set(i, c, basis.get(i, j) * factor);
  });
  const sv = new SingularValueDecomposition(scaled, {
    computeLeftSingularVectors: false,
    computeRightSingularVectors: false,
    autoTranspose: true,
  }).diagonal;
  const smallest = sv[sv.length - 1];
  if (!(smallest > 0)) return CONDITION_CAP;
  return Math.min(sv[0] / smallest, CONDITION_CAP);
}

function normaliseColumn(V: MlMatrix, j: number): void {
  let norm = 0;
  let largest = 0;
  for (let i = 0; i < V.rows; i++) {
    const v = V.get(i, j);
    norm += v * v;
    if (Math.abs(v) > Math.abs(largest)) largest = v;
  }
  if (!(norm > 0)) return;
  const factor = Math.sign(largest) / Math.sqrt(norm);
  for (let i = 0; i < V.rows; i++) V.set(i, j, V.get(i, j) * factor);
}

/** Scales `re + i·im` to unit norm and rotates its phase so the largest component is real positive. */
function normalisePair(V: MlMatrix, j: number): void {
  let norm = 0;
  let pivot = 0;
  for (let i = 0; i < V.rows; i++) {
    const m = V.get(i, j) ** 2 + V.get(i, j + 1) ** 2;
    norm += m;
    if (m > V.get(pivot, j) ** 2 + V.get(pivot, j + 1) ** 2) pivot = i;
  }
  if (!(norm > 0)) return;
  const pr = V.get(pivot, j);
  const pi = V.get(pivot, j + 1);
  const scale = Math.sqrt(norm) * Math.hypot(pr, pi);
  // multiply by conj(pivot)/(|pivot|·‖w‖): unit norm, pivot component real and positive
  const cr = pr / scale;
  const ci = -pi / scale;
  for (let i = 0; i < V.rows; i++) {
    const a = V.get(i, j);
    const b = V.get(i, j + 1);
    V.set(i, j, a * cr - b * ci);
    V.set(i, j + 1, a * ci + b * cr);
  }
}
