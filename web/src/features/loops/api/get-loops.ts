import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';

import type { Loop } from '@shadowloop/api/contracts';

export type { Loop };

export type TrackingStatus = Loop['status'];

export const loopKeys = {
  all: ['loops'] as const,
  list: () => [...loopKeys.all, 'list'] as const,
  detail: (loopId: string) => [...loopKeys.all, 'detail', loopId] as const,
};

/** Every loop; the table sorts, filters and pages them in the browser. */
export function getLoops(signal?: AbortSignal): Promise<Loop[]> {
  return apiFetch<Loop[]>('/api/v1/loops', { signal });
}

export function loopsQueryOptions() {
  return queryOptions({ queryKey: loopKeys.list(), queryFn: ({ signal }) => getLoops(signal) });
}
