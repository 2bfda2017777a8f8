import uPlot from 'uplot';
import { timeLineOptions } from '../../../components/charts/chart-theme';
import { INK, TWIN, type ChartOptions } from '../../twin/utils/trend-chart-options';
import type { Autocorrelation } from '../types';

/**
 * r(τ) for τ = 1 … maxLag as bars, and the whiteness band ±b as dashed lines. r(0) = 1 by definition
 * and would flatten the rest, so it is left out. The axes keep the shared chart look.
 */
export function autocorrelationOptions(): ChartOptions {
  const bars = uPlot.paths?.bars?.({ size: [0.5, 12] });
  const base = timeLineOptions({
    yLabel: 'r(τ)',
    lines: [
      { label: 'r(τ)', colour: INK, fill: 'rgba(23, 32, 38, 0.55)' },
      { label: 'band +', colour: TWIN, dash: [6, 4], width: 1.5 },
      { label: 'band −', colour: TWIN, dash: [6, 4], width: 1.5 },
    ],
  });
  const [lagAxis, valueAxis] = base.axes ?? [];
  return {
    ...base,
    legend: { show: false },
    series: base.series.map((s, i) => (i === 1 ? { ...s, paths: bars } : s)),
    axes: [
      { ...lagAxis, label: 'lag τ (samples)', incrs: [1, 2, 5, 10], values: (_u, splits) => splits.map(String) },
      valueAxis,
    ],
    scales: {
      x: { time: false, range: (_u, min, max) => [min - 0.5, max + 0.5] },
      y: { range: (_u, min, max) => [Math.min(min, 0) * 1.1, Math.max(max, 0) * 1.1] },
    },
  };
}

export function autocorrelationData(autocorrelation: Autocorrelation): uPlot.AlignedData {
  const lags = autocorrelation.correlation.slice(1).map((_, i) => i + 1);
  return [
    lags,
    autocorrelation.correlation.slice(1),
    lags.map(() => autocorrelation.band),
    lags.map(() => -autocorrelation.band),
  ];
}
