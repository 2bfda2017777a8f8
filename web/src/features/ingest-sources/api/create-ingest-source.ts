import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { ingestSourceKeys, type IngestSource } from './get-ingest-sources';

/** The contract's CreatedIngestSourceSchema: the source and its token, shown this once. */
export type CreatedIngestSource = IngestSource & { token: string };
export type CreateIngestSourceBody = { name: string; description: string; loopIds: string[] };

export function createIngestSource(body: CreateIngestSourceBody): Promise<CreatedIngestSource> {
  return apiFetch<CreatedIngestSource>('/api/v1/ingest-sources', { method: 'POST', body });
}

export function useCreateIngestSource() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createIngestSource,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ingestSourceKeys.all }),
  });
}
