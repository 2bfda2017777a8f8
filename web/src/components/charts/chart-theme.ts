import type uPlot from 'uplot';
import { formatDuration, formatNumber } from '../../lib/format-number';

/** Line colours of our own, kept apart from the status colours so a line never reads as a status. */
export const SERIES_COLOURS = ['#172026', '#6d28d9', '#0f766e', '#1d4ed8', '#9d174d', '#475569', '#7c2d12'];

export function seriesColour(index: number): string {
  return SERIES_COLOURS[index % SERIES_COLOURS.length];
}

/** Time ticks at round durations: seconds, minutes, hours, days. */
const TIME_INCREMENTS = [
  0.1, 0.2, 0.5, 1, 2, 5, 10, 15, 20, 30, 60, 120, 300, 600, 900, 1200, 1800, 3600, 7200, 10_800, 21_600, 43_200,
  86_400, 172_800, 432_000, 864_000,
];

const AXIS_STYLE = {
  stroke: '#172026',
  grid: { stroke: '#d5d9d2', width: 1 },
  ticks: { stroke: '#d5d9d2', width: 1 },
  font: '12px "Roboto Condensed", sans-serif',
  labelFont: '500 12px "Roboto Condensed", sans-serif',
};

export type LineSpec = { label: string; colour: string; dash?: number[]; width?: number; fill?: string };

/** Options for a chart of lines over time in seconds, its axes labelled with units. */
export function timeLineOptions(spec: {
  yLabel: string;
  lines: LineSpec[];
  bands?: uPlot.Band[];
}): Omit<uPlot.Options, 'width' | 'height'> {
  return {
    scales: { x: { time: false } },
    legend: { show: true, live: false },
    cursor: { drag: { x: false, y: false } },
    axes: [
      {
        ...AXIS_STYLE,
        label: 'time',
        incrs: TIME_INCREMENTS,
        values: (_u, splits) => splits.map((s) => (s === 0 ? '0' : formatDuration(s))),
      },
      { ...AXIS_STYLE, label: spec.yLabel, size: 60, values: (_u, splits) => splits.map((s) => formatNumber(s, 3)) },
    ],
    series: [
      { label: 'time' },
      ...spec.lines.map((line) => ({
        label: line.label,
        stroke: line.colour,
        width: line.width ?? 1.75,
        dash: line.dash,
        fill: line.fill,
        points: { show: false },
      })),
    ],
    bands: spec.bands,
  };
}
