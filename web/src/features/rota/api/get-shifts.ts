import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { rotaKeys } from './rota-keys';

import type { Shift } from '@shadowloop/api/contracts';

export type { Shift };

export function getShifts(from: string, to: string, signal?: AbortSignal): Promise<Shift[]> {
  const query = new URLSearchParams({ from, to });
  return apiFetch<Shift[]>(`/api/v1/oncall/shifts?${query.toString()}`, { signal });
}

export function shiftsQueryOptions(from: string, to: string) {
  return queryOptions({ queryKey: rotaKeys.shifts(from, to), queryFn: ({ signal }) => getShifts(from, to, signal) });
}
