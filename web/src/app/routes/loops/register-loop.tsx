import { useQuery } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/page-loading';
import { useCreateLoop } from '../../../features/loops/api/create-loop';
import { areasQueryOptions } from '../../../features/loops/api/get-areas';
import { LoopForm } from '../../../features/loops/components/loop-form';
import { newLoopValues } from '../../../features/loops/utils/loop-form-values';

export function RegisterLoopPage() {
  const navigate = useNavigate();
  const areas = useQuery(areasQueryOptions());
  const create = useCreateLoop();

  return (
    <div>
      <PageHeader
        title="Register a loop"
        description="Describe the loop as the model will see it: its tag, sample period, and the names and units of its inputs, states and outputs. Model versions are added afterwards under Models."
      />
      {areas.isError ? <ErrorNotice error={areas.error} onRetry={() => void areas.refetch()} /> : null}
      {areas.isPending ? (
        <PageLoading />
      ) : (
        <LoopForm
          initial={newLoopValues()}
          areas={areas.data ?? []}
          submitLabel="Register the loop"
          conflictField="tag"
          onSave={async (body) => {
            const loop = await create.mutateAsync(body);
            await navigate(`/loops/${loop.id}`);
          }}
        />
      )}
    </div>
  );
}
