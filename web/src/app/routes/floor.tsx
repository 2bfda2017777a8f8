import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router';
import { ErrorNotice } from '../../components/errors/error-notice';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { PageLoading } from '../../components/ui/page-loading';
import { FloorControls } from '../../features/floor/components/floor-controls';
import { FloorGrid } from '../../features/floor/components/floor-grid';
import { useFloorLoops } from '../../features/floor/hooks/use-floor-loops';
import { readFloorSearch, writeFloorSearch } from '../../features/floor/utils/floor-search';
import { filterTiles, groupByArea, sortTiles, statusCounts } from '../../features/floor/utils/tile-order';
import { areasQueryOptions } from '../../features/loops/api/get-areas';
import { TRACKING_STATUS_WORDS } from '../../features/loops/components/tracking-status-word';
import { useNow } from '../../lib/use-now';

function NoLoopsYet() {
  return (
    <EmptyState title="No loops on the floor yet">
      <p>
        Each registered loop will appear here as a tile once a control engineer registers it and activates a model
        version.
      </p>
      <p>
        A tile will show the loop&apos;s tag and name, its tracking status in words and colour, a short trend of the
        main output measured against the twin&apos;s prediction, and how recently the last reading arrived.
      </p>
    </EmptyState>
  );
}

export function FloorPage() {
  const { loops: list, error, refetch } = useFloorLoops();
  const areas = useQuery(areasQueryOptions());
  const [params, setParams] = useSearchParams();
  const { filter, order } = readFloorSearch(params);
  const now = useNow(1000);

  let body;
  if (error) body = <ErrorNotice error={error} onRetry={refetch} />;
  else if (!list) body = <PageLoading />;
  else if (list.length === 0) body = <NoLoopsYet />;
  else {
    const shown = sortTiles(filterTiles(list, filter), order);
    body = (
      <div className="space-y-4">
        <FloorControls
          filter={filter}
          order={order}
          counts={statusCounts(list)}
          total={list.length}
          onChange={(next) => setParams(writeFloorSearch(next), { replace: true })}
        />
        {shown.length ? (
          <FloorGrid groups={groupByArea(shown, areas.data ?? [])} now={now} />
        ) : (
          <p className="text-sm">
            No loop is {filter === 'all' ? 'here' : TRACKING_STATUS_WORDS[filter]} right now. Choose “Every status” to
            see them all.
          </p>
        )}
      </div>
    );
  }
  return (
    <div>
      <PageHeader
        title="Floor"
        description="Every loop at a glance: tracking status, measured against predicted, and how much of the residual band is used."
      />
      {body}
    </div>
  );
}
