import { describe, expect, it } from 'vitest';
import { steadyStateKalman } from '@shadowloop/simulator/engine';
import { expectMatchesPrinted, expectWithin } from './support.js';

/**
 * Scalar filtering Riccati equation P = a²P − a²c²P²/(c²P + R) + Q, multiplied out:
 * c²P² + (R(1 − a²) − Qc²)P − QR = 0, whose positive root is the steady prior variance (closed form).
 */
function scalarPrior(a: number, c: number, Q: number, R: number): number {
  const b = R * (1 - a * a) - Q * c * c;
  return (-b + Math.sqrt(b * b + 4 * c * c * Q * R)) / (2 * c * c);
}

describe('steady-state Kalman filter against closed forms', () => {
  it('scalar a = c = Q = R = 1: prior variance is the golden ratio', () => {
    // closed form: P² − P − 1 = 0 ⇒ P = (1 + √5)/2, K = P/(P + 1) = P − 1 (values to 10 decimals)
    const { K, P } = steadyStateKalman([[1]], [[1]], [[1]], [[1]]);
    expectMatchesPrinted(P[0][0], '1.6180339887');
    expectMatchesPrinted(K[0][0], '0.6180339887');
  });

  it('scalar stable case a = 0.9, c = 2, Q = 0.5, R = 3', () => {
    // closed form (quadratic above); K = cP/(c²P + R); 1e-12 relative
    const P = scalarPrior(0.9, 2, 0.5, 3);
    const result = steadyStateKalman([[0.9]], [[2]], [[0.5]], [[3]]);
    expectWithin(result.P[0][0], P, 1e-12 * P);
    expectWithin(result.K[0][0], (2 * P) / (4 * P + 3), 1e-12);
  });

  it('scalar unstable case a = 2, c = 1, Q = R = 1: P = 2 + √5', () => {
    // closed form: P² − 4P − 1 = 0
    const result = steadyStateKalman([[2]], [[1]], [[1]], [[1]]);
    expectWithin(result.P[0][0], 2 + Math.sqrt(5), 1e-12 * (2 + Math.sqrt(5)));
  });

  it('α–β tracker: the steady gain is [α, β/T] from the tracking index (Kalata)', () => {
    // P. R. Kalata, "The tracking index: a generalized parameter for α–β and α–β–γ target trackers",
    // IEEE Trans. Aerospace and Electronic Systems 20(2), 1984; also Bar-Shalom, Li & Kirubarajan,
    // Estimation with Applications to Tracking and Navigation, 2001 (discrete white-noise acceleration
    // model). Formulas from memory: λ = σ_v T²/σ_w,
    // α = −(λ² + 8λ − (λ + 4)√(λ² + 8λ))/8, β = (λ² + 4λ − λ√(λ² + 8λ))/4; tolerance 1e-12
    for (const [T, sigmaV, sigmaW] of [
      [1, 0.5, 1],
      [0.5, 2, 0.3],
      [2, 1, 1],
    ]) {
      const lambda = (sigmaV * T * T) / sigmaW;
      const root = Math.sqrt(lambda * lambda + 8 * lambda);
      const alpha = -(lambda * lambda + 8 * lambda - (lambda + 4) * root) / 8;
      const beta = (lambda * lambda + 4 * lambda - lambda * root) / 4;
      const q = sigmaV * sigmaV;
      const Q = [
        [(q * T ** 4) / 4, (q * T ** 3) / 2],
        [(q * T ** 3) / 2, q * T * T],
      ];
      const { K } = steadyStateKalman(
        [
          [1, T],
          [0, 1],
        ],
        [[1, 0]],
        Q,
        [[sigmaW * sigmaW]],
      );
      expectWithin(K[0][0], alpha, 1e-12);
      expectWithin(K[1][0], beta / T, 1e-12);
      // Kalata's relation between the gains: λ² = β²/(1 − α)
      expectWithin((beta * beta) / (1 - alpha), lambda * lambda, 1e-12 * lambda * lambda);
    }
  });

  it('refuses an undetectable pair and an unstable mode without process noise', () => {
    // by definition: the mode 1.2 is unseen by C = [0 1], so its variance grows without bound
    expect(() =>
      steadyStateKalman(
        [
          [1.2, 0],
          [0, 0.5],
        ],
        [[0, 1]],
        [
          [1, 0],
          [0, 1],
        ],
        [[1]],
      ),
    ).toThrow(/detectable/);
    // a = 2 with Q = 0: the recursion from P = 0 stays at 0 and the error would grow like 2^k
    expect(() => steadyStateKalman([[2]], [[1]], [[0]], [[1]])).toThrow(/process noise/);
  });
});
