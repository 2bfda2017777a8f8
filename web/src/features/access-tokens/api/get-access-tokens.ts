import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';

import type { AccessToken } from '@shadowloop/api/contracts';

export type { AccessToken };

export type AccessTokenScope = 'mine' | 'all';

export const accessTokenKeys = {
  all: ['access-tokens'] as const,
  list: (scope: AccessTokenScope) => [...accessTokenKeys.all, 'list', { scope }] as const,
};

export function getAccessTokens(scope: AccessTokenScope, signal?: AbortSignal): Promise<AccessToken[]> {
  const path = scope === 'all' ? '/api/v1/access-tokens?all=true' : '/api/v1/access-tokens';
  return apiFetch<AccessToken[]>(path, { signal });
}

export function accessTokensQueryOptions(scope: AccessTokenScope) {
  return queryOptions({
    queryKey: accessTokenKeys.list(scope),
    queryFn: ({ signal }) => getAccessTokens(scope, signal),
  });
}
