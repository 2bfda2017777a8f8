import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { BacktestSummary } from '../types';
import { backtestKeys, isUnfinished, POLL_MS } from './backtest-keys';

/** A loop's backtests, newest first, without their results. */
export function getLoopBacktests(loopId: string, signal?: AbortSignal): Promise<BacktestSummary[]> {
  return apiFetch<BacktestSummary[]>(`/api/v1/loops/${encodeURIComponent(loopId)}/backtests`, { signal });
}

export function loopBacktestsQueryOptions(loopId: string) {
  return queryOptions({
    queryKey: backtestKeys.forLoop(loopId),
    queryFn: ({ signal }) => getLoopBacktests(loopId, signal),
    refetchInterval: (query) => (query.state.data?.some((b) => isUnfinished(b.status)) ? POLL_MS : false),
  });
}
