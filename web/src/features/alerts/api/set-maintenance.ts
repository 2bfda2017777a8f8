import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { loopKeys } from '../../loops/api/get-loops';

export type MaintenanceBody = { maintenance: boolean; note: string };

export function setMaintenance(loopId: string, body: MaintenanceBody): Promise<unknown> {
  return apiFetch<unknown>(`/api/v1/loops/${encodeURIComponent(loopId)}/maintenance`, { method: 'PUT', body });
}

/** Maintenance is a field of the loop: the loop is asked for again once it changed. */
export function useSetMaintenance(loopId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: MaintenanceBody) => setMaintenance(loopId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: loopKeys.detail(loopId) }),
  });
}
