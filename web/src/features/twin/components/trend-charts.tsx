import { useCallback, useMemo } from 'react';
import type { Loop } from '../../loops/api/get-loops';
import { inputsChartData, outputChartData, residualChartData } from '../utils/chart-data';
import type { CursorStore } from '../utils/cursor-store';
import type { LiveTrend } from '../utils/live-trend';
import {
  inputsChartOptions,
  lineColour,
  outputChartOptions,
  residualChartOptions,
  type TrendChartContext,
} from '../utils/trend-chart-options';
import type { LegendItem } from './chart-legend';
import { TrendChart } from './trend-chart';

const withUnit = (signal: { name: string; unit: string }) =>
  signal.unit ? `${signal.name} (${signal.unit})` : signal.name;
const unitsOf = (signals: { unit: string }[]) => [...new Set(signals.map((s) => s.unit).filter(Boolean))].join(', ');

const OUTPUT_LEGEND: LegendItem[] = [
  { label: 'measured', mark: 'measured' },
  { label: 'predicted by the twin', mark: 'predicted' },
  { label: 'residual band', mark: 'band' },
  { label: 'forecast (model prediction)', mark: 'forecast' },
  { label: 'move preview (model prediction)', mark: 'preview' },
];

type TrendChartsProps = {
  loop: Loop;
  trend: LiveTrend;
  cursor: CursorStore;
  showInputs: boolean;
  bandsKnown: boolean;
  /** Which model trajectories are drawn, so the key names only what is on the chart. */
  drawn: { forecast: boolean; preview: boolean };
};

export function TrendCharts({ loop, trend, cursor, showInputs, bandsKnown, drawn }: TrendChartsProps) {
  const outputLegend = OUTPUT_LEGEND.filter((item) =>
    item.mark === 'forecast' ? drawn.forecast : item.mark === 'preview' ? drawn.preview : true,
  );
  const context: TrendChartContext = useMemo(
    () => ({ timeZone: loop.timeZone, syncKey: `trend-${loop.id}`, cursor }),
    [loop.timeZone, loop.id, cursor],
  );
  const forecastStart = useCallback(
    () => trend.overlays.forecast?.t[0] ?? trend.overlays.preview?.t[0] ?? null,
    [trend],
  );
  const residualLabel = bandsKnown ? '% of residual band' : `residual (${unitsOf(loop.outputs) || 'output units'})`;
  const residualOptions = useMemo(
    () =>
      residualChartOptions(
        context,
        residualLabel,
        loop.outputs.map((s) => s.name),
      ),
    [context, residualLabel, loop.outputs],
  );
  const inputsOptions = useMemo(
    () => inputsChartOptions(context, unitsOf(loop.inputs) || 'input', loop.inputs.map(withUnit)),
    [context, loop.inputs],
  );
  const residualDraw = useMemo(
    () => ({
      data: (t: LiveTrend) => residualChartData(t.rows(), t.source.layout, t.overlays.bands),
      xRange: (t: LiveTrend) => t.xRange(),
    }),
    [],
  );
  const inputsDraw = useMemo(
    () => ({
      data: (t: LiveTrend) => inputsChartData(t.rows(), t.source.layout),
      xRange: (t: LiveTrend) => t.xRange(),
    }),
    [],
  );
  const residualLegend = loop.outputs.map((s, i) => ({ label: s.name, mark: { colour: lineColour(i) } }));

  return (
    <div className="space-y-3">
      {loop.outputs.map((signal, i) => (
        <OutputChart
          key={`${i}-${signal.name}`}
          index={i}
          label={withUnit(signal)}
          trend={trend}
          context={context}
          forecastStart={forecastStart}
          legend={outputLegend}
        />
      ))}
      <TrendChart
        title="Residual: measured − predicted"
        note={
          bandsKnown
            ? 'Shaded: inside the residual band (±100 %).'
            : 'The residual band is not known yet: it needs 30 residuals or a configured band.'
        }
        legend={loop.outputs.length > 1 ? residualLegend : []}
        trend={trend}
        options={residualOptions}
        draw={residualDraw}
        height={170}
      />
      {showInputs ? (
        <TrendChart
          title="Inputs"
          note="Inputs come with the stored readings; the newest value is carried on until the next ones are fetched."
          legend={loop.inputs.map((s, i) => ({ label: withUnit(s), mark: { colour: lineColour(i) } }))}
          trend={trend}
          options={inputsOptions}
          draw={inputsDraw}
          height={170}
        />
      ) : null}
    </div>
  );
}

type OutputChartProps = {
  index: number;
  label: string;
  trend: LiveTrend;
  context: TrendChartContext;
  forecastStart: () => number | null;
  legend: LegendItem[];
};

function OutputChart({ index, label, trend, context, forecastStart, legend }: OutputChartProps) {
  const options = useMemo(() => outputChartOptions(context, label, forecastStart), [context, label, forecastStart]);
  const draw = useMemo(
    () => ({
      data: (t: LiveTrend) =>
        outputChartData(
          t.rows(),
          t.source.layout,
          index,
          t.overlays.bands[index] ?? null,
          t.overlays.forecast,
          t.overlays.preview,
        ),
      xRange: (t: LiveTrend) => t.xRange(),
    }),
    [index],
  );
  return <TrendChart title={label} legend={legend} trend={trend} options={options} draw={draw} height={220} />;
}
