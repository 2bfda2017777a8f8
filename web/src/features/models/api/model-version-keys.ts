import type { ExploreBody } from '@shadowloop/api/contracts';

/** One hierarchy for every model-version query, so a review action can refresh them all at once. */
export const versionKeys = {
  all: ['model-versions'] as const,
  forLoop: (loopId: string) => [...versionKeys.all, 'loop', loopId] as const,
  detail: (versionId: string) => [...versionKeys.all, 'detail', versionId] as const,
  analysis: (versionId: string, stepSamples: number) =>
    [...versionKeys.detail(versionId), 'analysis', stepSamples] as const,
  explore: (versionId: string, body: ExploreBody) => [...versionKeys.detail(versionId), 'explore', body] as const,
  preview: (body: unknown) => [...versionKeys.all, 'preview', body] as const,
};
