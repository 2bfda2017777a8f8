import type { Knex } from 'knex';
import type { LoopTwin } from './loop-twin.js';
import { slotAtMs } from './slot-clock.js';
import { vectorLiteral, vectorsLiteral } from './twin-store.js';

/**
 * The predictions of one tick, written in one multi-row INSERT. Only the lease holder's rows go in
 * (a process that lost a lease without noticing yet writes nothing), and a slot that already has
 * its prediction keeps it.
 */
export function createPredictionBatch() {
  const loopIds: string[] = [];
  const slots: number[] = [];
  const ks: number[] = [];
  const versionIds: string[] = [];
  const xs: string[] = [];
  const ys: string[] = [];
  return {
    /** The prediction the twin holds now: x̂ and ŷ of slot `twin.next`. */
    add(twin: LoopTwin): void {
      loopIds.push(twin.loopId);
      slots.push(slotAtMs(twin.next, twin.periodMs) / 1000);
      ks.push(twin.next);
      versionIds.push(twin.active.version.id);
      xs.push(vectorLiteral(twin.x));
      ys.push(vectorLiteral(twin.predicted));
    },
    size: () => loopIds.length,
    async write(db: Knex, holder: string): Promise<number> {
      if (!loopIds.length) return 0;
      const result = await db.raw(
        `INSERT INTO predictions (loop_id, slot_at, k, version_id, x, y)
         SELECT p.loop_id, to_timestamp(p.slot_s), p.k, p.version_id, p.x::float8[], p.y::float8[]
         FROM unnest(?::uuid[], ?::float8[], ?::bigint[], ?::uuid[], ?::text[], ?::text[]) AS p(loop_id, slot_s, k, version_id, x, y)
         JOIN loop_leases l ON l.loop_id = p.loop_id AND l.holder = ?
         ON CONFLICT DO NOTHING`,
        [
          vectorLiteral(loopIds),
          vectorLiteral(slots),
          vectorLiteral(ks),
          vectorLiteral(versionIds),
          vectorsLiteral(xs),
          vectorsLiteral(ys),
          holder,
        ],
      );
      return (result as { rowCount: number }).rowCount;
    },
  };
}

export type PredictionBatch = ReturnType<typeof createPredictionBatch>;

/** Persists twins (state, slot, version) in one upsert, again only for loops this holder still leases. */
export async function saveTwins(db: Knex, holder: string, twins: LoopTwin[]): Promise<void> {
  if (!twins.length) return;
  await db.raw(
    `INSERT INTO twin_state (loop_id, version_id, k, x, last_measured_k, updated_at)
     SELECT s.loop_id, s.version_id, s.k, s.x::float8[], s.last_k, now()
     FROM unnest(?::uuid[], ?::uuid[], ?::bigint[], ?::text[], ?::bigint[]) AS s(loop_id, version_id, k, x, last_k)
     JOIN loop_leases l ON l.loop_id = s.loop_id AND l.holder = ?
     ON CONFLICT (loop_id) DO UPDATE SET version_id = EXCLUDED.version_id, k = EXCLUDED.k, x = EXCLUDED.x,
       last_measured_k = EXCLUDED.last_measured_k, updated_at = EXCLUDED.updated_at`,
    [
      vectorLiteral(twins.map((t) => t.loopId)),
      vectorLiteral(twins.map((t) => t.active.version.id)),
      vectorLiteral(twins.map((t) => t.next)),
      vectorsLiteral(twins.map((t) => vectorLiteral(t.x))),
      vectorLiteral(twins.map((t) => t.lastMeasuredK)),
      holder,
    ],
  );
  for (const twin of twins) twin.dirty = false;
}
