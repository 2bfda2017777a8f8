import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { Evidence } from '../types';
import { backtestKeys } from './backtest-keys';

export const evidencePath = (versionId: string) => `/api/v1/model-versions/${encodeURIComponent(versionId)}/evidence`;

/** The backtests attached to a version, with its figures and the active version's in each. */
export function evidenceQueryOptions(versionId: string) {
  return queryOptions({
    queryKey: backtestKeys.evidence(versionId),
    queryFn: ({ signal }) => apiFetch<Evidence[]>(evidencePath(versionId), { signal }),
  });
}
