import type { AlertState, Priority } from '@shadowloop/api/contracts';
import type { AlertFilters } from './alert-filters';
import type { QueueOrder } from './alert-order';
import { ALERT_STATE_WORDS } from './alert-words';

export const RANGES = { any: null, '24h': 24, '7d': 7 * 24, '30d': 30 * 24 } as const;
export type QueueRange = keyof typeof RANGES | 'custom';

/** The queue's filters as they stand in the address, so a filtered queue can be linked and reloaded. */
export type QueueSearch = {
  /** `open` (the default), `all`, or states comma-separated. */
  state: string;
  area: string;
  loopId: string;
  priorities: Priority[];
  range: QueueRange;
  /** ISO instants of a custom range. */
  from: string;
  to: string;
  /** `urgent` (the default) or `newest`. */
  order: QueueOrder;
};

const KNOWN_STATES = new Set<string>(Object.keys(ALERT_STATE_WORDS));

function readPriorities(text: string | null): Priority[] {
  const picked = (text ?? '').split(',').filter((p) => p === '1' || p === '2' || p === '3');
  return [...new Set(picked)].sort().map(Number) as Priority[];
}

/** An instant from the address as ISO 8601 UTC, or '' when it is missing or not a time. */
function readInstant(text: string | null): string {
  const ms = Date.parse(text ?? '');
  return Number.isNaN(ms) ? '' : new Date(ms).toISOString();
}

function readRange(params: URLSearchParams): QueueRange {
  if (readInstant(params.get('from')) || readInstant(params.get('to'))) return 'custom';
  const range = params.get('range') ?? 'any';
  return range in RANGES ? (range as QueueRange) : 'any';
}

export function readQueueSearch(params: URLSearchParams): QueueSearch {
  return {
    state: params.get('state') || 'open',
    area: params.get('area') ?? '',
    loopId: params.get('loop') ?? '',
    priorities: readPriorities(params.get('priority')),
    range: readRange(params),
    from: readInstant(params.get('from')),
    to: readInstant(params.get('to')),
    order: params.get('order') === 'newest' ? 'newest' : 'urgent',
  };
}

const WEEK_MS = 7 * 86_400_000;

/** The custom window in ms, one end filled in from the other when only one was given. */
export function customWindow(search: QueueSearch): { fromMs: number; toMs: number } {
  const from = Date.parse(search.from);
  const to = Date.parse(search.to);
  return { fromMs: Number.isNaN(from) ? to - WEEK_MS : from, toMs: Number.isNaN(to) ? from + WEEK_MS : to };
}

export function writeQueueSearch(search: QueueSearch): URLSearchParams {
  const params = new URLSearchParams();
  if (search.state !== 'open') params.set('state', search.state);
  if (search.area) params.set('area', search.area);
  if (search.loopId) params.set('loop', search.loopId);
  if (search.priorities.length) params.set('priority', search.priorities.join(','));
  if (search.range === 'custom') {
    if (search.from) params.set('from', search.from);
    if (search.to) params.set('to', search.to);
  } else if (search.range !== 'any') params.set('range', search.range);
  if (search.order === 'newest') params.set('order', 'newest');
  return params;
}

function readStates(state: string): AlertFilters['states'] {
  if (state === 'all') return undefined;
  const states = state.split(',').filter((s) => s === 'open' || KNOWN_STATES.has(s)) as (AlertState | 'open')[];
  return states.length ? states : ['open'];
}

/** The request's filters; a rolling range counts back from `nowMs` (rounded to the minute by the caller). */
export function queueFilters(search: QueueSearch, nowMs: number): AlertFilters {
  const hours = search.range === 'custom' ? null : RANGES[search.range];
  return {
    states: readStates(search.state),
    area: search.area || undefined,
    loopId: search.loopId || undefined,
    priorities: search.priorities.length ? search.priorities : undefined,
    from: hours ? new Date(nowMs - hours * 3_600_000).toISOString() : search.from || undefined,
    to: search.range === 'custom' ? search.to || undefined : undefined,
    limit: 500,
    ...(search.order === 'urgent' ? { order: 'urgent' as const } : {}),
  };
}
