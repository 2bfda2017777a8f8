import { describe, expect, it } from 'vitest';
import { step, steadyStateKalman, type StateSpaceModel } from '../../engine/index.js';
import { seededRandom } from '../../engine/__tests__/seeded-random.js';
import { createLoopTwin } from '../loop-twin.js';
import { outputFigures, startReplay, type Recording, type ReplayVersion } from '../replay.js';
import { coast, stepSlot } from '../twin-step.js';
import { TANKS, activeModel, nextState } from './twin-fixtures.js';

/** Three states, two inputs, two outputs (C not invertible, D ≠ 0), with an operating point. */
const MIXER: StateSpaceModel = {
  A: [
    [0.85, 0.1, 0],
    [0, 0.7, 0.2],
    [0.05, 0, 0.9],
  ],
  B: [
    [0.3, 0],
    [0.1, 0.2],
    [0, 0.4],
  ],
  C: [
    [1, 0, 0.5],
    [0, 1, 0],
  ],
  D: [
    [0.02, 0],
    [0, 0.01],
  ],
  x0: [4, 2, 6],
  u0: [50, 30],
  y0: [7, 2.1],
};

const KALMAN = steadyStateKalman(
  MIXER.A,
  MIXER.C!,
  [
    [0.01, 0, 0],
    [0, 0.01, 0],
    [0, 0, 0.01],
  ],
  [
    [0.04, 0],
    [0, 0.04],
  ],
).K;

/**
 * Readings of a model driven by seeded random inputs from state `x`, generated with the engine's
 * `step`, with seeded uniform noise of ±noise/2 on the outputs. Slot numbers from `k0`; `skip`
 * lists slot numbers that get no reading (the plant still moves, on held inputs).
 */
function record(
  model: StateSpaceModel,
  x: number[],
  slots: number,
  options: { seed?: number; noise?: number; k0?: number; skip?: (k: number) => boolean } = {},
): Recording {
  const random = seededRandom(options.seed ?? 1);
  const m = model.B[0].length;
  const u0 = model.u0 ?? new Array<number>(m).fill(0);
  const k: number[] = [];
  const us: number[] = [];
  const ys: number[] = [];
  let u = u0.slice();
  for (let t = 0; t < slots; t++) {
    const slot = (options.k0 ?? 1000) + t;
    const missing = options.skip?.(slot) ?? false;
    if (!missing) u = u0.map((v) => v + (random() < 0.5 ? -5 : 5));
    const { x: next, y } = step(model, x, u);
    if (!missing) {
      k.push(slot);
      us.push(...u);
      ys.push(...y.map((v) => v + (options.noise ?? 0) * (random() - 0.5)));
    }
    x = next;
  }
  return {
    k: Float64Array.from(k),
    u: Float64Array.from(us),
    y: Float64Array.from(ys),
    inputs: m,
    outputs: ys.length / k.length,
  };
}

/** The twin run by hand over a recording (stepSlot per reading, coast over gaps): its prior predictions. */
function handRun(version: ReplayVersion, recording: Recording, x: number[]): number[] {
  const { k, u, y, inputs: m, outputs: p } = recording;
  const twin = createLoopTwin(activeModel(version.model, version.correction), {
    next: k[0],
    x,
    u: u.slice(0, m),
    staleAfterSamples: 5,
  });
  const predictions: number[] = [];
  for (let i = 0; i < k.length; i++) {
    coast(twin, k[i] - twin.next);
    predictions.push(...twin.predicted);
    const reading = {
      k: k[i],
      u: Array.from(u.subarray(i * m, i * m + m)),
      y: Array.from(y.subarray(i * p, i * p + p)),
    };
    stepSlot(twin, reading.y.every(Number.isFinite) ? reading : undefined);
  }
  return predictions;
}

function replayAll(version: ReplayVersion, recording: Recording, options?: { initialSamples?: number }) {
  const replay = startReplay(version, recording, options);
  replay.advance(Infinity);
  return replay.result();
}

