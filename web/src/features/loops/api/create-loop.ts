import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { loopKeys, type Loop } from './get-loops';

import type { CreateLoopBody } from '@shadowloop/api/contracts';

export type { CreateLoopBody };

export function createLoop(body: CreateLoopBody): Promise<Loop> {
  return apiFetch<Loop>('/api/v1/loops', { method: 'POST', body });
}

export function useCreateLoop() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createLoop,
    onSuccess: (loop) => {
      queryClient.setQueryData(loopKeys.detail(loop.id), loop);
      return queryClient.invalidateQueries({ queryKey: loopKeys.list() });
    },
  });
}
