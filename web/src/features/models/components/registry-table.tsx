import { Link } from 'react-router';
import { SkeletonRows, Table, Td, Th } from '../../../components/ui/table';
import type { Loop } from '../../loops/api/get-loops';

const COLUMNS = 6;

function Count({ value, word }: { value: number; word: string }) {
  return value === 0 ? (
    <span className="text-ink/60">none</span>
  ) : (
    <span className="font-medium tabular-nums">{`${value} ${word}`}</span>
  );
}

/** Every loop with the version its twin runs and what is waiting: drafts and versions in review. */
export function RegistryTable({ loops }: { loops: Loop[] | undefined }) {
  const sorted = loops
    ? [...loops].sort((a, b) => b.inReviewCount - a.inReviewCount || a.tag.localeCompare(b.tag))
    : undefined;
  return (
    <Table caption="Model registry: loops and their model versions">
      <thead>
        <tr>
          <Th>Loop</Th>
          <Th>Area</Th>
          <Th>Active version</Th>
          <Th>Waiting for review</Th>
          <Th>Drafts</Th>
          <Th>
            <span className="sr-only">Actions</span>
          </Th>
        </tr>
      </thead>
      <tbody>
        {sorted === undefined ? <SkeletonRows columns={COLUMNS} rows={5} /> : null}
        {sorted?.map((loop) => (
          <tr key={loop.id} className="hover:bg-paper">
            <Td>
              <Link to={`/models/${loop.id}`} className="font-bold hover:underline">
                {loop.tag}
              </Link>
              <div className="text-ink/75">{loop.name}</div>
            </Td>
            <Td>{loop.areaName}</Td>
            <Td>
              {loop.activeVersionId ? (
                <Link to={`/models/versions/${loop.activeVersionId}`} className="underline tabular-nums">
                  version {loop.activeVersionNumber}
                </Link>
              ) : (
                <span className="text-ink/70">none active</span>
              )}
            </Td>
            <Td>
              <Count value={loop.inReviewCount} word="in review" />
            </Td>
            <Td>
              <Count value={loop.draftCount} word={loop.draftCount === 1 ? 'draft' : 'drafts'} />
            </Td>
            <Td>
              <Link to={`/models/${loop.id}/new`} className="text-sm font-medium underline">
                New version
              </Link>
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
