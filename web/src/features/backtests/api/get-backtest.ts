import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { Backtest } from '../types';
import { backtestKeys, isUnfinished, POLL_MS } from './backtest-keys';

export function getBacktest(backtestId: string, signal?: AbortSignal): Promise<Backtest> {
  return apiFetch<Backtest>(`/api/v1/backtests/${encodeURIComponent(backtestId)}`, { signal });
}

/** Asked every second while the job is queued or running; a finished backtest never changes but for its evidence. */
export function backtestQueryOptions(backtestId: string) {
  return queryOptions({
    queryKey: backtestKeys.detail(backtestId),
    queryFn: ({ signal }) => getBacktest(backtestId, signal),
    refetchInterval: (query) => (query.state.data && isUnfinished(query.state.data.status) ? POLL_MS : false),
  });
}
