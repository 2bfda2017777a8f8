import { describe, expect, it } from 'vitest';
import { steadyStateKalman } from '../../engine/index.js';
import { createLoopTwin } from '../loop-twin.js';
import { stepSlot } from '../twin-step.js';
import { TANKS, activeModel, add, matVec, nextState, sub } from './twin-fixtures.js';

const start = { next: 100, staleAfterSamples: 5 };
const u = [740];

describe('correction modes: the prediction of slot k+1 from the reading of slot k', () => {
  it('free_run ignores the measurement and only follows the inputs', () => {
    const twin = createLoopTwin(activeModel(TANKS), { ...start, x: [3.2, 2.4] });
    stepSlot(twin, { k: 100, u, y: [9, 9] });
    expect(twin.next).toBe(101);
    expect(Array.from(twin.x)).toEqual(nextState(TANKS, [3.2, 2.4], u));
    expect(Array.from(twin.predicted)).toEqual(Array.from(twin.x)); // C = I
  });

  it('reset with C = I restarts from the measured state', () => {
    const twin = createLoopTwin(activeModel(TANKS, { mode: 'reset', K: null }), { ...start, x: [3.2, 2.4] });
    stepSlot(twin, { k: 100, u, y: [3.5, 2.1] });
    const expected = nextState(TANKS, [3.5, 2.1], u);
    Array.from(twin.x).forEach((v, i) => expect(v).toBeCloseTo(expected[i], 12));
  });

  it('reset with an invertible C takes the state that reproduces the measurement (with feedthrough)', () => {
    const model = {
      ...TANKS,
      C: [
        [1, 1],
        [0, 2],
      ],
      D: [[0.001], [0]],
    };
    const twin = createLoopTwin(activeModel(model, { mode: 'reset', K: null }), { ...start, x: [3.2, 2.4] });
    const xTrue = [3.6, 2.2];
    // y0 defaults to C x0 + D u0, so y = C x + D u in engineering units
    stepSlot(twin, { k: 100, u, y: add(matVec(model.C, xTrue), matVec(model.D, u)) });
    const expected = nextState(model, xTrue, u);
    Array.from(twin.x).forEach((v, i) => expect(v).toBeCloseTo(expected[i], 10));
  });

  it('reset with more outputs than states takes the least-squares state (residual orthogonal to the columns of C)', () => {
    const model = {
      A: [
        [0.5, 0],
        [0, 0.5],
      ],
      B: [[0], [0]],
      C: [
        [1, 0],
        [0, 1],
        [1, 1],
      ],
    };
    const twin = createLoopTwin(activeModel(model, { mode: 'reset', K: null }), { ...start, x: [0, 0] });
    const y = [1, 2, 4];
    stepSlot(twin, { k: 100, u: [0], y });
    const corrected = Array.from(twin.x, (v) => v / 0.5); // undo A = 0.5 I to see x̂(k|k)
    const residual = sub(y, matVec(model.C, corrected));
    for (let j = 0; j < 2; j++) expect(model.C.reduce((s, row, i) => s + row[j] * residual[i], 0)).toBeCloseTo(0, 12);
  });

  it('reset falls back to free running, and says why, when the outputs cannot give every state', () => {
    const model = { ...TANKS, C: [[1, 0]] };
    const twin = createLoopTwin(activeModel(model, { mode: 'reset', K: null }), { ...start, x: [3.2, 2.4] });
    expect(twin.corrector.mode).toBe('free_run');
    expect(twin.corrector.note).toMatch(/1 outputs cannot give 2 states/);
    stepSlot(twin, { k: 100, u, y: [9] });
    expect(Array.from(twin.x)).toEqual(nextState(model, [3.2, 2.4], u));
  });

  it('kalman adds K times the innovation before predicting', () => {
    const model = { ...TANKS, C: [[1, 0]] };
    const { K } = steadyStateKalman(
      model.A,
      model.C,
      [
        [1e-3, 0],
        [0, 1e-3],
      ],
      [[1e-2]],
    );
    const twin = createLoopTwin(activeModel(model, { mode: 'kalman', K }), { ...start, x: [3.2, 2.4] });
    stepSlot(twin, { k: 100, u, y: [3.3] });
    const innovation = 3.3 - 3.2;
    const corrected = add(
      [3.2, 2.4],
      K.map((row) => row[0] * innovation),
    );
    const expected = nextState(model, corrected, u);
    Array.from(twin.x).forEach((v, i) => expect(v).toBeCloseTo(expected[i], 12));
    expect(twin.predicted[0]).toBeCloseTo(expected[0], 12);
  });

  it('kalman without a usable gain runs free and says so', () => {
    const twin = createLoopTwin(activeModel(TANKS, { mode: 'kalman', K: [[1]] }), start);
    expect(twin.corrector.mode).toBe('free_run');
    expect(twin.corrector.note).toMatch(/2×2 gain K/);
  });

  it('a missing reading coasts on the held inputs without correction', () => {
    const twin = createLoopTwin(activeModel(TANKS, { mode: 'reset', K: null }), { ...start, x: [3.2, 2.4], u: [700] });
    expect(stepSlot(twin, undefined)).toBe(false);
    expect(Array.from(twin.x)).toEqual(nextState(TANKS, [3.2, 2.4], [700]));
    expect(twin.lastMeasuredK).toBeNull();
  });
});
