import { useMemo } from 'react';
import { UPlotChart } from '../../../components/charts/uplot-chart';
import { ChartLegend } from '../../twin/components/chart-legend';
import type { OutputFit } from '../types';
import { autocorrelationData, autocorrelationOptions } from '../utils/autocorrelation-chart';
import { whitenessText } from '../utils/backtest-words';

const LEGEND = [
  { label: 'r(τ)', mark: { colour: '#172026' } },
  { label: 'whiteness band ±1.96/√N', mark: 'predicted' },
] as const;

/** The one-step residual's autocorrelation of one output, the verdict in words under it. */
export function AutocorrelationChart({ output }: { output: OutputFit }) {
  const options = useMemo(() => autocorrelationOptions(), []);
  const data = useMemo(
    () => (output.autocorrelation ? autocorrelationData(output.autocorrelation) : null),
    [output.autocorrelation],
  );
  const title = `${output.name}: autocorrelation of the one-step residual`;
  return (
    <figure aria-label={title} className="min-w-0 rounded-sm border border-rule bg-panel p-2">
      <figcaption className="mb-1 flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 text-sm">
        <span className="font-bold">{title}</span>
        <ChartLegend items={LEGEND} />
        <span className="w-full text-xs text-ink/75">
          {whitenessText(output.autocorrelation)}. Lags 1 to{' '}
          {output.autocorrelation ? output.autocorrelation.correlation.length - 1 : '…'}; r(0) = 1 is not drawn.
        </span>
      </figcaption>
      {data ? <UPlotChart options={options} data={data} height={160} /> : null}
    </figure>
  );
}
