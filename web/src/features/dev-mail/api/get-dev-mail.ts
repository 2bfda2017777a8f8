import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';

export type CapturedMail = {
  to: string;
  subject: string;
  text: string;
  receivedAt: string;
};

export const devMailKeys = {
  all: ['dev-mail'] as const,
  list: () => [...devMailKeys.all, 'list'] as const,
};

export function getDevMail(signal?: AbortSignal): Promise<CapturedMail[]> {
  return apiFetch<CapturedMail[]>('/api/v1/dev/mail', { signal });
}

export function devMailQueryOptions() {
  return queryOptions({
    queryKey: devMailKeys.list(),
    queryFn: ({ signal }) => getDevMail(signal),
    staleTime: 5_000,
  });
}
