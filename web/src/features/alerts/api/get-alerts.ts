import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { alertQueryString, type AlertFilters } from '../utils/alert-filters';
import { alertKeys } from './alert-keys';

import type { Alert } from '@shadowloop/api/contracts';

export type { Alert };

export function getAlerts(filters: AlertFilters, signal?: AbortSignal): Promise<Alert[]> {
  const query = alertQueryString(filters);
  return apiFetch<Alert[]>(`/api/v1/alerts${query ? `?${query}` : ''}`, { signal });
}

/** Pushed changes keep these lists current (useAlertUpdates), so they stay fresh for long. */
export function alertsQueryOptions(filters: AlertFilters) {
  return queryOptions({
    queryKey: alertKeys.list(filters),
    queryFn: ({ signal }) => getAlerts(filters, signal),
    staleTime: 5 * 60_000,
    placeholderData: keepPreviousData,
  });
}
