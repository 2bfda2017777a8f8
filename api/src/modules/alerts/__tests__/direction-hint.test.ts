import { describe, expect, it } from 'vitest';
import { directionOf, type DirectionInput } from '../direction-hint.js';

const repeat = (r: number[], times = 20) => Array.from({ length: times }, () => [...r]);
const TWO = [
  { name: 'Level', unit: 'm' },
  { name: 'Flow', unit: 'm³/h' },
];
// [[a, b], [b, a]] has eigenvalues a ± b with eigenvectors (1, ±1)/√2.
const COUPLED = [
  [0.8, 0.1],
  [0.1, 0.8],
];
const base: DirectionInput = { A: COUPLED, C: null, samplePeriodS: 10, outputs: TWO, residuals: [], sigma: [1, 1] };

describe('directionOf', () => {
  it('names the one output that carries the residual', () => {
    const d = directionOf({ ...base, residuals: repeat([0, 0.5]) });
    expect(d?.points).toBe('sensor');
    expect(d?.hint).toBe('Only Flow carries the residual (100 % of it): check its transmitter first.');
    expect(d?.signals[0]).toEqual({ index: 1, name: 'Flow', unit: 'm³/h', share: 1, residual: 0.5 });
    expect(d?.modes.map((m) => m.share)).toEqual([expect.closeTo(0.5, 12), expect.closeTo(0.5, 12)]);
  });

  it('names the slow mode with its time constant when the residual follows it', () => {
    const d = directionOf({ ...base, residuals: repeat([0.3, 0.3]) });
    expect(d?.points).toBe('process');
    // τ = −T / ln λ = −10 s / ln 0.9 = 94.9 s
    expect(d?.hint).toBe(
      'The residual lies along the slow mode λ = 0.900 (time constant about 1.6 min): the process itself changed.',
    );
    const fast = directionOf({ ...base, residuals: repeat([0.3, -0.3]) });
    expect(fast?.hint).toMatch(/^The residual lies along the fast mode λ = 0\.700 \(time constant about 28 s\)/);
  });

  it('gives an oscillating pair its period', () => {
    // ρ·rotation(θ) has λ = ρe^{±iθ}: period 2π/θ samples
    const theta = Math.PI / 6;
    const A = [
      [0.9 * Math.cos(theta), -0.9 * Math.sin(theta)],
      [0.9 * Math.sin(theta), 0.9 * Math.cos(theta)],
    ];
    const d = directionOf({ ...base, A, samplePeriodS: 5, residuals: repeat([0.4, 0.2]) });
    expect(d?.points).toBe('process');
    expect(d?.hint).toContain(`λ = ${(0.9 * Math.cos(theta)).toFixed(3)} ± 0.450i (oscillating every about 60 s)`);
  });

  it('says a single output cannot tell sensor from process', () => {
    const d = directionOf({ ...base, C: [[1, 0]], outputs: [TWO[0]], sigma: [0.2], residuals: repeat([0.4]) });
    expect(d?.points).toBe('unclear');
    expect(d?.hint).toBe(
      'One output only: the direction cannot tell a sensor from the process; compare with the inputs.',
    );
  });

  it('says when nothing stands out', () => {
    const A = [
      [0.9, 0, 0],
      [0, 0.7, 0],
      [0, 0, 0.5],
    ];
    const three = [...TWO, { name: 'Temp', unit: '°C' }];
    const d = directionOf({ ...base, A, outputs: three, sigma: [1, 1, 1], residuals: repeat([1, 1, 1]) });
    expect(d?.points).toBe('unclear');
    expect(d?.hint).toMatch(/spread over several outputs/);
    expect(directionOf({ ...base, residuals: repeat([0, 0]) })?.hint).toMatch(/averages out/);
  });

  it('leaves out rows of the wrong length and answers null without usable residuals or with a mismatched model', () => {
    expect(directionOf({ ...base, residuals: [[1], [Number.NaN, 1]] })).toBeNull();
    expect(directionOf({ ...base, residuals: [[1], [0, 1]] })?.signals[0].residual).toBe(1);
    expect(directionOf({ ...base, C: [[1, 0]], residuals: repeat([0, 1]) })).toBeNull();
  });
});
