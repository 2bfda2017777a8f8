import uPlot from 'uplot';
import { formatNumber } from '../../../lib/format-number';
import { formatAxisTime } from '../../../lib/plant-time';
import { INK, TWIN } from '../../twin/utils/trend-chart-options';
import type { CountSeries } from './load-series';

type ChartOptions = Omit<uPlot.Options, 'width' | 'height'>;

const AXIS = {
  stroke: INK,
  grid: { stroke: '#d5d9d2', width: 1 },
  ticks: { stroke: '#d5d9d2', width: 1 },
  font: '12px "Roboto Condensed", sans-serif',
  labelFont: '500 12px "Roboto Condensed", sans-serif',
};

/** Counts as bars (uPlot's bar paths; a plain line where they are missing) and the target as a dashed line. */
export function countChartOptions(spec: { yLabel: string; timeZone: string }): ChartOptions {
  const bars = uPlot.paths?.bars?.({ size: [0.8, 40], align: 1 });
  return {
    tzDate: (seconds) => uPlot.tzDate(new Date(seconds * 1000), spec.timeZone),
    scales: { x: { time: true }, y: { range: (_u, _min, max) => [0, Math.max(1, max * 1.1)] } },
    legend: { show: false },
    cursor: { drag: { x: false, y: false } },
    axes: [
      {
        ...AXIS,
        space: 70,
        label: `plant time (${spec.timeZone})`,
        values: (u, splits) => {
          const spanMs = ((u.scales.x.max ?? 0) - (u.scales.x.min ?? 0)) * 1000;
          return splits.map((s) => formatAxisTime(s * 1000, spec.timeZone, spanMs));
        },
      },
      { ...AXIS, label: spec.yLabel, size: 50, values: (_u, splits) => splits.map((s) => formatNumber(s, 3)) },
    ],
    series: [
      {},
      { label: 'alerts', stroke: INK, fill: 'rgba(23, 32, 38, 0.55)', width: 1, paths: bars, points: { show: false } },
      { label: 'target', stroke: TWIN, width: 1.5, dash: [6, 4], points: { show: false } },
    ],
  };
}

export function countChartData(series: CountSeries, target: number): uPlot.AlignedData {
  return [series.x, series.counts, series.x.map(() => target)];
}
