import { Matrix as MlMatrix, SingularValueDecomposition } from 'ml-matrix';
import { toMl } from './dense.js';
import { assertColumns, assertRows, assertSquare } from './shape.js';
import type { Matrix } from './types.js';

/**
 * Relative tolerance of the rank decisions: a new direction counts when its singular value exceeds
 * this fraction of ‖A‖_F (or of ‖B‖ for the first block). Directions weaker than 1e-10 of the
 * model's own scale are not reachable in practice.
 */
export const RANK_RELATIVE_TOLERANCE = 1e-10;

/**
 * Rank of the controllability matrix `[B, AB, …, A^{n−1}B]`: the dimension of the state subspace the
 * inputs can reach; n means controllable.
 *
 * The Krylov blocks are orthonormalised one at a time and each new block's rank is read from its
 * SVD with a relative tolerance (the idea of the controllability staircase), because the powers in
 * the explicit matrix spread its columns over many orders of magnitude (C. C. Paige, "Properties of
 * numerical algorithms related to computing controllability", IEEE Trans. Automatic Control 26(1), 1981).
 *
 * @param A - n×n state matrix
 * @param B - n×m input matrix
 * @param relativeTolerance - see {@link RANK_RELATIVE_TOLERANCE}
 */
export function controllabilityRank(A: Matrix, B: Matrix, relativeTolerance = RANK_RELATIVE_TOLERANCE): number {
  const n = assertSquare('controllabilityRank', 'A', A);
  assertRows('controllabilityRank', 'B', B, n, 'the order of A');
  return krylovRank(toMl(A), toMl(B), relativeTolerance);
}

/**
 * Rank of the observability matrix `[C; CA; …; CA^{n−1}]`: the dimension of the state subspace that
 * shows in the outputs; n means observable. Computed as the controllability rank of `(Aᵀ, Cᵀ)`.
 *
 * @param A - n×n state matrix
 * @param C - p×n output matrix
 * @param relativeTolerance - see {@link RANK_RELATIVE_TOLERANCE}
 */
export function observabilityRank(A: Matrix, C: Matrix, relativeTolerance = RANK_RELATIVE_TOLERANCE): number {
  const n = assertSquare('observabilityRank', 'A', A);
  assertColumns('observabilityRank', 'C', C, n, 'the order of A');
  return krylovRank(toMl(A).transpose(), toMl(C).transpose(), relativeTolerance);
}

function krylovRank(A: MlMatrix, B: MlMatrix, relativeTolerance: number): number {
  const n = A.rows;
  let basis = newDirections(B, relativeTolerance * B.norm('frobenius'));
  let block = basis;
  const threshold = relativeTolerance * A.norm('frobenius');
  while (block.columns > 0 && basis.columns < n) {
    let Z = A.mmul(block);
    // project out the known subspace twice: one pass of Gram–Schmidt can leave a rounding residue
    for (let pass = 0; pass < 2; pass++) Z = Z.sub(basis.mmul(basis.transpose().mmul(Z)));
    block = newDirections(Z, threshold);
    basis = block.columns > 0 ? concatColumns(basis, block) : basis;
  }
  return basis.columns;
}

/** Orthonormal basis of the directions of Z whose singular values exceed `threshold`. */
function newDirections(Z: MlMatrix, threshold: number): MlMatrix {
  if (!(threshold > 0)) return new MlMatrix(Z.rows, 0);
  const svd = new SingularValueDecomposition(Z, { computeRightSingularVectors: false, autoTranspose: true });
  const kept = svd.diagonal.filter((s) => s > threshold).length;
  const U = svd.leftSingularVectors;
  return kept > 0 ? U.subMatrix(0, U.rows - 1, 0, kept - 1) : new MlMatrix(Z.rows, 0);
}

function concatColumns(X: MlMatrix, Y: MlMatrix): MlMatrix {
  const out = new MlMatrix(X.rows, X.columns + Y.columns);
  out.setSubMatrix(X, 0, 0);
  out.setSubMatrix(Y, 0, X.columns);
  return out;
}
