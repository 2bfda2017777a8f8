/**
 * A hashed timer wheel: one clock for every loop whatever its sample period. Time is cut into
 * ticks of `resolutionMs`; an entry due at t sits in bucket ⌈t / resolution⌉ mod `buckets`, and
 * entries due further ahead than one turn simply wait in their bucket for a later turn.
 *
 * The wheel holds no timer itself: its owner calls {@link TimerWheel.advance} every tick. After a
 * pause, one call visits each bucket at most once, so catching up costs at most one turn of the
 * wheel however long the pause was, and every overdue key comes back once.
 */
export interface TimerWheel {
  /** (Re)schedules a key; a key has at most one due time. */
  schedule(key: string, dueMs: number): void;
  cancel(key: string): void;
  /** Keys due at or before nowMs, each once, in no particular order. */
  advance(nowMs: number): string[];
  size(): number;
  dueAt(key: string): number | undefined;
}

export interface TimerWheelOptions {
  resolutionMs: number;
  /** Rounded up to a power of two. */
  buckets: number;
  /** Where the wheel starts; ticks before it are never visited. */
  startMs: number;
}

interface Entry {
  key: string;
  dueMs: number;
}

export function createTimerWheel(options: TimerWheelOptions): TimerWheel {
  if (!(options.resolutionMs > 0)) throw new RangeError('timer wheel: resolutionMs must be positive');
  const size = 2 ** Math.ceil(Math.log2(Math.max(2, options.buckets)));
  const mask = size - 1;
  const resolution = options.resolutionMs;
  const buckets: Entry[][] = Array.from({ length: size }, () => []);
  const due = new Map<string, number>();
  const tickOf = (ms: number) => Math.floor(ms / resolution);
  let visited = tickOf(options.startMs) - 1;

  function schedule(key: string, dueMs: number): void {
    due.set(key, dueMs);
    // the first tick that starts at or after the due time (a tick visited early would keep it for
    // a whole turn); a due time in a tick already visited goes to the next one
    buckets[Math.max(Math.ceil(dueMs / resolution), visited + 1) & mask].push({ key, dueMs });
  }

  /** Takes the entries of one bucket that are due; stale entries (rescheduled or cancelled) are dropped. */
  function drain(bucket: Entry[], nowMs: number, out: string[]): void {
    let kept = 0;
    for (const entry of bucket) {
      if (due.get(entry.key) !== entry.dueMs) continue;
      if (entry.dueMs <= nowMs) {
        due.delete(entry.key);
        out.push(entry.key);
      } else {
        bucket[kept++] = entry;
      }
    }
    bucket.length = kept;
  }

  function advance(nowMs: number): string[] {
    const now = tickOf(nowMs);
    const out: string[] = [];
    if (now <= visited) return out;
    const from = Math.max(visited + 1, now - mask);
    for (let tick = from; tick <= now; tick++) drain(buckets[tick & mask], nowMs, out);
    visited = now;
    return out;
  }

  return {
    schedule,
    cancel: (key) => void due.delete(key),
    advance,
    size: () => due.size,
    dueAt: (key) => due.get(key),
  };
}
