import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { twinSocket } from '../../../lib/socket';
import { alertKeys } from '../api/alert-keys';
import type { Alert } from '../api/get-alerts';
import type { AlertWithEvents } from '../api/get-alert';
import type { AlertFilters } from '../utils/alert-filters';
import { applyAlertToDetail, applyAlertToList } from '../utils/apply-alert-change';

export function applyPushedAlert(queryClient: QueryClient, alert: Alert): void {
  for (const [key] of queryClient.getQueriesData<Alert[]>({ queryKey: alertKeys.lists() })) {
    const filters = (key[2] ?? {}) as AlertFilters;
    queryClient.setQueryData<Alert[]>(key, (list) => applyAlertToList(list, alert, filters));
  }
  queryClient.setQueryData<AlertWithEvents>(alertKeys.detail(alert.id), (detail) => applyAlertToDetail(detail, alert));
  // The timeline gained an event: an open detail page fetches it; a closed one waits until it opens.
  void queryClient.invalidateQueries({ queryKey: alertKeys.detail(alert.id), exact: true, refetchType: 'active' });
}

/**
 * Keeps every cached alert list and detail current from `alert:raised` and `alert:updated`; after a
 * dropped connection, what was missed is asked for again.
 */
export function useAlertUpdates(): void {
  const queryClient = useQueryClient();
  useEffect(() => {
    const socket = twinSocket();
    // The payload is the api's AlertSchema object (simulator/src/events.ts names only its common fields).
    const stopAlerts = socket.watchAlerts((alert) => applyPushedAlert(queryClient, alert as unknown as Alert));
    const stopReconnect = socket.onReconnect(() => void queryClient.invalidateQueries({ queryKey: alertKeys.all }));
    return () => {
      stopAlerts();
      stopReconnect();
    };
  }, [queryClient]);
}
