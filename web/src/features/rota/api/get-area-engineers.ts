import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { rotaKeys } from './rota-keys';
import type { Person } from './get-people';

export type AreaEngineers = { area: string; engineers: Person[] }[];

export function getAreaEngineers(signal?: AbortSignal): Promise<AreaEngineers> {
  return apiFetch<AreaEngineers>('/api/v1/oncall/area-engineers', { signal });
}

export function areaEngineersQueryOptions() {
  return queryOptions({
    queryKey: rotaKeys.areaEngineers(),
    queryFn: ({ signal }) => getAreaEngineers(signal),
    staleTime: 5 * 60_000,
  });
}
