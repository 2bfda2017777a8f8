import { describe, expect, it } from 'vitest';
import type { ModalPart } from '../types';
import { modeRows } from './mode-rows';
import { stackModeContributions } from './stack-contributions';
import { outputSteadyStateGain, timeToReach } from './step-metrics';

describe('step response figures', () => {
  it('maps the state gain through C and adds D', () => {
    expect(outputSteadyStateGain([[2], [4]], [[0.5, 0.25]], [[1]])).toEqual([[3]]);
    expect(outputSteadyStateGain([[2], [4]], null, null)).toEqual([[2], [4]]);
    expect(outputSteadyStateGain(null, [[1, 0]], null)).toBeNull();
  });

  it('finds the first sample at 95 % of the final value, for either sign', () => {
    const t = [0, 10, 20, 30, 40];
    expect(timeToReach([0, 0.5, 0.9, 0.96, 0.99], t, 1)).toEqual({ kind: 'reached', sample: 3, timeS: 30 });
    expect(timeToReach([0, -0.5, -0.97, -1, -1], t, -1)).toEqual({ kind: 'reached', sample: 2, timeS: 20 });
    expect(timeToReach([0, 0.1, 0.2, 0.3, 0.4], t, 1)).toEqual({ kind: 'not-reached' });
    expect(timeToReach([0, 1, 2, 3, 4], t, null)).toEqual({ kind: 'no-final-value' });
    expect(timeToReach([0, 0.2, 0, 0, 0], t, 0)).toEqual({ kind: 'no-change' });
  });
});

describe('mode split and mode rows', () => {
  it('stacks the modes so that the top layer is the free response', () => {
    const real = { conjugatePair: false, eigenvector: [] };
    const modal: ModalPart[] = [
      {
        ...real,
        eigenvalue: { re: 0.9, im: 0 },
        coefficient: { re: 1, im: 0 },
        contribution: [
          [1, 0],
          [0.9, 0],
          [0.81, 0],
        ],
      },
      {
        ...real,
        eigenvalue: { re: 0.5, im: 0 },
        coefficient: { re: -1, im: 0 },
        contribution: [
          [-0.5, 1],
          [-0.25, 0.5],
          [-0.125, 0.25],
        ],
      },
    ];
    const stacked = stackModeContributions(modal, 0);
    expect(stacked.labels).toEqual(['λ = 0.9', 'λ = 0.5']);
    expect(stacked.layers[1]).toEqual([0.5, 0.65, 0.685]);
  });

  it('folds a conjugate pair into one row and marks the slowest and growing modes', () => {
    const base = { naturalFrequencyRadS: 1, dampingRatio: 0.1, timeConstantS: null };
    const rows = modeRows(
      [
        { ...base, eigenvalue: { re: 1.1, im: 0 }, magnitude: 1.1, periodSamples: null },
        { ...base, eigenvalue: { re: 0.5, im: 0.5 }, magnitude: 0.707, timeConstantS: 2.9, periodSamples: 8 },
        { ...base, eigenvalue: { re: 0.5, im: -0.5 }, magnitude: 0.707, timeConstantS: 2.9, periodSamples: 8 },
      ],
      2,
    );
    expect(rows.map((row) => [row.pair, row.marks, row.periodS])).toEqual([
      [false, ['slowest', 'divergent'], null],
      [true, [], 16],
    ]);
  });
});
