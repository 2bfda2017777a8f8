import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { alertSettingsKey } from './alert-keys';

import type { AlertSettings } from '@shadowloop/api/contracts';

export type { AlertSettings };

export function getAlertSettings(signal?: AbortSignal): Promise<AlertSettings> {
  return apiFetch<AlertSettings>('/api/v1/alert-settings', { signal });
}

export function alertSettingsQueryOptions() {
  return queryOptions({
    queryKey: alertSettingsKey,
    queryFn: ({ signal }) => getAlertSettings(signal),
    staleTime: 5 * 60_000,
  });
}
