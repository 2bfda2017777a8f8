import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import type { Series } from '../../api/src/contracts/twin.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { ENGINEER, OPERATOR, REVIEWER, signedIn } from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';
import {
  insertPrediction,
  loopWithTwin,
  openDb,
  personalToken,
  postReadings,
  reading,
  slotMsAgo,
  TWO_OUTPUTS,
  TWO_OUTPUT_MODEL,
} from '../helpers/twin-fixtures.js';

const stack = inject('stack');
let api: RunningApi;
let db: Knex;
let operator: SessionClient;
let token: string;
let loop: Loop;
let version: ModelVersion;

beforeAll(async () => {
  api = await startApi(stack);
  db = openDb(stack.databaseUrl);
  const [engineer, reviewer] = await Promise.all([ENGINEER, REVIEWER].map((email) => signedIn(api.url, email)));
  operator = await signedIn(api.url, OPERATOR);
  token = await personalToken(engineer);
  ({ loop, version } = await loopWithTwin(engineer, reviewer, TWO_OUTPUTS, TWO_OUTPUT_MODEL));
});
afterAll(async () => {
  await db.destroy();
  await api.close();
});

const series = async (query: string) => operator.request<Series>('GET', `/api/v1/loops/${loop.id}/series?${query}`);
const iso = (ms: number) => new Date(ms).toISOString();

describe('GET /api/v1/loops/{loopId}/series', () => {
  it('aligns measured, predicted, residual and inputs on slot times, with null where nothing was stored', async () => {
    const start = slotMsAgo(60);
    for (const i of [0, 1, 3])
      await insertPrediction(db, {
        loopId: loop.id,
        versionId: version.id,
        slotMs: start + i * 1000,
        x: [i, 0],
        y: [i, 10 * i],
      });
    const posted = await postReadings(
      api.url,
      token,
      loop.id,
      [0, 1, 2].map((i) => reading(start + i * 1000, [i + 0.5], [i + 0.25, 10 * i + 1])),
    );
    expect(posted.body.accepted).toBe(3);
    const response = await series(`from=${iso(start)}&to=${iso(start + 5000)}`);
    expect(response.status).toBe(200);
    expect(response.body).toEqual({
      t: [0, 1, 2, 3].map((i) => iso(start + i * 1000)),
      measured: [
        [0.25, 1.25, 2.25, null],
        [1, 11, 21, null],
      ],
      predicted: [
        [0, 1, null, 3],
        [0, 10, null, 30],
      ],
      residual: [
        [0.25, 0.25, null, null],
        [1, 1, null, null],
      ],
      inputs: [[0.5, 1.5, 2.5, null]],
      downsampled: false,
    });
  });

  it('defaults to the last 15 minutes', async () => {
    const now = slotMsAgo(2);
    await postReadings(api.url, token, loop.id, [reading(now, [7], [7, 7]), reading(slotMsAgo(16 * 60), [8], [8, 8])]);
    const response = await series('');
    expect(response.body.t).toContain(iso(now));
    expect(response.body.t).not.toContain(iso(slotMsAgo(16 * 60)));
    expect(response.body.t.every((t) => Date.parse(t) >= Date.now() - 15 * 60_000 - 5000)).toBe(true);
  });

  it('downsamples a long window to min and max per bucket in time order, keeping every peak, and sees late readings', async () => {
    const rows = 20_000;
    const start = Math.floor(Date.now() / 86_400_000 - 10) * 86_400_000;
    const startS = start / 1000;
    await db.raw('SELECT shadowloop_ensure_day_partitions(?::date, ?::date)', [
      iso(start).slice(0, 10),
      iso(start).slice(0, 10),
    ]);
    // Every second except slot 15000, which a late reading fills below.
    await db.raw(
      `INSERT INTO readings (loop_id, slot_at, k, t, u, y)
      SELECT ?, to_timestamp(? + i), ? + i, to_timestamp(? + i), ARRAY[i % 7]::float8[],
        ARRAY[CASE WHEN i = 12345 THEN 500 WHEN i = 777 THEN -500 ELSE sin(i / 100.0) END, i]::float8[]
      FROM generate_series(0, ? - 1) AS i WHERE i <> 15000`,
      [loop.id, startS, startS, startS, rows],
    );
    await db.raw(
      `INSERT INTO predictions (loop_id, slot_at, k, version_id, x, y, residual)
      SELECT ?, to_timestamp(? + i), ? + i, ?, ARRAY[0, 0]::float8[], ARRAY[sin(i / 100.0), i]::float8[], ARRAY[0, 0]::float8[]
      FROM generate_series(0, ? - 1) AS i`,
      [loop.id, startS, startS, version.id, rows],
    );
    const window = `from=${iso(start)}&to=${iso(start + rows * 1000)}&maxPoints=400`;
    const s = (await series(window)).body;
    expect(s.downsampled).toBe(true);
    expect(s.t.length).toBeGreaterThan(300);
    expect(s.t.length).toBeLessThanOrEqual(400);
    for (const trace of [...s.measured, ...s.predicted, ...s.residual, ...s.inputs])
      expect(trace).toHaveLength(s.t.length);
    const times = s.t.map(Date.parse);
    expect(times.every((t, i) => i === 0 || t > times[i - 1])).toBe(true);
    expect(Math.max(...(s.measured[0] as number[]))).toBe(500);
    expect(Math.min(...(s.measured[0] as number[]))).toBe(-500);
    expect(s.measured[1][0]).toBe(0);
    expect(Math.max(...(s.measured[1] as number[]))).toBe(rows - 1);
    expect(Math.max(...(s.inputs[0] as number[]))).toBe(6);
    expect(Math.max(...(s.predicted[1] as number[]))).toBe(rows - 1);

    const late = await postReadings(api.url, token, loop.id, [reading(start + 15_000_000, [3], [900, 15_000])]);
    expect(late.body.accepted).toBe(1);
    expect(Math.max(...((await series(window)).body.measured[0] as number[]))).toBe(900);
  });

  it('refuses a window that ends before it starts', async () => {
    expect((await series(`from=${iso(Date.now())}&to=${iso(Date.now() - 1000)}`)).status).toBe(400);
    expect((await series('maxPoints=5')).status).toBe(400);
  });
});
