import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { alertKeys } from './alert-keys';

export type BulkAcknowledgeResult = { acknowledged: string[]; skipped: { id: string; reason: string }[] };

export function acknowledgeAlerts(body: { ids: string[]; note: string }): Promise<BulkAcknowledgeResult> {
  return apiFetch<BulkAcknowledgeResult>('/api/v1/alerts/acknowledge', { method: 'POST', body });
}

export function useAcknowledgeAlerts() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acknowledgeAlerts,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: alertKeys.all }),
  });
}
