import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { loopKeys } from '../../loops/api/get-loops';

import type { AlertSuppression } from '@shadowloop/api/contracts';

export type { AlertSuppression };

/** Raises recorded while the loop was in maintenance, newest first. */
export function suppressionsQueryOptions(loopId: string) {
  return queryOptions({
    queryKey: [...loopKeys.detail(loopId), 'alert-suppressions'] as const,
    queryFn: ({ signal }) =>
      apiFetch<AlertSuppression[]>(`/api/v1/loops/${encodeURIComponent(loopId)}/alert-suppressions?limit=20`, {
        signal,
      }),
  });
}
