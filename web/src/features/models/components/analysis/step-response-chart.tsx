import { useMemo } from 'react';
import { timeLineOptions, type LineSpec } from '../../../../components/charts/chart-theme';
import { UPlotChart } from '../../../../components/charts/uplot-chart';

export type StepLine = LineSpec & { values: number[] };

type StepResponseChartProps = { title: string; yLabel: string; t: number[]; lines: StepLine[]; summary: string };

/** One input → output step response; the summary says in words what the chart shows. */
export function StepResponseChart({ title, yLabel, t, lines, summary }: StepResponseChartProps) {
  const key = lines.map((line) => `${line.label}|${line.colour}|${line.dash?.join(',') ?? ''}`).join(';');
  // eslint-disable-next-line react-hooks/exhaustive-deps -- the key holds everything the options use
  const options = useMemo(() => timeLineOptions({ yLabel, lines }), [yLabel, key]);
  const data = useMemo(() => [t, ...lines.map((line) => line.values)] as [number[], ...number[][]], [t, lines]);
  return (
    <figure className="min-w-0 rounded-sm border border-rule bg-panel p-2">
      <figcaption className="mb-1 text-sm">
        <span className="font-bold">{title}</span>
        <span className="block text-ink/80">{summary}</span>
      </figcaption>
      <UPlotChart options={options} data={data} height={200} />
    </figure>
  );
}
