import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { Version } from '../types';
import { versionKeys } from './model-version-keys';

export function getModelVersion(versionId: string, signal?: AbortSignal): Promise<Version> {
  return apiFetch<Version>(`/api/v1/model-versions/${encodeURIComponent(versionId)}`, { signal });
}

export function modelVersionQueryOptions(versionId: string) {
  return queryOptions({
    queryKey: versionKeys.detail(versionId),
    queryFn: ({ signal }) => getModelVersion(versionId, signal),
  });
}
