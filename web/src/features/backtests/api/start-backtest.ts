import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { BacktestCreated, BacktestRequest } from '../types';
import { backtestKeys } from './backtest-keys';

/**
 * A range goes as JSON; an upload as multipart with the text fields before the file, so the server
 * reads the versions and the mapping first and then streams the rows.
 */
export function startBacktest(loopId: string, request: BacktestRequest): Promise<BacktestCreated> {
  const path = `/api/v1/loops/${encodeURIComponent(loopId)}/backtests`;
  if (request.source === 'range') {
    const { versionIds, from, to } = request;
    return apiFetch<BacktestCreated>(path, { method: 'POST', body: { versionIds, from, to } });
  }
  const form = new FormData();
  form.append('versionIds', JSON.stringify(request.versionIds));
  form.append('mapping', JSON.stringify(request.mapping));
  form.append('file', request.file);
  return apiFetch<BacktestCreated>(path, { method: 'POST', body: form });
}

export function useStartBacktest(loopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: BacktestRequest) => startBacktest(loopId, request),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: backtestKeys.forLoop(loopId) }),
  });
}
