import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { IngestResult } from '../../api/src/contracts/ingest.js';
import type { Loop } from '../../api/src/contracts/registry.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { ENGINEER, OPERATOR, REVIEWER, signedIn } from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';
import {
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
let engineer: SessionClient;
let operator: SessionClient;
let token: string;
let loop: Loop;

beforeAll(async () => {
  api = await startApi(stack);
  db = openDb(stack.databaseUrl);
  const reviewer = await signedIn(api.url, REVIEWER);
  [engineer, operator] = await Promise.all([ENGINEER, OPERATOR].map((email) => signedIn(api.url, email)));
  token = await personalToken(engineer);
  ({ loop } = await loopWithTwin(engineer, reviewer, TWO_OUTPUTS, TWO_OUTPUT_MODEL));
});
afterAll(async () => {
  await db.destroy();
  await api.close();
});

const post = (readings: unknown[]) => postReadings(api.url, token, loop.id, readings);
const stored = (slotMs: number) =>
  db('readings')
    .where({ loop_id: loop.id, slot_at: new Date(slotMs) })
    .first();

describe('POST /api/v1/loops/{loopId}/readings', () => {
  it('rejects every kind of bad reading with its index and a reason, and keeps the good ones', async () => {
    const at = slotMsAgo(100);
    const good = (i: number) => reading(at + i * 1000, [50], [1.2, 3.4]);
    const bad: [unknown, string | RegExp][] = [
      [42, 'the reading is not an object {"t","u","y"}'],
      [[1, 2], 'the reading is not an object {"t","u","y"}'],
      [{ u: [1], y: [1, 2] }, 't is missing'],
      [
        { t: '2026-12-02 08:00:00', u: [1], y: [1, 2] },
        't is not an ISO 8601 time with a time zone, e.g. 2026-12-02T08:00:00Z',
      ],
      [{ t: 1733126400, u: [1], y: [1, 2] }, 't is not an ISO 8601 time with a time zone, e.g. 2026-12-02T08:00:00Z'],
      [{ t: '2026-13-45T00:00:00Z', u: [1], y: [1, 2] }, 't (2026-13-45T00:00:00Z) is not a calendar time'],
      [
        reading(Date.now() + 3_600_000, [1], [1, 2]),
        /^t is in the future: 35\d\d s beyond the accepted clock tolerance; check the sender's clock$/,
      ],
      [
        reading(Date.now() - 40 * 86_400_000, [1], [1, 2]),
        't is too old: more than 30 days ago; upload history as a CSV file (POST …/readings/import)',
      ],
      [{ t: new Date(at).toISOString(), y: [1, 2] }, 'u is missing; expected 1 value'],
      [{ t: new Date(at).toISOString(), u: 5, y: [1, 2] }, 'u is not an array; expected 1 value'],
      [reading(at, [1, 2], [1, 2]), 'u has 2 values, expected 1'],
      [reading(at, [1], [1]), 'y has 1 value, expected 2'],
      [reading(at, [null], [1, 2]), 'u[0] is not a finite number'],
      [reading(at, [1], [1, '2.5']), 'y[1] is not a finite number'],
    ];
    const batch = [good(0), ...bad.map(([item]) => item), good(1)];
    const response = await post(batch);
    expect(response.status).toBe(200);
    expect(response.body.accepted).toBe(2);
    expect(response.body.duplicates).toBe(0);
    expect(response.body.rejected).toHaveLength(bad.length);
    response.body.rejected.forEach((rejection, i) => {
      const expected = bad[i][1];
      expect(rejection).toEqual({
        index: i + 1,
        reason: typeof expected === 'string' ? expected : expect.stringMatching(expected),
      });
    });
    expect(await stored(at)).toMatchObject({ k: String(at / 1000), u: [50], y: [1.2, 3.4], source_id: null });
  });

  it('rejects a number that JSON cannot hold as a finite double', async () => {
    const body = `{"readings":[{"t":"${new Date(slotMsAgo(90)).toISOString()}","u":[1e999],"y":[1,2]}]}`;
    const response = await fetch(`${api.url}/api/v1/loops/${loop.id}/readings`, {
      method: 'POST',
      body,
      headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
    });
    expect(await response.json()).toEqual({
      accepted: 0,
      duplicates: 0,
      rejected: [{ index: 0, reason: 'u[0] is not a finite number' }],
    });
  });

  it('places readings in the nearest slot (jitter up to T/2) and counts a second reading of a slot as a duplicate', async () => {
    const at = slotMsAgo(80);
    const response = await post([
      reading(at + 400, [1], [1, 1]),
      reading(at - 300, [2], [2, 2]),
      reading(at + 600, [3], [3, 3]),
    ]);
    expect(response.body).toEqual({ accepted: 2, duplicates: 1, rejected: [] });
    expect(await stored(at)).toMatchObject({ u: [1], t: new Date(at + 400) });
    expect(await stored(at + 1000)).toMatchObject({ u: [3] });
  });

  it('is idempotent: the same batch again is all duplicates and changes nothing', async () => {
    const at = slotMsAgo(70);
    const batch = Array.from({ length: 5 }, (_, i) => reading(at + i * 1000, [i], [i, 10 + i]));
    expect((await post(batch)).body).toEqual({ accepted: 5, duplicates: 0, rejected: [] });
    const count = async () =>
      Number((await db('readings').where({ loop_id: loop.id }).count<{ count: string }[]>('* as count'))[0].count);
    const before = await count();
    expect((await post(batch)).body).toEqual({ accepted: 0, duplicates: 5, rejected: [] });
    const changed = batch.map((r) => ({ ...r, y: [99, 99] }));
    expect((await post(changed)).body).toEqual({ accepted: 0, duplicates: 5, rejected: [] });
    expect(await count()).toBe(before);
    expect(await stored(at)).toMatchObject({ y: [0, 10] });
  });

  it('lets an engineer post through the session (with CSRF) and refuses operators and oversized batches', async () => {
    const body = { readings: [reading(slotMsAgo(60), [1], [1, 2])] };
    expect(
      (await engineer.request<IngestResult>('POST', `/api/v1/loops/${loop.id}/readings`, body, { csrf: true })).body
        .accepted,
    ).toBe(1);
    const refused = await operator.request<{ error: { code: string } }>(
      'POST',
      `/api/v1/loops/${loop.id}/readings`,
      body,
      { csrf: true },
    );
    expect(refused.status).toBe(403);
    const tooMany = await postReadings(
      api.url,
      token,
      loop.id,
      Array.from({ length: 5001 }, () => reading(slotMsAgo(1), [1], [1, 2])),
    );
    expect(tooMany.status).toBe(400);
    expect((await postReadings(api.url, token, '00000000-0000-4000-8000-000000000000', body.readings)).status).toBe(
      404,
    );
    expect((await postReadings(api.url, token, loop.id, [])).status).toBe(400);
  });

  it('creates day partitions of predictions that keep half of each page free for the residual update', async () => {
    // a day far ahead, so the partitions are new to this run
    const day = new Date(Date.now() + 400 * 86_400_000).toISOString().slice(0, 10);
    await db.raw('SELECT shadowloop_ensure_day_partitions(?::date, ?::date)', [day, day]);
    const suffix = day.replaceAll('-', '');
    const options = async (table: string) =>
      (
        (await db.raw('SELECT reloptions FROM pg_class WHERE relname = ?', [table])) as {
          rows: { reloptions: string[] | null }[];
        }
      ).rows[0].reloptions;
    expect(await options(`predictions_${suffix}`)).toEqual(['fillfactor=50']);
    expect(await options(`readings_${suffix}`)).toBeNull();
    await db.raw(`DROP TABLE predictions_${suffix}, readings_${suffix}`);
  });
});
