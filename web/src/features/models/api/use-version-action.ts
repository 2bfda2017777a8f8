import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { loopKeys } from '../../loops/api/get-loops';
import type { Version } from '../types';
import { versionKeys } from './model-version-keys';

export type VersionAction = 'submit' | 'approve' | 'reject' | 'activate' | 'retire';

export function postVersionAction<TBody>(versionId: string, action: VersionAction, body: TBody): Promise<Version> {
  return apiFetch<Version>(`/api/v1/model-versions/${encodeURIComponent(versionId)}/${action}`, {
    method: 'POST',
    body,
  });
}

/** A review step changes the version, its loop's list, and (on activation) the loop's active version. */
export function useVersionAction<TBody>(versionId: string, action: VersionAction) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TBody) => postVersionAction(versionId, action, body),
    onSuccess: (version) => {
      queryClient.setQueryData(versionKeys.detail(version.id), version);
      void queryClient.invalidateQueries({ queryKey: versionKeys.forLoop(version.loopId) });
      void queryClient.invalidateQueries({ queryKey: ['audit'] });
      return queryClient.invalidateQueries({ queryKey: loopKeys.all });
    },
  });
}
