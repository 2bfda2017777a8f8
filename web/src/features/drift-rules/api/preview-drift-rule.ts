import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { driftRuleKeys } from './drift-rule-keys';
import { rulesPath } from './get-drift-rules';

import type { DriftRuleKind, RuleExpectation } from '@shadowloop/api/contracts';

export type { RuleExpectation };

/** What unsaved settings would mean; a read, though sent as POST, so it is cached by its settings. */
export function ruleExpectationQueryOptions(loopId: string, kind: DriftRuleKind, params: Record<string, unknown>) {
  return queryOptions({
    queryKey: driftRuleKeys.preview(loopId, kind, params),
    queryFn: ({ signal }) =>
      apiFetch<RuleExpectation>(`${rulesPath(loopId)}/preview`, { method: 'POST', body: { kind, params }, signal }),
    staleTime: Infinity,
    retry: false,
  });
}
