import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { createArea, insertLoop, insertReadings, slotOf } from '../helpers/twin-service-fixtures.js';
import { eventually, sleep, startTwins } from '../helpers/twin-service-runner.js';

const stack = inject('stack');
const PERIOD_S = 0.5;
const model = {
  A: [
    [0.8, 0.1],
    [0, 0.7],
  ],
  B: [[0.05], [0.3]],
  operatingPoint: { x0: [10, 20], u0: [50] },
};
let db: Knex;
let area: string;
let loop: Awaited<ReturnType<typeof insertLoop>>;
const inputAt = (k: number) => 50 + (k % 7) - 3;

beforeAll(async () => {
  db = knexFactory({ client: 'pg', connection: stack.databaseUrl, pool: { min: 0, max: 4 } });
  area = await createArea(db);
  loop = await insertLoop(db, area, model, { samplePeriodS: PERIOD_S });
  const now = slotOf(Date.now(), PERIOD_S);
  const rows = Array.from({ length: 80 }, (_, i) => now - 4 + i).map((k) => ({ k, u: [inputAt(k)], y: [10, 20] }));
  await insertReadings(db, loop.loopId, PERIOD_S, rows);
});
afterAll(() => db.destroy());

const savedState = async () =>
  (await db('twin_state').where({ loop_id: loop.loopId }).first()) as {
    k: string;
    x: number[];
    version_id: string;
    last_measured_k: string;
  };

describe('a restarted simulator resumes its twins', () => {
  it('continues at the saved slot with the saved state, and leaves no gap in the predictions', async () => {
    const before = await startTwins(db, stack.databaseUrl, area);
    await eventually(() => before.emitter.samples.length >= 4, 'a few slots stepped');
    await before.stop();
    const saved = await savedState();
    const K = Number(saved.k);
    expect(saved.version_id).toBe(loop.versionId);
    expect(Number(saved.last_measured_k)).toBe(K - 1);
    expect(await db('loop_leases').where({ loop_id: loop.loopId }).first()).toBeUndefined(); // released at stop

    await sleep(1200); // the simulator is down for a few slots
    const after = await startTwins(db, stack.databaseUrl, area);
    await eventually(() => after.emitter.samples.some((s) => s.k >= K + 4), 'the restarted twin to catch up');
    await after.stop();

    expect(after.log.some((line) => /adopted 1 loop \(1 resumed from their saved state\)/.test(line))).toBe(true);
    // the first prediction after the restart comes from the saved x and the reading of slot K
    const [x0, u0] = [model.operatingPoint.x0, model.operatingPoint.u0];
    const dx = saved.x.map((v, i) => v - x0[i]);
    const du = inputAt(K) - u0[0];
    const expected = model.A.map((row, i) => x0[i] + row[0] * dx[0] + row[1] * dx[1] + model.B[i][0] * du);
    const next = await db('predictions')
      .where({ loop_id: loop.loopId, k: K + 1 })
      .first();
    expect(next.version_id).toBe(loop.versionId);
    next.x.forEach((v: number, i: number) => expect(v).toBeCloseTo(expected[i], 10));
    const ks = (await db('predictions').where({ loop_id: loop.loopId }).orderBy('k').pluck('k')).map(Number);
    expect(ks).toEqual(ks.map((_, i) => ks[0] + i));
    expect(ks[ks.length - 1]).toBeGreaterThanOrEqual(K + 4);
  });
});
