import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { Exploration } from '../types';
import { versionKeys } from './model-version-keys';

import type { ExploreBody } from '@shadowloop/api/contracts';

export type { ExploreBody };

export function exploreVersion(versionId: string, body: ExploreBody, signal?: AbortSignal): Promise<Exploration> {
  return apiFetch<Exploration>(`/api/v1/model-versions/${encodeURIComponent(versionId)}/explore`, {
    method: 'POST',
    body,
    signal,
  });
}

/** A^k, the free response from x0 and its split into modes; pure computation, cached like a read. */
export function explorationQueryOptions(versionId: string, body: ExploreBody) {
  return queryOptions({
    queryKey: versionKeys.explore(versionId, body),
    queryFn: ({ signal }) => exploreVersion(versionId, body, signal),
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });
}
