import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';

import type { IngestSource } from '@shadowloop/api/contracts';

export type { IngestSource };

export const ingestSourceKeys = { all: ['ingest-sources'] as const };

export function getIngestSources(signal?: AbortSignal): Promise<IngestSource[]> {
  return apiFetch<IngestSource[]>('/api/v1/ingest-sources', { signal });
}

export function ingestSourcesQueryOptions() {
  return queryOptions({ queryKey: ingestSourceKeys.all, queryFn: ({ signal }) => getIngestSources(signal) });
}
