import type uPlot from 'uplot';
import type { AlignedRows } from './live-trend';
import { column, type TrendLayout } from './trend-layout';

/** A model trajectory on the chart's time axis: times in seconds, one array per output. */
export interface Overlay {
  t: number[];
  y: number[][];
}

/** What the charts draw beside the buffer: the residual band per output and the model's trajectories. */
export interface TrendOverlays {
  bands: (number | null)[];
  forecast: Overlay | null;
  preview: Overlay | null;
}

export function overlayOf(trajectory: { t: string[]; y: number[][] }): Overlay {
  return { t: trajectory.t.map((iso) => Date.parse(iso) / 1000), y: trajectory.y };
}

function overlayOnAxis(x: number[], overlay: Overlay | null, output: number): (number | null)[] {
  if (!overlay) return x.map(() => null);
  const byTime = new Map(overlay.t.map((t, i) => [t, overlay.y[output]?.[i] ?? null]));
  return x.map((t) => byTime.get(t) ?? null);
}

/**
 * One output: measured, predicted, the band's lower and upper edge around the prediction, then the
 * forecast and the move preview, on an axis that runs on past the newest row into the forecast.
 */
export function outputChartData(
  rows: AlignedRows,
  layout: TrendLayout,
  output: number,
  band: number | null,
  forecast: Overlay | null,
  preview: Overlay | null,
): uPlot.AlignedData {
  const [t, ...columns] = rows;
  const last = t.length ? t[t.length - 1] : -Infinity;
  const ahead = [...new Set([...(forecast?.t ?? []), ...(preview?.t ?? [])])]
    .filter((s) => s > last)
    .sort((a, b) => a - b);
  const x = t.concat(ahead);
  const pad = (values: (number | null)[]) => values.concat(ahead.map(() => null));
  const predicted = pad(columns[column.predicted(layout, output)]);
  const edge = (sign: number) => predicted.map((v) => (v === null || band === null ? null : v + sign * band));
  return [
    x,
    pad(columns[column.measured(layout, output)]),
    predicted,
    edge(-1),
    edge(1),
    overlayOnAxis(x, forecast, output),
    overlayOnAxis(x, preview, output),
  ];
}

/** Every band known and positive: residuals are then drawn as a percentage of their band. */
export function bandsComplete(bands: readonly (number | null)[], outputs: number): bands is number[] {
  return bands.length === outputs && bands.every((b) => b !== null && b > 0);
}

/** Residuals (as % of band when every band is known, else in the outputs' units), then ±100 % edges. */
export function residualChartData(
  rows: AlignedRows,
  layout: TrendLayout,
  bands: readonly (number | null)[],
): uPlot.AlignedData {
  const [t, ...columns] = rows;
  const normalised = bandsComplete(bands, layout.outputs);
  const lines = Array.from({ length: layout.outputs }, (_, i) => {
    const values = columns[column.residual(layout, i)];
    return normalised ? values.map((v) => (v === null ? null : (100 * v) / bands[i])) : values;
  });
  const limit = (value: number) => t.map(() => (normalised ? value : null));
  return [t, ...lines, limit(-100), limit(100)];
}

export function inputsChartData(rows: AlignedRows, layout: TrendLayout): uPlot.AlignedData {
  const [t, ...columns] = rows;
  return [t, ...Array.from({ length: layout.inputs }, (_, i) => columns[column.input(layout, i)])];
}
