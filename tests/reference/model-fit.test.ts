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

  it('portmanteau test: N Σ r(τ)² against the χ²(M) 95 % point', () => {
    // Ljung §16.6: for a white residual ζ = N Σ_{τ=1}^{M} r(τ)² is asymptotically χ²(M). The limit for
    // M = 25 at 0.95 is 37.652 (NIST/SEMATECH e-Handbook, table of upper critical values of chi-square).
    const random = seededRandom(203);
    const white = Array.from({ length: 10_000 }, () => random() - 0.5);
    const result = residualAutocorrelation(white, 25);
    expectWithin(result.limit, 37.652, 0.0005);
    const sum = result.correlation.slice(1).reduce((s, r) => s + r * r, 0);
    expectWithin(result.statistic, 10_000 * sum, 1e-9);
    expect(result.white).toBe(result.statistic <= result.limit);
    // an AR(1) residual with φ = 0.3 gives r(1) ≈ 0.3, so ζ ≈ N·0.09/(1 − 0.09) ≫ 37.652
    const e = [0];
    for (let t = 1; t < 10_000; t++) e.push(0.3 * e[t - 1] + (random() - 0.5));
    const correlated = residualAutocorrelation(e, 25);
    expect(correlated.statistic).toBeGreaterThan(10 * correlated.limit);
    expect(correlated.white).toBe(false);
  });
});
