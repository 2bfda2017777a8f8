import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { steadyStateKalman, type Matrix } from '../../simulator/src/engine/index.js';
import {
  createArea,
  insertLoop,
  insertReadings,
  slotOf,
  type TestLoopModel,
} from '../helpers/twin-service-fixtures.js';
import { eventually, startTwins } from '../helpers/twin-service-runner.js';

const stack = inject('stack');
const PERIOD_S = 0.5;
const A = [
  [0.9, 0.05],
  [0.02, 0.85],
];
const B = [[0.1], [0.2]];
const C = [[1, 0]];
const { K } = steadyStateKalman(
  A,
  C,
  [
    [0.01, 0],
    [0, 0.01],
  ],
  [[0.04]],
);
const models: Record<string, TestLoopModel> = {
  free_run: { A, B, correction: { mode: 'free_run' } },
  reset: { A, B, correction: { mode: 'reset' } },
  kalman: { A, B, C, correction: { mode: 'kalman', K } },
};
let db: Knex;
let area: string;
const loops: Record<string, string> = {};
/** Readings that the model does not explain exactly, so each correction leaves its mark. */
const readingAt = (k: number, outputs: number) => ({
  k,
  u: [1 + (k % 5)],
  y: [3 + Math.sin(k), 2 + Math.cos(k)].slice(0, outputs),
});

const mul = (M: Matrix, v: number[]) => M.map((row) => row.reduce((s, a, j) => s + a * v[j], 0));
const plus = (a: number[], b: number[]) => a.map((v, i) => v + b[i]);

/** x̂(k+1) from the prior x̂(k) and the reading of slot k, written out for each mode. */
function expectedNext(mode: string, prior: number[], reading: { u: number[]; y: number[] }): number[] {
  let x = prior;
  if (mode === 'reset') x = reading.y;
  if (mode === 'kalman')
    x = plus(
      prior,
      K.map((row) => row[0] * (reading.y[0] - prior[0])),
    );
  return plus(mul(A, x), mul(B, reading.u));
}

beforeAll(async () => {
  db = knexFactory({ client: 'pg', connection: stack.databaseUrl, pool: { min: 0, max: 4 } });
  area = await createArea(db);
  const now = slotOf(Date.now(), PERIOD_S);
  for (const [mode, model] of Object.entries(models)) {
    loops[mode] = (await insertLoop(db, area, model, { samplePeriodS: PERIOD_S })).loopId;
    const outputs = (model.C ?? A).length;
    await insertReadings(
      db,
      loops[mode],
      PERIOD_S,
      Array.from({ length: 60 }, (_, i) => readingAt(now - 2 + i, outputs)),
    );
  }
});
afterAll(() => db.destroy());

describe('each correction mode: the prediction of slot k+1 from the reading of slot k', () => {
  it('writes predictions that follow the version’s correction', async () => {
    const twins = await startTwins(db, stack.databaseUrl, area);
    await eventually(
      () => Object.values(loops).every((id) => twins.emitter.samples.filter((s) => s.loopId === id).length >= 5),
      'five slots of every loop',
    );
    await twins.stop();
    for (const [mode, loopId] of Object.entries(loops)) {
      const rows = (await db('predictions').where({ loop_id: loopId }).orderBy('k').select('k', 'x', 'y')).map((r) => ({
        ...r,
        k: Number(r.k),
      }));
      expect(rows.length, mode).toBeGreaterThanOrEqual(5);
      const outputs = (models[mode].C ?? A).length;
      for (let i = 0; i + 1 < rows.length; i++) {
        const expected = expectedNext(mode, rows[i].x, readingAt(rows[i].k, outputs));
        rows[i + 1].x.forEach((v: number, j: number) =>
          expect(v, `${mode} slot ${rows[i + 1].k}`).toBeCloseTo(expected[j], 10),
        );
      }
      // the stored output is ŷ = C x̂ of the same slot
      const last = rows[rows.length - 1];
      expect(last.y).toEqual(mode === 'kalman' ? [last.x[0]] : last.x);
    }
  });

  it('sends each new prediction as a sample of the next slot, not yet measured', async () => {
    const twins = await startTwins(db, stack.databaseUrl, area);
    const sample = await eventually(
      () => twins.emitter.samples.find((s) => s.loopId === loops.kalman),
      'a sample of the kalman loop',
    );
    await twins.stop();
    const stored = await db('predictions').where({ loop_id: loops.kalman, k: sample.k }).first();
    expect(sample.t).toBe(new Date(sample.k * PERIOD_S * 1000).toISOString());
    expect(sample.predicted).toEqual(stored.y);
    expect(sample).toMatchObject({ measured: null, residual: null, status: 'in_step' });
  });
});
