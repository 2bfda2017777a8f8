import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { rotaKeys } from './rota-keys';

import type { Person } from '@shadowloop/api/contracts';

export type { Person };

/** The people who may be put on the rota. */
export function getPeople(signal?: AbortSignal): Promise<Person[]> {
  return apiFetch<Person[]>('/api/v1/oncall/people', { signal });
}

export function peopleQueryOptions() {
  return queryOptions({
    queryKey: rotaKeys.people(),
    queryFn: ({ signal }) => getPeople(signal),
    staleTime: 5 * 60_000,
  });
}
