import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { User } from '@shadowloop/api/contracts';

export type UserAccount = User;

export const userKeys = {
  all: ['users'] as const,
  list: () => [...userKeys.all, 'list'] as const,
};

export function getUsers(signal?: AbortSignal): Promise<UserAccount[]> {
  return apiFetch<UserAccount[]>('/api/v1/users', { signal });
}

export function usersQueryOptions() {
  return queryOptions({
    queryKey: userKeys.list(),
    queryFn: ({ signal }) => getUsers(signal),
  });
}
