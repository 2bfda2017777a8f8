import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { Backtest } from '../types';
import { backtestKeys } from './backtest-keys';

export function cancelBacktest(backtestId: string): Promise<Backtest> {
  return apiFetch<Backtest>(`/api/v1/backtests/${encodeURIComponent(backtestId)}/cancel`, { method: 'POST' });
}

/** A queued job stops at once; a running one at the worker's next chunk, which the polling then shows. */
export function useCancelBacktest() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelBacktest,
    onSuccess: (backtest) => {
      queryClient.setQueryData(backtestKeys.detail(backtest.id), backtest);
      return queryClient.invalidateQueries({ queryKey: backtestKeys.forLoop(backtest.loopId) });
    },
  });
}
