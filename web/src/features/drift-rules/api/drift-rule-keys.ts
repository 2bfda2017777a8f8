import type { DriftRuleKind } from '@shadowloop/api/contracts';

export const driftRuleKeys = {
  all: (loopId: string) => ['drift-rules', loopId] as const,
  list: (loopId: string) => [...driftRuleKeys.all(loopId), 'list'] as const,
  versions: (loopId: string, kind: DriftRuleKind) => [...driftRuleKeys.all(loopId), 'versions', kind] as const,
  preview: (loopId: string, kind: DriftRuleKind, params: Record<string, unknown>) =>
    [...driftRuleKeys.all(loopId), 'preview', kind, params] as const,
  suggestion: (loopId: string) => [...driftRuleKeys.all(loopId), 'suggestion'] as const,
};
