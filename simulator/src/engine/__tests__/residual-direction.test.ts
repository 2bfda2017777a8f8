import { describe, expect, it } from 'vitest';
import { residualDirection } from '../residual-direction.js';

const repeat = (r: number[], times = 5) => Array.from({ length: times }, () => [...r]);
const shareOf = (result: ReturnType<typeof residualDirection>, index: number) =>
  result.signals.find((s) => s.index === index)?.share;

// Strang, Introduction to Linear Algebra (4th ed.), §6.1, worked example: the Markov matrix
// A = [.8 .3; .2 .7] has λ₁ = 1 with x₁ = (.6, .4) and λ₂ = 1/2 with x₂ = (1, −1).
const STRANG_A = [
  [0.8, 0.3],
  [0.2, 0.7],
];

describe('residualDirection', () => {
  it('points to the sensor when one output of a diagonal model carries the residual (C = I)', () => {
    const A = [
      [0.9, 0, 0],
      [0, 0.7, 0],
      [0, 0, 0.5],
    ];
    const result = residualDirection({ A, C: null, residuals: repeat([0, 0.4, 0]), sigma: [1, 1, 1] });
    expect(result.points).toBe('sensor');
    expect(result.signals[0]).toEqual({ index: 1, share: 1 });
    expect(result.meanResidual).toEqual([0, 0.4, 0]);
    // the state residual is e₂, itself the eigenvector of λ = 0.7, yet only one output moves
    expect(result.modes[0].eigenvalue.re).toBeCloseTo(0.7, 12);
    expect(result.modes[0].share).toBeCloseTo(1, 12);
  });

  it('points to the process when the residual lies along an eigenvector of a coupled A (Strang §6.1)', () => {
    const slow = residualDirection({ A: STRANG_A, C: null, residuals: repeat([0.6, 0.4]), sigma: [1, 1] });
    expect(slow.points).toBe('process');
    expect(slow.modes[0].eigenvalue.re).toBeCloseTo(1, 12);
    expect(slow.modes[0].share).toBeCloseTo(1, 12);
    // output shares 0.6² : 0.4² = 0.36 : 0.16
    expect(shareOf(slow, 0)).toBeCloseTo(0.36 / 0.52, 12);

    const fast = residualDirection({ A: STRANG_A, C: null, residuals: repeat([-0.2, 0.2]), sigma: [1, 1] });
    expect(fast.points).toBe('process');
    expect(fast.modes[0].eigenvalue.re).toBeCloseTo(0.5, 12);
    expect(fast.modes[0].share).toBeCloseTo(1, 12);
  });

  it('splits a one-output residual over both modes of the coupled A and calls it a sensor', () => {
    // (1, 0) = 1·(.6, .4) + 0.4·(1, −1); with unit eigenvectors |α₁| = ‖(.6,.4)‖ = √0.52, |α₂| = 0.4·√2
    const result = residualDirection({ A: STRANG_A, C: null, residuals: repeat([1, 0]), sigma: [1, 1] });
    expect(result.points).toBe('sensor');
    expect(result.modes.map((m) => m.share)).toEqual([
      expect.closeTo(0.52 / 0.84, 12),
      expect.closeTo(0.32 / 0.84, 12),
    ]);
  });

  it('combines a conjugate pair into one mode', () => {
    // ρ[cos θ −sin θ; sin θ cos θ] has λ = ρe^{±iθ} with eigenvectors (1, ∓i)/√2: its plane is the first two states
    const [rho, theta] = [0.95, 0.3];
    const A = [
      [rho * Math.cos(theta), -rho * Math.sin(theta), 0],
      [rho * Math.sin(theta), rho * Math.cos(theta), 0],
      [0, 0, 0.5],
    ];
    const result = residualDirection({ A, C: null, residuals: repeat([0.3, -0.5, 0]), sigma: [1, 1, 1] });
    expect(result.modes).toHaveLength(2);
    expect(result.modes[0].conjugatePair).toBe(true);
    expect(Math.hypot(result.modes[0].eigenvalue.re, result.modes[0].eigenvalue.im)).toBeCloseTo(rho, 12);
    expect(result.modes[0].eigenvalue.im).toBeCloseTo(rho * Math.sin(theta), 12);
    expect(result.modes[0].share).toBeCloseTo(1, 12);
    expect(result.points).toBe('process');
  });

  it('standardises each output by its sigma and averages the window', () => {
    const A = [
      [0.9, 0],
      [0, 0.8],
    ];
    const result = residualDirection({
      A,
      C: null,
      residuals: [
        [0, 10],
        [2, 10],
      ],
      sigma: [1, 10],
    });
    expect(result.meanResidual).toEqual([1, 10]);
    expect(shareOf(result, 0)).toBeCloseTo(0.5, 15);
    expect(shareOf(result, 1)).toBeCloseTo(0.5, 15);
  });

  it('finds the least-squares state when there are more outputs than states', () => {
    // one state seen by two outputs y = (1, 2)·x: r̄ = (1, 2) is exactly the state 1, along the only mode
    const result = residualDirection({ A: [[0.9]], C: [[1], [2]], residuals: repeat([1, 2]), sigma: [1, 1] });
    expect(result.modes).toEqual([{ eigenvalue: { re: 0.9, im: 0 }, conjugatePair: false, share: 1 }]);
    expect(result.points).toBe('process');
  });

  it('says unclear for one output, for a zero residual and for a spread residual', () => {
    const one = residualDirection({ A: STRANG_A, C: [[1, 0]], residuals: repeat([2]), sigma: [0.5] });
    expect(one.points).toBe('unclear');
    const zero = residualDirection({ A: STRANG_A, C: null, residuals: repeat([0, 0]), sigma: [1, 1] });
    expect(zero.points).toBe('unclear');
    expect(zero.signals.map((s) => s.share)).toEqual([0, 0]);
    const A = [
      [0.9, 0, 0],
      [0, 0.7, 0],
      [0, 0, 0.5],
    ];
    const spread = residualDirection({ A, C: null, residuals: repeat([1, 1, 1]), sigma: [1, 1, 1] });
    expect(spread.points).toBe('unclear');
  });

  it('leaves the modes out for a defective A and still sees a lone output', () => {
    const jordan = [
      [0.9, 1],
      [0, 0.9],
    ];
    const result = residualDirection({ A: jordan, C: null, residuals: repeat([0, 1]), sigma: [1, 1] });
    expect(result.modes).toEqual([]);
    expect(result.points).toBe('sensor');
  });

  it('refuses mismatched shapes, an empty window, bad sigma and non-finite residuals', () => {
    const base = { A: STRANG_A, C: null, residuals: repeat([1, 0]), sigma: [1, 1] };
    expect(() => residualDirection({ ...base, residuals: [] })).toThrow(/at least one residual/);
    expect(() => residualDirection({ ...base, residuals: [[1, 2, 3]] })).toThrow(/residuals\[0\] must have length 2/);
    expect(() => residualDirection({ ...base, sigma: [1, 0] })).toThrow(/sigma\[1\] must be > 0/);
    expect(() => residualDirection({ ...base, residuals: [[1, Number.NaN]] })).toThrow(/non-finite/);
    expect(() => residualDirection({ ...base, C: [[1, 0, 0]] })).toThrow(RangeError);
  });
});
