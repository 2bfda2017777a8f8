import { describe, expect, it } from 'vitest';
import { step, steadyStateKalman, type StateSpaceModel } from '@shadowloop/simulator/engine';
import { outputFigures, startReplay, type Recording, type ReplayVersion } from '@shadowloop/simulator/replay';
import { expectWithin, seededRandom } from './support.js';

/**
 * Backtest figures against L. Ljung, System Identification: Theory for the User, 2nd ed., Prentice
 * Hall 1999, §16.6 (residual analysis: the autocorrelation of the residuals with its 95 % band
 * ±1.96/√N) and the normalised-RMSE fit 100 (1 − ‖y − ŷ‖/‖y − ȳ‖) (often quoted as NRMSE fit).
 */

/** The backtest's autocorrelation lags, τ = 1 … 25. */
const MAX_LAG = 25;

function replayAll(version: ReplayVersion, recording: Recording, options?: { initialSamples?: number }) {
  const replay = startReplay(version, recording, options);
  while (!replay.done) replay.advance(1000);
  return replay.result();
}

describe('backtest fit figures (Ljung, System Identification, 2nd ed., 1999, §16.6)', () => {
  it('a version that generated the data fits 100 % with a negligible, white residual in both runs', () => {
    // Ljung §16.6: the true system leaves a residual of zero (here: rounding only), so the fit is
    // 100 % by the definition of the fit, and no lag carries correlation
    const model: StateSpaceModel = {
      A: [
        [0.8, 0.15, 0, 0],
        [0, 0.9, 0.05, 0],
        [0, 0, 0.6, 0.3],
        [0.1, 0, 0, 0.7],
      ],
      B: [
        [0.5, 0],
        [0, 0.2],
        [0.3, 0.1],
        [0, 0.4],
      ],
      C: [
        [1, 0, 0, 0],
        [0, 0, 1, 1],
      ],
      x0: [10, 5, 2, 3],
      u0: [40, 60],
    };
    const { K } = steadyStateKalman(
      model.A,
      model.C!,
      model.A.map((row, i) => row.map((_, j) => (i === j ? 0.01 : 0))),
      [
        [0.1, 0],
        [0, 0.1],
      ],
    );
    // a persistently exciting input: a seeded random binary signal of ±2 about the operating point
    const random = seededRandom(301);
    const N = 3000;
    const k = new Float64Array(N);
    const u = new Float64Array(2 * N);
    const y = new Float64Array(2 * N);
    let x = [11, 4, 3, 2.5];
    for (let t = 0; t < N; t++) {
      k[t] = 1_760_000_000 + t;
      const input = [40 + (random() < 0.5 ? -2 : 2), 60 + (random() < 0.5 ? -2 : 2)];
      const next = step(model, x, input);
      u.set(input, 2 * t);
      y.set(next.y, 2 * t);
      x = next.x;
    }
    const result = replayAll({ model, correction: { mode: 'kalman', K } }, { k, u, y, inputs: 2, outputs: 2 });
    expect(result.correction).toBe('kalman');
    for (const predicted of [result.oneStep, result.freeRun]) {
      for (const figures of outputFigures(y, predicted, 2, MAX_LAG)) {
        expect(figures.scored).toBe(N);
        expectWithin(figures.fitPercent ?? NaN, 100, 1e-9);
        expect(figures.autocorrelation?.negligible).toBe(true);
        expect(figures.autocorrelation?.white).toBe(true);
      }
    }
  });

  it('a gain scaled by g: free run g·y, fit exactly 100 (1 − |1 − g| ‖y‖/‖y − ȳ‖)', () => {
    // x(k+1) = a x(k) + b u(k), y = x, unit step from rest: y(k) = b (1 − a^k)/(1 − a) (closed
    // form); the version with g·b predicts g·y(k), so y − ŷ = (1 − g) y and the fit follows from
    // its definition
    const a = 0.85;
    const b = 0.4;
    const N = 400;
    const y = Float64Array.from({ length: N }, (_, t) => (b * (1 - a ** t)) / (1 - a));
    const recording: Recording = {
      k: Float64Array.from({ length: N }, (_, t) => t),
      u: new Float64Array(N).fill(1),
      y,
      inputs: 1,
      outputs: 1,
    };
    const mean = y.reduce((s, v) => s + v, 0) / N;
    const norm = Math.sqrt(y.reduce((s, v) => s + v * v, 0));
    const spread = Math.sqrt(y.reduce((s, v) => s + (v - mean) ** 2, 0));
    for (const g of [0.5, 0.9, 1.2]) {
      const version: ReplayVersion = { model: { A: [[a]], B: [[g * b]] }, correction: { mode: 'free_run', K: null } };
      // the first reading (y(0) = 0, at rest) fixes the start at rest
      const result = replayAll(version, recording, { initialSamples: 1 });
      expect(result.initialState).toEqual([0]);
      result.freeRun.forEach((v, t) => expectWithin(v, g * y[t], 1e-12));
      const [figures] = outputFigures(y, result.freeRun, 1, MAX_LAG);
      expectWithin(figures.fitPercent ?? NaN, 100 * (1 - (Math.abs(1 - g) * norm) / spread), 1e-9);
      expectWithin(figures.rmse ?? NaN, (Math.abs(1 - g) * norm) / Math.sqrt(N), 1e-12);
    }
  });

  it('whiteness: an AR(1) residual fails the test; a white one leaves few lags outside the band', () => {
    const N = 10_000;
    const random = seededRandom(303);
    const zeros = new Float64Array(N);
    // AR(1) e(t) = φ e(t−1) + w(t), φ = 0.5: r(τ) = φ^τ (G. E. P. Box, G. M. Jenkins, Time Series Analysis:
    // Forecasting and Control, rev. ed., 1976, §3.2.4), far outside ±1.96/√N at small lags
    const phi = 0.5;
    const ar = new Float64Array(N);
    for (let t = 1; t < N; t++) ar[t] = phi * ar[t - 1] + (random() - 0.5);
    const [correlated] = outputFigures(ar, zeros, 1, MAX_LAG);
    expect(correlated.autocorrelation?.white).toBe(false);
    expect(correlated.autocorrelation?.lagsOutside.slice(0, 3)).toEqual([1, 2, 3]);
    expectWithin(correlated.autocorrelation!.correlation[1], phi, 4 / Math.sqrt(N));
    expectWithin(correlated.autocorrelation!.band, 1.96 / Math.sqrt(N), 1e-15);

    // white: each r(τ), τ ≥ 1, is about N(0, 1/N) and nearly independent (Ljung §16.6), so the lags
    // outside the 95 % band count like Binomial(25, 0.05); the bound is the smallest c with
    // P(count > c) ≤ 0.001 under that binomial (c = 6)
    const white = Float64Array.from({ length: N }, () => random() - 0.5);
    const [figures] = outputFigures(white, zeros, 1, MAX_LAG);
    const bound = binomialUpperBound(MAX_LAG, 0.05, 0.001);
    expect(bound).toBe(6);
    expect(figures.autocorrelation?.negligible).toBe(false);
    expect(figures.autocorrelation!.lagsOutside.length).toBeLessThanOrEqual(bound);
  });
});

/** Smallest c with P(X > c) ≤ level for X ~ Binomial(trials, p). */
function binomialUpperBound(trials: number, p: number, level: number): number {
  let pmf = (1 - p) ** trials; // P(X = 0)
  let cdf = pmf;
  let c = 0;
  while (1 - cdf > level) {
    pmf *= ((trials - c) / (c + 1)) * (p / (1 - p));
    cdf += pmf;
    c++;
  }
  return c;
}
