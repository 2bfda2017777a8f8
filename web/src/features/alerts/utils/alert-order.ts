import type { Alert } from '@shadowloop/api/contracts';

/** How the queue lists alerts: what needs someone first, or simply the newest raise first. */
export type QueueOrder = 'urgent' | 'newest';

export const ORDER_WORDS: Record<QueueOrder, string> = {
  urgent: 'Most urgent first',
  newest: 'Newest first',
};

/**
 * Urgency: an active alert nobody acknowledged, then one that cleared before anyone did (it still
 * waits), then active acknowledged ones, shelved ones, acknowledged ones whose condition cleared,
 * and closed ones last.
 */
function urgencyRank(alert: Alert): number {
  if (alert.state === 'unacknowledged') return 0;
  if (alert.state === 'returned_unacknowledged') return 1;
  if (alert.state === 'acknowledged' && alert.active) return 2;
  if (alert.state === 'shelved') return 3;
  if (alert.state === 'acknowledged') return 4;
  return 5;
}

/**
 * The alerts in the queue's order. `urgent`: by urgency (see {@link urgencyRank}), then priority
 * (P1 first), then the latest raise or re-raise; `newest`: as the api lists them, newest first raise first.
 */
export function orderAlerts(alerts: Alert[], order: QueueOrder): Alert[] {
  if (order === 'newest') return alerts;
  return [...alerts].sort(
    (a, b) =>
      urgencyRank(a) - urgencyRank(b) ||
      a.priority - b.priority ||
      Date.parse(b.activeSince) - Date.parse(a.activeSince) ||
      b.number - a.number,
  );
}
