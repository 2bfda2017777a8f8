import { describe, expect, it } from 'vitest';
import { analyzeModel } from '../analysis.js';
import { stepResponseSeries } from '../step-response.js';

describe('analyzeModel', () => {
  const input = {
    A: [
      [0.9, 0.1],
      [0, 0.7],
    ],
    B: [[0], [1]],
    C: [[1, 0]],
    D: [[0.5]],
    samplePeriodS: 2,
  };

  it('returns the API analysis object, JSON-safe', () => {
    const analysis = analyzeModel(input, { stepSamples: 50 });
    expect(Object.keys(analysis).sort()).toEqual(
      [
        'spectralRadius',
        'stability',
        'defective',
        'eigenvectorCondition',
        'modes',
        'steadyStateGain',
        'controllabilityRank',
        'observabilityRank',
        'stepResponse',
      ].sort(),
    );
    expect(analysis.stability).toBe('stable');
    expect(analysis.controllabilityRank).toBe(2);
    expect(analysis.observabilityRank).toBe(2);
    expect(JSON.parse(JSON.stringify(analysis))).toEqual(analysis);
  });

  it('charts the output step response y(n) = C H(n) + D at t = nT', () => {
    const { stepResponse } = analyzeModel(input, { stepSamples: 50 });
    const H = stepResponseSeries(input.A, input.B, 50);
    expect(stepResponse.samples).toBe(50);
    expect(stepResponse.t[3]).toBe(6);
    expect(stepResponse.series).toHaveLength(1);
    expect(stepResponse.series[0]).toHaveLength(1);
    expect(stepResponse.series[0][0][0]).toBe(0.5);
    expect(stepResponse.series[0][0][17]).toBeCloseTo(H[17][0][0] + 0.5, 14);
  });

  it('uses C = I when C is omitted and reports no gain for an integrator', () => {
    const analysis = analyzeModel({
      A: [
        [1, 0.1],
        [0, 1],
      ],
      B: [[0.005], [0.1]],
      samplePeriodS: 0.1,
    });
    expect(analysis.steadyStateGain).toBeNull();
    expect(analysis.stability).toBe('unstable');
    expect(analysis.stepResponse.series).toHaveLength(2);
  });

  it('stops the chart before a strongly unstable response overflows', () => {
    const analysis = analyzeModel({ A: [[1e3]], B: [[1]], samplePeriodS: 1 }, { stepSamples: 200 });
    expect(analysis.stepResponse.samples).toBeLessThan(200);
    expect(analysis.stepResponse.t).toHaveLength(analysis.stepResponse.samples + 1);
    expect(analysis.stepResponse.series[0][0].every(Number.isFinite)).toBe(true);
    expect(JSON.parse(JSON.stringify(analysis))).toEqual(analysis);
  });
});
