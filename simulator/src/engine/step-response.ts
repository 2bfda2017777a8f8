import { Matrix as MlMatrix, SingularValueDecomposition, solve } from 'ml-matrix';
import { addInPlace, fromMl, identity, multiply, toMl, zeros } from './dense.js';
import { assertCount, assertRows, assertSquare } from './shape.js';
import type { Matrix } from './types.js';

/**
 * Step response `H(n) = Σ_{i=0}^{n-1} A^i B`: the state after `n` samples of a unit step in each
 * input, starting from rest (column j answers a step in input j). `H(0) = 0`.
 *
 * Uses doubling, `H(2m) = H(m) + A^m H(m)` and `H(m+1) = A H(m) + B`, so the cost grows with
 * `log2(n)`, not with `n`.
 *
 * @param A - n×n state matrix
 * @param B - n×m input matrix (state units per input unit, per sample)
 * @param n - samples since the step, an integer ≥ 0
 * @returns n×m matrix `H(n)` (state units per input unit)
 */
export function stepResponse(A: Matrix, B: Matrix, n: number): Matrix {
  const states = assertSquare('stepResponse', 'A', A);
  const inputs = assertRows('stepResponse', 'B', B, states, 'the order of A');
  assertCount('stepResponse', 'n', n);
  let power = identity(states);
  let sum = zeros(states, inputs);
  for (const bit of n.toString(2)) {
    sum = addInPlace(multiply(power, sum), sum);
    power = multiply(power, power);
    if (bit === '1') {
      sum = addInPlace(multiply(A, sum), B);
      power = multiply(A, power);
    }
  }
  return sum;
}

/**
 * The step response at every sample `n = 0 … N`, for charts: `H(0) = 0`, `H(n+1) = A H(n) + B`
 * (one product per sample, no repeated powers).
 *
 * @param A - n×n state matrix
 * @param B - n×m input matrix
 * @param N - last sample, an integer ≥ 0
 * @returns `N + 1` matrices, `H(0) … H(N)`
 */
export function stepResponseSeries(A: Matrix, B: Matrix, N: number): Matrix[] {
  const states = assertSquare('stepResponseSeries', 'A', A);
  const inputs = assertRows('stepResponseSeries', 'B', B, states, 'the order of A');
  assertCount('stepResponseSeries', 'N', N);
  const series: Matrix[] = [zeros(states, inputs)];
  for (let k = 0; k < N; k++) series.push(addInPlace(multiply(A, series[k]), B));
  return series;
}

/**
 * Relative tolerance under which `I − A` counts as singular: smallest over largest singular value.
 * A mode within about 1e-12 of λ = 1 has a time constant beyond 10^12 samples; the loop integrates.
 */
export const SINGULAR_RELATIVE_TOLERANCE = 1e-12;

/**
 * Steady-state gain `(I − A)^{-1} B`: the final state change per unit input step, the limit of
 * `H(n)` as `n → ∞` when A is stable.
 *
 * @param A - n×n state matrix
 * @param B - n×m input matrix
 * @returns n×m gain (state units per input unit), or `null` when `I − A` is singular within
 *   {@link SINGULAR_RELATIVE_TOLERANCE} (an integrating mode, eigenvalue at 1: no finite gain)
 */
export function steadyStateGain(A: Matrix, B: Matrix): Matrix | null {
  const states = assertSquare('steadyStateGain', 'A', A);
  assertRows('steadyStateGain', 'B', B, states, 'the order of A');
  const iMinusA = MlMatrix.eye(states).sub(toMl(A));
  const sv = new SingularValueDecomposition(iMinusA, {
    computeLeftSingularVectors: false,
    computeRightSingularVectors: false,
  }).diagonal;
  const largest = sv[0];
  const smallest = sv[sv.length - 1];
  if (!(largest > 0) || smallest <= SINGULAR_RELATIVE_TOLERANCE * largest) return null;
  return fromMl(solve(iMinusA, toMl(B)));
}
