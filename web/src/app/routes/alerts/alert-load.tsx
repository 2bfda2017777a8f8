import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { buttonClasses } from '../../../components/ui/button';
import { PageLoading } from '../../../components/ui/page-loading';
import { alertLoadCsvHref, alertLoadQueryOptions, type AlertLoad } from '../../../features/alerts/api/get-alert-load';
import { LoadCharts } from '../../../features/alerts/components/load-charts';
import { LoadRangePicker } from '../../../features/alerts/components/load-range-picker';
import {
  ChatteringTable,
  FloodsTable,
  StaleTable,
  TopLoopsTable,
} from '../../../features/alerts/components/load-tables';
import { usePlantTimeZone } from '../../../features/alerts/hooks/use-plant-time-zone';
import { loadWindow, readLoadRange, writeLoadRange } from '../../../features/alerts/utils/load-range';
import { formatDuration, plural } from '../../../lib/format-number';
import { formatPlantTime } from '../../../lib/plant-time';
import { useNow } from '../../../lib/use-now';

function LoadSummary({ load, timeZone }: { load: AlertLoad; timeZone: string }) {
  const when = (iso: string) => formatPlantTime(Date.parse(iso), timeZone, { date: true, seconds: false });
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-2 rounded-sm border border-rule bg-panel px-4 py-3 text-sm md:grid-cols-4">
      <div>
        <dt className="text-xs font-bold uppercase tracking-wide text-ink/70">Range</dt>
        <dd className="tabular-nums">
          {when(load.from)} to {when(load.to)}
        </dd>
      </div>
      <div>
        <dt className="text-xs font-bold uppercase tracking-wide text-ink/70">Alerts raised</dt>
        <dd className="tabular-nums">{plural(load.total, 'activation')}</dd>
      </div>
      <div>
        <dt className="text-xs font-bold uppercase tracking-wide text-ink/70">Mean time to acknowledge</dt>
        <dd className="tabular-nums">
          {load.meanTimeToAcknowledgeS === null
            ? 'nothing acknowledged yet'
            : formatDuration(load.meanTimeToAcknowledgeS)}
        </dd>
      </div>
      <div>
        <dt className="text-xs font-bold uppercase tracking-wide text-ink/70">Targets</dt>
        <dd className="tabular-nums">
          {load.targets.perDay} a day, {load.targets.per10Min} per 10 min; a flood is over {load.targets.floodPer10Min}{' '}
          in 10 min
        </dd>
      </div>
    </dl>
  );
}

export function AlertLoadPage() {
  const [params, setParams] = useSearchParams();
  const range = readLoadRange(params);
  const nowMs = useNow(60_000);
  const reportWindow = loadWindow(range, Math.floor(nowMs / 60_000) * 60_000);
  const load = useQuery(alertLoadQueryOptions(reportWindow.from, reportWindow.to));
  const timeZone = usePlantTimeZone();

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <LoadRangePicker
          range={range}
          window={reportWindow}
          timeZone={timeZone}
          onChange={(next) => setParams(writeLoadRange(next), { replace: true })}
        />
        <a href={alertLoadCsvHref(reportWindow.from, reportWindow.to)} download className={buttonClasses('secondary')}>
          Download CSV
        </a>
      </div>
      {load.isError ? (
        <ErrorNotice error={load.error} onRetry={() => void load.refetch()} />
      ) : !load.data ? (
        <PageLoading />
      ) : (
        <>
          <LoadSummary load={load.data} timeZone={timeZone} />
          {load.data.total === 0 ? (
            <p className="text-sm text-ink/80">
              No alert was raised in this range. The charts fill as drift rules raise alerts; a calm plant keeps them
              under the target lines.
            </p>
          ) : null}
          <LoadCharts load={load.data} timeZone={timeZone} />
          <div className="grid items-start gap-4 xl:grid-cols-2">
            <TopLoopsTable load={load.data} />
            <FloodsTable load={load.data} timeZone={timeZone} />
            <ChatteringTable load={load.data} />
            <StaleTable load={load.data} timeZone={timeZone} />
          </div>
        </>
      )}
    </div>
  );
}
