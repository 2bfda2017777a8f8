import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { analyzeModel } from '@shadowloop/simulator/engine';
import type { ModelAnalysis, ModelProblem } from '../../api/src/contracts/registry.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { ENGINEER, ONCALL, OPERATOR, signedIn, type ErrorResponse } from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';

const stack = inject('stack');
let api: RunningApi;
let engineer: SessionClient;

beforeAll(async () => {
  api = await startApi(stack);
  engineer = await signedIn(api.url, ENGINEER);
});
afterAll(async () => {
  await api.close();
});

const analyse = (body: Record<string, unknown>) =>
  engineer.request<ModelAnalysis & ErrorResponse<ModelProblem[]>>('POST', '/api/v1/analysis', body, { csrf: true });

describe('POST /api/v1/analysis', () => {
  it('recovers gain 2 and time constant 5 s from the zero-order hold of a first-order lag', async () => {
    // Åström & Wittenmark, Computer-Controlled Systems: ZOH of K/(τs + 1) is a = e^{-T/τ}, b = K(1 − e^{-T/τ});
    // K = 2, τ = 5 s, T = 1 s (closed form, as listed in REFERENCES.md).
    const a = Math.exp(-0.2);
    const response = await analyse({ A: [[a]], B: [[2 * (1 - a)]], samplePeriodS: 1 });
    expect(response.status).toBe(200);
    expect(response.body.stability).toBe('stable');
    expect(Math.abs((response.body.steadyStateGain as number[][])[0][0] - 2)).toBeLessThan(2e-12);
    expect(Math.abs((response.body.modes[0].timeConstantS as number) - 5)).toBeLessThan(5e-12);
  });

  it('gives no steady-state gain for the sampled double integrator, whose A must not be inverted', async () => {
    // Double integrator at T = 0.1 s: A = [[1, T], [0, 1]], B = [[T²/2], [T]] (closed form, REFERENCES.md).
    const response = await analyse({
      A: [
        [1, 0.1],
        [0, 1],
      ],
      B: [[0.005], [0.1]],
      samplePeriodS: 0.1,
    });
    expect(response.status).toBe(200);
    expect(response.body.steadyStateGain).toBeNull();
    expect(response.body.stability).toBe('unstable');
    expect(response.body.controllabilityRank).toBe(2);
  });

  it('answers exactly what the engine computes, step horizon included', async () => {
    const model = {
      A: [
        [0.8, 0.1, 0],
        [-0.1, 0.8, 0.05],
        [0, 0, 0.95],
      ],
      B: [
        [1, 0],
        [0, 0],
        [0, 1],
      ],
      C: [
        [1, 0, 0],
        [0, 0, 1],
      ],
      samplePeriodS: 5,
    };
    const response = await analyse({ ...model, stepSamples: 40 });
    expect(response.body).toEqual(JSON.parse(JSON.stringify(analyzeModel(model, { stepSamples: 40 }))));
    expect(response.body.stepResponse.samples).toBe(40);
  });

  it('lists every problem of an invalid model', async () => {
    const response = await analyse({ A: [[1, 'x'], [0]], B: [[1]], samplePeriodS: 1 });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('invalid_model');
    expect(response.body.error.details.map((d) => d.message)).toEqual([
      'A[1][2] is not a finite number',
      'A row 2 has 1 column, expected 2',
      'B has 1 row, expected 2 (one per state)',
    ]);
  });

  it('bounds the step-response chart of a very wide model: a shorter default, 400 beyond the bound', async () => {
    const identity = Array.from({ length: 50 }, (_, i) => Array.from({ length: 50 }, (_, j) => (i === j ? 1 : 0)));
    const wide = { A: identity.map((row) => row.map((v) => v / 2)), B: identity, samplePeriodS: 1 };
    expect((await analyse(wide)).body.stepResponse.samples).toBe(199);
    const refused = await analyse({ ...wide, stepSamples: 300 });
    expect(refused.status).toBe(400);
    expect(refused.body.error.message).toMatch(/choose stepSamples of at most 199/);
  });

  it('refuses a missing sample period and a step horizon over 5000, and anyone but engineers', async () => {
    expect((await analyse({ A: [[0.5]], B: [[1]] })).status).toBe(400);
    expect((await analyse({ A: [[0.5]], B: [[1]], samplePeriodS: 1, stepSamples: 5001 })).status).toBe(400);
    for (const email of [OPERATOR, ONCALL]) {
      const client = await signedIn(api.url, email);
      expect(
        (await client.request('POST', '/api/v1/analysis', { A: [[0.5]], B: [[1]], samplePeriodS: 1 }, { csrf: true }))
          .status,
      ).toBe(403);
    }
  });
});
