import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { discretizeZoh, steadyStateKalman } from '@shadowloop/simulator/engine';
import type { Loop, ModelProblem, ModelVersion } from '../../api/src/contracts/registry.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import {
  createDraft,
  createLoop,
  ENGINEER,
  ONCALL,
  OPERATOR,
  signedIn,
  STABLE_MODEL,
  type ErrorResponse,
} from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';

const stack = inject('stack');
let api: RunningApi;
let engineer: SessionClient;
let operator: SessionClient;
let loop: Loop;

beforeAll(async () => {
  api = await startApi(stack);
  [engineer, operator] = await Promise.all([ENGINEER, OPERATOR].map((email) => signedIn(api.url, email)));
  loop = await createLoop(engineer, { samplePeriodS: 2 });
});
afterAll(async () => {
  await api.close();
});

const post = (body: Record<string, unknown>) =>
  engineer.request<ModelVersion & ErrorResponse<ModelProblem[]>>(
    'POST',
    `/api/v1/loops/${loop.id}/model-versions`,
    { changeNote: 'test', ...body },
    { csrf: true },
  );
const expectClose = (actual: number[][], expected: number[][], tolerance: number) =>
  actual.forEach((row, i) =>
    row.forEach((value, j) =>
      expect(Math.abs(value - expected[i][j])).toBeLessThanOrEqual(tolerance * Math.max(1, Math.abs(expected[i][j]))),
    ),
  );

describe('saving a draft', () => {
  it('stores a discrete model as a numbered draft with its analysis; operators and on-call are refused', async () => {
    const first = await post(STABLE_MODEL);
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({
      status: 'draft',
      A: STABLE_MODEL.A,
      C: STABLE_MODEL.C,
      D: null,
      continuous: null,
      author: { email: ENGINEER },
    });
    expect(first.body.analysis).toMatchObject({ stability: 'stable', controllabilityRank: 2 });
    expect((await post(STABLE_MODEL)).body.number).toBe(first.body.number + 1);
    const oncall = await signedIn(api.url, ONCALL);
    for (const client of [operator, oncall]) {
      expect(
        (
          await client.request(
            'POST',
            `/api/v1/loops/${loop.id}/model-versions`,
            { ...STABLE_MODEL, changeNote: 'x' },
            { csrf: true },
          )
        ).status,
      ).toBe(403);
    }
  });

  it('discretises a continuous model by zero-order hold at the loop sample period and keeps both', async () => {
    const Ac = [
      [-0.1, 0.02],
      [0, -0.5],
    ];
    const Bc = [[0], [0.4]];
    const response = await post({ source: 'continuous', Ac, Bc, C: [[1, 0]] });
    expect(response.status).toBe(201);
    const expected = discretizeZoh(Ac, Bc, 2);
    expectClose(response.body.A, expected.A, 1e-12);
    expectClose(response.body.B, expected.B, 1e-12);
    expect(response.body.continuous).toEqual({ Ac, Bc, samplePeriodS: 2 });
  });

  it('computes the steady-state Kalman gain for a kalman correction', async () => {
    const correction = {
      mode: 'kalman',
      Q: [
        [0.01, 0],
        [0, 0.02],
      ],
      R: [[0.1]],
    };
    const response = await post({ ...STABLE_MODEL, correction });
    expect(response.status).toBe(201);
    const expected = steadyStateKalman(STABLE_MODEL.A, STABLE_MODEL.C, correction.Q, correction.R);
    expectClose(response.body.correction.K as number[][], expected.K, 1e-12);
    expectClose(response.body.correction.P as number[][], expected.P, 1e-12);
  });

  it('lists every problem of Q and R: asymmetric, negative variance, R not positive definite, wrong size', async () => {
    const asymmetric = await post({
      ...STABLE_MODEL,
      correction: {
        mode: 'kalman',
        Q: [
          [1, 0.5],
          [0.2, 1],
        ],
        R: [[0]],
      },
    });
    expect(asymmetric.status).toBe(400);
    expect(asymmetric.body.error.details.map((d) => d.field)).toEqual(['correction.Q.0.1', 'correction.R']);
    const indefinite = await post({
      ...STABLE_MODEL,
      correction: {
        mode: 'kalman',
        Q: [
          [1, 2],
          [2, 1],
        ],
        R: [
          [1, 0],
          [0, 1],
        ],
      },
    });
    expect(indefinite.body.error.details.map((d) => d.message)).toEqual([
      expect.stringMatching(/^Q must be positive semidefinite/),
      'R has 2 rows, expected 1 (one per output)',
      'R row 1 has 2 columns, expected 1',
      'R row 2 has 2 columns, expected 1',
    ]);
  });

  it('answers 422 when the Kalman gain does not exist (an unstable mode the output never sees)', async () => {
    const response = await post({
      A: [
        [1.2, 0],
        [0, 0.5],
      ],
      B: [[1], [1]],
      C: [[0, 1]],
      correction: {
        mode: 'kalman',
        Q: [
          [1, 0],
          [0, 1],
        ],
        R: [[1]],
      },
    });
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('kalman_not_converged');
  });

  it('answers 404 for an unknown loop', async () => {
    const response = await engineer.request(
      'POST',
      '/api/v1/loops/00000000-0000-4000-8000-000000000000/model-versions',
      { ...STABLE_MODEL, changeNote: 'x' },
      { csrf: true },
    );
    expect(response.status).toBe(404);
  });
});

