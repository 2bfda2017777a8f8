import { describe, expect, it } from 'vitest';
import { analyzeModes, type Complex } from '@shadowloop/simulator/engine';
import { expectSameSpectrum, expectWithin } from './support.js';

function eigenvalues(A: number[][]): Complex[] {
  return analyzeModes(A, 1).modes.map((m) => m.eigenvalue);
}

function tridiagonalToeplitz(n: number, a: number, b: number, c: number): number[][] {
  return Array.from({ length: n }, (_, i) =>
    Array.from({ length: n }, (_, j) => (i === j ? a : j === i + 1 ? b : j === i - 1 ? c : 0)),
  );
}

describe('eigenvalues against closed-form spectra', () => {
  it('tridiagonal Toeplitz, real spectrum: a + 2√(bc) cos(kπ/(n+1))', () => {
    // closed form (e.g. S. Noschese, L. Pasquini, L. Reichel, "Tridiagonal Toeplitz matrices:
    // properties and novel applications", Numer. Linear Algebra Appl. 20, 2013); n = 10, bc > 0
    const [n, a, b, c] = [10, 0.5, 0.2, 0.3];
    const expected = Array.from({ length: n }, (_, k) => ({
      re: a + 2 * Math.sqrt(b * c) * Math.cos(((k + 1) * Math.PI) / (n + 1)),
      im: 0,
    }));
    expectSameSpectrum(eigenvalues(tridiagonalToeplitz(n, a, b, c)), expected, 1e-12);
  });

  it('tridiagonal Toeplitz, bc < 0: a ± 2i√|bc| cos(kπ/(n+1)), complex pairs', () => {
    // closed form as above with √(bc) = i√|bc|; n = 10 (even: no eigenvalue at exactly a)
    const [n, a, b, c] = [10, 0.4, 0.2, -0.3];
    const expected = Array.from({ length: n }, (_, k) => ({
      re: a,
      im: 2 * Math.sqrt(-b * c) * Math.cos(((k + 1) * Math.PI) / (n + 1)),
    }));
    expectSameSpectrum(eigenvalues(tridiagonalToeplitz(n, a, b, c)), expected, 1e-12);
  });

  it('second-difference matrix tridiag(−1, 2, −1), n = 50: 4 sin²(kπ/(2(n+1)))', () => {
    // closed form (the same family, a = 2, b = c = −1)
    const n = 50;
    const expected = Array.from({ length: n }, (_, k) => 4 * Math.sin(((k + 1) * Math.PI) / (2 * (n + 1))) ** 2);
    const spectrum = expected.map((re) => ({ re, im: 0 }));
    expectSameSpectrum(eigenvalues(tridiagonalToeplitz(n, 2, -1, -1)), spectrum, 1e-12);
  });

  it('rotation-scaling matrix r[[cos θ, −sin θ], [sin θ, cos θ]]: modes r e^{±iθ}', () => {
    // closed form; with s = (ln r + iθ)/T: τ = −T/ln r, ωn = |s|, ζ = −ln r/√(ln²r + θ²), period 2π/θ
    const [r, theta, T] = [0.95, 0.3, 0.5];
    const A = [
      [r * Math.cos(theta), -r * Math.sin(theta)],
      [r * Math.sin(theta), r * Math.cos(theta)],
    ];
    const { modes, spectralRadius, stability } = analyzeModes(A, T);
    expectWithin(spectralRadius, r, 1e-15);
    expect(stability).toBe('stable');
    expectWithin(modes[0].eigenvalue.im, r * Math.sin(theta), 1e-15);
    expectWithin(modes[1].eigenvalue.im, -r * Math.sin(theta), 1e-15);
    const ln = Math.log(r);
    for (const mode of modes) {
      expectWithin(mode.timeConstantS ?? NaN, -T / ln, 1e-12);
      expectWithin(mode.naturalFrequencyRadS ?? NaN, Math.hypot(ln, theta) / T, 1e-12);
      expectWithin(mode.dampingRatio ?? NaN, -ln / Math.hypot(ln, theta), 1e-12);
      expectWithin(mode.periodSamples ?? NaN, (2 * Math.PI) / theta, 1e-11);
    }
  });

  it('companion matrix of (z − 0.5)(z + 0.8)(z² − 1.8 cos(0.4) z + 0.81): its roots', () => {
    // closed form: roots 0.5, −0.8, 0.9 e^{±0.4i}; coefficients from multiplying the factors out
    const q = [1, -1.8 * Math.cos(0.4), 0.81];
    const p2 = [1, 0.3, -0.4]; // (z − 0.5)(z + 0.8)
    const poly = [0, 0, 0, 0, 0];
    p2.forEach((x, i) => q.forEach((y, j) => (poly[i + j] += x * y)));
    const A = [poly.slice(1).map((x) => -x), [1, 0, 0, 0], [0, 1, 0, 0], [0, 0, 1, 0]];
    const expected = [
      { re: 0.5, im: 0 },
      { re: -0.8, im: 0 },
      { re: 0.9 * Math.cos(0.4), im: 0.9 * Math.sin(0.4) },
      { re: 0.9 * Math.cos(0.4), im: -0.9 * Math.sin(0.4) },
    ];
    expectSameSpectrum(eigenvalues(A), expected, 1e-12);
  });
});
