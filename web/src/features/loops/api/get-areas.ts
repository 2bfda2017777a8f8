import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';

import type { Area } from '@shadowloop/api/contracts';

export type { Area };

export const areaKeys = { all: ['areas'] as const };

export function getAreas(signal?: AbortSignal): Promise<Area[]> {
  return apiFetch<Area[]>('/api/v1/areas', { signal });
}

export function areasQueryOptions() {
  return queryOptions({ queryKey: areaKeys.all, queryFn: ({ signal }) => getAreas(signal), staleTime: 5 * 60_000 });
}
