import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { loopQueryOptions } from '../../../features/loops/api/get-loop';
import { LoopFacts } from '../../../features/loops/components/loop-facts';
import { loopVersionsQueryOptions } from '../../../features/models/api/get-loop-versions';
import { VersionList } from '../../../features/models/components/version-list';

export function LoopVersionsPage() {
  const loopId = useParams().loopId ?? '';
  const loop = useQuery(loopQueryOptions(loopId));
  const versions = useQuery(loopVersionsQueryOptions(loopId));
  const failed = loop.error ?? versions.error;

  return (
    <div className="space-y-3">
      <PageHeader
        title={loop.data ? `Model versions of ${loop.data.tag}` : 'Model versions'}
        description={loop.data ? <LoopFacts loop={loop.data} /> : undefined}
        actions={
          <>
            <Link to={`/loops/${loopId}/import`} className={buttonClasses('secondary')}>
              Import readings
            </Link>
            <Link to={`/models/${loopId}/new`} className={buttonClasses('primary')}>
              New version
            </Link>
          </>
        }
      />
      {failed ? (
        <ErrorNotice error={failed} onRetry={() => void Promise.all([loop.refetch(), versions.refetch()])} />
      ) : null}
      {versions.data?.length === 0 ? (
        <EmptyState title="No model versions yet">
          <p>
            Add the first version with “New version”: type or paste A and B (and C and D), upload them as files, or give
            a continuous model. It is saved as a draft with its analysis, then goes to a second engineer for review.
          </p>
        </EmptyState>
      ) : failed ? null : (
        <VersionList versions={versions.data} timeZone={loop.data?.timeZone ?? 'UTC'} />
      )}
      {loop.data ? (
        <p className="text-sm">
          <Link to={`/loops/${loopId}`} className="underline">
            Open the loop page of {loop.data.tag}
          </Link>
        </p>
      ) : null}
    </div>
  );
}
