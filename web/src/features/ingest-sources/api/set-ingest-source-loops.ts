import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { ingestSourceKeys, type IngestSource } from './get-ingest-sources';

export function setIngestSourceLoops(sourceId: string, loopIds: string[]): Promise<IngestSource> {
  return apiFetch<IngestSource>(`/api/v1/ingest-sources/${encodeURIComponent(sourceId)}/loops`, {
    method: 'PUT',
    body: { loopIds },
  });
}

export function useSetIngestSourceLoops(sourceId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (loopIds: string[]) => setIngestSourceLoops(sourceId, loopIds),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ingestSourceKeys.all }),
  });
}
