import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { PageHeader } from '../../../components/ui/page-header';
import { PageLoading } from '../../../components/ui/page-loading';
import { isUnfinished } from '../../../features/backtests/api/backtest-keys';
import { backtestQueryOptions } from '../../../features/backtests/api/get-backtest';
import { BacktestOutcome } from '../../../features/backtests/components/backtest-outcome';
import { BacktestProgress } from '../../../features/backtests/components/backtest-progress';
import { BacktestResultsView } from '../../../features/backtests/components/backtest-results';
import { BacktestStatusWord } from '../../../features/backtests/components/backtest-status-word';
import { UploadTally } from '../../../features/backtests/components/upload-tally';
import { sourceText, versionNumbersText } from '../../../features/backtests/utils/backtest-words';
import { loopQueryOptions } from '../../../features/loops/api/get-loop';
import { hasRole } from '../../../features/session/roles';
import { useSignedInUser } from '../../../features/session/use-signed-in-user';
import { formatInTimeZone } from '../../../lib/format-time';

export function BacktestPage() {
  const backtestId = useParams().backtestId ?? '';
  const user = useSignedInUser();
  const backtest = useQuery(backtestQueryOptions(backtestId));
  const loop = useQuery({ ...loopQueryOptions(backtest.data?.loopId ?? ''), enabled: Boolean(backtest.data) });
  const failed = backtest.error ?? loop.error;
  const isEngineer = hasRole(user, 'engineer');

  if (failed) {
    return (
      <div>
        <PageHeader title="Backtest" />
        <ErrorNotice error={failed} onRetry={() => void Promise.all([backtest.refetch(), loop.refetch()])} />
      </div>
    );
  }
  if (!backtest.data || !loop.data) return <PageLoading />;
  const b = backtest.data;
  const timeZone = loop.data.timeZone;
  return (
    <div className="space-y-5">
      <PageHeader
        title={`Backtest · ${b.loopTag} · ${sourceText(b, timeZone)}`}
        description={
          <span className="flex flex-wrap items-center gap-x-3">
            <BacktestStatusWord status={b.status} />
            <span>
              {versionNumbersText(b.versions.map((v) => v.number))}, started by {b.createdBy?.name ?? 'someone'}{' '}
              {formatInTimeZone(b.createdAt, timeZone)}
            </span>
          </span>
        }
        actions={
          <Link to={`/loops/${b.loopId}/backtests`} className="text-sm underline">
            Backtests of {b.loopTag}
          </Link>
        }
      />
      {isUnfinished(b.status) ? (
        <section aria-label="Progress" className="max-w-2xl rounded-sm border border-rule bg-panel px-4 py-3">
          <BacktestProgress backtest={b} mayCancel={isEngineer} />
        </section>
      ) : null}
      <BacktestOutcome backtest={b} loopTag={b.loopTag} />
      {b.upload ? <UploadTally tally={b.upload} /> : null}
      {b.status === 'succeeded' && b.results ? (
        <BacktestResultsView
          backtest={b}
          results={b.results}
          timeZone={timeZone}
          mayAttachAs={isEngineer ? (user?.id ?? null) : null}
        />
      ) : null}
    </div>
  );
}
