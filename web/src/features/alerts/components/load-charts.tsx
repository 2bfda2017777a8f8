import type { AlertLoad } from '@shadowloop/api/contracts';
import { useMemo } from 'react';
import { UPlotChart } from '../../../components/charts/uplot-chart';
import { ChartLegend } from '../../twin/components/chart-legend';
import { countChartData, countChartOptions } from '../utils/load-chart';
import { per10MinSeries, perDaySeries, type CountSeries } from '../utils/load-series';

type CountChartProps = { title: string; note: string; series: CountSeries; target: number; timeZone: string };

function CountChart({ title, note, series, target, timeZone }: CountChartProps) {
  const options = useMemo(() => countChartOptions({ yLabel: 'alerts', timeZone }), [timeZone]);
  const data = useMemo(() => countChartData(series, target), [series, target]);
  const legend = useMemo(
    () =>
      [
        { label: 'alerts raised', mark: { colour: '#172026' } },
        { label: `target, ${target}`, mark: 'predicted' },
      ] as const,
    [target],
  );
  return (
    <figure aria-label={title} className="min-w-0 rounded-sm border border-rule bg-panel p-2">
      <figcaption className="mb-1 flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 text-sm">
        <span className="font-bold">{title}</span>
        <ChartLegend items={legend} />
        <span className="w-full text-xs text-ink/75">{note}</span>
      </figcaption>
      <UPlotChart options={options} data={data} height={200} />
    </figure>
  );
}

/** Activations per plant day and per 10 minutes, each against its target line. */
export function LoadCharts({ load, timeZone }: { load: AlertLoad; timeZone: string }) {
  const perDay = useMemo(() => perDaySeries(load), [load]);
  const per10 = useMemo(() => per10MinSeries(load), [load]);
  const daysOver = load.perDay.filter((d) => d.count > load.targets.perDay).length;
  return (
    <div className="grid gap-3 xl:grid-cols-2">
      <CountChart
        title="Alerts per day (UTC days)"
        note={`${daysOver} of ${load.perDay.length} days over the target of ${load.targets.perDay} a day.`}
        series={perDay}
        target={load.targets.perDay}
        timeZone={timeZone}
      />
      <CountChart
        title="Alerts per 10 minutes"
        note={`${Math.round(load.windowsOverTargetPercent * 10) / 10} % of 10-minute windows over the target of ${load.targets.per10Min}.`}
        series={per10}
        target={load.targets.per10Min}
        timeZone={timeZone}
      />
    </div>
  );
}
