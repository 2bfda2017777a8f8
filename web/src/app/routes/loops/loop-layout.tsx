import { useQuery } from '@tanstack/react-query';
import { Link, Outlet, useOutletContext, useParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { buttonClasses } from '../../../components/ui/button';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/page-loading';
import { RouteTabs } from '../../../components/ui/route-tabs';
import { loopQueryOptions } from '../../../features/loops/api/get-loop';
import type { Loop } from '../../../features/loops/api/get-loops';
import { LoopFacts } from '../../../features/loops/components/loop-facts';
import { hasRole } from '../../../features/session/roles';
import { useTrackingStatus } from '../../../features/twin/hooks/use-tracking-status';
import { useSignedInUser } from '../../../features/session/use-signed-in-user';

export function useLoopOfPage(): Loop {
  return useOutletContext<Loop>();
}

export function LoopLayout() {
  const loopId = useParams().loopId ?? '';
  const user = useSignedInUser();
  const loop = useQuery(loopQueryOptions(loopId));
  const status = useTrackingStatus(loop.data);
  const isEngineer = hasRole(user, 'engineer');
  const seesLog = isEngineer || hasRole(user, 'admin');

  if (loop.isError) {
    return (
      <div>
        <PageHeader title="Loop" />
        <ErrorNotice error={loop.error} onRetry={() => void loop.refetch()} />
      </div>
    );
  }
  if (!loop.data) return <PageLoading />;
  const base = `/loops/${loop.data.id}`;
  const tabs = [
    { to: base, label: 'Trend', end: true },
    { to: `${base}/model`, label: 'Twin model' },
    { to: `${base}/alerts`, label: 'Alerts' },
    { to: `${base}/rules`, label: 'Rules' },
    { to: `${base}/backtests`, label: 'Backtests' },
    ...(seesLog ? [{ to: `${base}/log`, label: 'Log' }] : []),
  ];
  return (
    <div className="space-y-4">
      <PageHeader
        title={`${loop.data.tag} · ${loop.data.name}`}
        description={<LoopFacts loop={{ ...loop.data, status: status ?? loop.data.status }} />}
        actions={
          isEngineer ? (
            <>
              <Link to={`/models/${loop.data.id}`} className={buttonClasses('secondary')}>
                Model versions
              </Link>
              <Link to={`${base}/import`} className={buttonClasses('secondary')}>
                Import readings
              </Link>
              <Link to={`${base}/edit`} className={buttonClasses('quiet')}>
                Change the loop
              </Link>
            </>
          ) : null
        }
      />
      <RouteTabs label="Loop pages" tabs={tabs} />
      <Outlet context={loop.data} />
    </div>
  );
}
