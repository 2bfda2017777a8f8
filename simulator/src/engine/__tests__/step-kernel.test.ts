import { describe, expect, it } from 'vitest';
import { multiplyVector } from '../dense.js';
import { createStepper } from '../step.js';
import type { Matrix, StateSpaceModel } from '../types.js';
import { randomMatrix, seededRandom } from './seeded-random.js';

/** x(k+1) and y(k) written out with plain products, independent of either kernel. */
function reference(model: StateSpaceModel, x: number[], u: number[]): { x: number[]; y: number[] } {
  const n = x.length;
  const x0 = model.x0 ?? new Array<number>(n).fill(0);
  const u0 = model.u0 ?? new Array<number>(u.length).fill(0);
  const dx = x.map((v, i) => v - x0[i]);
  const du = u.map((v, j) => v - u0[j]);
  const add = (a: number[], b: number[]) => a.map((v, i) => v + b[i]);
  const next = add(x0, add(multiplyVector(model.A, dx), multiplyVector(model.B, du)));
  const y = model.C
    ? add(
        model.y0 ?? new Array<number>(model.C.length).fill(0),
        add(multiplyVector(model.C, dx), multiplyVector(model.D as Matrix, du)),
      )
    : add(model.y0 ?? x0, dx);
  return { x: next, y };
}

function randomModel(seed: number, n: number, m: number, p: number | null): StateSpaceModel {
  const random = seededRandom(seed);
  const model: StateSpaceModel = {
    A: randomMatrix(random, n, n, 0.9 / n),
    B: randomMatrix(random, n, m),
    x0: randomMatrix(random, 1, n, 50)[0],
    u0: randomMatrix(random, 1, m, 50)[0],
  };
  if (p === null) return model;
  return {
    ...model,
    C: randomMatrix(random, p, n),
    D: randomMatrix(random, p, m),
    y0: randomMatrix(random, 1, p, 50)[0],
  };
}

/**
 * Models from 16 states plus inputs up run in the WebAssembly SIMD kernel, smaller ones in the
 * JavaScript loops: both must give the plain products' result, step after step, including for
 * widths that are not a multiple of the kernels' 8 columns and for the output-free form (C = I).
 */
describe('createStepper kernels', () => {
  const shapes: Array<[number, number, number | null]> = [
    [3, 1, 1],
    [9, 2, 3],
    [14, 2, 3],
    [15, 2, 4],
    [23, 1, 5],
    [50, 5, 5],
    [20, 3, null],
    [120, 30, 12],
  ];
  const cases = shapes.map(([n, m, p]) => ({ n, m, p, outputs: p === null ? 'no C or D' : `${p} outputs` }));
  it.each(cases)('$n states, $m inputs, $outputs: 25 steps agree with plain products', ({ n, m, p }) => {
    const model = randomModel(700 + n + m, n, m, p);
    const random = seededRandom(900 + n);
    const run = createStepper(model);
    const outputs = p ?? n;
    let x = randomMatrix(random, 1, n, 60)[0];
    const state = Float64Array.from(x);
    const y = new Float64Array(outputs);
    for (let k = 0; k < 25; k++) {
      const u = randomMatrix(random, 1, m, 60)[0];
      const expected = reference(model, x, u);
      run(state, Float64Array.from(u), state, y); // xNext is x: the kernel must read x first
      const scale = Math.max(1, ...expected.x.map(Math.abs), ...expected.y.map(Math.abs));
      expected.x.forEach((v, i) => expect(Math.abs(state[i] - v)).toBeLessThan(1e-12 * scale));
      expected.y.forEach((v, i) => expect(Math.abs(y[i] - v)).toBeLessThan(1e-12 * scale));
      x = expected.x;
    }
  });

  it('steppers of one large shape keep their own matrices', () => {
    const first = randomModel(11, 30, 4, 2);
    const second = randomModel(12, 30, 4, 2);
    const runFirst = createStepper(first);
    const runSecond = createStepper(second);
    const x = new Array<number>(30).fill(1);
    const u = [1, 2, 3, 4];
    const a = new Float64Array(30);
    const b = new Float64Array(30);
    const y = new Float64Array(2);
    runFirst(Float64Array.from(x), Float64Array.from(u), a, y);
    runSecond(Float64Array.from(x), Float64Array.from(u), b, y);
    expect(Array.from(a)).not.toEqual(Array.from(b));
    reference(first, x, u).x.forEach((v, i) => expect(a[i]).toBeCloseTo(v, 9));
  });
});
