import { describeMode } from '@shadowloop/simulator/engine';
import { describe, expect, it } from 'vitest';
import type { ModelAnalysis } from '../types';
import { buildVerdict, verdictText } from './verdict';

const T = 1;

function analysis(eigenvalues: [number, number][], extra: Partial<ModelAnalysis> = {}) {
  const modes = eigenvalues
    .map(([re, im]) => describeMode({ re, im }, T))
    .sort((a, b) => b.magnitude - a.magnitude || b.eigenvalue.im - a.eigenvalue.im);
  const spectralRadius = modes[0].magnitude;
  const stability = spectralRadius < 1 - 1e-6 ? 'stable' : spectralRadius > 1 + 1e-6 ? 'unstable' : 'marginal';
  return { stability, modes, defective: false, eigenvectorCondition: 1.2, ...extra } as const;
}

describe('buildVerdict', () => {
  it('names the slowest mode and its settling time (four time constants) for a stable model', () => {
    const verdict = buildVerdict(
      analysis([
        [0.982, 0],
        [0.5, 0],
        [0.2, 0],
      ]),
      T,
    );
    expect(verdictText(verdict)).toBe(
      'Stable. The slowest mode, λ = 0.982, settles in about 3.7 min; it dominates the long-run response.',
    );
  });

  it('describes an oscillating pair once, with its period', () => {
    const verdict = buildVerdict(
      analysis([
        [0.9, 0.2],
        [0.9, -0.2],
        [0.3, 0],
      ]),
      2,
    );
    expect(verdict.sentence).toMatch(
      /^The slowest modes, λ = 0\.9 ± 0\.2i, settle in about 49\.2 s, oscillating every 28\.7 samples \(57\.5 s\); they dominate/,
    );
  });

  it('says when every mode dies out in a finite number of samples', () => {
    expect(
      buildVerdict(
        analysis([
          [0, 0],
          [0, 0],
        ]),
        5,
      ).sentence,
    ).toBe('Every eigenvalue is 0: the free response dies out completely within 2 samples (10 s).');
  });

  it('explains an integrating mode on the unit circle', () => {
    const verdict = buildVerdict(
      analysis([
        [1, 0],
        [0.6, 0],
      ]),
      T,
    );
    expect(verdict.headline).toBe('Marginal');
    expect(verdict.sentence).toContain('λ = 1 sits on the unit circle and integrates');
    expect(verdict.sentence).toContain('no steady-state gain');
  });

  it('explains a sustained oscillation on the unit circle', () => {
    const verdict = buildVerdict(
      analysis([
        [0, 1],
        [0, -1],
      ]),
      T,
    );
    expect(verdict.sentence).toBe(
      'The modes λ = 0 ± 1i sit on the unit circle, oscillating every 4 samples (4 s) without ever decaying.',
    );
  });

  it('says how fast the divergent mode grows', () => {
    const verdict = buildVerdict(
      analysis([
        [1.05, 0],
        [0.5, 0],
      ]),
      10,
    );
    expect(verdictText(verdict)).toBe(
      "Unstable. The mode λ = 1.05 lies outside the unit circle and grows by 5 % per sample, doubling about every 14.2 samples (2.4 min); the twin's prediction would run away from the plant.",
    );
  });

  it('counts several divergent eigenvalues', () => {
    const verdict = buildVerdict(
      analysis([
        [1.2, 0],
        [1.1, 0],
        [0.5, 0],
      ]),
      T,
    );
    expect(verdict.sentence).toMatch(
      /^2 eigenvalues lie outside the unit circle; the fastest-growing, λ = 1\.2, grows by 20 %/,
    );
  });

  it('explains a repeated eigenvalue on the circle that makes the model unstable', () => {
    const verdict = buildVerdict(
      {
        ...analysis([
          [1, 0],
          [1, 0],
        ]),
        stability: 'unstable',
        defective: true,
        eigenvectorCondition: 1e16,
      },
      T,
    );
    expect(verdict.sentence).toContain('repeated on the unit circle without independent eigenvectors');
    expect(verdict.notes[0]).toMatch(/^Defective:/);
  });

  it('calls out ill-conditioned eigenvectors', () => {
    const verdict = buildVerdict(
      analysis(
        [
          [0.9, 0],
          [0.89, 0],
        ],
        { eigenvectorCondition: 2.5e4 },
      ),
      T,
    );
    expect(verdict.notes).toEqual([expect.stringMatching(/^Ill-conditioned: .*condition number 25000\)/)]);
  });
});
