import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { sessionKeys } from '../../session/api/get-me';
import type { Role } from '../../session/roles';
import { userKeys, type UserAccount } from './get-users';

export type UpdateUserRolesInput = { userId: string; roles: Role[] };

export function updateUserRoles({ userId, roles }: UpdateUserRolesInput): Promise<UserAccount> {
  return apiFetch<UserAccount>(`/api/v1/users/${encodeURIComponent(userId)}/roles`, {
    method: 'PUT',
    body: { roles },
  });
}

export function useUpdateUserRoles() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUserRoles,
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: userKeys.all }),
        queryClient.invalidateQueries({ queryKey: sessionKeys.all }),
      ]);
    },
  });
}
