import { apiFetch } from '../../../lib/api';

import type { Series } from '@shadowloop/api/contracts';

export type { Series };

export type SeriesRequest = { loopId: string; fromMs: number; toMs: number; maxPoints: number };

/**
 * Measured, predicted, residual and inputs over a window. Not cached: the answer goes straight into
 * the trend's ring buffer, which the live samples then extend.
 */
export function getSeries(request: SeriesRequest, signal?: AbortSignal): Promise<Series> {
  const query = new URLSearchParams({
    from: new Date(request.fromMs).toISOString(),
    to: new Date(request.toMs).toISOString(),
    maxPoints: String(request.maxPoints),
  });
  return apiFetch<Series>(`/api/v1/loops/${encodeURIComponent(request.loopId)}/series?${query.toString()}`, { signal });
}
