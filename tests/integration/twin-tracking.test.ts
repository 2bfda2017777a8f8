import type { Knex } from 'knex';
import { afterAll, beforeAll, beforeEach, describe, expect, inject, it } from 'vitest';
import type { Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import type { LoopTracking, LoopTrackingFields } from '../../api/src/contracts/twin.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { createLoop, ENGINEER, REVIEWER, signedIn } from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';
import {
  insertPrediction,
  loopWithTwin as loopWithActiveVersion,
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
let token: string;

beforeAll(async () => {
  api = await startApi(stack);
  db = openDb(stack.databaseUrl);
  [engineer, reviewer] = await Promise.all([ENGINEER, REVIEWER].map((email) => signedIn(api.url, email)));
  token = await personalToken(engineer);
});
afterAll(async () => {
  await db.destroy();
  await api.close();
});

const tracked = async (loopId: string) =>
  (await engineer.request<LoopTracking>('GET', `/api/v1/loops/${loopId}/tracking`)).body;

type Listed = Loop & LoopTrackingFields;
const listed = async (loopId: string) => (await engineer.request<Listed>('GET', `/api/v1/loops/${loopId}`)).body;

async function loopWithTwin() {
  const twin = await loopWithActiveVersion(engineer, reviewer);
  await markTwinRunning(db, twin.loop, twin.version);
  // The readings below sit up to a few minutes back; only the stale test shortens this again.
  await db('loops').where({ id: twin.loop.id }).update({ stale_after_samples: 3600 });
  return twin;
}
const tracking = (loopId: string) => db('loop_tracking').where({ loop_id: loopId }).first();

// Slots of one test count back from the same instant, so that a second boundary passing between two
// posts cannot make "7 samples ago" land on the slot that was "6 samples ago".
let nowSlotMs = 0;
beforeEach(() => {
  nowSlotMs = slotMsAgo(0);
});

/** Posts y = ŷ + r for the slot `samplesAgo` back, after storing the twin's prediction ŷ = 1. */
async function postWithResidual(loop: Loop, version: ModelVersion, samplesAgo: number, r: number) {
  const slotMs = nowSlotMs - samplesAgo * 1000;
  await insertPrediction(db, { loopId: loop.id, versionId: version.id, slotMs, x: [1, 0], y: [1] });
  const response = await postReadings(api.url, token, loop.id, [reading(slotMs, [0.5], [1 + r])]);
  expect(response.body.accepted).toBe(1);
  return slotMs;
}

describe('residuals and tracking status', () => {
  it('writes y − ŷ into the prediction the twin stored for the slot', async () => {
    const { loop, version } = await loopWithTwin();
    const slotMs = await postWithResidual(loop, version, 3, 0.25);
    const prediction = await db('predictions')
      .where({ loop_id: loop.id, slot_at: new Date(slotMs) })
      .first();
    expect(prediction.residual[0]).toBeCloseTo(0.25, 12);
    const row = await tracking(loop.id);
    expect(row).toMatchObject({ status: 'in_step', residual_count: '1', worst_band_fraction: null });
    expect(row.last_residual[0]).toBeCloseTo(0.25, 12);
    expect(await tracked(loop.id)).toMatchObject({
      status: 'in_step',
      lastReadingAt: new Date(slotMs).toISOString(),
      worstBandFraction: null,
    });
  });

  it('turns drifting when a residual leaves the configured band, and back in_step inside it', async () => {
    const { loop, version } = await loopWithTwin();
    await db('loops')
      .where({ id: loop.id })
      .update({ residual_band: JSON.stringify([0.5]) });
    await postWithResidual(loop, version, 6, 0.2);
    expect(await tracked(loop.id)).toMatchObject({ status: 'in_step', worstBandFraction: expect.closeTo(0.4, 9) });
    await postWithResidual(loop, version, 5, -0.8);
    expect(await tracked(loop.id)).toMatchObject({ status: 'drifting', worstBandFraction: expect.closeTo(1.6, 9) });
    await postWithResidual(loop, version, 7, 0.1);
    expect((await tracked(loop.id)).status).toBe('drifting');
    await postWithResidual(loop, version, 4, 0.1);
    expect((await tracked(loop.id)).status).toBe('in_step');
  });

  it('keeps Welford statistics and uses three running standard deviations once 30 residuals are known', async () => {
    const { loop, version } = await loopWithTwin();
    const residuals = Array.from({ length: 30 }, (_, i) => (i % 2 ? 0.1 : -0.1) + i * 0.001);
    const start = slotMsAgo(200);
    for (const i of residuals.keys()) {
      await insertPrediction(db, {
        loopId: loop.id,
        versionId: version.id,
        slotMs: start + i * 1000,
        x: [1, 0],
        y: [1],
      });
    }
    const batch = residuals.map((r, i) => reading(start + i * 1000, [0.5], [1 + r]));
    expect((await postReadings(api.url, token, loop.id, batch)).body.accepted).toBe(30);
    const mean = residuals.reduce((a, b) => a + b, 0) / residuals.length;
    const m2 = residuals.reduce((a, r) => a + (r - mean) ** 2, 0);
    const row = await tracking(loop.id);
    expect(row.residual_mean[0]).toBeCloseTo(mean, 12);
    expect(row.residual_m2[0]).toBeCloseTo(m2, 12);
    expect(row.status).toBe('in_step');
    const band = 3 * Math.sqrt(m2 / 29);
    const before = await tracked(loop.id);
    expect(before.residualCount).toBe(30);
    expect(before.band[0]).toBeCloseTo(band, 12);
    expect(before.residualSd?.[0]).toBeCloseTo(band / 3, 12);
    await postWithResidual(loop, version, 20, 0.9 * band);
    expect(await tracked(loop.id)).toMatchObject({ status: 'in_step', worstBandFraction: expect.closeTo(0.9, 9) });
    await postWithResidual(loop, version, 19, 5 * band);
    expect((await tracked(loop.id)).status).toBe('drifting');
  });

  it('derives stale from the age of the newest reading, and no_twin without an active version', async () => {
    const { loop, version } = await loopWithTwin();
    expect((await tracked(loop.id)).status).toBe('stale');
    await db('loops').where({ id: loop.id }).update({ stale_after_samples: 5 });
    await postWithResidual(loop, version, 2, 0);
    expect((await tracked(loop.id)).status).toBe('in_step');
    await postWithResidual(loop, version, 60, 0);
    expect((await tracked(loop.id)).status).toBe('in_step');
    await db('loop_tracking')
      .where({ loop_id: loop.id })
      .update({ last_reading_at: new Date(Date.now() - 10_000) });
    expect((await tracked(loop.id)).status).toBe('stale');
    expect(await listed(loop.id)).toMatchObject({
      status: 'stale',
      lastReadingAt: expect.any(String),
      worstBandFraction: null,
    });
    const list = await engineer.request<Listed[]>('GET', '/api/v1/loops?status=stale');
    expect(list.body.find((l) => l.id === loop.id)).toMatchObject({ status: 'stale' });

    const bare = await createLoop(engineer);
    expect((await postReadings(api.url, token, bare.id, [reading(slotMsAgo(1), [1], [1])])).body.accepted).toBe(1);
    expect(await tracking(bare.id)).toMatchObject({ status: 'no_twin' });
    expect(await tracked(bare.id)).toMatchObject({ status: 'no_twin', lastReadingAt: expect.any(String) });
    const notStarted = await loopWithActiveVersion(engineer, reviewer);
    expect(await listed(notStarted.loop.id)).toMatchObject({ status: 'no_twin', lastReadingAt: null });
  });
});
