/**
 * How long ago, in the short words a tile has room for: `just now`, `3 s ago`, `4 min ago`,
 * `2 h ago`, `3 days ago`. A time slightly ahead of this browser's clock reads as `just now`.
 */
export function timeAgo(thenMs: number | null, nowMs: number): string {
  if (thenMs === null || !Number.isFinite(thenMs)) return 'no reading yet';
  const seconds = Math.floor((nowMs - thenMs) / 1000);
  if (seconds < 1) return 'just now';
  if (seconds < 120) return `${seconds} s ago`;
  const minutes = Math.floor(seconds / 60);
  if (minutes < 120) return `${minutes} min ago`;
  const hours = Math.floor(minutes / 60);
  if (hours < 48) return `${hours} h ago`;
  const days = Math.floor(hours / 24);
  return `${days} days ago`;
}

/** The newer of two times (ms), either of which may be unknown. */
export function newest(a: number | null, b: number | null): number | null {
  if (a === null) return b;
  if (b === null) return a;
  return Math.max(a, b);
}
