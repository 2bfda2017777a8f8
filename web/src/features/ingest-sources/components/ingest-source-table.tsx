import { useQuery } from '@tanstack/react-query';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { SkeletonRows, Table, Td, Th } from '../../../components/ui/table';
import { usePlantTimestamp } from '../../alerts/hooks/use-plant-time-zone';
import { ingestSourcesQueryOptions, type IngestSource } from '../api/get-ingest-sources';
import { EditSourceLoops } from './edit-source-loops';
import { RevokeSourceButton } from './revoke-source-button';

const HEADINGS = ['Name', 'Loops', 'Token starts with', 'Created', 'Last used', 'State', 'Actions'];

function SourceRow({ source }: { source: IngestSource }) {
  const formatTimestamp = usePlantTimestamp();
  return (
    <tr className={source.revokedAt ? 'text-ink/60' : undefined}>
      <Td>
        <span className="font-medium">{source.name}</span>
        {source.description ? <span className="block text-xs text-ink/75">{source.description}</span> : null}
      </Td>
      <Td>
        {source.loops.length ? (
          source.loops.map((l) => l.tag).join(', ')
        ) : (
          <span className="text-ink/70">none yet</span>
        )}
      </Td>
      <Td>
        <code>{source.prefix}…</code>
      </Td>
      <Td className="tabular-nums">{formatTimestamp(source.createdAt)}</Td>
      <Td className="tabular-nums">{source.lastUsedAt ? formatTimestamp(source.lastUsedAt) : 'never'}</Td>
      <Td>{source.revokedAt ? `Revoked ${formatTimestamp(source.revokedAt)}` : 'Active'}</Td>
      <Td>
        <div className="flex flex-wrap gap-2">
          <EditSourceLoops source={source} />
          <RevokeSourceButton source={source} />
        </div>
      </Td>
    </tr>
  );
}

export function IngestSourceTable() {
  const sources = useQuery(ingestSourcesQueryOptions());
  if (sources.isError) return <ErrorNotice error={sources.error} onRetry={() => void sources.refetch()} />;
  return (
    <Table caption="Ingest sources">
      <thead>
        <tr>
          {HEADINGS.map((heading) => (
            <Th key={heading}>{heading}</Th>
          ))}
        </tr>
      </thead>
      <tbody>
        {sources.isPending ? <SkeletonRows columns={HEADINGS.length} /> : null}
        {sources.data?.length === 0 ? (
          <tr>
            <Td colSpan={HEADINGS.length} className="py-4 text-ink/75">
              No ingest sources yet. Create one below for each plant bridge or historian connector that posts readings.
            </Td>
          </tr>
        ) : null}
        {sources.data?.map((source) => (
          <SourceRow key={source.id} source={source} />
        ))}
      </tbody>
    </Table>
  );
}
