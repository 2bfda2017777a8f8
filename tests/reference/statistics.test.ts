import { describe, expect, it } from 'vitest';
import {
  chiSquareQuantile,
  cusumArl,
  ewmaStep,
  normalCdf,
  normalQuantile,
  persistenceArl,
} from '@shadowloop/simulator/engine';
import { expectMatchesPrinted, expectWithin } from './support.js';

describe('chi-square quantiles', () => {
  it('NIST/SEMATECH e-Handbook upper critical values, df 1 and 2', () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.4, critical values of the chi-square
    // distribution (values as printed, 6 decimals)
    const table: [number, number, string][] = [
      [1, 0.95, '3.841459'],
      [1, 0.99, '6.634897'],
      [1, 0.999, '10.827566'],
      [2, 0.95, '5.991465'],
      [2, 0.99, '9.210340'],
      [2, 0.999, '13.815511'],
    ];
    for (const [dof, p, printed] of table) expectMatchesPrinted(chiSquareQuantile(p, dof), printed);
  });

  it('NIST/SEMATECH e-Handbook upper critical values, df 5 and 10 (3 decimals)', () => {
    // same table; from memory
    const table: [number, number, string][] = [
      [5, 0.95, '11.070'],
      [5, 0.99, '15.086'],
      [5, 0.999, '20.515'],
      [10, 0.95, '18.307'],
      [10, 0.99, '23.209'],
      [10, 0.999, '29.588'],
    ];
    for (const [dof, p, printed] of table) expectMatchesPrinted(chiSquareQuantile(p, dof), printed);
  });

  it('two degrees of freedom is the exponential law: x = −2 ln(1 − p)', () => {
    // closed form; 1e-13 relative
    for (const p of [0.001, 0.3, 0.9, 0.99999]) {
      const x = -2 * Math.log1p(-p);
      expectWithin(chiSquareQuantile(p, 2), x, 1e-13 * x);
    }
  });
});

describe('normal distribution', () => {
  it('standard normal quantiles to 9 decimals', () => {
    // standard percentage points of the normal distribution, as tabulated in M. Abramowitz and
    // I. A. Stegun, Handbook of Mathematical Functions, ch. 26; from memory
    const table: [number, string][] = [
      [0.95, '1.644853627'],
      [0.975, '1.959963985'],
      [0.99, '2.326347874'],
      [0.995, '2.575829304'],
      [0.999, '3.090232306'],
      [0.9995, '3.290526731'],
    ];
    for (const [p, printed] of table) {
      expectMatchesPrinted(normalQuantile(p), printed);
      expectMatchesPrinted(-normalQuantile(1 - p), printed);
    }
  });

  it('Φ(1), Φ(2), Φ(3) to 10 decimals', () => {
    // standard values (Abramowitz & Stegun, ch. 26); from memory
    expectMatchesPrinted(normalCdf(1), '0.8413447461');
    expectMatchesPrinted(normalCdf(2), '0.9772498681');
    expectMatchesPrinted(normalCdf(3), '0.9986501020');
  });
});

