import { describe, expect, it } from 'vitest';
import { multiplyVector } from '../dense.js';
import { forecast, movePreview } from '../forecast.js';
import { step, createStepper } from '../step.js';
import { stepResponse } from '../step-response.js';
import { transitionMatrix } from '../transition.js';
import type { StateSpaceModel } from '../types.js';
import { randomMatrix, seededRandom } from './seeded-random.js';

function randomModel(seed: number, n: number, m: number, p: number): StateSpaceModel {
  const random = seededRandom(seed);
  return {
    A: randomMatrix(random, n, n, 0.9 / n),
    B: randomMatrix(random, n, m),
    C: randomMatrix(random, p, n),
    D: randomMatrix(random, p, m),
    x0: randomMatrix(random, 1, n, 50)[0],
    u0: randomMatrix(random, 1, m, 50)[0],
    y0: randomMatrix(random, 1, p, 50)[0],
  };
}

describe('step', () => {
  it('acts on deviations from the operating point', () => {
    const model = randomModel(51, 4, 2, 3);
    const x = [1, 2, 3, 4];
    const u = [5, -6];
    const dx = x.map((v, i) => v - (model.x0 ?? [])[i]);
    const du = u.map((v, j) => v - (model.u0 ?? [])[j]);
    const { x: next, y } = step(model, x, u);
    const Adx = multiplyVector(model.A, dx);
    const Bdu = multiplyVector(model.B, du);
    next.forEach((v, i) => expect(v).toBeCloseTo((model.x0 ?? [])[i] + Adx[i] + Bdu[i], 12));
    const Cdx = multiplyVector(model.C ?? [], dx);
    const Ddu = multiplyVector(model.D ?? [], du);
    y.forEach((v, i) => expect(v).toBeCloseTo((model.y0 ?? [])[i] + Cdx[i] + Ddu[i], 12));
  });

  it('defaults to C = I, D = 0 and y0 = C x0 + D u0', () => {
    const model = {
      A: [
        [0.5, 0],
        [0.1, 0.8],
      ],
      B: [[1], [0]],
      x0: [10, 20],
      u0: [3],
    };
    const { x, y } = step(model, [11, 21], [4]);
    expect(y).toEqual([11, 21]);
    expect(x[0]).toBeCloseTo(10 + 0.5 + 1, 14);
    expect(x[1]).toBeCloseTo(20 + 0.1 + 0.8, 14);
  });

  it('the preallocated stepper agrees with step and allows xNext to be x', () => {
    const model = randomModel(52, 6, 3, 2);
    const run = createStepper(model);
    const x = Float64Array.from([1, 2, 3, 4, 5, 6]);
    const u = Float64Array.from([0.5, -1, 2]);
    const y = new Float64Array(2);
    const expected = step(model, Array.from(x), Array.from(u));
    run(x, u, x, y);
    Array.from(x).forEach((v, i) => expect(v).toBeCloseTo(expected.x[i], 12));
    Array.from(y).forEach((v, i) => expect(v).toBeCloseTo(expected.y[i], 12));
  });

  it('rejects mismatched lengths and shapes', () => {
    const run = createStepper({ A: [[0.5]], B: [[1]] });
    expect(() => run(new Float64Array(2), new Float64Array(1), new Float64Array(1), new Float64Array(1))).toThrow(
      /x must have length 1/,
    );
    expect(() => step({ A: [[0.5]], B: [[1]], D: [[1, 2]] }, [0], [0])).toThrow(/D has 2 columns/);
  });
});

describe('forecast', () => {
  it('equals A^j (x − x0) + H(j) (u − u0) for j = 1 … n', () => {
    const model = randomModel(53, 5, 2, 2);
    const x = [3, 1, 4, 1, 5];
    const u = [9, 2];
    const n = 12;
    const { states, outputs } = forecast(model, x, u, n);
    const dx = x.map((v, i) => v - (model.x0 ?? [])[i]);
    const du = u.map((v, i) => v - (model.u0 ?? [])[i]);
    for (let j = 1; j <= n; j++) {
      const free = multiplyVector(transitionMatrix(model.A, j), dx);
      const forced = multiplyVector(stepResponse(model.A, model.B, j), du);
      const expected = free.map((v, i) => (model.x0 ?? [])[i] + v + forced[i]);
      states[j - 1].forEach((v, i) => expect(v).toBeCloseTo(expected[i], 10));
      const y = step(model, states[j - 1], u).y;
      outputs[j - 1].forEach((v, i) => expect(v).toBeCloseTo(y[i], 10));
    }
  });

  it('previews a move as the forecast with one input stepped', () => {
    const model = randomModel(54, 3, 2, 3);
    const preview = movePreview(model, [1, 2, 3], [4, 5], 1, -2, 6);
    expect(preview).toEqual(forecast(model, [1, 2, 3], [4, 3], 6));
    expect(() => movePreview(model, [1, 2, 3], [4, 5], 2, 1, 6)).toThrow(/inputIndex/);
  });
});
