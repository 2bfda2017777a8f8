import { ConfirmRevokeButton } from '../../../components/ui/confirm-revoke-button';
import type { IngestSource } from '../api/get-ingest-sources';
import { useRevokeIngestSource } from '../api/revoke-ingest-source';

export function RevokeSourceButton({ source }: { source: IngestSource }) {
  const revoke = useRevokeIngestSource();
  if (source.revokedAt) return null;
  return (
    <ConfirmRevokeButton
      name={source.name}
      consequence="The bridge using this token stops posting readings at once; its loops will go stale."
      pending={revoke.isPending}
      error={revoke.isError ? revoke.error : null}
      onConfirm={(done) => revoke.mutate(source.id, { onSuccess: done })}
    />
  );
}
