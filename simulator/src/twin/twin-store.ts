import type { Knex } from 'knex';
import type { SlotReading } from './twin-step.js';

/**
 * The twin's queries. Each one carries every loop of a tick in a few arrays (unnest), so a tick
 * costs the same number of round trips for one loop as for thousands. Vectors of different
 * lengths travel as PostgreSQL array literals and are cast on the server.
 */

/** A persisted twin: the prior state x of slot k. */
export interface SavedTwin {
  versionId: string;
  k: number;
  x: number[];
  lastMeasuredK: number | null;
}

/**
 * PostgreSQL array literals built here rather than by the driver, which escapes element by element
 * (a tick sends thousands). JavaScript prints every double so that it reads back exactly; uuids and
 * numbers need no quoting, and NULL stands for null.
 */
export const vectorLiteral = (v: ArrayLike<number | string | null>) =>
  `{${Array.prototype.map.call(v, (e: unknown) => (e === null ? 'NULL' : e)).join(',')}}`;

/** A text[] literal of vector literals: each element quoted, since it holds commas and braces. */
export const vectorsLiteral = (vectors: string[]) => `{${vectors.map((v) => `"${v}"`).join(',')}}`;

export async function loadSavedTwins(db: Knex, loopIds: string[]): Promise<Map<string, SavedTwin>> {
  const { rows } = await db.raw<{
    rows: { loop_id: string; version_id: string; k: number; x: number[]; last: number | null }[];
  }>(
    `SELECT loop_id, version_id, k::float8 AS k, x, last_measured_k::float8 AS last FROM twin_state WHERE loop_id = ANY(?::uuid[])`,
    [loopIds],
  );
  return new Map(rows.map((r) => [r.loop_id, { versionId: r.version_id, k: r.k, x: r.x, lastMeasuredK: r.last }]));
}

/** The newest reading of each loop between `sinceMs` and `untilMs` (its inputs are held until the next one). */
export async function loadNewestReadings(
  db: Knex,
  loopIds: string[],
  sinceMs: number,
  untilMs: number,
): Promise<Map<string, SlotReading>> {
  const { rows } = await db.raw<{ rows: { loop_id: string; k: number; u: number[]; y: number[] }[] }>(
    `SELECT l.id AS loop_id, r.k, r.u, r.y FROM unnest(?::uuid[]) AS l(id)
     CROSS JOIN LATERAL (SELECT k::float8 AS k, u, y FROM readings
       WHERE loop_id = l.id AND slot_at BETWEEN to_timestamp(?::float8) AND to_timestamp(?::float8)
       ORDER BY slot_at DESC LIMIT 1) r`,
    [vectorLiteral(loopIds), sinceMs / 1000, untilMs / 1000],
  );
  return new Map(rows.map((r) => [r.loop_id, { k: r.k, u: r.u, y: r.y }]));
}

/** The slots a tick steps for one loop: [fromK, toK] on its grid. */
export interface SlotRange {
  loopId: string;
  fromMs: number;
  toMs: number;
}

export interface TickReadings {
  readings: Map<string, SlotReading[]>;
  /** The api's tracking status of each loop (drifting and diverged pass through to the samples). */
  tracking: Map<string, string>;
}

/** One query per tick: every reading in each loop's range, and each loop's tracking status. */
export async function loadTickReadings(db: Knex, ranges: SlotRange[]): Promise<TickReadings> {
  const lowest = Math.min(...ranges.map((r) => r.fromMs));
  const highest = Math.max(...ranges.map((r) => r.toMs));
  const { rows } = await db.raw<{
    rows: { loop_id: string; status: string | null; k: number | null; u: number[]; y: number[] }[];
  }>(
    `SELECT d.loop_id, tr.status, r.k::float8 AS k, r.u, r.y
     FROM unnest(?::uuid[], ?::float8[], ?::float8[]) AS d(loop_id, from_s, to_s)
     LEFT JOIN loop_tracking tr ON tr.loop_id = d.loop_id
     LEFT JOIN readings r ON r.loop_id = d.loop_id
       AND r.slot_at BETWEEN to_timestamp(d.from_s) AND to_timestamp(d.to_s)
       AND r.slot_at BETWEEN to_timestamp(?::float8) AND to_timestamp(?::float8)`,
    [
      vectorLiteral(ranges.map((r) => r.loopId)),
      vectorLiteral(ranges.map((r) => r.fromMs / 1000)),
      vectorLiteral(ranges.map((r) => r.toMs / 1000)),
      lowest / 1000,
      highest / 1000,
    ],
  );
  const readings = new Map<string, SlotReading[]>();
  const tracking = new Map<string, string>();
  for (const row of rows) {
    if (row.status) tracking.set(row.loop_id, row.status);
    if (row.k === null) continue;
    const list = readings.get(row.loop_id);
    const reading = { k: row.k, u: row.u, y: row.y };
    if (list) list.push(reading);
    else readings.set(row.loop_id, [reading]);
  }
  return { readings, tracking };
}

/** Creates the day partitions of readings and predictions from one day before `nowMs` to `daysAhead` after. */
export async function ensurePartitions(db: Knex, nowMs: number, daysAhead: number): Promise<void> {
  const day = (offset: number) => new Date(nowMs + offset * 86_400_000).toISOString().slice(0, 10);
  await db.raw('SELECT shadowloop_ensure_day_partitions(?::date, ?::date)', [day(-1), day(daysAhead)]);
}
