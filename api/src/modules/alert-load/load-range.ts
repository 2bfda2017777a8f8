import { badRequest } from '../../http/errors.js';
import { WINDOW_MS } from './flood-merge.js';

const DAY_MS = 86_400_000;
export const DEFAULT_LOAD_DAYS = 7;
/** A quarter: the longest period alarm-load reviews usually look at in one go. */
export const MAX_LOAD_DAYS = 92;

export interface LoadRange {
  from: Date;
  to: Date;
}

/** The report's period [from, to): by default the 7 days up to now; `to` alone counts back 7 days. */
export function resolveLoadRange(query: { from?: string; to?: string }, now: Date = new Date()): LoadRange {
  const to = query.to ? new Date(query.to) : now;
  const from = query.from ? new Date(query.from) : new Date(to.getTime() - DEFAULT_LOAD_DAYS * DAY_MS);
  const span = to.getTime() - from.getTime();
  if (span <= 0)
    throw badRequest('query.from must be before query.to (and before now when to is left out).', [
      { path: 'query.from', message: 'must be before to' },
    ]);
  if (span > MAX_LOAD_DAYS * DAY_MS)
    throw badRequest(`The alert-load report covers at most ${MAX_LOAD_DAYS} days; shorten the period.`, [
      { path: 'query.from', message: `at most ${MAX_LOAD_DAYS} days before to` },
    ]);
  return { from, to };
}

/**
 * How many clock-aligned 10-minute windows (…:00, …:10, … UTC, as date_bin from 2000-01-01 makes
 * them) the range touches, the partial ones at either end included.
 */
export function countWindows({ from, to }: LoadRange, windowMs = WINDOW_MS): number {
  return Math.floor((to.getTime() - 1) / windowMs) - Math.floor(from.getTime() / windowMs) + 1;
}
