import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { UPlotChart } from '../../../components/charts/uplot-chart';
import { ErrorNotice } from '../../../components/errors/error-notice';
import type { Loop } from '../../loops/api/get-loops';
import { ChartLegend } from '../../twin/components/chart-legend';
import type { Series } from '../../twin/api/get-series';
import {
  alertSnapshotQueryOptions,
  raiseSlotOf,
  SNAPSHOT_AFTER_SAMPLES,
  SNAPSHOT_BEFORE_SAMPLES,
} from '../api/get-alert-snapshot';
import { snapshotChartOptions, snapshotData } from '../utils/snapshot-chart';

const LEGEND = [
  { label: 'measured', mark: 'measured' },
  { label: 'predicted by the twin', mark: 'predicted' },
] as const;

type OutputChartProps = { series: Series; output: number; loop: Loop; raisedAt: string };

function OutputChart({ series, output, loop, raisedAt }: OutputChartProps) {
  const signal = loop.outputs[output];
  const title = `${signal.name}${signal.unit ? ` (${signal.unit})` : ''}`;
  const options = useMemo(
    () => snapshotChartOptions({ yLabel: title, timeZone: loop.timeZone, raisedAt }),
    [title, loop.timeZone, raisedAt],
  );
  const data = useMemo(() => snapshotData(series, output), [series, output]);
  return (
    <figure aria-label={title} className="min-w-0 rounded-sm border border-rule bg-panel p-2">
      <figcaption className="mb-1 flex flex-wrap items-baseline justify-between gap-x-4 text-sm">
        <span className="font-bold">{title}</span>
        <ChartLegend items={LEGEND} />
      </figcaption>
      <UPlotChart options={options} data={data} height={200} />
    </figure>
  );
}

/** Measured against predicted in the window around the raise, one chart per output. */
export function AlertSnapshot({
  alert,
  loop,
}: {
  alert: { id: string; loopId: string; raisedAt: string; detail?: { slotAt?: string } };
  loop: Loop;
}) {
  const series = useQuery(alertSnapshotQueryOptions(alert, loop.samplePeriodS));
  const windowText = `${SNAPSHOT_BEFORE_SAMPLES} samples before the raise and ${SNAPSHOT_AFTER_SAMPLES} after it, at ${loop.samplePeriodS} s a sample; the ink line marks the raise.`;
  if (series.isError) return <ErrorNotice error={series.error} onRetry={() => void series.refetch()} />;
  if (!series.data)
    return <p className="h-52 animate-pulse rounded-sm bg-rule/40" role="status" aria-label="Loading the snapshot" />;
  if (series.data.t.length === 0) {
    return (
      <p className="text-sm text-ink/75">No readings or predictions are stored for the window around the raise.</p>
    );
  }
  return (
    <div className="space-y-2">
      <p className="text-xs text-ink/75">{windowText}</p>
      <div className={`grid gap-3 ${loop.outputs.length > 1 ? 'xl:grid-cols-2' : ''}`}>
        {loop.outputs.map((_, output) => (
          <OutputChart key={output} series={series.data} output={output} loop={loop} raisedAt={raiseSlotOf(alert)} />
        ))}
      </div>
    </div>
  );
}
