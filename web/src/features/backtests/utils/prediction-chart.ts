import type uPlot from 'uplot';
import { INK, lineColour, plantTimeChartOptions, TWIN, type ChartOptions } from '../../twin/utils/trend-chart-options';
import type { BacktestChart } from '../types';

export type ChartVersion = { id: string; number: number };

/** The candidate wears the twin colour; other versions the shared line colours. Free runs are dotted. */
function versionColour(index: number): string {
  return index === 0 ? TWIN : lineColour(index + 1);
}

export type PredictionLine = { label: string; colour: string; dash: number[] };

/** The lines of one output's chart after the measured one: each version's one-step prediction, then its free run. */
export function predictionLines(versions: readonly ChartVersion[], showFreeRun: boolean): PredictionLine[] {
  const oneStep = versions.map((v, i) => ({
    label: `version ${v.number}, one step ahead`,
    colour: versionColour(i),
    dash: [6, 4],
  }));
  const freeRun = versions.map((v, i) => ({
    label: `version ${v.number}, free run`,
    colour: versionColour(i),
    dash: [2, 3],
  }));
  return showFreeRun ? [...oneStep, ...freeRun] : oneStep;
}

/** Measured solid ink, then the prediction lines, on the plant's clock. */
export function predictionChartOptions(spec: {
  timeZone: string;
  yLabel: string;
  lines: PredictionLine[];
}): ChartOptions {
  return plantTimeChartOptions({
    timeZone: spec.timeZone,
    yLabel: spec.yLabel,
    series: [
      { label: 'measured', stroke: INK, width: 1.75, points: { show: false } },
      ...spec.lines.map((line) => ({
        label: line.label,
        stroke: line.colour,
        width: 1.5,
        dash: line.dash,
        points: { show: false },
      })),
    ],
  });
}

/**
 * x in epoch seconds (the chart's slot times are in ms), measured, then per version its one-step
 * and (when shown) free-run prediction of this output, in the order of `versions`.
 */
export function predictionChartData(
  chart: BacktestChart,
  output: number,
  versions: readonly ChartVersion[],
  showFreeRun: boolean,
): uPlot.AlignedData {
  const seriesOf = (versionId: string) => chart.predictions.find((p) => p.versionId === versionId);
  const none = chart.t.map(() => null);
  const oneStep = versions.map((v) => seriesOf(v.id)?.oneStep[output] ?? none);
  const freeRun = versions.map((v) => seriesOf(v.id)?.freeRun[output] ?? none);
  return [
    chart.t.map((ms) => ms / 1000),
    chart.measured[output] ?? none,
    ...oneStep,
    ...(showFreeRun ? freeRun : []),
  ] as uPlot.AlignedData;
}
