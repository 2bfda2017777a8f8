import { useQuery } from '@tanstack/react-query';
import { Link, useParams, useSearchParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/page-loading';
import { loopQueryOptions } from '../../../features/loops/api/get-loop';
import { loopVersionsQueryOptions } from '../../../features/models/api/get-loop-versions';
import { modelVersionQueryOptions } from '../../../features/models/api/get-model-version';
import { CompareView } from '../../../features/models/components/compare/compare-view';
import { OtherVersionPicker } from '../../../features/models/components/compare/other-version-picker';

export function CompareVersionsPage() {
  const versionId = useParams().versionId ?? '';
  const [searchParams, setSearchParams] = useSearchParams();
  const version = useQuery(modelVersionQueryOptions(versionId));
  const loopId = version.data?.loopId ?? '';
  const loop = useQuery({ ...loopQueryOptions(loopId), enabled: loopId !== '' });
  const versions = useQuery({ ...loopVersionsQueryOptions(loopId), enabled: loopId !== '' });
  const fallback = [loop.data?.activeVersionId, ...(versions.data ?? []).map((v) => v.id)].find(
    (id) => id && id !== versionId,
  );
  const otherId = searchParams.get('with') ?? fallback ?? null;
  const other = useQuery({ ...modelVersionQueryOptions(otherId ?? ''), enabled: otherId !== null });
  const failed = version.error ?? loop.error ?? versions.error ?? other.error;

  const title =
    version.data && other.data
      ? `Version ${version.data.number} compared with version ${other.data.number}`
      : 'Compare two model versions';
  return (
    <div className="space-y-4">
      <PageHeader
        title={loop.data ? `${loop.data.tag}: ${title}` : title}
        description={
          version.data ? (
            <Link to={`/models/versions/${version.data.id}`} className="underline">
              Back to the analysis of version {version.data.number}
            </Link>
          ) : undefined
        }
      />
      {failed ? (
        <ErrorNotice error={failed} onRetry={() => void Promise.all([version.refetch(), other.refetch()])} />
      ) : null}
      {versions.data && version.data ? (
        <OtherVersionPicker
          versions={versions.data}
          thisId={version.data.id}
          otherId={otherId}
          onPick={(id) => setSearchParams({ with: id })}
        />
      ) : null}
      {version.data && versions.data && otherId === null ? (
        <EmptyState title="Nothing to compare with yet">
          <p>
            This is the loop&apos;s only model version. Once there is another version, its matrices, eigenvalues and
            step responses will be set beside this one here.
          </p>
        </EmptyState>
      ) : version.data && other.data && loop.data ? (
        <CompareView version={version.data} other={other.data} loop={loop.data} />
      ) : failed ? null : (
        <PageLoading />
      )}
    </div>
  );
}
