import uPlot from 'uplot';
import { seriesColour } from '../../../components/charts/chart-theme';
import { formatNumber } from '../../../lib/format-number';
import { formatAxisTime } from '../../../lib/plant-time';
import type { CursorStore } from './cursor-store';
import { predictionMarker } from './prediction-marker';

export const TWIN = '#6d28d9';
export const INK = '#172026';
/** The residual band: the twin colour at 12 % opacity. */
export const BAND_FILL = 'rgba(109, 40, 217, 0.12)';

const AXIS = {
  stroke: INK,
  grid: { stroke: '#d5d9d2', width: 1 },
  ticks: { stroke: '#d5d9d2', width: 1 },
  font: '12px "Roboto Condensed", sans-serif',
  labelFont: '500 12px "Roboto Condensed", sans-serif',
};

/** Ink first, then the shared line colours, skipping the twin colour, which only the model's lines wear. */
export const lineColour = (i: number) => seriesColour(i === 0 ? 0 : i + 1);

export type ChartOptions = Omit<uPlot.Options, 'width' | 'height'>;
export type TrendChartContext = { timeZone: string; syncKey: string; cursor: CursorStore };

const line = (label: string, stroke: string, extra: Partial<uPlot.Series> = {}): uPlot.Series => ({
  label,
  stroke,
  width: 1.75,
  points: { show: false },
  ...extra,
});
const edge = (label: string): uPlot.Series => ({ label, stroke: 'transparent', width: 0, points: { show: false } });

/**
 * A chart over plant time: x in epoch seconds shown in the plant's time zone, y with its label and
 * three significant figures, no legend, no drag zoom. The trend, alert snapshot and alert-load
 * charts build on it.
 */
export function plantTimeChartOptions(spec: {
  timeZone: string;
  yLabel: string;
  ySize?: number;
  series: uPlot.Series[];
}): ChartOptions {
  return {
    tzDate: (seconds) => uPlot.tzDate(new Date(seconds * 1000), spec.timeZone),
    scales: { x: { time: true } },
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
      {
        ...AXIS,
        label: spec.yLabel,
        size: spec.ySize ?? 64,
        values: (_u, splits) => splits.map((s) => formatNumber(s, 3)),
      },
    ],
    series: [{}, ...spec.series],
  };
}

function baseOptions(
  context: TrendChartContext,
  yLabel: string,
  series: uPlot.Series[],
  extra: Partial<ChartOptions> = {},
): ChartOptions {
  return {
    ...plantTimeChartOptions({ timeZone: context.timeZone, yLabel, series }),
    cursor: { sync: { key: context.syncKey }, drag: { x: false, y: false } },
    hooks: {
      setCursor: [
        (u) =>
          context.cursor.set(
            u.cursor.idx === null || u.cursor.idx === undefined ? null : (u.data[0][u.cursor.idx] ?? null),
          ),
      ],
    },
    ...extra,
  };
}

/** Measured (ink), predicted (twin, dashed), the band shaded around the prediction, forecast and move preview. */
export function outputChartOptions(
  context: TrendChartContext,
  yLabel: string,
  forecastStart: () => number | null,
): ChartOptions {
  return baseOptions(
    context,
    yLabel,
    [
      line('measured', INK),
      line('predicted', TWIN, { width: 1.5, dash: [6, 4] }),
      edge('band lower edge'),
      edge('band upper edge'),
      line('forecast (model prediction)', TWIN, { width: 2, dash: [2, 3] }),
      line('move preview (model prediction)', TWIN, { width: 2.5, dash: [10, 4] }),
    ],
    { bands: [{ series: [4, 3], fill: BAND_FILL }], plugins: [predictionMarker(forecastStart)] },
  );
}

export function residualChartOptions(context: TrendChartContext, yLabel: string, names: string[]): ChartOptions {
  const n = names.length;
  return baseOptions(
    context,
    yLabel,
    [...names.map((name, i) => line(name, lineColour(i))), edge('band lower edge'), edge('band upper edge')],
    { bands: [{ series: [n + 2, n + 1], fill: BAND_FILL }] },
  );
}

/** Inputs are not in the live samples: the line runs on from the newest stored value. */
export function inputsChartOptions(context: TrendChartContext, yLabel: string, names: string[]): ChartOptions {
  return baseOptions(
    context,
    yLabel,
    names.map((name, i) => line(name, lineColour(i), { spanGaps: true })),
  );
}
