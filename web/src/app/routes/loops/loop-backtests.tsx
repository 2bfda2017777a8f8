import { useQuery } from '@tanstack/react-query';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageLoading } from '../../../components/ui/page-loading';
import { loopBacktestsQueryOptions } from '../../../features/backtests/api/get-loop-backtests';
import { BacktestList } from '../../../features/backtests/components/backtest-list';
import { NewBacktestPanel } from '../../../features/backtests/components/new-backtest-panel';
import { hasRole } from '../../../features/session/roles';
import { useSignedInUser } from '../../../features/session/use-signed-in-user';
import { useLoopOfPage } from './loop-layout';

export function LoopBacktestsTab() {
  const loop = useLoopOfPage();
  const user = useSignedInUser();
  const backtests = useQuery(loopBacktestsQueryOptions(loop.id));
  const isEngineer = hasRole(user, 'engineer');

  return (
    <div className="space-y-4">
      <p className="max-w-4xl text-sm">
        A backtest replays model versions of {loop.tag} over recorded readings and shows how well each explains the
        plant, one sample ahead and in free run, and how many alerts its drift rules would have raised.
        {isEngineer ? ' Attach one to a version as evidence when you submit it for review.' : ''}
      </p>
      {isEngineer ? <NewBacktestPanel loop={loop} /> : null}
      {backtests.isError ? <ErrorNotice error={backtests.error} onRetry={() => void backtests.refetch()} /> : null}
      {!backtests.data && !backtests.isError ? <PageLoading /> : null}
      {backtests.data?.length === 0 ? (
        <EmptyState title="No backtests yet">
          <p>
            Before a new model version goes to review, a backtest gives the evidence: its fit to the plant against the
            active version&apos;s, whether its prediction errors are white, and the alert load its rules would bring the
            on-call engineer.
          </p>
          <p>
            {isEngineer
              ? 'Start one above: tick the versions, then pick a range of stored readings or upload a CSV.'
              : 'Control engineers start backtests; they appear here with their verdicts.'}
          </p>
        </EmptyState>
      ) : null}
      {backtests.data?.length ? (
        <BacktestList backtests={backtests.data} timeZone={loop.timeZone} mayCancel={isEngineer} />
      ) : null}
    </div>
  );
}