describe('CUSUM average run lengths', () => {
  it('Lucas–Crosier two-sided ARL, k = 0.5, h = 4: 168, 26.6, 8.38', () => {
    // J. M. Lucas and R. B. Crosier, "Fast initial response for CUSUM quality-control schemes",
    // Technometrics 24(3), 1982, Table 1 (zero head start). The table is of two-sided ARLs: at zero
    // shift both sides are alike, so 1/ARL = 1/ARL⁺ + 1/ARL⁻ is half the one-sided value (≈ 335),
    // which the table does not match.
    expectMatchesPrinted(cusumArl({ k: 0.5, h: 4, shift: 0, twoSided: true }), '168');
    expectMatchesPrinted(cusumArl({ k: 0.5, h: 4, shift: 0.5, twoSided: true }), '26.6');
    expectMatchesPrinted(cusumArl({ k: 0.5, h: 4, shift: 1, twoSided: true }), '8.38');
    const oneSided = cusumArl({ k: 0.5, h: 4, shift: 0, twoSided: false });
    expectWithin(cusumArl({ k: 0.5, h: 4, shift: 0 }), oneSided / 2, 1e-9 * oneSided);
    expect(Math.abs(oneSided - 168)).toBeGreaterThan(100);
  });

  it('two-sided ARL table for k = ½, h = 4 and h = 5 across shifts', () => {
    // D. C. Montgomery, Introduction to Statistical Quality Control, the table of two-sided ARLs of
    // the tabular CUSUM with k = ½, h = 4 and h = 5; values from memory
    const table: [number, number, string][] = [
      [4, 0.25, '74.2'],
      [4, 0.75, '13.3'],
      [4, 1.5, '4.75'],
      [4, 2, '3.34'],
      [4, 2.5, '2.62'],
      [4, 3, '2.19'],
      [4, 4, '1.71'],
      [5, 0, '465'],
      [5, 0.25, '139'],
      [5, 0.5, '38.0'],
      [5, 0.75, '17.0'],
      [5, 1, '10.4'],
      [5, 1.5, '5.75'],
      [5, 2, '4.01'],
      [5, 2.5, '3.11'],
      [5, 3, '2.57'],
      [5, 4, '2.01'],
    ];
    for (const [h, shift, printed] of table) expectMatchesPrinted(cusumArl({ k: 0.5, h, shift }), printed);
  });

  it("Siegmund's approximation for the one-sided ARL, within 2 % for designs with k ≤ ½", () => {
    // D. Siegmund, Sequential Analysis: Tests and Confidence Intervals, 1985:
    // ARL ≈ (e^{−2Δb} + 2Δb − 1)/(2Δ²), Δ = δ − k, b = h + 1.166 (b² when Δ = 0). It is an
    // approximation (it drifts for large k and very short run lengths), so the tolerance is its
    // accuracy, not ours
    const siegmund = (k: number, h: number, shift: number) => {
      const delta = shift - k;
      const b = h + 1.166;
      return delta === 0 ? b * b : (Math.exp(-2 * delta * b) + 2 * delta * b - 1) / (2 * delta * delta);
    };
    for (const [k, h, shift] of [
      [0.5, 4, 0],
      [0.5, 4, 1],
      [0.5, 5, 0.5],
      [0.25, 8, 0],
      [0.25, 5, 0.75],
    ]) {
      const exact = cusumArl({ k, h, shift, twoSided: false });
      expect(Math.abs(exact - siegmund(k, h, shift)) / exact).toBeLessThan(0.02);
    }
  });
});

describe('persistence and EWMA', () => {
  it('r consecutive exceedances: Feller’s (1 − p^r)/((1 − p)p^r) in its known special cases', () => {
    // W. Feller, An Introduction to Probability Theory and Its Applications, vol. 1, ch. XIII:
    // r = 1 is geometric, 1/p (closed form); for a fair coin the expected tosses to r heads in a row
    // is 2^{r+1} − 2, so 6 for two and 14 for three (closed form)
    expectWithin(persistenceArl(0.05, 1), 20, 1e-12);
    expectWithin(persistenceArl(0.5, 2), 6, 1e-12);
    expectWithin(persistenceArl(0.5, 3), 14, 1e-12);
    expectWithin(persistenceArl(0.5, 10), 2 ** 11 - 2, 1e-9);
  });

  it('EWMA limit tends to L√(λ/(2 − λ))', () => {
    // J. M. Lucas and M. S. Saccucci, Technometrics 32(1), 1990: asymptotic EWMA standard deviation
    // √(λ/(2 − λ)) σ (closed form); after 500 samples with λ = 0.1 the factor 1 − 0.9^1000 is 1
    let state = { value: 0, count: 0 };
    let limit = 0;
    for (let i = 0; i < 500; i++) ({ limit, ...state } = ewmaStep(state, 0, { lambda: 0.1, L: 2.7 }));
    expectWithin(limit, 2.7 * Math.sqrt(0.1 / 1.9), 1e-15);
  });
});
