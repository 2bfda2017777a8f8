import { useMemo, useState } from 'react';
import { UPlotChart } from '../../../components/charts/uplot-chart';
import { ChartLegend, type LegendItem } from '../../twin/components/chart-legend';
import type { BacktestChart, OutputFit } from '../types';
import {
  predictionChartData,
  predictionChartOptions,
  predictionLines,
  type ChartVersion,
} from '../utils/prediction-chart';

type OutputChartProps = {
  chart: BacktestChart;
  output: number;
  signal: Pick<OutputFit, 'name' | 'unit'>;
  versions: ChartVersion[];
  showFreeRun: boolean;
  timeZone: string;
};

function OutputChart({ chart, output, signal, versions, showFreeRun, timeZone }: OutputChartProps) {
  const title = signal.unit ? `${signal.name} (${signal.unit})` : signal.name;
  const lines = useMemo(() => predictionLines(versions, showFreeRun), [versions, showFreeRun]);
  const options = useMemo(() => predictionChartOptions({ timeZone, yLabel: title, lines }), [timeZone, title, lines]);
  const data = useMemo(
    () => predictionChartData(chart, output, versions, showFreeRun),
    [chart, output, versions, showFreeRun],
  );
  const legend: LegendItem[] = [
    { label: 'measured', mark: 'measured' },
    ...lines.map((line) => ({ label: line.label, mark: { colour: line.colour } })),
  ];
  return (
    <figure aria-label={title} className="min-w-0 rounded-sm border border-rule bg-panel p-2">
      <figcaption className="mb-1 flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 text-sm">
        <span className="font-bold">{title}</span>
        <ChartLegend items={legend} />
      </figcaption>
      <UPlotChart options={options} data={data} height={220} />
    </figure>
  );
}

type PredictionChartsProps = {
  chart: BacktestChart;
  outputs: Pick<OutputFit, 'name' | 'unit'>[];
  versions: ChartVersion[];
  timeZone: string;
};

/** Measured against each version's one-step prediction over the range, one chart per output; the free runs on request. */
export function PredictionCharts({ chart, outputs, versions, timeZone }: PredictionChartsProps) {
  const [showFreeRun, setShowFreeRun] = useState(false);
  return (
    <section aria-label="Measured against predicted" className="space-y-2">
      <div className="flex flex-wrap items-baseline justify-between gap-3 border-b border-rule pb-1">
        <h2 className="text-lg font-bold">Measured against predicted</h2>
        <label className="inline-flex items-center gap-1.5 text-sm">
          <input type="checkbox" checked={showFreeRun} onChange={(e) => setShowFreeRun(e.target.checked)} />
          Show the free runs
        </label>
      </div>
      <p className="text-xs text-ink/75">
        On the plant&apos;s clock ({timeZone}). Over long ranges each point pair is the smallest and largest value in
        its stretch of samples, so short spikes stay visible.
      </p>
      <div className={`grid gap-3 ${outputs.length > 1 ? 'xl:grid-cols-2' : ''}`}>
        {outputs.map((signal, output) => (
          <OutputChart
            key={signal.name}
            chart={chart}
            output={output}
            signal={signal}
            versions={versions}
            showFreeRun={showFreeRun}
            timeZone={timeZone}
          />
        ))}
      </div>
    </section>
  );
}
