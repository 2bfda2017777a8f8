import { useQuery } from '@tanstack/react-query';
import { versionAnalysisQueryOptions } from '../api/get-version-analysis';
import type { ModelAnalysis, Version } from '../types';

/**
 * The version's analysis with its step response over `horizon` samples: the stored one when the
 * horizon matches, else fetched (showing the stored one until it arrives).
 */
export function useStepAnalysis(version: Version, horizon: number) {
  const stored = version.analysis.stepResponse.samples;
  const fetched = useQuery({ ...versionAnalysisQueryOptions(version.id, horizon), enabled: horizon !== stored });
  const analysis: ModelAnalysis = horizon === stored ? version.analysis : (fetched.data ?? version.analysis);
  return { analysis, isFetching: fetched.isFetching, error: fetched.error, refetch: fetched.refetch };
}
