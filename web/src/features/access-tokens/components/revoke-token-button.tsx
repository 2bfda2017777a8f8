import { ConfirmRevokeButton } from '../../../components/ui/confirm-revoke-button';
import type { AccessToken } from '../api/get-access-tokens';
import { useRevokeAccessToken } from '../api/revoke-access-token';

export function RevokeTokenButton({ token }: { token: AccessToken }) {
  const revoke = useRevokeAccessToken();
  if (token.revokedAt) return null;
  return (
    <ConfirmRevokeButton
      name={token.label}
      consequence="Scripts using this token will stop working."
      pending={revoke.isPending}
      error={revoke.isError ? revoke.error : null}
      onConfirm={(done) => revoke.mutate(token.id, { onSuccess: done })}
    />
  );
}
