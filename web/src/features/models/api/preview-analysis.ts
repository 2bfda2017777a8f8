import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { ModelAnalysis } from '../types';
import { versionKeys } from './model-version-keys';

export type AnalysisRequest = {
  A: number[][];
  B: number[][];
  C?: number[][];
  D?: number[][];
  samplePeriodS: number;
  stepSamples?: number;
};

export function previewAnalysis(body: AnalysisRequest, signal?: AbortSignal): Promise<ModelAnalysis> {
  return apiFetch<ModelAnalysis>('/api/v1/analysis', { method: 'POST', body, signal });
}

/** The analysis of matrices still in the editor; a computation, so it is cached like a read. */
export function previewAnalysisQueryOptions(body: AnalysisRequest | null) {
  return queryOptions({
    queryKey: versionKeys.preview(body),
    queryFn: ({ signal }) => previewAnalysis(body as AnalysisRequest, signal),
    enabled: body !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });
}
