import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { SignedInUser } from '../roles';

export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
};

export function getMe(signal?: AbortSignal): Promise<SignedInUser> {
  return apiFetch<SignedInUser>('/api/v1/me', { signal });
}

export function meQueryOptions() {
  return queryOptions({
    queryKey: sessionKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });
}
