import type { Db } from '../../api/src/db/knex.js';
import { createIngestSource } from '../../api/src/modules/ingest-sources/ingest-sources.service.js';

const MODEL = {
  A: [
    [0.9, 0.05],
    [0, 0.7],
  ],
  B: [[0], [0.3]],
  C: [[1, 0]],
};

/** Bench loops (1 input, 1 output, T = 1 s unless told), each with an active version whose twin is running. */
export async function createBenchLoops(db: Db, count: number, prefix: string, samplePeriodS = 1): Promise<string[]> {
  const engineer = await db('users').where({ email: 'engineer@quillmere.example' }).first<{ id: string }>('id');
  const signal = (name: string) => JSON.stringify([{ name, unit: '' }]);
  const loops = await db('loops')
    .insert(
      Array.from({ length: count }, (_, i) => ({
        tag: `${prefix}-${String(i).padStart(5, '0')}`,
        name: `bench loop ${i}`,
        area_id: 'storage',
        sample_period_s: samplePeriodS,
        inputs: signal('u'),
        states: JSON.stringify([
          { name: 'x1', unit: '' },
          { name: 'x2', unit: '' },
        ]),
        outputs: signal('y'),
        stale_after_samples: 30,
        created_by: engineer.id,
      })),
    )
    .returning<{ id: string }[]>('id');
  const versions = await db('model_versions')
    .insert(
      loops.map((loop) => ({
        loop_id: loop.id,
        number: 1,
        status: 'active',
        sample_period_s: samplePeriodS,
        a: JSON.stringify(MODEL.A),
        b: JSON.stringify(MODEL.B),
        c: JSON.stringify(MODEL.C),
        correction: JSON.stringify({ mode: 'free_run', Q: null, R: null, K: null, P: null }),
        change_note: 'bench',
        analysis: '{}',
        author_id: engineer.id,
      })),
    )
    .returning<{ id: string; loop_id: string }[]>(['id', 'loop_id']);
  await db('twin_state').insert(versions.map((v) => ({ loop_id: v.loop_id, version_id: v.id, k: 0, x: [0, 0] })));
  return loops.map((loop) => loop.id);
}

/** An ingest source's token for the loops, as a plant bridge would use it. */
export async function benchToken(db: Db, loopIds: string[], name: string): Promise<string> {
  const admin = await db('users')
    .where({ email: 'admin@quillmere.example' })
    .first<{ id: string; email: string }>('id', 'email');
  const source = await createIngestSource(
    db,
    { ...admin, name: 'bench', roles: ['admin'] },
    { name, description: '', loopIds },
  );
  return source.token;
}

/** The twin's predictions for slots [fromK, fromK + count) of each loop, as the simulator would store them. */
export async function insertBenchPredictions(db: Db, loopIds: string[], fromK: number, count: number): Promise<void> {
  const days = [fromK, fromK + count].map((k) => new Date(k * 1000).toISOString().slice(0, 10));
  await db.raw('SELECT shadowloop_ensure_day_partitions(?::date, ?::date)', days);
  for (const loopId of loopIds) {
    await db.raw(
      `INSERT INTO predictions (loop_id, slot_at, k, version_id, x, y)
      SELECT l.id, to_timestamp(k), k, v.id, ARRAY[0.5, 0]::float8[], ARRAY[0.5]::float8[]
      FROM loops l JOIN model_versions v ON v.loop_id = l.id AND v.status = 'active',
        generate_series(?::bigint, ?::bigint) AS k
      WHERE l.id = ?`,
      [fromK, fromK + count - 1, loopId],
    );
  }
}
