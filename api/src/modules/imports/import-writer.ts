import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { CheckedReading } from '../readings/reading-checks.js';

const iso = (ms: number) => new Date(ms).toISOString();

/** One row in COPY text format; arrays as literals (numbers and ISO times need no escaping). */
const copyLine = (line: number, r: CheckedReading) =>
  `${line}\t${r.k}\t${iso(r.slotMs)}\t${iso(r.tMs)}\t{${r.u.join(',')}}\t{${r.y.join(',')}}\n`;

/** Same slot rule as the live ingest: the first reading of a slot stays; new ones score the predictions. */
const INSERT_FROM_STAGING = `
WITH inserted AS (
  INSERT INTO readings (loop_id, slot_at, k, t, u, y)
  SELECT $1::uuid, slot_at, k, t, u, y FROM import_rows ORDER BY line
  ON CONFLICT DO NOTHING
  RETURNING slot_at, y
), scored AS (
  UPDATE predictions p SET residual = ARRAY(SELECT m - e FROM unnest(n.y, p.y) AS d(m, e))
  FROM inserted n WHERE p.loop_id = $1::uuid AND p.slot_at BETWEEN $2 AND $3 AND p.slot_at = n.slot_at
  RETURNING 1
)
SELECT (SELECT count(*) FROM inserted)::int AS accepted, (SELECT count(*) FROM scored)::int AS scored`;

/**
 * Writes an import in chunks through one connection: COPY the chunk into a session-private staging
 * table, insert it into readings with the same slot and duplicate rules as the live ingest, empty
 * the staging table. Each chunk commits by itself, so progress is real and a repeated import only
 * adds what is missing.
 */
export async function openImportWriter(pool: pg.Pool, loopId: string) {
  const client = await pool.connect();
  try {
    await client.query(
      `CREATE TEMP TABLE import_rows (line bigint, k bigint, slot_at timestamptz, t timestamptz, u float8[], y float8[])`,
    );
  } catch (error) {
    client.release(error as Error);
    throw error;
  }
  return {
    /** Stores the chunk; returns how many readings were new. */
    async write(rows: { line: number; reading: CheckedReading }[]): Promise<number> {
      await pipeline(
        Readable.from([rows.map((r) => copyLine(r.line, r.reading)).join('')]),
        client.query(copyFrom('COPY import_rows (line, k, slot_at, t, u, y) FROM STDIN')),
      );
      const slots = rows.map((r) => r.reading.slotMs);
      const bounds = [iso(slots.reduce((a, b) => Math.min(a, b))), iso(slots.reduce((a, b) => Math.max(a, b)))];
      const {
        rows: [result],
      } = await client.query<{ accepted: number }>(INSERT_FROM_STAGING, [loopId, ...bounds]);
      await client.query('TRUNCATE import_rows');
      return result.accepted;
    },
    async close(failed: boolean): Promise<void> {
      if (failed) return client.release(true);
      await client.query('DROP TABLE IF EXISTS import_rows');
      client.release();
    },
  };
}