describe('invalid matrices: 400 invalid_model with every problem listed', () => {
  const problemsOf = async (body: Record<string, unknown>) => {
    const response = await post(body);
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('invalid_model');
    return response.body.error.details;
  };

  it('not square, wrong sizes against each other and against the loop, all at once', async () => {
    const details = await problemsOf({
      A: [
        [1, 0, 0],
        [0, 1, 0],
      ],
      B: [
        [1, 0],
        [1, 0],
        [1, 0],
      ],
      C: [[1, 0, 0]],
      D: [[0]],
    });
    expect(details.map((d) => d.message)).toEqual([
      'A must be square, got 2×3',
      'B has 3 rows, expected 2 (one per state)',
      'C row 1 has 3 columns, expected 2',
      'D row 1 has 1 column, expected 2',
      `B has 2 columns, expected 1: loop ${loop.tag} has 1 input (Valve)`,
    ]);
  });

  it('NaN as a string, other strings, null and nested arrays, each with its place', async () => {
    const details = await problemsOf({
      A: [
        ['NaN', 0],
        [0, 'fast'],
      ],
      B: [[null], [[1]]],
      C: [[1, 0]],
    });
    expect(details).toEqual(
      expect.arrayContaining([
        { field: 'A.0.0', message: 'A[1][1] is not a finite number' },
        { field: 'A.1.1', message: 'A[2][2] is not a finite number' },
        { field: 'B.0.0', message: 'B[1][1] is not a finite number' },
        { field: 'B.1.0', message: 'B[2][1] is not a finite number' },
      ]),
    );
  });

  it('empty and missing matrices', async () => {
    const details = await problemsOf({ A: [], C: [[1, 0]] });
    expect(details.map((d) => d.message)).toEqual(
      expect.arrayContaining(['A must have at least one row', 'B is missing']),
    );
  });

  it('too large: 201×201', async () => {
    const big = Array.from({ length: 201 }, (_, i) => Array.from({ length: 201 }, (_, j) => (i === j ? 0.5 : 0)));
    const details = await problemsOf({ A: big, B: big.map(() => [1]), C: [big[0]] });
    expect(details.map((d) => d.message)).toEqual(
      expect.arrayContaining(['A has 201 states; at most 200 are allowed']),
    );
    expect(details.find((d) => d.field === 'A' && d.message.includes(`loop ${loop.tag} has 2 states`))).toBeDefined();
  });

  it('names Ac and Bc for a continuous model, and a missing C when outputs are fewer than states', async () => {
    const details = await problemsOf({ source: 'continuous', Ac: [[-1, 0]], Bc: [[1]] });
    expect(details.map((d) => d.field)).toEqual(expect.arrayContaining(['Ac', 'C']));
    expect(details.map((d) => d.message)).toEqual(expect.arrayContaining(['Ac must be square, got 1×2']));
  });
});

describe('reading versions', () => {
  it("lists a loop's versions newest first and shows one, 404 for unknown ids", async () => {
    const list = await operator.request<ModelVersion[]>('GET', `/api/v1/loops/${loop.id}/model-versions`);
    expect(list.status).toBe(200);
    const numbers = list.body.map((v) => v.number);
    expect(numbers).toEqual([...numbers].sort((a, b) => b - a));
    const one = await operator.request<ModelVersion>('GET', `/api/v1/model-versions/${list.body[0].id}`);
    expect(one.body).toEqual(list.body[0]);
    expect((await operator.request('GET', '/api/v1/model-versions/00000000-0000-4000-8000-000000000000')).status).toBe(
      404,
    );
  });

  it('recomputes the analysis for another step horizon, at most 5000 samples', async () => {
    const draft = await createDraft(engineer, loop.id);
    const response = await operator.request<{ stepResponse: { samples: number; t: number[] } }>(
      'GET',
      `/api/v1/model-versions/${draft.id}/analysis?stepSamples=50`,
    );
    expect(response.status).toBe(200);
    expect(response.body.stepResponse.samples).toBe(50);
    expect(response.body.stepResponse.t.at(-1)).toBe(100);
    expect((await operator.request('GET', `/api/v1/model-versions/${draft.id}/analysis?stepSamples=5001`)).status).toBe(
      400,
    );
  });
});
