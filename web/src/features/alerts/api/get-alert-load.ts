import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { alertKeys } from './alert-keys';

import type { AlertLoad } from '@shadowloop/api/contracts';

export type { AlertLoad };

export function alertLoadQuery(from: string, to: string): string {
  return new URLSearchParams({ from, to }).toString();
}

export function getAlertLoad(from: string, to: string, signal?: AbortSignal): Promise<AlertLoad> {
  return apiFetch<AlertLoad>(`/api/v1/alerts/load?${alertLoadQuery(from, to)}`, { signal });
}

export function alertLoadQueryOptions(from: string, to: string) {
  return queryOptions({
    queryKey: alertKeys.load(from, to),
    queryFn: ({ signal }) => getAlertLoad(from, to, signal),
  });
}

/** The same report as CSV, for a download link. */
export const alertLoadCsvHref = (from: string, to: string) => `/api/v1/alerts/load.csv?${alertLoadQuery(from, to)}`;
