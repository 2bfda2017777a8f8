import { useQuery } from '@tanstack/react-query';
import { useParams, useSearchParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/page-loading';
import { loopQueryOptions } from '../../../features/loops/api/get-loop';
import { modelVersionQueryOptions } from '../../../features/models/api/get-model-version';
import { NewVersionForm } from '../../../features/models/components/editor/new-version-form';

export function NewVersionPage() {
  const loopId = useParams().loopId ?? '';
  const fromId = useSearchParams()[0].get('from');
  const loop = useQuery(loopQueryOptions(loopId));
  const from = useQuery({ ...modelVersionQueryOptions(fromId ?? ''), enabled: fromId !== null });
  const failed = loop.error ?? from.error;
  const ready = loop.data && (fromId === null || from.data);

  return (
    <div>
      <PageHeader
        title={loop.data ? `New model version for ${loop.data.tag}` : 'New model version'}
        description={
          from.data
            ? `Starting from version ${from.data.number}. Submitted versions never change; saving makes a new draft.`
            : 'Enter the sampled model x(k+1) = A x(k) + B u(k), y(k) = C x(k) + D u(k) around the operating point, or a continuous one.'
        }
      />
      {failed ? (
        <ErrorNotice error={failed} onRetry={() => void Promise.all([loop.refetch(), from.refetch()])} />
      ) : null}
      {ready && loop.data ? <NewVersionForm loop={loop.data} from={from.data} /> : failed ? null : <PageLoading />}
    </div>
  );
}
