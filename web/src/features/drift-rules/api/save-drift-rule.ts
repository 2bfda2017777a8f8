import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { driftRuleKeys } from './drift-rule-keys';
import { rulesPath, type DriftRule } from './get-drift-rules';

import type { DriftRuleKind, SaveDriftRuleBody } from '@shadowloop/api/contracts';

export function saveDriftRule(loopId: string, kind: DriftRuleKind, body: SaveDriftRuleBody): Promise<DriftRule> {
  return apiFetch<DriftRule>(`${rulesPath(loopId)}/${kind}`, { method: 'PUT', body });
}

/** A saved rule is a new version: the list and that rule's history are asked for again. */
export function useSaveDriftRule(loopId: string, kind: DriftRuleKind) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SaveDriftRuleBody) => saveDriftRule(loopId, kind, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: driftRuleKeys.all(loopId) }),
  });
}
