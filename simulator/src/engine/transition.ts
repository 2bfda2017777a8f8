import { identity, multiply } from './dense.js';
import { assertCount, assertSquare } from './shape.js';
import type { Matrix } from './types.js';

/**
 * State transition matrix `A^k`: the map that carries a state `k` samples ahead with zero input,
 * `x(k) = A^k x(0)`. `A^0 = I`.
 *
 * Computed by binary exponentiation (repeated squaring), about `2·log2(k)` products, so a forecast
 * horizon of thousands of samples costs a handful of products.
 *
 * @param A - n×n state matrix (dimensionless, per sample)
 * @param k - number of samples, an integer ≥ 0
 * @returns n×n matrix `A^k`
 */
export function transitionMatrix(A: Matrix, k: number): Matrix {
  const n = assertSquare('transitionMatrix', 'A', A);
  assertCount('transitionMatrix', 'k', k);
  let result = identity(n);
  let base = A;
  let remaining = k;
  while (remaining > 0) {
    if (remaining % 2 === 1) result = multiply(result, base);
    remaining = Math.floor(remaining / 2);
    if (remaining > 0) base = multiply(base, base);
  }
  return result;
}
