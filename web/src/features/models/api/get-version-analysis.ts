import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { ModelAnalysis } from '../types';
import { versionKeys } from './model-version-keys';

/** The stored version's analysis recomputed for another step-response horizon. */
export function getVersionAnalysis(
  versionId: string,
  stepSamples: number,
  signal?: AbortSignal,
): Promise<ModelAnalysis> {
  const path = `/api/v1/model-versions/${encodeURIComponent(versionId)}/analysis?stepSamples=${stepSamples}`;
  return apiFetch<ModelAnalysis>(path, { signal });
}

export function versionAnalysisQueryOptions(versionId: string, stepSamples: number) {
  return queryOptions({
    queryKey: versionKeys.analysis(versionId, stepSamples),
    queryFn: ({ signal }) => getVersionAnalysis(versionId, stepSamples, signal),
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });
}
