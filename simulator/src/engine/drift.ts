import { LuDecomposition, Matrix as MlMatrix } from 'ml-matrix';
import { toMl } from './dense.js';
import { assertSquare, assertVector } from './shape.js';
import type { Matrix } from './types.js';

/** Which side of a two-sided detector crossed its limit on this sample, if any. */
export type DriftSignal = 'none' | 'upper' | 'lower';

/** Running sums of a two-sided tabular CUSUM, in standard deviations. Start from `{ upper: 0, lower: 0 }`. */
export interface CusumState {
  upper: number;
  lower: number;
}

/** CUSUM design: reference value k and decision interval h, both in standard deviations. */
export interface CusumDesign {
  k: number;
  h: number;
}

/**
 * One sample of the two-sided tabular CUSUM (E. S. Page, Biometrika 41, 1954) on a standardised
 * residual z: `upper = max(0, upper + z − k)`, `lower = max(0, lower − z − k)`; it signals when a sum
 * exceeds h (the larger excess wins if both do). The sums are not reset here: the caller resets
 * them when it raises an alert.
 */
export function cusumStep(state: CusumState, z: number, design: CusumDesign): CusumState & { signal: DriftSignal } {
  const upper = Math.max(0, state.upper + z - design.k);
  const lower = Math.max(0, state.lower - z - design.k);
  let signal: DriftSignal = 'none';
  if (upper > design.h || lower > design.h) signal = upper - design.h >= lower - design.h ? 'upper' : 'lower';
  return { upper, lower, signal };
}

/** EWMA statistic and the number of samples it has seen. Start from `{ value: 0, count: 0 }`. */
export interface EwmaState {
  value: number;
  count: number;
}

/** EWMA design: weight λ in (0, 1] and limit width L in standard deviations. */
export interface EwmaDesign {
  lambda: number;
  L: number;
}

/**
 * One sample of the EWMA chart on a standardised residual z: `value = λ z + (1 − λ) value`, with the
 * exact time-varying limit `L √(λ/(2−λ) · (1 − (1−λ)^{2·count}))` (J. M. Lucas and M. S. Saccucci,
 * Technometrics 32(1), 1990). Signals when |value| exceeds the limit.
 */
export function ewmaStep(
  state: EwmaState,
  z: number,
  design: EwmaDesign,
): EwmaState & { limit: number; signal: DriftSignal } {
  if (!(design.lambda > 0 && design.lambda <= 1)) {
    throw new RangeError(`ewmaStep: lambda must be in (0, 1], got ${design.lambda}`);
  }
  const { lambda, L } = design;
  const value = lambda * z + (1 - lambda) * state.value;
  const count = state.count + 1;
  const limit = L * Math.sqrt((lambda / (2 - lambda)) * (1 - (1 - lambda) ** (2 * count)));
  const signal: DriftSignal = value > limit ? 'upper' : value < -limit ? 'lower' : 'none';
  return { value, count, limit, signal };
}

/**
 * Normalised innovation squared `rᵀ S^{-1} r` (dimensionless). With a consistent model and S the
 * innovation covariance it follows a chi-square distribution with p = length(r) degrees of freedom
 * (Y. Bar-Shalom, X. R. Li, T. Kirubarajan, Estimation with Applications to Tracking and
 * Navigation, 2001, §5.4).
 *
 * @param residual - innovation r (length p, output units)
 * @param S - p×p innovation covariance (output units squared), nonsingular
 */
export function nis(residual: number[], S: Matrix): number {
  const p = assertSquare('nis', 'S', S);
  assertVector('nis', 'residual', residual, p);
  const lu = new LuDecomposition(toMl(S));
  if (lu.isSingular()) throw new RangeError('nis: S is singular');
  const w = lu.solve(MlMatrix.columnVector(residual)).to1DArray();
  return residual.reduce((sum, r, i) => sum + r * w[i], 0);
}
