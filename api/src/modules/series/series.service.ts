import type { z } from 'zod';
import type { Series, SeriesQuerySchema } from '../../contracts/twin.js';
import type { Db } from '../../db/knex.js';
import { badRequest } from '../../http/errors.js';
import { requireLiveLoop } from '../readings/live-loop.js';
import { mergeBuckets } from './bucket-merge.js';
import { rawBuckets } from './raw-buckets.js';
import { rawSeries, type Bucket, type SeriesRow, type SeriesWindow } from './series.repository.js';
import { MINUTE_MS, minuteBuckets, settledBefore } from './trend-minutes.js';

const DEFAULT_SPAN_MS = 15 * 60_000;
const MAX_SPAN_MS = 366 * 86_400_000;
type Values = (number | null)[] | null;

/** Appends one point: each signal's value (or null) to that signal's trace. */
function push(traces: (number | null)[][], values: Values): void {
  traces.forEach((trace, i) => trace.push(values?.[i] ?? null));
}

const traces = (n: number) => Array.from({ length: n }, () => [] as (number | null)[]);

function emptySeries(w: SeriesWindow, downsampled: boolean): Series {
  return {
    t: [],
    measured: traces(w.outputs),
    predicted: traces(w.outputs),
    residual: traces(w.outputs),
    inputs: traces(w.inputs),
    downsampled,
  };
}

function fromRows(w: SeriesWindow, rows: SeriesRow[]): Series {
  const s = emptySeries(w, false);
  for (const r of rows) {
    s.t.push(r.at.toISOString());
    push(s.measured, r.measured);
    push(s.predicted, r.predicted);
    push(s.residual, r.residual);
    push(s.inputs, r.inputs);
  }
  return s;
}

/**
 * Two points per bucket, at its first and last slot: the minima, then the maxima of every signal
 * (one point when the bucket holds a single slot).
 */
function fromBuckets(w: SeriesWindow, buckets: Bucket[]): Series {
  const s = emptySeries(w, true);
  for (const bucket of buckets) {
    const group = (name: string, end: 'min' | 'max') => bucket.groups[name]?.[end] ?? null;
    for (const end of bucket.firstMs === bucket.lastMs ? (['min'] as const) : (['min', 'max'] as const)) {
      s.t.push(new Date(end === 'min' ? bucket.firstMs : bucket.lastMs).toISOString());
      push(s.measured, group('measured', end));
      push(s.predicted, group('predicted', end));
      push(s.residual, group('residual', end));
      push(s.inputs, group('inputs', end));
    }
  }
  return s;
}

/**
 * Buckets of both sources. Buckets of a minute or more read the kept per-minute extremes for the
 * settled whole minutes of the window and the raw rows for its two ends; narrower buckets read the
 * raw rows only.
 */
async function bucketsOf(db: Db, w: SeriesWindow, samplePeriodS: number, bucketMs: number): Promise<Bucket[]> {
  const fromMs = w.from.getTime();
  const endMs = w.to.getTime() + 1;
  const parts = await Promise.all(
    (['readings', 'predictions'] as const).map(async (source) => {
      if (bucketMs < MINUTE_MS) return rawBuckets(db, source, w, { fromMs, toMs: endMs, originMs: fromMs, bucketMs });
      const width = Math.ceil(bucketMs / MINUTE_MS) * MINUTE_MS;
      const originMs = Math.floor(fromMs / MINUTE_MS) * MINUTE_MS;
      const kept = { from: Math.ceil(fromMs / MINUTE_MS) * MINUTE_MS, to: 0 };
      kept.to = Math.max(
        kept.from,
        Math.min(Math.floor(endMs / MINUTE_MS) * MINUTE_MS, settledBefore(Date.now(), samplePeriodS)),
      );
      const grid = { originMs, bucketMs: width };
      return (
        await Promise.all([
          rawBuckets(db, source, w, { ...grid, fromMs, toMs: kept.from }),
          minuteBuckets(db, source, w, { ...grid, fromMs: kept.from, toMs: kept.to }),
          rawBuckets(db, source, w, { ...grid, fromMs: kept.to, toMs: endMs }),
        ])
      ).flat();
    }),
  );
  return mergeBuckets(parts);
}

/**
 * A loop's trend: measured, predicted, residual and inputs, aligned on slot times. When the window
 * holds more samples than maxPoints, it is cut into about maxPoints/2 time buckets and each bucket
 * gives its minima and maxima, so peaks survive at about one point per pixel.
 */
export async function loopSeries(db: Db, loopId: string, query: z.infer<typeof SeriesQuerySchema>): Promise<Series> {
  const loop = await requireLiveLoop(db, loopId);
  const to = query.to ? new Date(query.to) : new Date();
  const from = query.from ? new Date(query.from) : new Date(to.getTime() - DEFAULT_SPAN_MS);
  const spanMs = to.getTime() - from.getTime();
  if (spanMs <= 0) throw badRequest('from must be before to.');
  if (spanMs > MAX_SPAN_MS) throw badRequest('Ask for at most 366 days at a time.');
  const w: SeriesWindow = { loopId: loop.id, from, to, inputs: loop.inputs, outputs: loop.outputs };
  const samples = spanMs / (loop.samplePeriodS * 1000);
  if (samples <= query.maxPoints) return fromRows(w, await rawSeries(db, w));
  const bucketMs = Math.ceil(spanMs / Math.floor(query.maxPoints / 2));
  return fromBuckets(w, await bucketsOf(db, w, loop.samplePeriodS, bucketMs));
}
