import type { Knex } from 'knex';
import type { Db } from '../../db/knex.js';

/** One point of a trend: a slot time and, per signal group, one value per signal (null where missing). */
export interface SeriesRow {
  at: Date;
  measured: (number | null)[] | null;
  inputs: (number | null)[] | null;
  predicted: (number | null)[] | null;
  residual: (number | null)[] | null;
}

export interface SeriesWindow {
  loopId: string;
  from: Date;
  to: Date;
  inputs: number;
  outputs: number;
}

/** Every stored slot in the window, readings and predictions side by side. */
export async function rawSeries(db: Db, w: SeriesWindow): Promise<SeriesRow[]> {
  const { rows } = (await db.raw(
    `
    SELECT slot_at AS at, r.y AS measured, r.u AS inputs, p.y AS predicted, p.residual
    FROM (SELECT slot_at, u, y FROM readings WHERE loop_id = ? AND slot_at BETWEEN ? AND ?) r
    FULL JOIN (SELECT slot_at, y, residual FROM predictions WHERE loop_id = ? AND slot_at BETWEEN ? AND ?) p USING (slot_at)
    ORDER BY slot_at`,
    [w.loopId, w.from, w.to, w.loopId, w.from, w.to],
  )) as { rows: SeriesRow[] };
  return rows;
}

/** The two tables a trend reads, each with its two groups of array columns (a and b). */
export const TREND_SOURCES = {
  readings: { a: { name: 'measured', column: 'y' }, b: { name: 'inputs', column: 'u' } },
  predictions: { a: { name: 'predicted', column: 'y' }, b: { name: 'residual', column: 'residual' } },
} as const;
export type TrendSource = keyof typeof TREND_SOURCES;

/** Signal counts of a source's groups a and b. */
export const groupSizes = (source: TrendSource, w: SeriesWindow) => ({
  a: w.outputs,
  b: source === 'readings' ? w.inputs : w.outputs,
});

/** ARRAY[agg(expr(1)), …, agg(expr(n))]: n is a signal count from the loop, never user text. */
export const perSignal = (agg: 'min' | 'max', n: number, element: (i: number) => string) =>
  `ARRAY[${Array.from({ length: n }, (_, i) => `${agg}(${element(i + 1)})`).join(', ')}]::float8[]`;

export type Extremes = { min: (number | null)[] | null; max: (number | null)[] | null };

/** One time bucket of one source: its first and last slot, and the minima and maxima of its groups. */
export interface Bucket {
  bucketMs: number;
  firstMs: number;
  lastMs: number;
  groups: Record<string, Extremes>;
}

export type BucketRaw = {
  bucket_ms: number;
  first_ms: number;
  last_ms: number;
  a_min: Extremes['min'];
  a_max: Extremes['max'];
  b_min: Extremes['min'];
  b_max: Extremes['max'];
};

export const toBucket =
  (source: TrendSource) =>
  (r: BucketRaw): Bucket => ({
    bucketMs: r.bucket_ms,
    firstMs: r.first_ms,
    lastMs: r.last_ms,
    groups: {
      [TREND_SOURCES[source].a.name]: { min: r.a_min, max: r.a_max },
      [TREND_SOURCES[source].b.name]: { min: r.b_min, max: r.b_max },
    },
  });

export const epochMs = (expr: string) => `(extract(epoch FROM ${expr}) * 1000)::float8`;

/**
 * Runs an aggregation over many rows into few groups. The planner expects one group per row and
 * would sort them all; the groups are few (maxPoints / 2 at most), so hashing is right: sorting
 * and JIT are switched off for this transaction only.
 */
export async function fewGroups<T>(db: Db, sql: string, bindings: readonly Knex.RawBinding[]): Promise<T[]> {
  return db.transaction(async (trx) => {
    await trx.raw('SET LOCAL enable_sort = off; SET LOCAL jit = off');
    return ((await trx.raw(sql, bindings)) as { rows: T[] }).rows;
  });
}
