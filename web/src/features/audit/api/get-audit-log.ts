import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';

import type { AuditEntry } from '@shadowloop/api/contracts';

export type { AuditEntry };

export type AuditPage = { items: AuditEntry[]; total: number };

export type AuditQuery = { limit: number; offset: number; action: string; targetType?: string; targetId?: string };

export const AUDIT_PAGE_SIZE = 50;

export const auditKeys = {
  all: ['audit'] as const,
  list: (query: AuditQuery) => [...auditKeys.all, 'list', query] as const,
};

export function parseAuditSearch(search: URLSearchParams): AuditQuery {
  const page = Number.parseInt(search.get('page') ?? '1', 10);
  const safePage = Number.isFinite(page) && page > 0 ? page : 1;
  return {
    limit: AUDIT_PAGE_SIZE,
    offset: (safePage - 1) * AUDIT_PAGE_SIZE,
    action: (search.get('action') ?? '').trim(),
  };
}

/** The entries about one thing, e.g. one loop (`loop`, its id). */
export function auditQueryFor(targetType: string, targetId: string, page = 1): AuditQuery {
  return { limit: AUDIT_PAGE_SIZE, offset: (page - 1) * AUDIT_PAGE_SIZE, action: '', targetType, targetId };
}

export function getAuditLog(query: AuditQuery, signal?: AbortSignal): Promise<AuditPage> {
  const params = new URLSearchParams({ limit: String(query.limit), offset: String(query.offset) });
  if (query.action) params.set('action', query.action);
  if (query.targetType) params.set('targetType', query.targetType);
  if (query.targetId) params.set('targetId', query.targetId);
  return apiFetch<AuditPage>(`/api/v1/audit?${params.toString()}`, { signal });
}

export function auditLogQueryOptions(query: AuditQuery) {
  return queryOptions({
    queryKey: auditKeys.list(query),
    queryFn: ({ signal }) => getAuditLog(query, signal),
    placeholderData: keepPreviousData,
  });
}
