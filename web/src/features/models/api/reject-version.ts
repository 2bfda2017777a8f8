import { useVersionAction } from './use-version-action';

export type RejectBody = { reason: string };

export function useRejectVersion(versionId: string) {
  return useVersionAction<RejectBody>(versionId, 'reject');
}
