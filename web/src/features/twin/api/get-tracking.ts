import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { loopKeys } from '../../loops/api/get-loops';

import type { LoopTracking } from '@shadowloop/api/contracts';

export type { LoopTracking };

export const trackingKey = (loopId: string) => [...loopKeys.detail(loopId), 'tracking'] as const;

export function getTracking(loopId: string, signal?: AbortSignal): Promise<LoopTracking> {
  return apiFetch<LoopTracking>(`/api/v1/loops/${encodeURIComponent(loopId)}/tracking`, { signal });
}

/** The residual band moves slowly (a running 3 sd until one is configured): a minute is fresh enough. */
export function trackingQueryOptions(loopId: string) {
  return queryOptions({
    queryKey: trackingKey(loopId),
    queryFn: ({ signal }) => getTracking(loopId, signal),
    staleTime: 60_000,
  });
}
