import { Link } from 'react-router';
import { SkeletonRows, Table, Td, Th } from '../../../components/ui/table';
import { formatInTimeZone } from '../../../lib/format-time';
import type { Version } from '../types';
import { VersionStatusWord } from './version-status-word';

const COLUMNS = 6;
const STABILITY_WORDS = { stable: 'stable', marginal: 'marginal', unstable: 'unstable' } as const;

type VersionListProps = { versions: Version[] | undefined; timeZone: string };

/** A loop's versions, newest first, with their status in words and colour. */
export function VersionList({ versions, timeZone }: VersionListProps) {
  return (
    <Table caption="Model versions, newest first">
      <thead>
        <tr>
          <Th>Version</Th>
          <Th>Status</Th>
          <Th>Model</Th>
          <Th>Written by</Th>
          <Th>Reviewed by</Th>
          <Th>What changed</Th>
        </tr>
      </thead>
      <tbody>
        {versions === undefined ? <SkeletonRows columns={COLUMNS} rows={3} /> : null}
        {versions?.map((version) => (
          <tr key={version.id} className="hover:bg-paper">
            <Td>
              <Link to={`/models/versions/${version.id}`} className="font-bold tabular-nums hover:underline">
                Version {version.number}
              </Link>
            </Td>
            <Td>
              <VersionStatusWord status={version.status} />
            </Td>
            <Td>
              {STABILITY_WORDS[version.analysis.stability]}, {version.A.length} states
              {version.continuous ? ', from a continuous model' : ''}
            </Td>
            <Td>
              {version.author?.name ?? '—'}
              <div className="text-xs text-ink/70 tabular-nums">{formatInTimeZone(version.createdAt, timeZone)}</div>
            </Td>
            <Td>{version.reviewer?.name ?? <span className="text-ink/60">not yet</span>}</Td>
            <Td className="max-w-md">
              <span className="line-clamp-2">{version.changeNote}</span>
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
