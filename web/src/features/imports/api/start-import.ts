import { useMutation } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';

import type { ImportMapping, ImportProgress } from '@shadowloop/api/contracts';

export type { ImportMapping, ImportProgress };

export type ImportRequest = { importId: string; mapping: ImportMapping; file: File };

/**
 * Uploads the whole file and answers when the import is over. The text fields go before the
 * file: the server reads the mapping first and then streams the rows.
 */
export function startImport(loopId: string, request: ImportRequest): Promise<ImportProgress> {
  const form = new FormData();
  form.append('mapping', JSON.stringify(request.mapping));
  form.append('importId', request.importId);
  form.append('file', request.file);
  return apiFetch<ImportProgress>(`/api/v1/loops/${encodeURIComponent(loopId)}/readings/import`, {
    method: 'POST',
    body: form,
  });
}

export function useStartImport(loopId: string) {
  return useMutation({ mutationFn: (request: ImportRequest) => startImport(loopId, request) });
}
