import { matrixExponential } from './expm.js';
import { assertRows, assertSquare } from './shape.js';
import type { Matrix } from './types.js';

/** A sampled model `x(k+1) = A x(k) + B u(k)`. */
export interface DiscreteModel {
  A: Matrix;
  B: Matrix;
}

/**
 * Zero-order-hold equivalent of `dx/dt = Ac x + Bc u` sampled every T seconds, with u held between
 * samples: `A = e^{Ac T}`, `B = ∫_0^T e^{Ac s} ds · Bc`. Both come from one exponential of the
 * augmented matrix `[[Ac, Bc], [0, 0]]·T = [[A, B], [0, I]]` (C. F. Van Loan, "Computing integrals
 * involving the matrix exponential", IEEE Trans. Automatic Control 23(3), 1978), so Ac may be
 * singular (integrators) — nothing is inverted.
 *
 * @param Ac - n×n continuous state matrix (1/s)
 * @param Bc - n×m continuous input matrix (state units per input unit per second)
 * @param samplePeriodS - T in seconds (> 0)
 */
export function discretizeZoh(Ac: Matrix, Bc: Matrix, samplePeriodS: number): DiscreteModel {
  const n = assertSquare('discretizeZoh', 'Ac', Ac);
  const m = assertRows('discretizeZoh', 'Bc', Bc, n, 'the order of Ac');
  if (!(samplePeriodS > 0) || !Number.isFinite(samplePeriodS)) {
    throw new RangeError(`discretizeZoh: samplePeriodS must be a positive number of seconds, got ${samplePeriodS}`);
  }
  const T = samplePeriodS;
  const augmented: Matrix = [
    ...Ac.map((row, i) => [...row.map((a) => a * T), ...Bc[i].map((b) => b * T)]),
    ...Array.from({ length: m }, () => new Array<number>(n + m).fill(0)),
  ];
  const E = matrixExponential(augmented);
  return {
    A: E.slice(0, n).map((row) => row.slice(0, n)),
    B: E.slice(0, n).map((row) => row.slice(n, n + m)),
  };
}
