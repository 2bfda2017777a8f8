import { describe, expect, it } from 'vitest';
import { fitPercent, residualAutocorrelation } from '@shadowloop/simulator/engine';
import { expectWithin, seededRandom } from './support.js';

describe('model fit figures (L. Ljung, System Identification, 2nd ed., 1999, model validation)', () => {
  it('fit of a prediction that keeps a fraction of the deviation from the mean', () => {
    // closed form: ŷ = ȳ + (1 − a)(y − ȳ) gives ‖y − ŷ‖ = |a|·‖y − ȳ‖, so fit = 100(1 − |a|)
    const random = seededRandom(201);
    const y = Array.from({ length: 200 }, () => 10 + random());
    const mean = y.reduce((s, v) => s + v, 0) / y.length;
    for (const a of [0, 0.25, 1, 1.5]) {
      const predicted = y.map((v) => mean + (1 - a) * (v - mean));
      expectWithin(fitPercent(y, predicted) ?? NaN, 100 * (1 - a), 1e-10);
    }
  });

  it('whiteness band ±1.96/√N and the AR(1) autocorrelation φ^τ', () => {
    // closed forms: band 1.96/√N (95 % for a white residual); an AR(1) residual e(t) = φe(t−1) + w(t)
    // has autocorrelation φ^τ, estimated within a few 1/√N on a seeded record of 20 000 samples
    const random = seededRandom(202);
    const phi = 0.6;
    const e = [0];
    for (let t = 1; t < 20_000; t++) e.push(phi * e[t - 1] + (random() - 0.5));
    const result = residualAutocorrelation(e, 4);
    expectWithin(result.band, 1.96 / Math.sqrt(20_000), 1e-15);
    result.correlation.forEach((r, tau) => expectWithin(r, phi ** tau, 4 / Math.sqrt(20_000)));
    expect(result.white).toBe(false);
  });
});
