import type { Knex } from 'knex';
import type { ScoredReading } from '../tracking/tracking-fold.js';
import type { CheckedReading } from './reading-checks.js';

/** A PostgreSQL array literal of numbers or ISO times (neither needs quoting). */
const arrayLiteral = (items: (number | string)[]) => `{${items.join(',')}}`;
const iso = (ms: number) => new Date(ms).toISOString();

/**
 * One statement per batch: unnest the batch (checked, one reading per slot) into readings, where
 * ON CONFLICT DO NOTHING keeps a slot's earlier reading; write each new reading's residual y − ŷ
 * into the prediction the twin stored for its slot; return the slot of each new reading with its
 * residual (the prediction itself only for the newest, which goes out as a twin sample). u and y
 * travel as one flat array each and are cut back into rows by position. The batch's first and last
 * slot bound the predictions lookup, so it touches only the partitions and index range of the batch.
 */
const INSERT_SCORED = `
WITH batch AS (
  SELECT b.k, b.slot_at, b.t, b.ord
  FROM unnest(?::bigint[], ?::timestamptz[], ?::timestamptz[]) WITH ORDINALITY AS b(k, slot_at, t, ord)
), inserted AS (
  INSERT INTO readings (loop_id, slot_at, k, t, u, y, source_id)
  SELECT ?::uuid, b.slot_at, b.k, b.t,
    flat.u[(b.ord - 1) * ? + 1 : b.ord * ?], flat.y[(b.ord - 1) * ? + 1 : b.ord * ?], ?::uuid
  FROM batch b, (SELECT ?::float8[] AS u, ?::float8[] AS y) flat
  ON CONFLICT DO NOTHING
  RETURNING slot_at, k, y
), scored AS (
  UPDATE predictions p SET residual = ARRAY(SELECT m - e FROM unnest(n.y, p.y) AS d(m, e))
  FROM inserted n
  WHERE p.loop_id = ?::uuid AND p.slot_at BETWEEN ?::timestamptz AND ?::timestamptz AND p.slot_at = n.slot_at
  RETURNING p.slot_at, p.y, p.residual
)
SELECT n.k, s.residual, CASE WHEN n.k = (SELECT max(k) FROM inserted) THEN s.y END AS predicted
FROM inserted n LEFT JOIN scored s USING (slot_at)`;

type Raw = { k: string; residual: number[] | null; predicted: number[] | null };

/** Stores the (checked, one per slot) readings; returns the new ones in slot order with residual. */
export async function insertScoredReadings(
  trx: Knex.Transaction,
  target: { loopId: string; inputs: number; outputs: number; sourceId: string | null },
  readings: CheckedReading[],
): Promise<ScoredReading[]> {
  const { loopId, inputs: m, outputs: p } = target;
  const slots = readings.map((r) => r.slotMs);
  const { rows } = (await trx.raw(INSERT_SCORED, [
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
  return rows
    .map((row) => {
      const reading = byK.get(Number(row.k)) as CheckedReading;
      return {
        k: reading.k,
        slotMs: reading.slotMs,
        tMs: reading.tMs,
        measured: reading.y,
        predicted: row.predicted,
        residual: row.residual,
      };
    })
    .sort((a, b) => a.k - b.k);
}
