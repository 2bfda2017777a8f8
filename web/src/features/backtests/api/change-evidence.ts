import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { Evidence } from '../types';
import { backtestKeys } from './backtest-keys';
import { evidencePath } from './get-evidence';

export type AttachEvidence = { versionId: string; backtestId: string; note?: string };

export function attachEvidence({ versionId, ...body }: AttachEvidence): Promise<Evidence> {
  return apiFetch<Evidence>(evidencePath(versionId), { method: 'POST', body });
}

export function detachEvidence({ versionId, backtestId }: AttachEvidence): Promise<void> {
  return apiFetch<void>(`${evidencePath(versionId)}/${encodeURIComponent(backtestId)}`, { method: 'DELETE' });
}

/** Attaching or detaching changes the version's evidence and the backtest's list of versions it backs. */
function useEvidenceChange(change: (request: AttachEvidence) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: change,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: backtestKeys.all }),
  });
}

export const useAttachEvidence = () => useEvidenceChange(attachEvidence);
export const useDetachEvidence = () => useEvidenceChange(detachEvidence);
