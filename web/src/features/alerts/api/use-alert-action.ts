import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { alertKeys } from './alert-keys';

import type { Alert, CloseCause } from '@shadowloop/api/contracts';

export type AcknowledgeBody = { note: string };
export type ShelveBody = { note: string; until: string };
export type CloseBody = { cause: CloseCause; note: string };

type ActionBodies = { acknowledge: AcknowledgeBody; shelve: ShelveBody; close: CloseBody };
export type AlertAction = keyof ActionBodies;

export function postAlertAction<A extends AlertAction>(alertId: string, action: A, body: ActionBodies[A]) {
  return apiFetch<Alert>(`/api/v1/alerts/${encodeURIComponent(alertId)}/${action}`, { method: 'POST', body });
}

/** Acknowledge, shelve or close one alert; its timeline and every list are asked for again. */
export function useAlertAction<A extends AlertAction>(alertId: string, action: A) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ActionBodies[A]) => postAlertAction(alertId, action, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: alertKeys.all }),
  });
}
