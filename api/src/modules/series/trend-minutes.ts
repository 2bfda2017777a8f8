import type { Db } from '../../db/knex.js';
import {
  epochMs,
  fewGroups,
  groupSizes,
  perSignal,
  toBucket,
  TREND_SOURCES,
  type Bucket,
  type BucketRaw,
  type SeriesWindow,
  type TrendSource,
} from './series.repository.js';
import type { BucketRange } from './raw-buckets.js';

/**
 * Long trends read per-minute extremes kept in trend_minutes, filled from the raw rows the first
 * time a minute is asked for. Only settled minutes are kept (older than 15 minutes and 100 sample
 * periods, when the twin no longer writes predictions for them); readings that arrive for an
 * older minute clear it again (forgetTrendMinutes).
 */
export const MINUTE_MS = 60_000;
export const settledBefore = (nowMs: number, samplePeriodS: number) =>
  Math.floor((nowMs - Math.max(15 * MINUTE_MS, 100 * samplePeriodS * 1000)) / MINUTE_MS) * MINUTE_MS;
const EPOCH = '1970-01-01T00:00:00Z';

async function missingSpan(db: Db, source: TrendSource, loopId: string, fromMs: number, toMs: number) {
  const { rows } = (await db.raw(
    `
    SELECT ${epochMs('min(m)')} AS first_ms, ${epochMs('max(m)')} AS last_ms
    FROM generate_series(?::timestamptz, ?::timestamptz, '1 minute') AS m
    WHERE NOT EXISTS (SELECT 1 FROM trend_minutes t WHERE t.loop_id = ? AND t.source = ? AND t.minute_at = m)`,
    [new Date(fromMs), new Date(toMs - MINUTE_MS), loopId, source],
  )) as { rows: { first_ms: number | null; last_ms: number | null }[] };
  return rows[0].first_ms === null
    ? undefined
    : { fromMs: rows[0].first_ms, toMs: (rows[0].last_ms as number) + MINUTE_MS };
}

/** Stores the minutes of [fromMs, toMs) that are not kept yet (empty minutes too, as samples = 0). */
async function fillMinutes(db: Db, source: TrendSource, w: SeriesWindow, fromMs: number, toMs: number): Promise<void> {
  const span = await missingSpan(db, source, w.loopId, fromMs, toMs);
  if (!span) return;
  const { a, b } = TREND_SOURCES[source];
  const n = groupSizes(source, w);
  await fewGroups(
    db,
    `
    INSERT INTO trend_minutes (loop_id, source, minute_at, samples, first_at, last_at, a_min, a_max, b_min, b_max)
    SELECT ?, ?, m, coalesce(g.samples, 0), g.first_at, g.last_at, g.a_min, g.a_max, g.b_min, g.b_max
    FROM generate_series(?::timestamptz, ?::timestamptz, '1 minute') AS m
    LEFT JOIN (
      SELECT date_bin('1 minute', slot_at, '${EPOCH}') AS minute_at, count(*) AS samples, min(slot_at) AS first_at, max(slot_at) AS last_at,
        ${perSignal('min', n.a, (i) => `${a.column}[${i}]`)} AS a_min, ${perSignal('max', n.a, (i) => `${a.column}[${i}]`)} AS a_max,
        ${perSignal('min', n.b, (i) => `${b.column}[${i}]`)} AS b_min, ${perSignal('max', n.b, (i) => `${b.column}[${i}]`)} AS b_max
      FROM ${source} WHERE loop_id = ? AND slot_at >= ? AND slot_at < ? GROUP BY 1) g ON g.minute_at = m
    ON CONFLICT DO NOTHING`,
    [
      w.loopId,
      source,
      new Date(span.fromMs),
      new Date(span.toMs - MINUTE_MS),
      w.loopId,
      new Date(span.fromMs),
      new Date(span.toMs),
    ],
  );
}

/** Buckets (a whole number of minutes wide) of settled minutes [fromMs, toMs), from the kept extremes. */
export async function minuteBuckets(
  db: Db,
  source: TrendSource,
  w: SeriesWindow,
  range: BucketRange,
): Promise<Bucket[]> {
  if (range.toMs <= range.fromMs) return [];
  await fillMinutes(db, source, w, range.fromMs, range.toMs);
  const n = groupSizes(source, w);
  const rows = await fewGroups<BucketRaw>(
    db,
    `
    SELECT ${epochMs('bucket')} AS bucket_ms, ${epochMs('first_at')} AS first_ms, ${epochMs('last_at')} AS last_ms, a_min, a_max, b_min, b_max
    FROM (
      SELECT date_bin(?::interval, minute_at, ?::timestamptz) AS bucket, min(first_at) AS first_at, max(last_at) AS last_at,
        ${perSignal('min', n.a, (i) => `a_min[${i}]`)} AS a_min, ${perSignal('max', n.a, (i) => `a_max[${i}]`)} AS a_max,
        ${perSignal('min', n.b, (i) => `b_min[${i}]`)} AS b_min, ${perSignal('max', n.b, (i) => `b_max[${i}]`)} AS b_max
      FROM trend_minutes WHERE loop_id = ? AND source = ? AND minute_at >= ? AND minute_at < ? AND samples > 0 GROUP BY 1) g`,
    [
      `${range.bucketMs} milliseconds`,
      new Date(range.originMs),
      w.loopId,
      source,
      new Date(range.fromMs),
      new Date(range.toMs),
    ],
  );
  return rows.map(toBucket(source));
}

/** Readings stored for slots [fromMs, toMs]: the kept minutes they fall in no longer hold (no-op for recent slots). */
export async function forgetTrendMinutes(
  db: Db,
  loop: { id: string; samplePeriodS: number },
  fromMs: number,
  toMs: number,
): Promise<void> {
  if (fromMs >= settledBefore(Date.now(), loop.samplePeriodS)) return;
  await db('trend_minutes')
    .where('loop_id', loop.id)
    .where('minute_at', '>=', new Date(Math.floor(fromMs / MINUTE_MS) * MINUTE_MS))
    .where('minute_at', '<=', new Date(toMs))
    .delete();
}
