import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { loopKeys, type Loop } from './get-loops';

import type { UpdateLoopBody } from '@shadowloop/api/contracts';

export function updateLoop(loopId: string, body: UpdateLoopBody): Promise<Loop> {
  return apiFetch<Loop>(`/api/v1/loops/${encodeURIComponent(loopId)}`, { method: 'PATCH', body });
}

export function useUpdateLoop(loopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateLoopBody) => updateLoop(loopId, body),
    onSuccess: (loop) => {
      queryClient.setQueryData(loopKeys.detail(loop.id), loop);
      return queryClient.invalidateQueries({ queryKey: loopKeys.list() });
    },
  });
}
