import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { loopKeys } from '../../loops/api/get-loops';
import type { Version } from '../types';
import { versionKeys } from './model-version-keys';

import type { CreateModelVersionBody } from '@shadowloop/api/contracts';

export type { CreateModelVersionBody };

export function createModelVersion(loopId: string, body: CreateModelVersionBody): Promise<Version> {
  return apiFetch<Version>(`/api/v1/loops/${encodeURIComponent(loopId)}/model-versions`, { method: 'POST', body });
}

export function useCreateModelVersion(loopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateModelVersionBody) => createModelVersion(loopId, body),
    onSuccess: (version) => {
      queryClient.setQueryData(versionKeys.detail(version.id), version);
      void queryClient.invalidateQueries({ queryKey: versionKeys.forLoop(loopId) });
      return queryClient.invalidateQueries({ queryKey: loopKeys.all });
    },
  });
}
