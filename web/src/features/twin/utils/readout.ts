import { rowAtOrBefore } from './cursor-store';
import type { AlignedRows, TrendOverlays } from './live-trend';
import { column, type TrendLayout } from './trend-layout';

export type OutputReadout = {
  measured: number | null;
  predicted: number | null;
  residual: number | null;
  forecast: number | null;
  preview: number | null;
};

export type Readout = { t: number; outputs: OutputReadout[]; inputs: (number | null)[] };

function overlayAt(overlay: TrendOverlays['forecast'], output: number, t: number): number | null {
  if (!overlay) return null;
  const i = overlay.t.indexOf(t);
  return i < 0 ? null : (overlay.y[output]?.[i] ?? null);
}

/** The newest non-empty value at or before row `i` (inputs are carried on between readings). */
function carried(values: readonly (number | null)[], i: number): number | null {
  for (let j = i; j >= 0; j--) if (values[j] !== null) return values[j];
  return null;
}

/**
 * The values at time `t` (seconds; null: the newest row): the stored row at or before it, or in
 * the forecast's reach the model's trajectories alone.
 */
export function readoutAt(
  rows: AlignedRows,
  layout: TrendLayout,
  overlays: TrendOverlays,
  t: number | null,
): Readout | null {
  const [times, ...columns] = rows;
  const newest = times.length - 1;
  const ahead = [...(overlays.forecast?.t ?? []), ...(overlays.preview?.t ?? [])];
  const at = t ?? (newest >= 0 ? times[newest] : null);
  if (at === null) return null;
  const i = rowAtOrBefore(times, at);
  const inForecast = i === newest && at > times[newest] && ahead.includes(at);
  const fromRow = (c: number) => (i < 0 || inForecast ? null : columns[c][i]);
  return {
    t: at,
    outputs: Array.from({ length: layout.outputs }, (_, o) => ({
      measured: fromRow(column.measured(layout, o)),
      predicted: fromRow(column.predicted(layout, o)),
      residual: fromRow(column.residual(layout, o)),
      forecast: overlayAt(overlays.forecast, o, at),
      preview: overlayAt(overlays.preview, o, at),
    })),
    inputs: Array.from({ length: layout.inputs }, (_, u) =>
      i < 0 ? null : carried(columns[column.input(layout, u)], i),
    ),
  };
}
