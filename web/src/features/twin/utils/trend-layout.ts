import type { TwinSample } from '../../../lib/socket';
import type { Series } from '../api/get-series';

/**
 * How a loop's trend sits in the columns of a ring buffer: measured, predicted and residual (one
 * column per output each), then the inputs. Times are in seconds since the epoch, as uPlot wants.
 */
export interface TrendLayout {
  outputs: number;
  inputs: number;
}

export const columnCount = (layout: TrendLayout) => 3 * layout.outputs + layout.inputs;

export const column = {
  measured: (layout: TrendLayout, output: number) => output,
  predicted: (layout: TrendLayout, output: number) => layout.outputs + output,
  residual: (layout: TrendLayout, output: number) => 2 * layout.outputs + output,
  input: (layout: TrendLayout, input: number) => 3 * layout.outputs + input,
};

type Values = readonly (number | null)[] | null | undefined;

/** One point of a trend; a group that is absent or null is unknown (NaN), not zero. */
export interface TrendPoint {
  measured?: Values;
  predicted?: Values;
  residual?: Values;
  inputs?: Values;
}

function place(row: Float64Array, start: number, count: number, values: Values): void {
  for (let i = 0; i < count; i++) {
    const v = values?.[i];
    row[start + i] = v === null || v === undefined ? NaN : v;
  }
}

export function pointRow(
  layout: TrendLayout,
  point: TrendPoint,
  row = new Float64Array(columnCount(layout)),
): Float64Array {
  place(row, column.measured(layout, 0), layout.outputs, point.measured);
  place(row, column.predicted(layout, 0), layout.outputs, point.predicted);
  place(row, column.residual(layout, 0), layout.outputs, point.residual);
  place(row, column.input(layout, 0), layout.inputs, point.inputs);
  return row;
}

/** A twin sample as a trend point: an empty prediction means the twin had none for the slot. */
export function sampleRow(layout: TrendLayout, sample: TwinSample): Float64Array {
  return pointRow(layout, {
    measured: sample.measured,
    predicted: sample.predicted.length ? sample.predicted : null,
    residual: sample.residual,
  });
}

export const secondsOf = (iso: string) => Date.parse(iso) / 1000;

const at = (traces: (number | null)[][], i: number) => traces.map((trace) => trace[i] ?? null);

/** The points of a series answer, one per time, each signal group as an array per signal. */
export function* seriesPoints(series: Series) {
  for (let i = 0; i < series.t.length; i++) {
    const point = {
      measured: at(series.measured, i),
      predicted: at(series.predicted, i),
      residual: at(series.residual, i),
      inputs: at(series.inputs, i),
    };
    yield { ms: Date.parse(series.t[i]), point };
  }
}
