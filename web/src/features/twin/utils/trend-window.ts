import type { Bucketing } from './merge-point';

export const LIVE_RANGES = [
  { key: '15m', label: '15 min', spanMs: 15 * 60_000 },
  { key: '1h', label: '1 h', spanMs: 3_600_000 },
  { key: '8h', label: '8 h', spanMs: 8 * 3_600_000 },
  { key: '24h', label: '24 h', spanMs: 24 * 3_600_000 },
  { key: '7d', label: '7 days', spanMs: 7 * 86_400_000 },
] as const;

export type LiveRangeKey = (typeof LIVE_RANGES)[number]['key'];

/** A window that follows now, or a fixed one chosen by the person (no live updates). */
export type TrendRange = { kind: 'live'; key: LiveRangeKey } | { kind: 'fixed'; fromMs: number; toMs: number };

export function spanOf(range: TrendRange): number {
  if (range.kind === 'fixed') return range.toMs - range.fromMs;
  return LIVE_RANGES.find((r) => r.key === range.key)?.spanMs ?? LIVE_RANGES[0].spanMs;
}

export function windowOf(range: TrendRange, nowMs: number): { fromMs: number; toMs: number } {
  if (range.kind === 'fixed') return { fromMs: range.fromMs, toMs: range.toMs };
  return { fromMs: nowMs - spanOf(range), toMs: nowMs };
}

/** About one point per pixel of the chart, within what the series route accepts. */
export function maxPointsForWidth(pixels: number): number {
  return Math.min(4000, Math.max(100, Math.round(pixels)));
}

/**
 * The server's choice, repeated here: raw samples when the window holds at most maxPoints of them,
 * else maxPoints/2 buckets from the window's start (GET …/series).
 */
export function bucketingFor(
  window: { fromMs: number; toMs: number },
  samplePeriodS: number,
  maxPoints: number,
): Bucketing {
  const spanMs = window.toMs - window.fromMs;
  if (spanMs / (samplePeriodS * 1000) <= maxPoints) return null;
  return { originMs: window.fromMs, bucketMs: Math.ceil(spanMs / Math.floor(maxPoints / 2)) };
}

/** Rows a buffer needs to hold the whole window, raw or bucketed, with room for late samples. */
export function capacityFor(spanMs: number, samplePeriodS: number, maxPoints: number): number {
  const samples = Math.ceil(spanMs / (samplePeriodS * 1000));
  return Math.min(samples, maxPoints) + 32;
}
