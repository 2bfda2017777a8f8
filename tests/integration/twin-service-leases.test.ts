import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { createArea, insertLoop } from '../helpers/twin-service-fixtures.js';
import { eventually, sleep, startTwins, type RunningTwins } from '../helpers/twin-service-runner.js';

const stack = inject('stack');
const PERIOD_S = 0.5;
let db: Knex;
let area: string;
let loopIds: string[];
let first: RunningTwins;
let second: RunningTwins | undefined;

const model = {
  A: [
    [0.9, 0],
    [0, 0.8],
  ],
  B: [[0.1], [0.2]],
  operatingPoint: { x0: [1, 2], u0: [3] },
};
const holders = async () =>
  (await db('loop_leases').whereIn('loop_id', loopIds).select('loop_id', 'holder')) as {
    loop_id: string;
    holder: string;
  }[];

beforeAll(async () => {
  db = knexFactory({ client: 'pg', connection: stack.databaseUrl, pool: { min: 0, max: 4 } });
  area = await createArea(db);
  loopIds = [];
  for (let i = 0; i < 6; i++) loopIds.push((await insertLoop(db, area, model, { samplePeriodS: PERIOD_S })).loopId);
});
afterAll(async () => {
  await second?.stop();
  await db.destroy();
});

describe('two simulator processes share the loops through leases', () => {
  it('gives every loop to exactly one holder and never steps a slot in both', async () => {
    // the first process may take at most half, so that the second finds loops to claim
    first = await startTwins(db, stack.databaseUrl, area, { lease: { maxLoops: 3 } });
    second = await startTwins(db, stack.databaseUrl, area);
    await eventually(
      () => (second as RunningTwins).service.stats().leased === 3,
      'the second process to claim the rest',
    );
    await sleep(2000);
    const leases = await holders();
    expect(leases.map((l) => l.loop_id).sort()).toEqual([...loopIds].sort());
    const count = (holder: string) => leases.filter((l) => l.holder === holder).length;
    expect([count(first.service.holder), count(second.service.holder)]).toEqual([3, 3]);
    const stepped = (run: RunningTwins) => new Set(run.emitter.samples.map((s) => `${s.loopId}:${s.k}`));
    const inBoth = [...stepped(first)].filter((slot) => stepped(second as RunningTwins).has(slot));
    expect(inBoth).toEqual([]);
    expect(stepped(first).size).toBeGreaterThan(10);
    expect(stepped(second).size).toBeGreaterThan(10);
  });

  it('takes over the loops of a process that died within a few sample periods, resuming without a gap', async () => {
    const survivor = second as RunningTwins;
    const dead = first;
    const diedAt = Date.now();
    await dead.stop(false); // no state saved at the end, no lease released: as if killed
    const tookOverAt = await eventually(async () => {
      const leases = await holders();
      return leases.length === 6 && leases.every((l) => l.holder === survivor.service.holder) && Date.now();
    }, 'the survivor to hold every loop');
    expect(tookOverAt - diedAt).toBeLessThan(8 * PERIOD_S * 1000); // lease of 1.5 s + a lease cycle or two
    await eventually(() => survivor.service.stats().stepping === 6, 'the survivor to step every loop');
    await sleep(1500);
    for (const loopId of loopIds) {
      const ks = (await db('predictions').where({ loop_id: loopId }).orderBy('k').pluck('k')).map(Number);
      expect(ks.length).toBeGreaterThan(6);
      // one prediction per slot, and no slot missing across the takeover
      expect(ks).toEqual(ks.map((_, i) => ks[0] + i));
    }
    expect(survivor.log.some((line) => /resumed from their saved state/.test(line))).toBe(true);
  });
});
