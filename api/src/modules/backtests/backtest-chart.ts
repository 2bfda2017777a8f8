import type { z } from 'zod';
import { BACKTEST_LIMITS, type BacktestChartSchema } from '../../contracts/backtests.js';
import { slotTimeMs } from '../readings/sample-grid.js';

export type BacktestChart = z.infer<typeof BacktestChartSchema>;

/** A recording (N slots) and each version's predictions over it, all N×p row-major; NaN: no value. */
export interface ChartInput {
  /** Slot numbers, strictly increasing; slot k sits at k·T after the epoch. */
  k: Float64Array;
  samplePeriodS: number;
  measured: Float64Array;
  outputs: number;
  predictions: { versionId: string; oneStep: Float64Array; freeRun: Float64Array }[];
}

/** Index ranges [start, end) of the recording drawn as one bucket. */
interface Bucket {
  start: number;
  end: number;
}

/**
 * The measured-against-predicted chart in at most BACKTEST_LIMITS.chartPoints points. Up to
 * chartPoints/2 slots are drawn one point each. Longer recordings are cut into chartPoints/2 equal
 * spans of slots (a span the recording skips draws nothing); each span draws two points, at its
 * first and last slot's time, carrying each series' smallest and largest value in the span — so a
 * spike survives decimation — or one point when it holds a single slot. Series are per output.
 */
export function decimateChart(input: ChartInput): BacktestChart {
  checkInput(input);
  const { k, samplePeriodS, outputs } = input;
  const buckets = bucketsOf(k, BACKTEST_LIMITS.chartPoints / 2);
  const t: number[] = [];
  for (const { start, end } of buckets) {
    t.push(slotTimeMs(k[start], samplePeriodS));
    if (end - start > 1) t.push(slotTimeMs(k[end - 1], samplePeriodS));
  }
  return {
    t,
    measured: seriesOf(input.measured, outputs, buckets),
    predictions: input.predictions.map((prediction) => ({
      versionId: prediction.versionId,
      oneStep: seriesOf(prediction.oneStep, outputs, buckets),
      freeRun: seriesOf(prediction.freeRun, outputs, buckets),
    })),
  };
}

function checkInput({ k, samplePeriodS, measured, outputs, predictions }: ChartInput): void {
  if (!Number.isInteger(outputs) || outputs < 1)
    throw new RangeError(`decimateChart: outputs must be ≥ 1, got ${outputs}`);
  if (!(samplePeriodS > 0)) throw new RangeError(`decimateChart: samplePeriodS must be > 0, got ${samplePeriodS}`);
  const expected = k.length * outputs;
  const check = (name: string, values: Float64Array) => {
    if (values.length !== expected) {
      throw new RangeError(`decimateChart: ${name} holds ${values.length} values, expected ${k.length}×${outputs}`);
    }
  };
  check('measured', measured);
  for (const p of predictions) {
    check(`the one-step prediction of version ${p.versionId}`, p.oneStep);
    check(`the free-run prediction of version ${p.versionId}`, p.freeRun);
  }
  for (let i = 1; i < k.length; i++) {
    if (!(k[i] > k[i - 1])) throw new RangeError(`decimateChart: k must increase, k[${i}] = ${k[i]} after ${k[i - 1]}`);
  }
}

/** One bucket per slot up to `maxBuckets` slots; beyond, the slots of each of `maxBuckets` equal spans of k. */
function bucketsOf(k: Float64Array, maxBuckets: number): Bucket[] {
  const n = k.length;
  if (n <= maxBuckets) return Array.from({ length: n }, (_, i) => ({ start: i, end: i + 1 }));
  const first = k[0];
  const span = k[n - 1] - first + 1;
  const buckets: Bucket[] = [];
  let start = 0;
  let current = 0;
  for (let i = 0; i < n; i++) {
    const bucket = Math.floor(((k[i] - first) * maxBuckets) / span);
    if (bucket === current) continue;
    buckets.push({ start, end: i });
    start = i;
    current = bucket;
  }
  buckets.push({ start, end: n });
  return buckets;
}

/** Per output: each bucket's min and max (one value for a single-slot bucket); null where nothing is finite. */
function seriesOf(values: Float64Array, outputs: number, buckets: Bucket[]): (number | null)[][] {
  return Array.from({ length: outputs }, (_, o) => {
    const series: (number | null)[] = [];
    for (const { start, end } of buckets) {
      let min = Infinity;
      let max = -Infinity;
      for (let i = start; i < end; i++) {
        const value = values[i * outputs + o];
        if (!Number.isFinite(value)) continue;
        if (value < min) min = value;
        if (value > max) max = value;
      }
      const found = min <= max;
      series.push(found ? min : null);
      if (end - start > 1) series.push(found ? max : null);
    }
    return series;
  });
}
