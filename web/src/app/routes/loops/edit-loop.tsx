import { useQuery } from '@tanstack/react-query';
import { useNavigate, useParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/page-loading';
import { areasQueryOptions } from '../../../features/loops/api/get-areas';
import { loopQueryOptions } from '../../../features/loops/api/get-loop';
import { useUpdateLoop } from '../../../features/loops/api/update-loop';
import { LoopForm } from '../../../features/loops/components/loop-form';
import { loopValues } from '../../../features/loops/utils/loop-form-values';

export function EditLoopPage() {
  const loopId = useParams().loopId ?? '';
  const navigate = useNavigate();
  const loop = useQuery(loopQueryOptions(loopId));
  const areas = useQuery(areasQueryOptions());
  const update = useUpdateLoop(loopId);
  const failed = loop.error ?? areas.error;

  return (
    <div>
      <PageHeader
        title={loop.data ? `Change loop ${loop.data.tag}` : 'Change a loop'}
        description="Once a loop has model versions, its number of signals and its sample period stay as they are: every stored matrix was made for them."
      />
      {failed ? (
        <ErrorNotice error={failed} onRetry={() => void Promise.all([loop.refetch(), areas.refetch()])} />
      ) : null}
      {loop.data && areas.data ? (
        <LoopForm
          initial={loopValues(loop.data)}
          areas={areas.data}
          submitLabel="Save the changes"
          onSave={async (body) => {
            await update.mutateAsync(body);
            await navigate(`/loops/${loopId}`);
          }}
        />
      ) : failed ? null : (
        <PageLoading />
      )}
    </div>
  );
}