describe('replaying a version over a recording', () => {
  it('predicts slot by slot what the twin predicts when run by hand (kalman correction)', () => {
    const version: ReplayVersion = { model: MIXER, correction: { mode: 'kalman', K: KALMAN } };
    const recording = record(MIXER, [4.5, 1.5, 6.5], 400, { noise: 0.2 });
    const result = replayAll(version, recording);
    expect(result.correction).toBe('kalman');
    expect(result.note).toBeNull();
    expect(Array.from(result.oneStep)).toEqual(handRun(version, recording, result.initialState));
    const free: ReplayVersion = { model: MIXER, correction: { mode: 'free_run', K: null } };
    expect(Array.from(result.freeRun)).toEqual(handRun(free, recording, result.initialState));
    expect(result.oneStep).not.toEqual(result.freeRun);
    expect(result.diverged).toBe(false);
  });

  it('gives the same one-step and free-run predictions when the version runs free', () => {
    const recording = record(MIXER, [4.5, 1.5, 6.5], 300, { noise: 0.2 });
    const result = replayAll({ model: MIXER, correction: { mode: 'free_run', K: null } }, recording);
    expect(result.correction).toBe('free_run');
    expect(result.oneStep).toEqual(result.freeRun);
  });

  it('falls back as the twin does, and says why, when the kalman gain is missing', () => {
    const recording = record(MIXER, [4, 2, 6], 60);
    const result = replayAll({ model: MIXER, correction: { mode: 'kalman', K: null } }, recording);
    expect(result.correction).toBe('free_run');
    expect(result.note).toMatch(/kalman correction needs a finite 3×2 gain K/);
    expect(result.oneStep).toEqual(result.freeRun);
  });

  it('coasts over missing slots and over unusable readings like the twin', () => {
    // slots 1010 … 1016 have no reading; slot 1030's outputs are not numbers
    const recording = record(TANKS, [3.4, 2.2], 80, { noise: 0.1, skip: (k) => k >= 1010 && k <= 1016 });
    const unusable = recording.k.indexOf(1030);
    recording.y[unusable * 2 + 1] = NaN;
    const version: ReplayVersion = { model: TANKS, correction: { mode: 'reset', K: null } };
    const result = replayAll(version, recording);
    expect(Array.from(result.oneStep)).toEqual(handRun(version, recording, result.initialState));
    // closed form across the gap: the reset state y(1009), then 8 steps on the held inputs u(1009)
    const before = recording.k.indexOf(1009);
    const held = Array.from(recording.u.subarray(before, before + 1));
    let expected = Array.from(recording.y.subarray(2 * before, 2 * before + 2));
    for (let s = 0; s < 8; s++) expected = nextState(TANKS, expected, held);
    const after = recording.k.indexOf(1017);
    expected.forEach((v, j) => expect(result.oneStep[2 * after + j]).toBeCloseTo(v, 10));
  });

  it('reset with C = I predicts y(k) = x0 + A (y(k−1) − x0) + B (u(k−1) − u0)', () => {
    const recording = record(TANKS, [3.4, 2.2], 200, { noise: 0.3 });
    const result = replayAll({ model: TANKS, correction: { mode: 'reset', K: null } }, recording);
    expect(result.correction).toBe('reset');
    for (let i = 1; i < recording.k.length; i++) {
      const y = Array.from(recording.y.subarray(2 * (i - 1), 2 * i));
      const u = Array.from(recording.u.subarray(i - 1, i));
      nextState(TANKS, y, u).forEach((v, j) => expect(Math.abs(result.oneStep[2 * i + j] - v)).toBeLessThan(1e-12));
    }
  });

  it('fits the initial state by least squares: a known offset comes back exactly, across a gap', () => {
    // D = 0: the prior prediction holds the previous inputs, so feedthrough would differ from the data
    const model = { ...MIXER, D: undefined };
    const truth = [4.7, 1.2, 5.1];
    const recording = record(model, truth, 120, { k0: 1_760_000_000, skip: (k) => k % 100 >= 20 && k % 100 < 31 });
    const result = replayAll({ model, correction: { mode: 'free_run', K: null } }, recording);
    result.initialState.forEach((v, i) => expect(Math.abs(v - truth[i])).toBeLessThan(1e-9));
    // from the exact start, the free run reproduces the noise-free data
    recording.y.forEach((v, i) => expect(Math.abs(result.freeRun[i] - v)).toBeLessThan(1e-9));
    expect(
      replayAll({ model, correction: { mode: 'free_run', K: null } }, recording, { initialSamples: 0 }).initialState,
    ).toEqual(model.x0);
  });

  it('leaves unseen states at the operating point (minimum-norm initial state)', () => {
    // only state 1 is measured and A is diagonal: states 2 and 3 never reach the output
    const model: StateSpaceModel = {
      A: [
        [0.9, 0, 0],
        [0, 0.5, 0],
        [0, 0, 0.7],
      ],
      B: [[0.2], [0.1], [0.3]],
      C: [[1, 0, 0]],
      x0: [10, 20, 30],
      u0: [1],
    };
    const recording = record(model, [12, 25, 27], 100);
    const { initialState } = replayAll({ model, correction: { mode: 'free_run', K: null } }, recording);
    expect(Math.abs(initialState[0] - 12)).toBeLessThan(1e-9);
    expect(Math.abs(initialState[1] - 20)).toBeLessThan(1e-12);
    expect(Math.abs(initialState[2] - 30)).toBeLessThan(1e-12);
  });

  it('marks an unstable version as diverged without throwing; its predictions are NaN from there', () => {
    const model: StateSpaceModel = { A: [[1e10]], B: [[1]] };
    const random = seededRandom(5);
    const N = 100;
    const recording: Recording = {
      k: Float64Array.from({ length: N }, (_, i) => i),
      u: Float64Array.from({ length: N }, () => random()),
      y: Float64Array.from({ length: N }, () => random()),
      inputs: 1,
      outputs: 1,
    };
    const result = replayAll({ model, correction: { mode: 'reset', K: null } }, recording);
    expect(result.diverged).toBe(true);
    const first = result.freeRun.findIndex((v) => Number.isNaN(v));
    expect(first).toBeGreaterThan(0);
    expect(result.freeRun.subarray(0, first).every(Number.isFinite)).toBe(true);
    expect(result.freeRun.subarray(first).every(Number.isNaN)).toBe(true);
    // the reset run restarts from each reading and stays finite: ŷ(k) = 10¹⁰ y(k−1) + u(k−1)
    expect(result.oneStep.every(Number.isFinite)).toBe(true);
  });

  it('gives bit-identical results in chunks of 7 slots, with the progress on the way', () => {
    const version: ReplayVersion = { model: MIXER, correction: { mode: 'kalman', K: KALMAN } };
    const recording = record(MIXER, [4.5, 1.5, 6.5], 250, { noise: 0.2, skip: (k) => k % 37 === 0 });
    const whole = replayAll(version, recording);
    const chunked = startReplay(version, recording);
    expect(() => chunked.result()).toThrow(/after 0 of \d+ slots/);
    const N = recording.k.length;
    for (let chunks = 1; !chunked.done; chunks++) {
      chunked.advance(7);
      expect(chunked.fraction).toBe(Math.min(7 * chunks, N) / N);
    }
    expect(chunked.fraction).toBe(1);
    expect(chunked.result()).toEqual(whole);
  });

  it('names what does not fit in a recording', () => {
    const version: ReplayVersion = { model: TANKS, correction: { mode: 'free_run', K: null } };
    const good = record(TANKS, [3, 2.5], 5);
    expect(() => startReplay(version, { ...good, outputs: 1 })).toThrow(/1 outputs, the model 1 and 2/);
    expect(() => startReplay(version, { ...good, y: good.y.subarray(1) })).toThrow(/need 5 input values and 10 output/);
    expect(() => startReplay(version, { ...good, k: Float64Array.from([1, 2, 2, 3, 4]) })).toThrow(
      /k\[2\] = 2 follows 2/,
    );
    expect(() => startReplay(version, { ...good, k: new Float64Array(0), u: good.u.subarray(0, 0) })).toThrow(
      /no slots/,
    );
    expect(() => startReplay(version, good, { initialSamples: -1 })).toThrow(/initialSamples/);
  });
});

