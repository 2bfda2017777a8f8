import { useState } from 'react';
import { describeError } from '../errors/describe-error';
import { Button } from './button';

type ConfirmRevokeButtonProps = {
  /** What is revoked, for the button's accessible name. */
  name: string;
  /** What happens once it is revoked, shown before the person confirms. */
  consequence: string;
  pending: boolean;
  error: unknown;
  onConfirm: (done: () => void) => void;
};

/** A revoke button that asks once more and says what revoking does. */
export function ConfirmRevokeButton({ name, consequence, pending, error, onConfirm }: ConfirmRevokeButtonProps) {
  const [confirming, setConfirming] = useState(false);
  if (!confirming) {
    return (
      <Button variant="danger" onClick={() => setConfirming(true)} aria-label={`Revoke ${name}`}>
        Revoke
      </Button>
    );
  }
  return (
    <div className="space-y-1">
      <p className="text-xs">{consequence}</p>
      <div className="flex gap-2">
        <Button variant="danger" disabled={pending} onClick={() => onConfirm(() => setConfirming(false))}>
          Confirm revoke
        </Button>
        <Button variant="quiet" onClick={() => setConfirming(false)}>
          Keep it
        </Button>
      </div>
      {error ? (
        <p role="alert" className="text-xs text-diverged">
          {describeError(error).explanation}
        </p>
      ) : null}
    </div>
  );
}
