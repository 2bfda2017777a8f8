import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { loopKeys, type Loop } from './get-loops';

export function getLoop(loopId: string, signal?: AbortSignal): Promise<Loop> {
  return apiFetch<Loop>(`/api/v1/loops/${encodeURIComponent(loopId)}`, { signal });
}

export function loopQueryOptions(loopId: string) {
  return queryOptions({ queryKey: loopKeys.detail(loopId), queryFn: ({ signal }) => getLoop(loopId, signal) });
}
