import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { driftRuleKeys } from './drift-rule-keys';

import type { DriftRule, DriftRuleKind, Priority } from '@shadowloop/api/contracts';

export type { DriftRule };

export type DriftRuleVersion = {
  version: number;
  enabled: boolean;
  priority: Priority;
  params: Record<string, unknown>;
  note: string;
  changedAt: string;
  changedBy: string | null;
};

const rulesPath = (loopId: string) => `/api/v1/loops/${encodeURIComponent(loopId)}/drift-rules`;

export function driftRulesQueryOptions(loopId: string) {
  return queryOptions({
    queryKey: driftRuleKeys.list(loopId),
    queryFn: ({ signal }) => apiFetch<DriftRule[]>(rulesPath(loopId), { signal }),
  });
}

export function driftRuleVersionsQueryOptions(loopId: string, kind: DriftRuleKind) {
  return queryOptions({
    queryKey: driftRuleKeys.versions(loopId, kind),
    queryFn: ({ signal }) => apiFetch<DriftRuleVersion[]>(`${rulesPath(loopId)}/${kind}/versions`, { signal }),
  });
}

export { rulesPath };
