import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import type { Shift } from './get-shifts';
import { rotaKeys } from './rota-keys';

export type SaveShiftBody = {
  userId: string;
  area: string | null;
  position: Shift['position'];
  startsAt: string;
  endsAt: string;
  note: string;
};

const shiftPath = (shiftId: string) => `/api/v1/oncall/shifts/${encodeURIComponent(shiftId)}`;

export const createShift = (body: SaveShiftBody) => apiFetch<Shift>('/api/v1/oncall/shifts', { method: 'POST', body });
export const updateShift = (shiftId: string, body: SaveShiftBody) =>
  apiFetch<Shift>(shiftPath(shiftId), { method: 'PUT', body });
export const deleteShift = (shiftId: string) => apiFetch<void>(shiftPath(shiftId), { method: 'DELETE' });
export const swapShifts = (shiftId: string, withShiftId: string) =>
  apiFetch<unknown>(`${shiftPath(shiftId)}/swap`, { method: 'POST', body: { withShiftId } });

/** Any change of the rota: the weeks shown and who is on call now are asked for again. */
export function useRotaChange<TVariables>(change: (variables: TVariables) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: change,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: rotaKeys.all }),
  });
}
