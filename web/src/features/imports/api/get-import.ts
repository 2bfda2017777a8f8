import { queryOptions } from '@tanstack/react-query';
import { apiFetch, isApiError } from '../../../lib/api';
import type { ImportProgress } from './start-import';

/** Progress of a running import; null until the server has registered it. */
export async function getImport(importId: string, signal?: AbortSignal): Promise<ImportProgress | null> {
  try {
    return await apiFetch<ImportProgress>(`/api/v1/imports/${encodeURIComponent(importId)}`, { signal });
  } catch (error) {
    if (isApiError(error) && error.status === 404) return null;
    throw error;
  }
}

/** Asked twice a second while the upload runs; the upload's own answer is the final tally. */
export function importProgressQueryOptions(importId: string | null, running: boolean) {
  return queryOptions({
    queryKey: ['imports', importId] as const,
    queryFn: ({ signal }) => getImport(importId ?? '', signal),
    enabled: importId !== null && running,
    refetchInterval: running ? 500 : false,
    retry: false,
  });
}
