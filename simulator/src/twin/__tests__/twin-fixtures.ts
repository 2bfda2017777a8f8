import type { Matrix, StateSpaceModel } from '../../engine/index.js';
import type { ActiveModel } from '../../registry/hot-swap.js';

/** A two-state, one-input loop with an operating point, as the registry would hand it over. */
export const TANKS: StateSpaceModel = {
  A: [
    [0.9, 0.05],
    [0.1, 0.8],
  ],
  B: [[0.2], [0.05]],
  x0: [3, 2.5],
  u0: [720],
};

export function activeModel(
  model: StateSpaceModel,
  correction: ActiveModel['correction'] = { mode: 'free_run', K: null },
  version = 1,
): ActiveModel {
  return {
    loopId: 'loop-1',
    loopTag: 'TEST-LT-1',
    samplePeriodS: 1,
    version: { id: `version-${version}`, number: version },
    model,
    correction,
  };
}

export const matVec = (M: Matrix, v: ArrayLike<number>) => M.map((row) => row.reduce((s, a, j) => s + a * v[j], 0));
export const sub = (a: ArrayLike<number>, b: ArrayLike<number>) => Array.from(a, (v, i) => v - b[i]);
export const add = (a: ArrayLike<number>, b: ArrayLike<number>) => Array.from(a, (v, i) => v + b[i]);

/** x0 + A (x − x0) + B (u − u0): the model's next state in engineering units. */
export function nextState(model: StateSpaceModel, x: number[], u: number[]): number[] {
  const x0 = model.x0 ?? x.map(() => 0);
  const u0 = model.u0 ?? u.map(() => 0);
  return add(x0, add(matVec(model.A, sub(x, x0)), matVec(model.B, sub(u, u0))));
}
