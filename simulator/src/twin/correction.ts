import type { Matrix, StateSpaceModel } from '../engine/index.js';
import type { ActiveModel } from '../registry/hot-swap.js';
import { resetGain } from './reset-gain.js';

export type CorrectionMode = ActiveModel['correction']['mode'];

/** How the twin uses a measurement y(k) against its prior output ŷ(k) = C x̂ + D u. */
export interface Corrector {
  /** The mode the twin runs: reset and kalman fall back to free_run when their gain is unusable. */
  mode: CorrectionMode;
  /** The mode the model version asked for. */
  requested: CorrectionMode;
  /** Why the twin runs another mode than requested; null when it does not. */
  note: string | null;
  /** x̂ ← x̂ + G (y − ŷ) in place; allocates nothing. A no-op for free_run. */
  correct(x: Float64Array, y: Float64Array, yHat: Float64Array): void;
}

const identity = (n: number): Matrix =>
  Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));

function hasShape(G: Matrix | null | undefined, rows: number, columns: number): G is Matrix {
  return (
    Array.isArray(G) &&
    G.length === rows &&
    G.every((row) => Array.isArray(row) && row.length === columns && row.every(Number.isFinite))
  );
}

/**
 * The measurement update of each mode, all of the form x̂ ← x̂ + G (y − ŷ):
 * - `free_run`: G = 0, the twin only ever sees the inputs;
 * - `reset`: G = C⁺, the least-squares state from the measurement (see {@link resetGain});
 * - `kalman`: G = K, the version's steady-state Kalman gain (n×p, stored with the version).
 */
export function createCorrector(version: { model: StateSpaceModel; correction: ActiveModel['correction'] }): Corrector {
  const { model, correction } = version;
  const n = model.A.length;
  const p = model.C ? model.C.length : n;
  const requested = correction.mode;
  let gain: Matrix | null = null;
  let note: string | null = null;
  if (requested === 'reset') {
    ({ gain, note } = resetGain(model.C ?? identity(n), n));
  } else if (requested === 'kalman') {
    if (hasShape(correction.K, n, p)) gain = correction.K;
    else
      note = `kalman correction needs a finite ${n}×${p} gain K with the version, and it has none: the twin runs free`;
  }
  if (!gain) return { mode: 'free_run', requested, note, correct: () => undefined };
  const G = Float64Array.from(gain.flat());
  const innovation = new Float64Array(p);
  return {
    mode: requested,
    requested,
    note,
    correct(x, y, yHat) {
      for (let j = 0; j < p; j++) innovation[j] = y[j] - yHat[j];
      for (let i = 0; i < n; i++) {
        let s = 0;
        for (let j = 0; j < p; j++) s += G[i * p + j] * innovation[j];
        x[i] += s;
      }
    },
  };
}
