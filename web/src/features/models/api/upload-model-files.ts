import { useMutation } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { UploadedModel } from '../types';

/** Sends one JSON file or CSVs named after their matrices; the answer fills the editor, nothing is stored. */
export function uploadModelFiles(loopId: string, files: File[]): Promise<UploadedModel> {
  const form = new FormData();
  for (const file of files) form.append('files', file, file.name);
  return apiFetch<UploadedModel>(`/api/v1/loops/${encodeURIComponent(loopId)}/model-uploads`, {
    method: 'POST',
    body: form,
  });
}

export function useUploadModelFiles(loopId: string) {
  return useMutation({ mutationFn: (files: File[]) => uploadModelFiles(loopId, files) });
}
