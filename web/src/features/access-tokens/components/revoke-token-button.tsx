import { useState } from 'react';
import { describeError } from '../../../components/errors/describe-error';
import { Button } from '../../../components/ui/button';
import { useRevokeAccessToken } from '../api/revoke-access-token';
import type { AccessToken } from '../api/get-access-tokens';

export function RevokeTokenButton({ token }: { token: AccessToken }) {
  const [confirming, setConfirming] = useState(false);
  const revoke = useRevokeAccessToken();

  if (token.revokedAt) return null;
  if (!confirming) {
    return (
      <Button variant="danger" onClick={() => setConfirming(true)} aria-label={`Revoke ${token.label}`}>
        Revoke
      </Button>
    );
  }
  return (
    <div className="space-y-1">
      <p className="text-xs">Scripts using this token will stop working.</p>
      <div className="flex gap-2">
        <Button
          variant="danger"
          disabled={revoke.isPending}
          onClick={() => revoke.mutate(token.id, { onSuccess: () => setConfirming(false) })}
        >
          Confirm revoke
        </Button>
        <Button variant="quiet" onClick={() => setConfirming(false)}>
          Keep it
        </Button>
      </div>
      {revoke.isError ? (
        <p role="alert" className="text-xs text-diverged">
          {describeError(revoke.error).explanation}
        </p>
      ) : null}
    </div>
  );
}
