import { SkeletonRows, Table, Td, Th } from '../../../components/ui/table';
import { usePlantTimestamp } from '../../alerts/hooks/use-plant-time-zone';
import type { AuditEntry } from '../api/get-audit-log';
import { describeTarget } from '../utils/describe-target';

function DetailsCell({ details }: { details: unknown }) {
  if (details === null || details === undefined) return <span className="text-ink/60">—</span>;
  const text = typeof details === 'string' ? details : JSON.stringify(details);
  return (
    <code className="block max-w-md truncate text-xs" title={text}>
      {text}
    </code>
  );
}

type AuditLogTableProps = {
  entries: AuditEntry[] | undefined;
  loading: boolean;
  filtered: boolean;
};

export function AuditLogTable({ entries, loading, filtered }: AuditLogTableProps) {
  const formatTimestamp = usePlantTimestamp();
  return (
    <Table caption="Audit log entries, newest first">
      <thead>
        <tr>
          <Th>When</Th>
          <Th>Who</Th>
          <Th>Action</Th>
          <Th>Target</Th>
          <Th>Details</Th>
        </tr>
      </thead>
      <tbody>
        {loading ? <SkeletonRows columns={5} rows={8} /> : null}
        {entries?.length === 0 ? (
          <tr>
            <Td colSpan={5} className="py-4 text-ink/75">
              {filtered
                ? 'No entries with this action. Check the spelling or show all actions.'
                : 'Nothing has been audited yet. Changes such as role edits and access tokens will be recorded here.'}
            </Td>
          </tr>
        ) : null}
        {entries?.map((entry) => (
          <tr key={entry.id}>
            <Td className="whitespace-nowrap tabular-nums">{formatTimestamp(entry.at)}</Td>
            <Td>{entry.actorEmail ?? 'system'}</Td>
            <Td>
              <code className="text-xs">{entry.action}</code>
            </Td>
            <Td title={entry.target ?? undefined}>{describeTarget(entry)}</Td>
            <Td>
              <DetailsCell details={entry.details} />
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
