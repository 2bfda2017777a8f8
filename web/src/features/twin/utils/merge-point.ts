import type { RingBuffer } from '../../../lib/ring-buffer';

/**
 * How a trend was downsampled by the server: buckets of `bucketMs` counted from `originMs`, each
 * shown as two points — the minima at its first slot and the maxima at its last. Null: raw samples.
 */
export type Bucketing = { originMs: number; bucketMs: number } | null;

/** How far back a late sample may land; older ones wait for the next backfill. */
const LATE_ROWS = 16;

const nanMin = (a: number, b: number) => (Number.isNaN(a) ? b : Number.isNaN(b) ? a : Math.min(a, b));
const nanMax = (a: number, b: number) => (Number.isNaN(a) ? b : Number.isNaN(b) ? a : Math.max(a, b));
const known = (a: number, b: number) => (Number.isNaN(b) ? a : b);

function combine(into: Float64Array, row: ArrayLike<number>, pick: (a: number, b: number) => number): Float64Array {
  for (let c = 0; c < into.length; c++) into[c] = pick(into[c], row[c]);
  return into;
}

/** Raw samples: a new slot is appended (or slotted in when late); a known slot gains what it lacked. */
function upsertRaw(buffer: RingBuffer, t: number, row: ArrayLike<number>): void {
  if (buffer.length === 0 || t > buffer.timeAt(0)) return buffer.push(t, row);
  const scratch = new Float64Array(buffer.columns);
  for (let back = 0; back < Math.min(buffer.length, LATE_ROWS); back++) {
    const rowTime = buffer.read(back, scratch);
    if (rowTime === t) return buffer.set(back, t, combine(scratch, row, known));
    if (rowTime < t) return buffer.insertOlderThan(back - 1, t, row);
  }
}

/** Downsampled: the sample widens its bucket's minima and maxima, as the server would have. */
function mergeBucketed(buffer: RingBuffer, t: number, row: ArrayLike<number>, b: NonNullable<Bucketing>): void {
  const bucketOf = (seconds: number) => Math.floor((seconds * 1000 - b.originMs) / b.bucketMs);
  const bucket = bucketOf(t);
  if (buffer.length === 0 || bucket > bucketOf(buffer.timeAt(0))) return buffer.push(t, row);
  let newest = -1;
  let count = 0;
  for (let back = 0; back < Math.min(buffer.length, 4); back++) {
    const rowBucket = bucketOf(buffer.timeAt(back));
    if (rowBucket < bucket) break;
    if (rowBucket === bucket) {
      if (newest < 0) newest = back;
      count += 1;
    }
  }
  if (count === 0) return;
  const high = new Float64Array(buffer.columns);
  const highTime = buffer.read(newest, high);
  if (count === 1) {
    if (highTime === t) return buffer.set(newest, t, combine(high, row, known));
    const low = combine(high.slice(), row, nanMin);
    combine(high, row, nanMax);
    buffer.set(newest, Math.min(highTime, t), low);
    if (newest === 0) buffer.push(Math.max(highTime, t), high);
    else buffer.insertOlderThan(newest - 1, Math.max(highTime, t), high);
    return;
  }
  const low = new Float64Array(buffer.columns);
  const lowTime = buffer.read(newest + 1, low);
  buffer.set(newest + 1, Math.min(lowTime, t), combine(low, row, nanMin));
  buffer.set(newest, Math.max(highTime, t), combine(high, row, nanMax));
}

/** Merges one point (time in seconds) into a trend buffer, raw or downsampled. */
export function mergePoint(buffer: RingBuffer, t: number, row: ArrayLike<number>, bucketing: Bucketing): void {
  if (bucketing) mergeBucketed(buffer, t, row, bucketing);
  else upsertRaw(buffer, t, row);
}
