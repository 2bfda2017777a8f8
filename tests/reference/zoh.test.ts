import { describe, expect, it } from 'vitest';
import { analyzeModes, discretizeZoh, steadyStateGain } from '@shadowloop/simulator/engine';
import { expectMatchesPrinted, expectMatrixClose, expectWithin } from './support.js';

describe('zero-order-hold equivalents against closed forms', () => {
  it('first-order lag K = 2, τ = 5 s, T = 1 s', () => {
    // Åström & Wittenmark, Computer-Controlled Systems, ZOH sampling of a first-order system: closed
    // form a = e^{−T/τ}, b = K(1 − e^{−T/τ}), here written out to 12 digits
    const { A, B } = discretizeZoh([[-1 / 5]], [[2 / 5]], 1);
    expectMatchesPrinted(A[0][0], '0.818730753078');
    expectMatchesPrinted(B[0][0], '0.362538493844');
    // steady-state gain exactly K and recovered time constant exactly τ (closed form, 1e-12 relative)
    expectWithin(steadyStateGain(A, B)?.[0][0] ?? NaN, 2, 2e-12);
    expectWithin(analyzeModes(A, 1).modes[0].timeConstantS ?? NaN, 5, 5e-12);
  });

  it('double integrator, T = 0.1 s (singular Ac: nothing may be inverted)', () => {
    // closed form A = [[1, T], [0, 1]], B = [[T²/2], [T]] (Franklin, Powell & Workman, Digital Control
    // of Dynamic Systems, the double-integrator plant)
    const T = 0.1;
    const { A, B } = discretizeZoh(
      [
        [0, 1],
        [0, 0],
      ],
      [[0], [1]],
      T,
    );
    expectMatrixClose(
      A,
      [
        [1, T],
        [0, 1],
      ],
      1e-15,
    );
    expectMatrixClose(B, [[(T * T) / 2], [T]], 1e-15);
  });

  it('undamped harmonic oscillator ω = 2 rad/s, T = 0.3 s', () => {
    // closed form: A = [[cos ωT, sin ωT/ω], [−ω sin ωT, cos ωT]], B = [[(1 − cos ωT)/ω²], [sin ωT/ω]]
    const [w, T] = [2, 0.3];
    const { A, B } = discretizeZoh(
      [
        [0, 1],
        [-w * w, 0],
      ],
      [[0], [1]],
      T,
    );
    const [c, s] = [Math.cos(w * T), Math.sin(w * T)];
    expectMatrixClose(
      A,
      [
        [c, s / w],
        [-w * s, c],
      ],
      1e-13,
    );
    expectMatrixClose(B, [[(1 - c) / (w * w)], [s / w]], 1e-13);
  });

  it('integrator with a lag (a motor-like plant), a = 0.5 1/s, T = 2 s', () => {
    // closed form for dx1/dt = x2, dx2/dt = −a x2 + u:
    // A = [[1, (1 − e^{−aT})/a], [0, e^{−aT}]], B = [[(aT − 1 + e^{−aT})/a²], [(1 − e^{−aT})/a]]
    const [a, T] = [0.5, 2];
    const e = Math.exp(-a * T);
    const { A, B } = discretizeZoh(
      [
        [0, 1],
        [0, -a],
      ],
      [[0], [1]],
      T,
    );
    expectMatrixClose(
      A,
      [
        [1, (1 - e) / a],
        [0, e],
      ],
      1e-14,
    );
    expectMatrixClose(B, [[(a * T - 1 + e) / (a * a)], [(1 - e) / a]], 1e-14);
  });

  it('damped second-order loop: the sampled poles give back ωn and ζ', () => {
    // closed form: continuous poles s = −ζωn ± iωn√(1 − ζ²) sample to λ = e^{sT}; analyzeModes maps
    // λ back with s = ln(λ)/T, so ωn and ζ are recovered while |Im s|·T < π
    const [wn, zeta, T] = [1.5, 0.3, 0.2];
    const { A } = discretizeZoh(
      [
        [0, 1],
        [-wn * wn, -2 * zeta * wn],
      ],
      [[0], [wn * wn]],
      T,
    );
    const modes = analyzeModes(A, T).modes;
    expect(modes).toHaveLength(2);
    for (const mode of modes) {
      expectWithin(mode.naturalFrequencyRadS ?? NaN, wn, 1e-12);
      expectWithin(mode.dampingRatio ?? NaN, zeta, 1e-12);
      expectWithin(mode.periodSamples ?? NaN, (2 * Math.PI) / (wn * Math.sqrt(1 - zeta * zeta) * T), 1e-10);
    }
  });
});
