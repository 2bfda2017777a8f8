import type { AlertLoad } from '@shadowloop/api/contracts';

const TEN_MINUTES_MS = 600_000;
const MAX_FILLED_WINDOWS = 20_000;

/** A report day (`2025-06-01`, a UTC calendar day) as the instant it starts, or an ISO instant as it is. */
export function dayStartMs(day: string): number {
  return /^\d{4}-\d{2}-\d{2}$/.test(day) ? Date.parse(`${day}T00:00:00Z`) : Date.parse(day);
}

export type CountSeries = { x: number[]; counts: number[] };

export function perDaySeries(load: AlertLoad): CountSeries {
  const days = [...load.perDay].sort((a, b) => a.day.localeCompare(b.day));
  return { x: days.map((d) => dayStartMs(d.day) / 1000), counts: days.map((d) => d.count) };
}

/**
 * Every 10-minute window of the range, empty ones as 0, so quiet stretches show as quiet; the
 * server sends only windows that had any. Very long ranges keep only those.
 */
export function per10MinSeries(load: AlertLoad): CountSeries {
  const byStart = new Map(load.per10Min.map((w) => [Date.parse(w.start), w.count]));
  const first = Math.floor(Date.parse(load.from) / TEN_MINUTES_MS) * TEN_MINUTES_MS;
  const last = Date.parse(load.to);
  if (!Number.isFinite(first) || !Number.isFinite(last) || (last - first) / TEN_MINUTES_MS > MAX_FILLED_WINDOWS) {
    const starts = [...byStart.keys()].sort((a, b) => a - b);
    return { x: starts.map((s) => s / 1000), counts: starts.map((s) => byStart.get(s) ?? 0) };
  }
  const x: number[] = [];
  const counts: number[] = [];
  for (let start = first; start < last; start += TEN_MINUTES_MS) {
    x.push(start / 1000);
    counts.push(byStart.get(start) ?? 0);
  }
  return { x, counts };
}
