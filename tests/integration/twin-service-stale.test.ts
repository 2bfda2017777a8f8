import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { createArea, insertLoop, insertReadings, slotOf } from '../helpers/twin-service-fixtures.js';
import { eventually, startTwins } from '../helpers/twin-service-runner.js';

const stack = inject('stack');
const PERIOD_S = 0.5;
const STALE_AFTER = 3;
const model = { A: [[0.5]], B: [[1]], operatingPoint: { x0: [4], u0: [2] } };
let db: Knex;
let area: string;

beforeAll(async () => {
  db = knexFactory({ client: 'pg', connection: stack.databaseUrl, pool: { min: 0, max: 4 } });
  area = await createArea(db);
});
afterAll(() => db.destroy());

describe('missing readings', () => {
  it('coasts on the held inputs and turns stale after the configured number of samples, then recovers', async () => {
    const { loopId } = await insertLoop(db, area, model, { samplePeriodS: PERIOD_S, staleAfterSamples: STALE_AFTER });
    const first = slotOf(Date.now(), PERIOD_S);
    const lastRead = first + 3;
    await insertReadings(
      db,
      loopId,
      PERIOD_S,
      Array.from({ length: 6 }, (_, i) => ({ k: first - 2 + i, u: [3], y: [4] })),
    );
    const twins = await startTwins(db, stack.databaseUrl, area);
    const samples = () => twins.emitter.samples.filter((s) => s.loopId === loopId);
    await eventually(() => samples().some((s) => s.k >= lastRead + STALE_AFTER + 2), 'slots past the last reading');

    const resumeAt = slotOf(Date.now(), PERIOD_S) + 3;
    await insertReadings(
      db,
      loopId,
      PERIOD_S,
      Array.from({ length: 20 }, (_, i) => ({ k: resumeAt + i, u: [2], y: [4] })),
    );
    await eventually(() => samples().some((s) => s.k >= resumeAt + 2), 'slots after the readings return');
    await twins.stop();

    // each sample is the prediction made at slot k for slot k + 1, with the status seen at slot k
    for (const sample of samples()) {
      const k = sample.k - 1;
      const missing = k <= lastRead || k >= resumeAt ? 0 : k - lastRead;
      expect(sample.status, `slot ${k}`).toBe(missing >= STALE_AFTER ? 'stale' : 'in_step');
      expect(sample.measured).toBeNull();
    }
    expect(twins.log.some((line) => line.includes(`stale, no reading for ${STALE_AFTER} samples`))).toBe(true);
    expect(twins.log.some((line) => line.includes('readings again'))).toBe(true);
    // the twin kept predicting through the gap, on the held input u = 3
    const ks = (await db('predictions').where({ loop_id: loopId }).orderBy('k').pluck('k')).map(Number);
    expect(ks).toEqual(ks.map((_, i) => ks[0] + i));
    const inGap = await db('predictions')
      .where({ loop_id: loopId, k: lastRead + 3 })
      .first();
    const before = await db('predictions')
      .where({ loop_id: loopId, k: lastRead + 2 })
      .first();
    expect(inGap.x[0]).toBeCloseTo(4 + 0.5 * (before.x[0] - 4) + (3 - 2), 12);
  });

  it('passes the api’s drifting or diverged status through to the samples', async () => {
    const { loopId } = await insertLoop(db, area, model, { samplePeriodS: PERIOD_S });
    const now = slotOf(Date.now(), PERIOD_S);
    await insertReadings(
      db,
      loopId,
      PERIOD_S,
      Array.from({ length: 20 }, (_, i) => ({ k: now + i, u: [2], y: [4] })),
    );
    await db('loop_tracking').insert({ loop_id: loopId, status: 'drifting' });
    const twins = await startTwins(db, stack.databaseUrl, area);
    const sample = await eventually(() => twins.emitter.samples.find((s) => s.loopId === loopId), 'a sample');
    await twins.stop();
    expect(sample.status).toBe('drifting');
  });
});
