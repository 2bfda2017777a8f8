import uPlot from 'uplot';
import { INK, plantTimeChartOptions, TWIN, type ChartOptions } from '../../twin/utils/trend-chart-options';
import type { CountSeries } from './load-series';

/** Counts as bars (uPlot's bar paths; a plain line where they are missing) and the target as a dashed line. */
export function countChartOptions(spec: { yLabel: string; timeZone: string }): ChartOptions {
  const bars = uPlot.paths?.bars?.({ size: [0.8, 40], align: 1 });
  const options = plantTimeChartOptions({
    timeZone: spec.timeZone,
    yLabel: spec.yLabel,
    ySize: 50,
    series: [
      { label: 'alerts', stroke: INK, fill: 'rgba(23, 32, 38, 0.55)', width: 1, paths: bars, points: { show: false } },
      { label: 'target', stroke: TWIN, width: 1.5, dash: [6, 4], points: { show: false } },
    ],
  });
  return { ...options, scales: { x: { time: true }, y: { range: (_u, _min, max) => [0, Math.max(1, max * 1.1)] } } };
}

export function countChartData(series: CountSeries, target: number): uPlot.AlignedData {
  return [series.x, series.counts, series.x.map(() => target)];
}
