import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { loopsQueryOptions } from '../../../features/loops/api/get-loops';
import { RegistryTable } from '../../../features/models/components/registry-table';

export function ModelsRegistryPage() {
  const loops = useQuery(loopsQueryOptions());
  return (
    <div>
      <PageHeader
        title="Models"
        description="Every loop with the model version its twin runs and the versions waiting: drafts, and versions in review that need a second engineer."
      />
      {loops.isError ? <ErrorNotice error={loops.error} onRetry={() => void loops.refetch()} /> : null}
      {loops.data?.length === 0 ? (
        <EmptyState title="No loops to model yet">
          <p>
            Model versions belong to loops.{' '}
            <Link to="/loops/new" className="font-medium underline">
              Register a loop
            </Link>{' '}
            first; it then appears here, and “New version” lets you enter, paste or upload its matrices.
          </p>
        </EmptyState>
      ) : loops.isError ? null : (
        <RegistryTable loops={loops.data} />
      )}
    </div>
  );
}
