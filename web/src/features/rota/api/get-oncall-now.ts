import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { rotaKeys } from './rota-keys';

import type { OnCallNow } from '@shadowloop/api/contracts';

export type { OnCallNow };

export function getOnCallNow(signal?: AbortSignal): Promise<OnCallNow> {
  return apiFetch<OnCallNow>('/api/v1/oncall/now', { signal });
}

/** Shifts start and end by the clock, with nothing pushed: asked for again each minute. */
export function onCallNowQueryOptions() {
  return queryOptions({
    queryKey: rotaKeys.now(),
    queryFn: ({ signal }) => getOnCallNow(signal),
    staleTime: 60_000,
    refetchInterval: 60_000,
  });
}
