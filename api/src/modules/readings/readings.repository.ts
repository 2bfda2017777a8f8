import type { Knex } from 'knex';
import type { ScoredReading, TrackingState } from '../tracking/tracking-fold.js';
import { LOCK_TRACKING_SQL, trackingStateOf, type TrackingRaw } from '../tracking/tracking.repository.js';
import type { CheckedReading } from './reading-checks.js';

/** A PostgreSQL array literal of numbers or ISO times (neither needs quoting). */
const arrayLiteral = (items: (number | string)[]) => `{${items.join(',')}}`;
const iso = (ms: number) => new Date(ms).toISOString();

/**
 * One statement per batch: lock the loop's tracking row (created when missing) and return it as it
 * stands before the batch; unnest the batch (checked, one reading per slot) into readings, where
 * ON CONFLICT DO NOTHING keeps a slot's earlier reading; write each new reading's residual y − ŷ
 * into the prediction the twin stored for its slot; return the slot of each new reading with its
 * residual (the prediction itself only for the newest, which goes out as a twin sample), in one
 * row beside the tracking columns as JSON arrays in slot order, so the answer is parsed once. The
 * readings insert joins the locked row, so the lock is always taken before any reading is written
 * (the same order as a separate lock statement). u and y travel as one flat array each and are cut
 * back into rows by position. The batch's first and last slot bound the predictions lookup, so it
 * touches only the partitions and index range of the batch. Exactly one row comes back (ks null
 * when nothing new was stored).
 */
const INSERT_SCORED = `
WITH tracking AS (${LOCK_TRACKING_SQL}
), batch AS (
  SELECT b.k, b.slot_at, b.t, b.ord
  FROM unnest(?::bigint[], ?::timestamptz[], ?::timestamptz[]) WITH ORDINALITY AS b(k, slot_at, t, ord)
), inserted AS (
  INSERT INTO readings (loop_id, slot_at, k, t, u, y, source_id)
  SELECT ?::uuid, b.slot_at, b.k, b.t,
    flat.u[(b.ord - 1) * ? + 1 : b.ord * ?], flat.y[(b.ord - 1) * ? + 1 : b.ord * ?], ?::uuid
  FROM tracking, batch b, (SELECT ?::float8[] AS u, ?::float8[] AS y) flat
  ON CONFLICT DO NOTHING
  RETURNING slot_at, k, y
), scored AS (
  UPDATE predictions p SET residual = ARRAY(SELECT m - e FROM unnest(n.y, p.y) AS d(m, e))
  FROM inserted n
  WHERE p.loop_id = ?::uuid AND p.slot_at BETWEEN ?::timestamptz AND ?::timestamptz AND p.slot_at = n.slot_at
  RETURNING p.slot_at, p.y, p.residual
)
SELECT t.status, t.last_reading_at, t.last_slot_at, t.residual_count, t.residual_mean, t.residual_m2,
  t.last_residual, t.worst_band_fraction, t.rule_state, stored.ks, stored.residuals, stored.predicted
FROM tracking t, (
  SELECT json_agg(n.k ORDER BY n.k) AS ks, json_agg(s.residual ORDER BY n.k) AS residuals,
    json_agg(s.y ORDER BY n.k DESC) -> 0 AS predicted
  FROM inserted n LEFT JOIN scored s USING (slot_at)) stored`;

type Raw = TrackingRaw & { ks: number[] | null; residuals: (number[] | null)[] | null; predicted: number[] | null };

/**
 * Locks the loop's tracking row and stores the (checked, one per slot) readings; returns the
 * tracking state before the batch and the new readings in slot order with residual.
 */
export async function insertScoredReadings(
  trx: Knex.Transaction,
  target: { loopId: string; inputs: number; outputs: number; sourceId: string | null },
  readings: CheckedReading[],
): Promise<{ before: TrackingState; stored: ScoredReading[] }> {
  const { loopId, inputs: m, outputs: p } = target;
  const slots = readings.map((r) => r.slotMs);
  const { rows } = (await trx.raw(INSERT_SCORED, [
    loopId,
    arrayLiteral(readings.map((r) => r.k)),
    arrayLiteral(slots.map(iso)),
    arrayLiteral(readings.map((r) => iso(r.tMs))),
    loopId,
    m,
    m,
    p,
    p,
    target.sourceId,
    arrayLiteral(readings.flatMap((r) => r.u)),
    arrayLiteral(readings.flatMap((r) => r.y)),
    loopId,
    iso(Math.min(...slots)),
    iso(Math.max(...slots)),
  ])) as { rows: Raw[] };
  const byK = new Map(readings.map((r) => [r.k, r]));
  const { ks, residuals, predicted } = rows[0];
  const stored = (ks ?? []).map((k, i, all) => {
    const reading = byK.get(k) as CheckedReading;
    return {
      k,
      slotMs: reading.slotMs,
      tMs: reading.tMs,
      measured: reading.y,
      predicted: i === all.length - 1 ? predicted : null,
      residual: residuals?.[i] ?? null,
    };
  });
  return { before: trackingStateOf(rows[0]), stored };
}
