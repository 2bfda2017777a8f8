import { useVersionAction } from './use-version-action';

export type ApproveBody = { note?: string };

export function useApproveVersion(versionId: string) {
  return useVersionAction<ApproveBody>(versionId, 'approve');
}
