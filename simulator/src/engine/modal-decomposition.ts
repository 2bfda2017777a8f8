import { solve, Matrix as MlMatrix } from 'ml-matrix';
import { eigenSystem } from './eigen.js';
import { assertCount, assertSquare, assertVector } from './shape.js';
import type { Complex, Matrix } from './types.js';

/** One mode's share of the free response `x(k) = A^k x0`. */
export interface ModalContribution {
  /** The eigenvalue λ_i (for a conjugate pair, the member with positive imaginary part). */
  eigenvalue: Complex;
  /** True when the contribution combines λ_i and its conjugate. */
  conjugatePair: boolean;
  /** Right eigenvector w_i: unit 2-norm, largest component real and positive. */
  eigenvector: Complex[];
  /** α_i = v_iᵀ x0 with the left eigenvector normalised so v_iᵀ w_i = 1. */
  coefficient: Complex;
  /**
   * Real contribution to x(k) for k = 0 … steps: `α_i λ_i^k w_i`, or for a pair
   * `α_i λ_i^k w_i + conj(…) = 2·Re(α_i λ_i^k w_i)`.
   */
  contribution: Matrix;
}

/**
 * Splits the free response `x(k) = A^k x0` into modes: with `A = W Λ W^{-1}` and left eigenvectors
 * `v_iᵀ` the rows of `W^{-1}` (so `v_iᵀ w_i = 1`), `x(k) = Σ_i (v_iᵀ x0) λ_i^k w_i`. Conjugate
 * pairs are merged into one real contribution. The contributions sum to `A^k x0`.
 *
 * Throws when A is defective (no eigenvector basis); use `transitionMatrix(A, k)` there instead.
 *
 * @param A - n×n state matrix
 * @param x0 - initial state deviation (length n)
 * @param steps - last sample k (integer ≥ 0)
 * @returns contributions sorted by |λ|, largest first
 */
export function modalDecomposition(A: Matrix, x0: number[], steps: number): ModalContribution[] {
  const n = assertSquare('modalDecomposition', 'A', A);
  assertVector('modalDecomposition', 'x0', x0, n);
  assertCount('modalDecomposition', 'steps', steps);
  const system = eigenSystem(A);
  if (system.defective) {
    throw new Error(
      `modalDecomposition: A is defective (eigenvector condition ${system.condition.toExponential(2)}); ` +
        'it has no basis of eigenvectors, so use transitionMatrix(A, k) · x0 instead',
    );
  }
  // coordinates of x0 in the real basis [.., re_i, im_i, ..]: x0 = Σ c_j V_j
  const c = solve(system.basis, MlMatrix.columnVector(x0)).to1DArray();
  const result: ModalContribution[] = [];
  system.values.forEach((value, j) => {
    if (value.im < 0) return;
    const pair = value.im > 0;
    const re = system.basis.getColumn(j);
    const im = pair ? system.basis.getColumn(j + 1) : re.map(() => 0);
    // x0 = c_j re + c_{j+1} im = 2 Re(α w) with w = re + i·im  ⇒  α = (c_j − i c_{j+1}) / 2
    const coefficient = pair ? { re: c[j] / 2, im: -c[j + 1] / 2 } : { re: c[j], im: 0 };
    result.push({
      eigenvalue: { ...value },
      conjugatePair: pair,
      eigenvector: re.map((r, i) => ({ re: r, im: im[i] })),
      coefficient,
      contribution: series(value, coefficient, re, im, pair ? 2 : 1, steps),
    });
  });
  return result.sort((a, b) => magnitude(b.eigenvalue) - magnitude(a.eigenvalue));
}

/** `factor · Re(α λ^k (re + i·im))` for k = 0 … steps. */
function series(lambda: Complex, alpha: Complex, re: number[], im: number[], factor: number, steps: number): Matrix {
  const out: Matrix = [];
  let zr = alpha.re;
  let zi = alpha.im;
  for (let k = 0; k <= steps; k++) {
    out.push(re.map((r, i) => factor * (zr * r - zi * im[i])));
    const nr = zr * lambda.re - zi * lambda.im;
    zi = zr * lambda.im + zi * lambda.re;
    zr = nr;
  }
  return out;
}

function magnitude(z: Complex): number {
  return Math.hypot(z.re, z.im);
}
