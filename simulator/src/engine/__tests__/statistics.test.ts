import { describe, expect, it } from 'vitest';
import { cusumStep, ewmaStep, nis } from '../drift.js';
import { cusumArl, persistenceArl } from '../run-length.js';
import { normalCdf, normalQuantile } from '../normal.js';
import { chiSquareCdf, chiSquareQuantile } from '../chi-square.js';
import { gaussLegendre } from '../gauss-legendre.js';
import { seededRandom } from './seeded-random.js';

/**
 * Brook–Evans Markov chain for the one-sided CUSUM: the interval [0, h] cut into `cells` states
 * (the first one the atom at zero), a second, independent way to the run length.
 */
function markovChainArl(k: number, h: number, shift: number, cells: number): number {
  const w = h / (cells - 0.5);
  const mid = (i: number) => (i === 0 ? 0 : i * w);
  const size = cells;
  const M = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < size; j++) {
      const upper = normalCdf(j * w + w / 2 - mid(i) + k - shift);
      const lower = j === 0 ? 0 : normalCdf(j * w - w / 2 - mid(i) + k - shift);
      M[i][j] = (i === j ? 1 : 0) - (upper - lower);
    }
  }
  // Gaussian elimination on (I − P) L = 1
  const L = new Array<number>(size).fill(1);
  for (let c = 0; c < size; c++) {
    for (let r = c + 1; r < size; r++) {
      const f = M[r][c] / M[c][c];
      for (let j = c; j < size; j++) M[r][j] -= f * M[c][j];
      L[r] -= f * L[c];
    }
  }
  for (let r = size - 1; r >= 0; r--) {
    let s = L[r];
    for (let j = r + 1; j < size; j++) s -= M[r][j] * L[j];
    L[r] = s / M[r][r];
  }
  return L[0];
}

describe('cusumStep', () => {
  it('accumulates excess over k and signals above h', () => {
    const design = { k: 0.5, h: 4 };
    let state = { upper: 0, lower: 0 };
    const signals: string[] = [];
    for (const z of [1.5, 1.5, 1.5, 1.5, 1.5]) {
      const next = cusumStep(state, z, design);
      signals.push(next.signal);
      state = next;
    }
    expect(state.upper).toBe(5);
    expect(signals).toEqual(['none', 'none', 'none', 'none', 'upper']);
    expect(cusumStep({ upper: 0, lower: 3.9 }, -1, design)).toEqual({ upper: 0, lower: 4.4, signal: 'lower' });
  });
});

describe('ewmaStep', () => {
  it('follows z_k = λx + (1−λ)z_{k−1} with the exact time-varying limit', () => {
    const first = ewmaStep({ value: 0, count: 0 }, 2, { lambda: 0.2, L: 3 });
    expect(first.value).toBeCloseTo(0.4, 15);
    // after one sample the limit is L·λ (variance λ²)
    expect(first.limit).toBeCloseTo(0.6, 15);
    expect(first.signal).toBe('none');
    expect(ewmaStep({ value: -0.5, count: 9 }, -3, { lambda: 0.2, L: 2 }).signal).toBe('lower');
  });
});

describe('nis', () => {
  it('is rᵀS^{-1}r', () => {
    expect(nis([2], [[4]])).toBeCloseTo(1, 15);
    expect(
      nis(
        [1, 1],
        [
          [2, 0],
          [0, 0.5],
        ],
      ),
    ).toBeCloseTo(2.5, 15);
    expect(() => nis([1], [[0]])).toThrow(/singular/);
  });
});

describe('distributions', () => {
  it('normalQuantile inverts normalCdf across the range (relative 1e-14)', () => {
    for (const p of [1e-12, 1e-6, 0.001, 0.02, 0.3, 0.5, 0.7, 0.975, 0.999999]) {
      const z = normalQuantile(p);
      // compare the smaller tail, where the relative error is visible: Φ(z) = p ⇔ Φ(−z) = 1 − p
      const [tail, target] = p < 0.5 ? [normalCdf(z), p] : [normalCdf(-z), 1 - p];
      expect(Math.abs(tail - target)).toBeLessThanOrEqual(1e-13 * target);
    }
    expect(normalQuantile(0)).toBe(-Infinity);
    expect(() => normalQuantile(1.5)).toThrow(/p must be/);
  });

  it('chiSquareQuantile inverts chiSquareCdf (relative 1e-12)', () => {
    for (const dof of [1, 2, 3, 7, 30, 100]) {
      for (const p of [0.001, 0.05, 0.5, 0.95, 0.9999]) {
        expect(chiSquareCdf(chiSquareQuantile(p, dof), dof)).toBeCloseTo(p, 12);
      }
    }
  });
});

describe('gaussLegendre', () => {
  it('integrates polynomials up to degree 2m − 1 exactly on [a, b] (relative 1e-13)', () => {
    for (const m of [1, 2, 5, 16, 48, 97]) {
      const { nodes, weights } = gaussLegendre(m, 0.5, 4);
      for (const degree of [0, 1, Math.min(2 * m - 1, 40)]) {
        const exact = (4 ** (degree + 1) - 0.5 ** (degree + 1)) / (degree + 1);
        const sum = nodes.reduce((s, x, i) => s + weights[i] * x ** degree, 0);
        expect(Math.abs(sum - exact)).toBeLessThanOrEqual(1e-13 * exact);
      }
    }
  });
});

describe('run lengths', () => {
  it('the integral-equation ARL agrees with a fine Brook–Evans Markov chain (relative 2e-3)', () => {
    for (const [k, h, shift] of [
      [0.5, 4, 0],
      [0.5, 4, 1],
      [0.25, 8, 0.5],
      [1, 2.5, 0],
    ]) {
      const chain = markovChainArl(k, h, shift, 600);
      const exact = cusumArl({ k, h, shift, twoSided: false });
      expect(Math.abs(chain - exact) / exact).toBeLessThan(2e-3);
    }
  });

  it('the two-sided ARL combines the sides as 1/ARL = 1/ARL⁺ + 1/ARL⁻', () => {
    const plus = cusumArl({ k: 0.5, h: 5, shift: 0.3, twoSided: false });
    const minus = cusumArl({ k: 0.5, h: 5, shift: -0.3, twoSided: false });
    expect(cusumArl({ k: 0.5, h: 5, shift: 0.3 })).toBeCloseTo(1 / (1 / plus + 1 / minus), 10);
  });

  it('persistenceArl agrees with a seeded simulation of r consecutive exceedances (within 3 %)', () => {
    const random = seededRandom(61);
    const [p, r] = [0.3, 3];
    let total = 0;
    const runs = 20_000;
    for (let i = 0; i < runs; i++) {
      let streak = 0;
      let samples = 0;
      while (streak < r) {
        samples++;
        streak = random() < p ? streak + 1 : 0;
      }
      total += samples;
    }
    expect(Math.abs(total / runs - persistenceArl(p, r)) / persistenceArl(p, r)).toBeLessThan(0.03);
    expect(persistenceArl(1, 4)).toBe(4);
    expect(persistenceArl(0, 2)).toBe(Infinity);
  });
});
