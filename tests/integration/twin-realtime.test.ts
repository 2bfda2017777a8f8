import type { Knex } from 'knex';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import type { Series } from '../../api/src/contracts/twin.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { ENGINEER, OPERATOR, REVIEWER, signedIn } from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';
import {
  eventually,
  insertPrediction,
  loopWithTwin,
  markTwinRunning,
  openDb,
  personalToken,
  postReadings,
  reading,
  slotMsAgo,
} from '../helpers/twin-fixtures.js';
import { collect, connected, twinSocket, watchLoop, type TwinSocket } from '../helpers/twin-socket.js';

const stack = inject('stack');
let api: RunningApi;
let second: RunningApi;
let db: Knex;
let operator: SessionClient;
let token: string;
let loop: Loop;
let version: ModelVersion;
const sockets: TwinSocket[] = [];

beforeAll(async () => {
  [api, second] = [await startApi(stack), await startApi(stack)];
  db = openDb(stack.databaseUrl);
  const [engineer, reviewer] = await Promise.all([ENGINEER, REVIEWER].map((email) => signedIn(api.url, email)));
  operator = await signedIn(api.url, OPERATOR);
  token = await personalToken(engineer);
  ({ loop, version } = await loopWithTwin(engineer, reviewer, { area: 'storage' }));
  await markTwinRunning(db, loop, version);
});
afterEach(() => {
  while (sockets.length) sockets.pop()?.disconnect();
});
afterAll(async () => {
  await db.destroy();
  await second.close();
  await api.close();
});

const open = (url: string, credentials: Parameters<typeof twinSocket>[1] = {}) => {
  const socket = twinSocket(url, credentials);
  sockets.push(socket);
  return socket;
};

describe('realtime', () => {
  it('refuses a socket without credentials, with an unknown token, or with an ingest token', async () => {
    await expect(connected(open(api.url))).rejects.toThrow('unauthenticated');
    await expect(connected(open(api.url, { token: 'slt_not-a-real-token' }))).rejects.toThrow('unauthenticated');
    await expect(connected(open(api.url, { token: 'sli_whatever' }))).rejects.toThrow('unauthenticated');
  });

  it('sends twin:sample to a token socket watching the loop after a reading is posted', async () => {
    const socket = open(api.url, { token });
    await connected(socket);
    expect(await watchLoop(socket, loop.id)).toEqual({ ok: true });
    const samples = collect(socket, 'twin:sample');
    const slotMs = slotMsAgo(1);
    await insertPrediction(db, { loopId: loop.id, versionId: version.id, slotMs, x: [1, 0], y: [1] });
    await postReadings(api.url, token, loop.id, [reading(slotMs - 1000, [3], [0.9]), reading(slotMs, [4], [1.5])]);
    const sample = await eventually(() => samples[0], 'twin:sample');
    expect(sample).toEqual({
      loopId: loop.id,
      t: new Date(slotMs).toISOString(),
      k: slotMs / 1000,
      predicted: [1],
      measured: [1.5],
      residual: [0.5],
      status: 'in_step',
    });
  });

  it('answers a watch of an unknown loop or a malformed payload with an error in the ack', async () => {
    const socket = open(api.url, { token });
    await connected(socket);
    expect(await watchLoop(socket, '00000000-0000-4000-8000-000000000000')).toMatchObject({
      ok: false,
      error: { code: 'not_found' },
    });
    expect(await watchLoop(socket, 'not-a-uuid')).toMatchObject({ ok: false, error: { code: 'validation_failed' } });
  });

  it('refuses a browser socket opened from a page of another origin, even with the session cookie', async () => {
    const cookie = await operator.jar.getCookieString(api.url);
    await expect(connected(open(api.url, { cookie, origin: 'http://elsewhere.example' }))).rejects.toThrow();
    await expect(connected(open(api.url, { cookie, origin: api.url }))).resolves.toBeUndefined();
  });

  it('signs a browser socket in with the session cookie and sends loop:status to its area room', async () => {
    const cookie = await operator.jar.getCookieString(api.url);
    const socket = open(api.url, { cookie });
    await connected(socket);
    expect(await socket.timeout(3000).emitWithAck('area:watch', { areaId: 'storage' })).toEqual({ ok: true });
    const changes = collect(socket, 'loop:status');
    await db('loop_tracking')
      .where({ loop_id: loop.id })
      .update({ last_reading_at: new Date(Date.now() - 60_000) });
    await postReadings(api.url, token, loop.id, [reading(slotMsAgo(0), [1], [1])]);
    const change = await eventually(() => changes.find((c) => c.loopId === loop.id), 'loop:status');
    expect(change).toMatchObject({ area: 'storage', previousStatus: 'stale', status: 'in_step' });
  });

  it('reaches sockets of another api process through the PostgreSQL adapter', async () => {
    const socket = open(second.url, { token });
    await connected(socket);
    await watchLoop(socket, loop.id);
    const samples = collect(socket, 'twin:sample');
    const slotMs = slotMsAgo(0) + 1000;
    await postReadings(api.url, token, loop.id, [reading(slotMs, [2], [2])]);
    expect(
      await eventually(() => samples.find((s) => s.k === slotMs / 1000), 'twin:sample via the adapter'),
    ).toMatchObject({ measured: [2] });
  });

  it('leaves no gap after a reconnect: the series covers what was posted meanwhile', async () => {
    const base = slotMsAgo(0) + 3000;
    const first = open(api.url, { token });
    await connected(first);
    await watchLoop(first, loop.id);
    const seen = collect(first, 'twin:sample');
    await postReadings(api.url, token, loop.id, [reading(base, [1], [1])]);
    const lastSeen = await eventually(() => seen[0], 'the first sample');
    first.disconnect();
    await postReadings(
      api.url,
      token,
      loop.id,
      [1, 2, 3].map((i) => reading(base + i * 1000, [1], [1 + i])),
    );
    const again = open(api.url, { token });
    await connected(again);
    await watchLoop(again, loop.id);
    const backfill = await operator.request<Series>(
      'GET',
      `/api/v1/loops/${loop.id}/series?from=${lastSeen.t}&to=${new Date(base + 10_000).toISOString()}`,
    );
    expect(backfill.body.t).toEqual([0, 1, 2, 3].map((i) => new Date(base + i * 1000).toISOString()));
    expect(backfill.body.measured[0]).toEqual([1, 2, 3, 4]);
    const live = collect(again, 'twin:sample');
    await postReadings(api.url, token, loop.id, [reading(base + 4000, [1], [5])]);
    expect(await eventually(() => live[0], 'a live sample after the reconnect')).toMatchObject({ measured: [5] });
  });
});
