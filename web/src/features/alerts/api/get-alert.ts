import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { alertKeys } from './alert-keys';

import type { AlertEvent, AlertWithEvents } from '@shadowloop/api/contracts';

export type { AlertEvent, AlertWithEvents };

export function getAlert(alertId: string, signal?: AbortSignal): Promise<AlertWithEvents> {
  return apiFetch<AlertWithEvents>(`/api/v1/alerts/${encodeURIComponent(alertId)}`, { signal });
}

export function alertQueryOptions(alertId: string) {
  return queryOptions({ queryKey: alertKeys.detail(alertId), queryFn: ({ signal }) => getAlert(alertId, signal) });
}
