import { useState } from 'react';
import { describeError } from '../../../components/errors/describe-error';
import { Button } from '../../../components/ui/button';
import type { IngestSource } from '../api/get-ingest-sources';
import { useRevokeIngestSource } from '../api/revoke-ingest-source';

export function RevokeSourceButton({ source }: { source: IngestSource }) {
  const [confirming, setConfirming] = useState(false);
  const revoke = useRevokeIngestSource();

  if (source.revokedAt) return null;
  if (!confirming) {
    return (
      <Button variant="danger" onClick={() => setConfirming(true)} aria-label={`Revoke ${source.name}`}>
        Revoke
      </Button>
    );
  }
  return (
    <div className="space-y-1">
      <p className="text-xs">The bridge using this token stops posting readings at once; its loops will go stale.</p>
      <div className="flex gap-2">
        <Button
          variant="danger"
          disabled={revoke.isPending}
          onClick={() => revoke.mutate(source.id, { onSuccess: () => setConfirming(false) })}
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
