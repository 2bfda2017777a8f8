import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { ingestSourceKeys } from './get-ingest-sources';

export function revokeIngestSource(sourceId: string): Promise<void> {
  return apiFetch<void>(`/api/v1/ingest-sources/${encodeURIComponent(sourceId)}`, { method: 'DELETE' });
}

export function useRevokeIngestSource() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeIngestSource,
    onSettled: () => queryClient.invalidateQueries({ queryKey: ingestSourceKeys.all }),
  });
}
