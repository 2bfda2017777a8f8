import { describe, expect, it } from 'vitest';
import { analyzeModes, steadyStateGain } from '../../engine/index.js';
import { DEMO_CYCLE_S, FAULT_SCHEDULE, demoSeconds, faultLevel, faultLevels } from '../fault-schedule.js';
import { inputOffset } from '../operator-moves.js';
import { seededNormal, seededUniform, uniformAt } from '../random.js';
import { perturbModel } from '../true-model.js';

describe('seeded noise', () => {
  it('repeats exactly for the same seed and differs for another', () => {
    const draw = (seed: number) => Array.from({ length: 5 }, seededNormal(seed));
    expect(draw(7)).toEqual(draw(7));
    expect(draw(7)).not.toEqual(draw(8));
    expect(uniformAt(7, 12)).toBe(uniformAt(7, 12));
  });

  it('gives standard normal deviates: mean 0 and variance 1 within sampling error', () => {
    const normal = seededNormal(2024);
    const n = 40_000;
    const values = Array.from({ length: n }, normal);
    const mean = values.reduce((s, v) => s + v, 0) / n;
    const variance = values.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1);
    expect(Math.abs(mean)).toBeLessThan(4 / Math.sqrt(n)); // four standard errors
    expect(Math.abs(variance - 1)).toBeLessThan(4 * Math.sqrt(2 / n));
    const uniform = seededUniform(1);
    expect(Array.from({ length: 1000 }, uniform).every((u) => u >= 0 && u < 1)).toBe(true);
  });
});

describe('the true model', () => {
  const model = {
    A: [
      [0.9, 0.02],
      [0.05, 0.8],
    ],
    B: [[0.1], [0.3]],
    x0: [1, 2],
    u0: [3],
  };

  it('scales the steady-state gain by the gain factor', () => {
    const truth = perturbModel(model, { gain: 1.04, timeScale: 0.97 });
    const expected = (steadyStateGain(model.A, model.B) as number[][]).map((row) => row.map((g) => 1.04 * g));
    (steadyStateGain(truth.A, truth.B) as number[][]).forEach((row, i) =>
      row.forEach((g, j) => expect(g).toBeCloseTo(expected[i][j], 10)),
    );
    expect(truth.x0).toEqual(model.x0);
    expect(truth.u0).toEqual(model.u0);
  });

  it('moves every eigenvalue λ to 1 + (λ − 1)/s, stretching the time constants by about s', () => {
    const s = 1.05;
    const magnitudes = (A: number[][]) =>
      analyzeModes(A, 1)
        .modes.map((m) => m.eigenvalue.re)
        .sort();
    const expected = magnitudes(model.A).map((l) => 1 + (l - 1) / s);
    magnitudes(perturbModel(model, { gain: 1, timeScale: s }).A).forEach((l, i) =>
      expect(l).toBeCloseTo(expected[i], 12),
    );
  });
});

describe('the fault script', () => {
  it('keeps the plant healthy for about the first three minutes, then starts the first fault', () => {
    for (let t = 0; t < 180; t += 5) expect(Object.values(faultLevels(t)).every((level) => level === 0)).toBe(true);
    expect(Math.min(...FAULT_SCHEDULE.map((f) => f.startS))).toBe(180);
    expect(faultLevels(181).transmitter_drift).toBeGreaterThan(0);
  });

  it('ramps a fault up linearly, holds it, repairs it, and repeats every cycle', () => {
    const fouling = FAULT_SCHEDULE.find((f) => f.kind === 'diffuser_fouling')!;
    expect(faultLevel(fouling, fouling.startS + fouling.rampS / 2)).toBeCloseTo(0.5, 12);
    expect(faultLevel(fouling, fouling.endS - 1)).toBe(1);
    expect(faultLevel(fouling, fouling.endS)).toBe(0);
    expect(faultLevel(fouling, DEMO_CYCLE_S + fouling.startS + fouling.rampS / 4)).toBeCloseTo(0.25, 12);
  });

  it('shows every kind of fault within one cycle', () => {
    const seen = new Set(
      Array.from({ length: DEMO_CYCLE_S }, (_, t) => faultLevels(t)).flatMap((l) =>
        Object.entries(l)
          .filter(([, v]) => v > 0)
          .map(([k]) => k),
      ),
    );
    expect(seen).toEqual(new Set(['diffuser_fouling', 'transmitter_drift', 'sticking_valve', 'frozen_analyser']));
  });

  it('runs the script faster with DEMO_SPEED', () => {
    expect(demoSeconds(90_000, 2)).toBe(180);
    expect(demoSeconds(90_000, 1)).toBe(90);
  });
});

describe('operator moves', () => {
  const habits = [{ input: 0, everyS: 300, amplitude: 4, step: 1 }];

  it('makes none in the first interval, then whole-step moves within the amplitude, the same on a replay', () => {
    expect(inputOffset(0, 299, 7, habits, [])).toBe(0);
    const moves = Array.from({ length: 40 }, (_, i) => inputOffset(0, 300 * (i + 1) + 10, 7, habits, []));
    expect(moves.every((m) => Number.isInteger(m) && Math.abs(m) <= 4)).toBe(true);
    expect(new Set(moves).size).toBeGreaterThan(2);
    expect(moves).toEqual(Array.from({ length: 40 }, (_, i) => inputOffset(0, 300 * (i + 1) + 10, 7, habits, [])));
    expect(inputOffset(0, 310, 7, habits, [])).toBe(inputOffset(0, 590, 7, habits, []));
  });

  it('adds a scripted move during its window only, on its own input', () => {
    const scripted = [{ input: 1, fromS: 100, untilS: 200, delta: 15 }];
    expect([
      inputOffset(1, 99, 7, [], scripted),
      inputOffset(1, 150, 7, [], scripted),
      inputOffset(1, 200, 7, [], scripted),
    ]).toEqual([0, 15, 0]);
    expect(inputOffset(0, 150, 7, [], scripted)).toBe(0);
  });
});