describe('output figures', () => {
  it('scores only slots where both values are finite, with the figures of a constant residual', () => {
    // closed forms for y − ŷ = c: rmse = |c|, mean = c, std = 0, fit = 100 (1 − |c| √N / ‖y − ȳ‖)
    const y = [1, 4, 2, 8, 5, 7, 3, 6];
    const c = 0.5;
    const measured = Float64Array.from([...y, NaN, 1]);
    const predicted = Float64Array.from([...y.map((v) => v - c), 3, NaN]);
    const [figures] = outputFigures(measured, predicted, 1, 3);
    const mean = y.reduce((s, v) => s + v, 0) / y.length;
    const spread = Math.sqrt(y.reduce((s, v) => s + (v - mean) ** 2, 0));
    expect(figures.scored).toBe(8);
    expect(figures.rmse).toBeCloseTo(c, 14);
    expect(figures.residualMean).toBeCloseTo(c, 14);
    expect(figures.residualStd).toBeCloseTo(0, 14);
    expect(figures.fitPercent).toBeCloseTo(100 * (1 - (c * Math.sqrt(8)) / spread), 12);
    // a constant residual has r(τ) = (N − τ)/N (no mean removed): not white
    figures.autocorrelation!.correlation.forEach((r, tau) => expect(r).toBeCloseTo((8 - tau) / 8, 14));
    expect(figures.autocorrelation!.white).toBe(false);
    expect(figures.autocorrelation!.negligible).toBe(false);
  });

  it('keeps outputs apart and leaves out what too few slots cannot give', () => {
    // output 1: y constant; output 2: one scored slot
    const measured = Float64Array.from([2, 1, 2, NaN, 2, NaN]);
    const predicted = Float64Array.from([1.5, 0, 2.5, 3, 2, 1]);
    const [constant, single] = outputFigures(measured, predicted, 2, 1);
    expect(constant.scored).toBe(3);
    expect(constant.fitPercent).toBeNull();
    expect(constant.rmse).toBeCloseTo(Math.sqrt(0.5 / 3), 14);
    expect(constant.autocorrelation).not.toBeNull();
    expect(single).toEqual({
      scored: 1,
      fitPercent: null,
      rmse: 1,
      residualMean: 1,
      residualStd: null,
      autocorrelation: null,
    });
    expect(outputFigures(measured, predicted, 2, 2)[0].autocorrelation).toBeNull(); // 3 ≤ maxLag + 1
  });

  it('reports a residual at rounding level as white, r = (1, 0, …)', () => {
    const y = Float64Array.from({ length: 50 }, (_, t) => 100 + Math.sin(t));
    const predicted = y.map((v, t) => v + (t % 2 ? 1e-13 : -1e-13));
    const [figures] = outputFigures(y, predicted, 1, 4);
    // limit: χ²₀.₉₅(4) = 9.488 (NIST/SEMATECH e-Handbook, upper critical values of chi-square)
    expect(figures.autocorrelation).toEqual({
      correlation: [1, 0, 0, 0, 0],
      band: 1.96 / Math.sqrt(50),
      lagsOutside: [],
      statistic: 0,
      limit: expect.closeTo(9.488, 3),
      white: true,
      negligible: true,
    });
  });

  it('refuses arrays that are not N×p', () => {
    expect(() => outputFigures(new Float64Array(5), new Float64Array(5), 2, 3)).toThrow(/must both be N×2/);
    expect(() => outputFigures(new Float64Array(4), new Float64Array(4), 2, 0)).toThrow(/maxLag/);
  });
});
