import { useMutation } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { FORECAST_SAMPLES } from './get-forecast';

import type { MovePreview } from '@shadowloop/api/contracts';

export type { MovePreview };

export type MoveRequest = { inputIndex: number; delta: number };

/** What-if only: the server computes a trajectory; nothing reaches the plant. */
export function previewMove(loopId: string, move: MoveRequest): Promise<MovePreview> {
  return apiFetch<MovePreview>(`/api/v1/loops/${encodeURIComponent(loopId)}/move-preview`, {
    method: 'POST',
    body: { ...move, n: FORECAST_SAMPLES },
  });
}

export function usePreviewMove(loopId: string) {
  return useMutation({ mutationFn: (move: MoveRequest) => previewMove(loopId, move) });
}
