import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { accessTokenKeys } from './get-access-tokens';

export function revokeAccessToken(id: string): Promise<void> {
  return apiFetch<void>(`/api/v1/access-tokens/${encodeURIComponent(id)}`, { method: 'DELETE' });
}

export function useRevokeAccessToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeAccessToken,
    onSettled: () => queryClient.invalidateQueries({ queryKey: accessTokenKeys.all }),
  });
}
