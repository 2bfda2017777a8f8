import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import type { Matrix } from '../../simulator/src/engine/index.js';

/** Loops of the twin-service suites live in an area of their own, so each service can be scoped to it. */
export async function createArea(db: Knex): Promise<string> {
  const id = `twin-test-${randomBytes(4).toString('hex')}`;
  await db('areas').insert({ id, name: `Twin test ${id}` });
  return id;
}

export interface TestLoopModel {
  A: Matrix;
  B: Matrix;
  C?: Matrix;
  correction?: { mode: 'free_run' | 'reset' | 'kalman'; K?: Matrix };
  operatingPoint?: { x0?: number[]; u0?: number[] };
}

const signals = (prefix: string, count: number) =>
  Array.from({ length: count }, (_, i) => ({ name: `${prefix} ${i + 1}`, unit: '-' }));

/** A loop with one active model version, written straight to the tables. */
export async function insertLoop(
  db: Knex,
  area: string,
  model: TestLoopModel,
  settings: { samplePeriodS: number; staleAfterSamples?: number },
) {
  const [n, m, p] = [model.A.length, model.B[0].length, (model.C ?? model.A).length];
  const [loop] = await db('loops')
    .insert({
      tag: `TW-${randomBytes(3).toString('hex').toUpperCase()}`,
      name: 'Twin test loop',
      area_id: area,
      sample_period_s: settings.samplePeriodS,
      inputs: JSON.stringify(signals('u', m)),
      states: JSON.stringify(signals('x', n)),
      outputs: JSON.stringify(signals('y', p)),
      operating_point: JSON.stringify(model.operatingPoint ?? {}),
      stale_after_samples: settings.staleAfterSamples ?? 5,
    })
    .returning<{ id: string; tag: string }[]>(['id', 'tag']);
  const version = await insertVersion(db, loop.id, 1, model);
  return { loopId: loop.id, tag: loop.tag, versionId: version };
}

export async function insertVersion(
  db: Knex,
  loopId: string,
  number: number,
  model: TestLoopModel,
  status = 'active',
): Promise<string> {
  const [{ sample_period_s: samplePeriodS }] = await db('loops').where({ id: loopId }).select('sample_period_s');
  const [row] = await db('model_versions')
    .insert({
      loop_id: loopId,
      number,
      status,
      sample_period_s: samplePeriodS,
      a: JSON.stringify(model.A),
      b: JSON.stringify(model.B),
      c: model.C ? JSON.stringify(model.C) : null,
      correction: JSON.stringify({ mode: model.correction?.mode ?? 'free_run', K: model.correction?.K ?? null }),
      change_note: 'twin-service test',
      analysis: '{}',
    })
    .returning<{ id: string }[]>('id');
  return row.id;
}

/** Readings at slots k (slot time k·T), as the ingest would store them. */
export async function insertReadings(
  db: Knex,
  loopId: string,
  samplePeriodS: number,
  rows: { k: number; u: number[]; y: number[] }[],
): Promise<void> {
  if (!rows.length) return;
  await db('readings')
    .insert(
      rows.map((r) => {
        const at = new Date(Math.round(r.k * samplePeriodS * 1000));
        return { loop_id: loopId, slot_at: at, k: r.k, t: at, u: r.u, y: r.y };
      }),
    )
    .onConflict(['loop_id', 'slot_at'])
    .ignore();
}

/** The slot of time `ms` on a grid of period T seconds. */
export const slotOf = (ms: number, samplePeriodS: number) => Math.floor(ms / (samplePeriodS * 1000));
