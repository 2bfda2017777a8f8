import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { DriftRuleKind } from '@shadowloop/api/contracts';
import { useDebouncedValue } from '../../../lib/use-debounced-value';
import { ruleExpectationQueryOptions } from '../api/preview-drift-rule';

/**
 * The expectation of the settings as typed, asked for once typing pauses; settings with a problem
 * found in the browser are not sent.
 */
export function useRuleExpectation(
  loopId: string,
  kind: DriftRuleKind,
  params: Record<string, unknown>,
  valid: boolean,
) {
  const settled = useDebouncedValue(valid ? JSON.stringify(params) : null, 400);
  return useQuery({
    ...ruleExpectationQueryOptions(loopId, kind, settled ? (JSON.parse(settled) as Record<string, unknown>) : {}),
    enabled: settled !== null,
    placeholderData: keepPreviousData,
  });
}
