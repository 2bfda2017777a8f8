import type { Alert, AlertWithEvents } from '@shadowloop/api/contracts';
import { matchesFilters, type AlertFilters } from './alert-filters';

const newestFirst = (a: Alert, b: Alert) => Date.parse(b.raisedAt) - Date.parse(a.raisedAt) || b.number - a.number;

/**
 * A cached list after a pushed alert: replaced where it was, added where it now belongs, dropped
 * where it no longer does; newest first, as the server sends them, and never longer than asked for.
 */
export function applyAlertToList(list: Alert[] | undefined, alert: Alert, filters: AlertFilters): Alert[] | undefined {
  if (!list) return list;
  const others = list.filter((item) => item.id !== alert.id);
  if (!matchesFilters(alert, filters)) return others.length === list.length ? list : others;
  const next = [...others, alert].sort(newestFirst);
  return filters.limit ? next.slice(0, filters.limit) : next;
}

/** The detail keeps its timeline; the next fetch brings the new events. */
export function applyAlertToDetail(detail: AlertWithEvents | undefined, alert: Alert): AlertWithEvents | undefined {
  if (!detail || Date.parse(alert.updatedAt) < Date.parse(detail.updatedAt)) return detail;
  return { ...detail, ...alert, events: detail.events };
}
