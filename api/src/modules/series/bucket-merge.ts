import type { Bucket, Extremes } from './series.repository.js';

type Values = (number | null)[] | null;

/** Element by element min (or max) of two vectors with gaps; null when both are missing. */
function combine(x: Values, y: Values, pick: (a: number, b: number) => number): Values {
  if (!x) return y;
  if (!y) return x;
  return x.map((v, i) => (v === null ? y[i] : y[i] === null ? v : pick(v, y[i] as number)));
}

function mergeExtremes(x: Extremes | undefined, y: Extremes): Extremes {
  return x ? { min: combine(x.min, y.min, Math.min), max: combine(x.max, y.max, Math.max) } : y;
}

/**
 * Buckets of several parts (raw rows, cached minutes; readings, predictions) that share a grid,
 * merged into one bucket per grid time, in time order.
 */
export function mergeBuckets(parts: Bucket[][]): Bucket[] {
  const merged = new Map<number, Bucket>();
  for (const bucket of parts.flat()) {
    const seen = merged.get(bucket.bucketMs);
    if (!seen) {
      merged.set(bucket.bucketMs, { ...bucket, groups: { ...bucket.groups } });
      continue;
    }
    seen.firstMs = Math.min(seen.firstMs, bucket.firstMs);
    seen.lastMs = Math.max(seen.lastMs, bucket.lastMs);
    for (const [name, extremes] of Object.entries(bucket.groups))
      seen.groups[name] = mergeExtremes(seen.groups[name], extremes);
  }
  return [...merged.values()].sort((p, q) => p.bucketMs - q.bucketMs);
}
