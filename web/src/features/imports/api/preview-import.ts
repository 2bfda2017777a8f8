import { useMutation } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';

import type { ImportPreview } from '@shadowloop/api/contracts';

export type { ImportPreview };

/** The file's header, first rows and a suggested mapping; the server stores nothing. */
export function previewImport(loopId: string, file: File): Promise<ImportPreview> {
  const form = new FormData();
  form.append('file', file);
  return apiFetch<ImportPreview>(`/api/v1/loops/${encodeURIComponent(loopId)}/readings/import/preview`, {
    method: 'POST',
    body: form,
  });
}

export function usePreviewImport(loopId: string) {
  return useMutation({ mutationFn: (file: File) => previewImport(loopId, file) });
}
