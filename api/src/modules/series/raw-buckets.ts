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

/** Slot times [fromMs, toMs) of one source, bucketed on the grid `origin + i·bucketMs`. */
export interface BucketRange {
  fromMs: number;
  toMs: number;
  originMs: number;
  bucketMs: number;
}

/** Min and max of every signal per time bucket, straight from the readings or predictions rows. */
export async function rawBuckets(db: Db, source: TrendSource, w: SeriesWindow, range: BucketRange): Promise<Bucket[]> {
  if (range.toMs <= range.fromMs) return [];
  const { a, b } = TREND_SOURCES[source];
  const n = groupSizes(source, w);
  const rows = await fewGroups<BucketRaw>(
    db,
    `
    SELECT ${epochMs('bucket')} AS bucket_ms, ${epochMs('first_at')} AS first_ms, ${epochMs('last_at')} AS last_ms, a_min, a_max, b_min, b_max
    FROM (
      SELECT date_bin(?::interval, slot_at, ?::timestamptz) AS bucket, min(slot_at) AS first_at, max(slot_at) AS last_at,
        ${perSignal('min', n.a, (i) => `${a.column}[${i}]`)} AS a_min, ${perSignal('max', n.a, (i) => `${a.column}[${i}]`)} AS a_max,
        ${perSignal('min', n.b, (i) => `${b.column}[${i}]`)} AS b_min, ${perSignal('max', n.b, (i) => `${b.column}[${i}]`)} AS b_max
      FROM ${source} WHERE loop_id = ? AND slot_at >= ? AND slot_at < ? GROUP BY 1) g`,
    [
      `${range.bucketMs} milliseconds`,
      new Date(range.originMs),
      w.loopId,
      new Date(range.fromMs),
      new Date(range.toMs),
    ],
  );
  return rows.map(toBucket(source));
}
