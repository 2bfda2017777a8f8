import { forecast, movePreview, type StateSpaceModel } from '@shadowloop/simulator/engine';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import type { Forecast, MovePreview } from '../../api/src/contracts/twin.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { createLoop, ENGINEER, OPERATOR, REVIEWER, signedIn, STABLE_MODEL } from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';
import {
  loopWithTwin,
  markTwinRunning,
  openDb,
  personalToken,
  postReadings,
  reading,
  slotMsAgo,
} from '../helpers/twin-fixtures.js';

const stack = inject('stack');
let api: RunningApi;
let db: Knex;
let engineer: SessionClient;
let reviewer: SessionClient;
let operator: SessionClient;
let loop: Loop;
let version: ModelVersion;

const OPERATING_POINT = { x0: [0.5, 0.1], u0: [40], y0: [0.5] };
const MODEL: StateSpaceModel = { A: STABLE_MODEL.A, B: STABLE_MODEL.B, C: STABLE_MODEL.C, ...OPERATING_POINT };
const X = [1.25, -0.5];
const K = 1_790_000_000 / 2;

beforeAll(async () => {
  api = await startApi(stack);
  db = openDb(stack.databaseUrl);
  [engineer, reviewer, operator] = await Promise.all(
    [ENGINEER, REVIEWER, OPERATOR].map((email) => signedIn(api.url, email)),
  );
  ({ loop, version } = await loopWithTwin(engineer, reviewer, { samplePeriodS: 2, operatingPoint: OPERATING_POINT }));
  await markTwinRunning(db, loop, version, { k: K, x: X });
});
afterAll(async () => {
  await db.destroy();
  await api.close();
});

const bySignal = (rows: number[][]) => rows[0].map((_, i) => rows.map((row) => row[i]));
const slotTimes = (n: number) => Array.from({ length: n }, (_, j) => new Date((K + j + 1) * 2000).toISOString());
const expectClose = (actual: number[][], expected: number[][]) =>
  actual.forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(expected[i][j], 12)));

describe('forecast and move preview', () => {
  it('forecasts from the persisted twin state, holding the operating-point inputs before any reading', async () => {
    const response = await operator.request<Forecast>('GET', `/api/v1/loops/${loop.id}/forecast?n=8`);
    expect(response.status).toBe(200);
    const expected = forecast(MODEL, X, [40], 8);
    expect(response.body).toMatchObject({ loopId: loop.id, versionId: version.id, k: K, u: [40], t: slotTimes(8) });
    expectClose(response.body.y, bySignal(expected.outputs));
    expectClose(response.body.x, bySignal(expected.states));
  });

  it('holds the newest inputs once readings arrive, and previews a step in one input beside that baseline', async () => {
    const token = await personalToken(engineer);
    await postReadings(api.url, token, loop.id, [reading(slotMsAgo(2, 2), [45], [0.7])]);
    const held = await operator.request<Forecast>('GET', `/api/v1/loops/${loop.id}/forecast`);
    expect(held.body.u).toEqual([45]);
    expect(held.body.t).toHaveLength(60);
    const preview = await operator.request<MovePreview>(
      'POST',
      `/api/v1/loops/${loop.id}/move-preview`,
      { inputIndex: 0, delta: -5, n: 12 },
      { csrf: true },
    );
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ inputIndex: 0, delta: -5, u: [45], t: slotTimes(12) });
    expectClose(preview.body.y, bySignal(movePreview(MODEL, X, [45], 0, -5, 12).outputs));
    expectClose(preview.body.baseline.y, bySignal(forecast(MODEL, X, [45], 12).outputs));
    const outOfRange = await operator.request(
      'POST',
      `/api/v1/loops/${loop.id}/move-preview`,
      { inputIndex: 1, delta: 1, n: 5 },
      { csrf: true },
    );
    expect(outOfRange.status).toBe(400);
  });

  it('answers 409 with a plain message when there is no twin yet', async () => {
    const bare = await createLoop(engineer);
    const none = await operator.request<{ error: { message: string } }>('GET', `/api/v1/loops/${bare.id}/forecast`);
    expect(none.status).toBe(409);
    expect(none.body.error.message).toBe(
      `${bare.tag} has no twin to forecast from yet: the loop has no active model version.`,
    );
    const notStarted = await loopWithTwin(engineer, reviewer);
    const waiting = await operator.request<{ error: { message: string } }>(
      'POST',
      `/api/v1/loops/${notStarted.loop.id}/move-preview`,
      { inputIndex: 0, delta: 1 },
      { csrf: true },
    );
    expect(waiting.status).toBe(409);
    expect(waiting.body.error.message).toContain('the simulator has not stepped the active version yet');
  });
});
