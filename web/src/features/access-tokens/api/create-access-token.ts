import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { accessTokenKeys } from './get-access-tokens';

import type { CreatedAccessToken } from '@shadowloop/api/contracts';

export type { CreatedAccessToken };

export function createAccessToken(label: string): Promise<CreatedAccessToken> {
  return apiFetch<CreatedAccessToken>('/api/v1/access-tokens', { method: 'POST', body: { label } });
}

export function useCreateAccessToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createAccessToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: accessTokenKeys.all }),
  });
}
