import { modelShape } from './model-shape.js';
import { assertCount, assertVector } from './shape.js';
import { createStepper } from './step.js';
import type { Matrix, StateSpaceModel } from './types.js';

/** Predicted trajectory for samples k+1 … k+n, in engineering units. */
export interface Forecast {
  /** n rows: x(k+1) … x(k+n). */
  states: Matrix;
  /** n rows: y(k+1) … y(k+n), with the input held. */
  outputs: Matrix;
}

/**
 * The twin's forecast with the input held at `u`: `x(k+j) − x0 = A^j (x − x0) + H(j) (u − u0)`,
 * `H(j) = Σ_{i<j} A^i B`, for j = 1 … n, and the outputs `y(k+j) = y0 + C (x(k+j) − x0) + D (u − u0)`.
 * Evaluated by the recursion `x(j+1) = x0 + A (x(j) − x0) + B (u − u0)`, which produces the same
 * sum with n matrix-vector products.
 *
 * @param model - the model and its operating point
 * @param x - current state x(k) (engineering units)
 * @param u - input held from sample k on (engineering units)
 * @param n - horizon in samples (integer ≥ 0)
 */
export function forecast(model: StateSpaceModel, x: number[], u: number[], n: number): Forecast {
  const shape = modelShape('forecast', model);
  assertVector('forecast', 'x', x, shape.states);
  assertVector('forecast', 'u', u, shape.inputs);
  assertCount('forecast', 'n', n);
  const run = createStepper(model);
  const state = Float64Array.from(x);
  const input = Float64Array.from(u);
  const output = new Float64Array(shape.outputs);
  const states: Matrix = [];
  const outputs: Matrix = [];
  run(state, input, state, output);
  for (let j = 1; j <= n; j++) {
    states.push(Array.from(state));
    run(state, input, state, output);
    outputs.push(Array.from(output));
  }
  return { states, outputs };
}

/**
 * What-if preview: the forecast when input `inputIndex` steps by `delta` now and is then held,
 * every other input held at its current value.
 *
 * @param model - the model and its operating point
 * @param x - current state (engineering units)
 * @param u - current inputs (engineering units)
 * @param inputIndex - zero-based index of the input to move
 * @param delta - size of the move, in that input's engineering units
 * @param n - horizon in samples
 */
export function movePreview(
  model: StateSpaceModel,
  x: number[],
  u: number[],
  inputIndex: number,
  delta: number,
  n: number,
): Forecast {
  const { inputs } = modelShape('movePreview', model);
  assertVector('movePreview', 'u', u, inputs);
  if (!Number.isInteger(inputIndex) || inputIndex < 0 || inputIndex >= inputs) {
    throw new RangeError(`movePreview: inputIndex must be an integer in 0…${inputs - 1}, got ${inputIndex}`);
  }
  if (!Number.isFinite(delta)) throw new RangeError(`movePreview: delta must be a finite number, got ${delta}`);
  const moved = u.slice();
  moved[inputIndex] += delta;
  return forecast(model, x, moved, n);
}
