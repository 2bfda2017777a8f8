import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { Version } from '../types';
import { versionKeys } from './model-version-keys';

/** A loop's model versions, newest first. */
export function getLoopVersions(loopId: string, signal?: AbortSignal): Promise<Version[]> {
  return apiFetch<Version[]>(`/api/v1/loops/${encodeURIComponent(loopId)}/model-versions`, { signal });
}

export function loopVersionsQueryOptions(loopId: string) {
  return queryOptions({
    queryKey: versionKeys.forLoop(loopId),
    queryFn: ({ signal }) => getLoopVersions(loopId, signal),
  });
}
