import type { AlertState, Priority } from '@shadowloop/api/contracts';

/** What the queue asks the server for: the query of GET /api/v1/alerts. */
export type AlertFilters = {
  /** `open` is every state but closed; absent: every state. */
  states?: (AlertState | 'open')[];
  area?: string;
  loopId?: string;
  priorities?: Priority[];
  from?: string;
  to?: string;
  limit?: number;
  /** `urgent`: the server picks and orders by urgency (so the limit keeps the most urgent). */
  order?: 'urgent';
};

export const WAITING_STATES: AlertState[] = ['unacknowledged', 'returned_unacknowledged'];

/** The query string of GET /api/v1/alerts, lists comma-separated. */
export function alertQueryString(filters: AlertFilters): string {
  const query = new URLSearchParams();
  if (filters.states?.length) query.set('state', filters.states.join(','));
  if (filters.area) query.set('area', filters.area);
  if (filters.loopId) query.set('loopId', filters.loopId);
  if (filters.priorities?.length) query.set('priority', filters.priorities.join(','));
  if (filters.from) query.set('from', filters.from);
  if (filters.to) query.set('to', filters.to);
  if (filters.limit) query.set('limit', String(filters.limit));
  if (filters.order) query.set('order', filters.order);
  return query.toString();
}

type Matchable = { state: AlertState; area: string; loopId: string; priority: number; raisedAt: string };

/** Whether an alert belongs in a list asked for with these filters (the server's own rules). */
export function matchesFilters(alert: Matchable, filters: AlertFilters): boolean {
  if (filters.states?.length) {
    const open = filters.states.includes('open') && alert.state !== 'closed';
    if (!open && !filters.states.includes(alert.state)) return false;
  }
  if (filters.area && alert.area !== filters.area) return false;
  if (filters.loopId && alert.loopId !== filters.loopId) return false;
  if (filters.priorities?.length && !filters.priorities.includes(alert.priority as Priority)) return false;
  const raised = Date.parse(alert.raisedAt);
  if (filters.from && raised < Date.parse(filters.from)) return false;
  if (filters.to && raised >= Date.parse(filters.to)) return false;
  return true;
}
