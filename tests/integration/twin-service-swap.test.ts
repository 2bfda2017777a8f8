import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { MODEL_ACTIVATED_CHANNEL } from '../../simulator/src/registry/twin-registry.js';
import { createArea, insertLoop, insertReadings, insertVersion, slotOf } from '../helpers/twin-service-fixtures.js';
import { eventually, startTwins } from '../helpers/twin-service-runner.js';

const stack = inject('stack');
const PERIOD_S = 0.5;
const first = {
  A: [
    [0.9, 0],
    [0, 0.9],
  ],
  B: [[0.1], [0.1]],
};
const second = {
  A: [
    [0.5, 0],
    [0, 0.5],
  ],
  B: [[1], [1]],
};
let db: Knex;

beforeAll(() => {
  db = knexFactory({ client: 'pg', connection: stack.databaseUrl, pool: { min: 0, max: 4 } });
});
afterAll(() => db.destroy());

/** What the api does on activation: retire the old version, activate the new one, NOTIFY at commit. */
async function activate(loopId: string, versionId: string): Promise<void> {
  await db.transaction(async (trx) => {
    await trx('model_versions').where({ loop_id: loopId, status: 'active' }).update({ status: 'retired' });
    await trx('model_versions').where({ id: versionId }).update({ status: 'active' });
    await trx.raw('SELECT pg_notify(?, ?)', [MODEL_ACTIVATED_CHANNEL, JSON.stringify({ loopId, versionId })]);
  });
}

describe('hot swap', () => {
  it('switches to a newly active version at a slot boundary and carries the state across', async () => {
    const area = await createArea(db);
    const loop = await insertLoop(db, area, first, { samplePeriodS: PERIOD_S });
    const now = slotOf(Date.now(), PERIOD_S);
    await insertReadings(
      db,
      loop.loopId,
      PERIOD_S,
      Array.from({ length: 60 }, (_, i) => ({ k: now - 2 + i, u: [2], y: [0, 0] })),
    );
    const twins = await startTwins(db, stack.databaseUrl, area);
    await eventually(() => twins.emitter.samples.length >= 3, 'a few slots on version 1');
    const v2 = await insertVersion(db, loop.loopId, 2, second, 'approved');
    await activate(loop.loopId, v2);
    const onSecond = async () =>
      Number(
        (await db('predictions').where({ loop_id: loop.loopId, version_id: v2 }).count<{ count: string }[]>())[0].count,
      );
    await eventually(async () => (await onSecond()) >= 3, 'predictions of version 2');
    await twins.stop();

    const rows = (
      await db('predictions').where({ loop_id: loop.loopId }).orderBy('k').select('k', 'version_id', 'x')
    ).map((r) => ({ ...r, k: Number(r.k) }));
    const at = rows.findIndex((r) => r.version_id === v2);
    expect(at).toBeGreaterThan(0);
    expect(rows.slice(at).every((r) => r.version_id === v2)).toBe(true);
    // the first prediction of version 2 steps version 2's matrices from version 1's last state
    const carried = rows[at - 1].x;
    rows[at].x.forEach((v: number, i: number) => expect(v).toBeCloseTo(0.5 * carried[i] + 2, 12));
    expect(twins.log.some((line) => /version 1 → 2 at slot \d+; state carried across \(2 states\)/.test(line))).toBe(
      true,
    );
  });
});
