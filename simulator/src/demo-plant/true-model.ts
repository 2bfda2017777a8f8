import type { Matrix, StateSpaceModel } from '../engine/index.js';

/** How the demo plant's "true" dynamics differ from the registered model. */
export interface Mismatch {
  /** Steady-state gain of the true plant over the model's (1.03: 3 % more). */
  gain: number;
  /** Time constants of the true plant over the model's (0.96: 4 % faster). */
  timeScale: number;
}

/**
 * The plant the demo plays: the registered model with its time constants scaled by `timeScale`
 * and its steady-state gain by `gain`, same operating point and outputs.
 *
 * With A = e^{A_c T}, a mode of time constant τ has eigenvalue λ = e^{−T/τ} and 1 − λ ≈ T/τ when
 * T ≪ τ. A' = I + (A − I)/s moves every eigenvalue to 1 + (λ − 1)/s, i.e. τ' ≈ s·τ, and then
 * (I − A')⁻¹ = s (I − A)⁻¹, so B' = g·B/s makes the steady-state gain (I − A')⁻¹B' = g (I − A)⁻¹B.
 */
export function perturbModel(model: StateSpaceModel, mismatch: Mismatch): StateSpaceModel {
  const { gain, timeScale } = mismatch;
  if (!(gain > 0) || !(timeScale > 0)) throw new RangeError('perturbModel: gain and timeScale must be positive');
  const A: Matrix = model.A.map((row, i) => row.map((a, j) => (i === j ? 1 : 0) + (a - (i === j ? 1 : 0)) / timeScale));
  const B: Matrix = model.B.map((row) => row.map((b) => (gain * b) / timeScale));
  return { ...model, A, B };
}
