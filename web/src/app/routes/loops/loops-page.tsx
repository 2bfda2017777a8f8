import { useQuery } from '@tanstack/react-query';
import { Link, useSearchParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { areasQueryOptions } from '../../../features/loops/api/get-areas';
import { loopsQueryOptions } from '../../../features/loops/api/get-loops';
import { LoopsTable } from '../../../features/loops/components/loops-table';
import { LoopsTableFilters } from '../../../features/loops/components/loops-table-filters';
import { readLoopTableSearch, writeLoopTableSearch } from '../../../features/loops/utils/loop-table-search';
import { hasRole } from '../../../features/session/roles';
import { useSignedInUser } from '../../../features/session/use-signed-in-user';

export function LoopsPage() {
  const user = useSignedInUser();
  const canRegister = hasRole(user, 'engineer');
  const [searchParams, setSearchParams] = useSearchParams();
  const search = readLoopTableSearch(searchParams);
  const loops = useQuery(loopsQueryOptions());
  const areas = useQuery(areasQueryOptions());

  const header = (
    <PageHeader
      title="Loops"
      description="The registered control loops with their area, sample period, signals, tracking status and the model version their twin runs."
      actions={
        canRegister ? (
          <Link to="/loops/new" className={buttonClasses('primary')}>
            Register a loop
          </Link>
        ) : null
      }
    />
  );
  if (loops.isError) {
    return (
      <div>
        {header}
        <ErrorNotice error={loops.error} onRetry={() => void loops.refetch()} />
      </div>
    );
  }
  if (loops.data?.length === 0) {
    return (
      <div>
        {header}
        <EmptyState title="No loops registered yet">
          <p>
            Each control loop appears here once a control engineer registers it with its tag, area, sample period and
            the names and units of its inputs, states and outputs.
          </p>
          <p>
            {canRegister
              ? 'Use “Register a loop” above to add the first one.'
              : 'Ask a control engineer to register the loops of your area.'}
          </p>
        </EmptyState>
      </div>
    );
  }
  return (
    <div className="space-y-3">
      {header}
      <LoopsTableFilters
        areas={areas.data ?? []}
        search={search}
        onChange={(next) => setSearchParams(writeLoopTableSearch(next), { replace: true })}
      />
      <LoopsTable
        loops={loops.data}
        search={search}
        onPage={(page) => setSearchParams(writeLoopTableSearch({ ...search, page }))}
      />
    </div>
  );
}
