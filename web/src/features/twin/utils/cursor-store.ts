/** The time under the pointer (seconds), shared by the synchronised charts and the readout table. */
export interface CursorStore {
  get(): number | null;
  set(t: number | null): void;
  subscribe(listener: () => void): () => void;
}

export function createCursorStore(): CursorStore {
  let value: number | null = null;
  const listeners = new Set<() => void>();
  return {
    get: () => value,
    set(t) {
      if (t === value) return;
      value = t;
      listeners.forEach((listener) => listener());
    },
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

/** The index of the last row at or before `t` in ascending times, or -1. */
export function rowAtOrBefore(times: readonly number[], t: number): number {
  let low = 0;
  let high = times.length - 1;
  let found = -1;
  while (low <= high) {
    const mid = (low + high) >> 1;
    if (times[mid] <= t) {
      found = mid;
      low = mid + 1;
    } else high = mid - 1;
  }
  return found;
}
