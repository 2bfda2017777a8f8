import { describe, expect, it } from 'vitest';
import { BACKTEST_LIMITS, BacktestChartSchema } from '../../../contracts/backtests.js';
import { decimateChart, type ChartInput } from '../backtest-chart.js';

const K0 = 1_700_000_000;
const VERSION = '00000000-0000-4000-8000-000000000004';
const HALF = BACKTEST_LIMITS.chartPoints / 2;

/** Two outputs over slots k; each series a different function of the slot index, NaN where asked. */
function chartInput(
  k: number[],
  samplePeriodS = 1,
  value = (i: number, o: number) => Math.sin(i / 50 + o),
): ChartInput {
  const n = k.length;
  const series = (shift: number) => Float64Array.from({ length: 2 * n }, (_, j) => value(j >> 1, j & 1) + shift);
  return {
    k: Float64Array.from(k),
    samplePeriodS,
    measured: series(0),
    outputs: 2,
    predictions: [{ versionId: VERSION, oneStep: series(0.1), freeRun: series(-0.2) }],
  };
}

const range = (n: number, from = K0) => Array.from({ length: n }, (_, i) => from + i);

/** Finite values of output o of an N×2 series. */
function column(values: Float64Array, o: number): number[] {
  return Array.from(values).filter((v, j) => j % 2 === o && Number.isFinite(v));
}

const largest = (values: number[]) => values.reduce((a, b) => Math.max(a, b), -Infinity);
const smallest = (values: number[]) => values.reduce((a, b) => Math.min(a, b), Infinity);
const strictlyIncreasing = (t: number[]) => t.every((v, i) => i === 0 || v > t[i - 1]);

describe('decimateChart', () => {
  it('draws up to chartPoints/2 slots one point each, at the slot times, NaN as null', () => {
    const input = chartInput(range(HALF), 2.5);
    input.measured[7] = NaN; // slot 3, output 2
    const chart = decimateChart(input);
    expect(chart.t).toEqual(range(HALF).map((k) => k * 2500));
    expect(chart.measured[0]).toEqual(column(input.measured, 0));
    expect(chart.measured[1][3]).toBeNull();
    expect(chart.predictions[0].freeRun[1][4]).toBe(input.predictions[0].freeRun[9]);
    expect(BacktestChartSchema.parse(chart)).toEqual(chart);
  });

  it('a long recording: at most chartPoints points, in time order, keeping every series’ global min and max', () => {
    const n = 604_800;
    // a slow wave with a one-slot spike up and one down, which a plain subsample would miss
    const input = chartInput(
      range(n),
      1,
      (i, o) => Math.sin(i / 9000 + o) + (i === 123_457 ? 5 : i === 400_001 ? -7 : 0),
    );
    const chart = decimateChart(input);
    expect(chart.t.length).toBeLessThanOrEqual(BACKTEST_LIMITS.chartPoints);
    expect(chart.t.length).toBeGreaterThan(BACKTEST_LIMITS.chartPoints - 10);
    expect(strictlyIncreasing(chart.t)).toBe(true);
    expect(chart.t[0]).toBe(K0 * 1000);
    expect(chart.t[chart.t.length - 1]).toBe((K0 + n - 1) * 1000);
    const series: [(number | null)[][], Float64Array][] = [
      [chart.measured, input.measured],
      [chart.predictions[0].oneStep, input.predictions[0].oneStep],
      [chart.predictions[0].freeRun, input.predictions[0].freeRun],
    ];
    for (const [drawn, values] of series) {
      for (const o of [0, 1]) {
        expect(drawn[o]).toHaveLength(chart.t.length);
        const all = column(values, o);
        expect(drawn[o]).not.toContain(null);
        const shown = drawn[o] as number[];
        expect(largest(shown)).toBe(largest(all));
        expect(smallest(shown)).toBe(smallest(all));
      }
    }
  });

  it('each bucket: the min at its first slot and the max at its last (a bucket of a ramp shows its ends)', () => {
    // on an increasing ramp the min of a bucket is its first slot's value and the max its last's
    const n = 10 * HALF + 3;
    const input = chartInput(range(n), 1, (i, o) => i * (o + 1));
    const chart = decimateChart(input);
    const slotOf = (tMs: number) => tMs / 1000 - K0;
    chart.t.forEach((tMs, j) => {
      expect(chart.measured[0][j]).toBe(slotOf(tMs));
      expect(chart.measured[1][j]).toBe(2 * slotOf(tMs));
    });
  });

  it('draws nothing inside a gap of the recording, and null for a bucket with no finite value', () => {
    // 3000 slots, then a gap of 10,000, then 3000 more
    const k = [...range(3000), ...range(3000, K0 + 13_000)];
    const input = chartInput(k);
    for (let j = 0; j < 2 * 40; j++) input.predictions[0].oneStep[j] = NaN; // the first 40 slots
    const chart = decimateChart(input);
    expect(chart.t.every((tMs) => tMs / 1000 < K0 + 3000 || tMs / 1000 >= K0 + 13_000)).toBe(true);
    expect(strictlyIncreasing(chart.t)).toBe(true);
    // the first bucket spans 16 slots (16,000 slots / 1000 buckets): all NaN in the one-step series
    expect(chart.t.slice(0, 2)).toEqual([K0 * 1000, (K0 + 15) * 1000]);
    expect(chart.predictions[0].oneStep[0].slice(0, 2)).toEqual([null, null]);
    expect(chart.measured[0][0]).not.toBeNull();
  });

  it('names what does not fit', () => {
    const input = chartInput(range(10));
    expect(() => decimateChart({ ...input, measured: new Float64Array(19) })).toThrow(
      /measured holds 19 values, expected 10×2/,
    );
    expect(() =>
      decimateChart({ ...input, predictions: [{ ...input.predictions[0], freeRun: new Float64Array(3) }] }),
    ).toThrow(`free-run prediction of version ${VERSION} holds 3 values`);
    expect(() => decimateChart({ ...input, k: Float64Array.from([1, 1, 2, 3, 4, 5, 6, 7, 8, 9]) })).toThrow(
      /k\[1\] = 1 after 1/,
    );
  });
});
