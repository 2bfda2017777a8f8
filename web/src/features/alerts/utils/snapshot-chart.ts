import uPlot from 'uplot';
import { formatNumber } from '../../../lib/format-number';
import { formatAxisTime } from '../../../lib/plant-time';
import { INK, TWIN } from '../../twin/utils/trend-chart-options';

type ChartOptions = Omit<uPlot.Options, 'width' | 'height'>;
type SeriesLike = { t: string[]; measured: (number | null)[][]; predicted: (number | null)[][] };

const AXIS = {
  stroke: INK,
  grid: { stroke: '#d5d9d2', width: 1 },
  ticks: { stroke: '#d5d9d2', width: 1 },
  font: '12px "Roboto Condensed", sans-serif',
  labelFont: '500 12px "Roboto Condensed", sans-serif',
};

/** x in seconds, then measured and predicted of one output. */
export function snapshotData(series: SeriesLike, output: number): uPlot.AlignedData {
  return [
    series.t.map((t) => Date.parse(t) / 1000),
    series.measured[output] ?? [],
    series.predicted[output] ?? [],
  ] as uPlot.AlignedData;
}

/** A solid ink line at the raise, labelled, so the eye finds the moment the rule fired. */
function raiseMarker(raisedAtS: number): uPlot.Plugin {
  return {
    hooks: {
      draw: [
        (u) => {
          const { left, top, width, height } = u.bbox;
          const x = Math.round(u.valToPos(raisedAtS, 'x', true));
          if (x < left || x > left + width) return;
          const ratio = window.devicePixelRatio || 1;
          const ctx = u.ctx;
          ctx.save();
          ctx.strokeStyle = INK;
          ctx.lineWidth = 2 * ratio;
          ctx.setLineDash([]);
          ctx.beginPath();
          ctx.moveTo(x, top);
          ctx.lineTo(x, top + height);
          ctx.stroke();
          ctx.fillStyle = INK;
          ctx.font = `700 ${12 * ratio}px "Roboto Condensed", sans-serif`;
          ctx.textBaseline = 'top';
          ctx.fillText('raised', x + 4 * ratio, top + 4 * ratio);
          ctx.restore();
        },
      ],
    },
  };
}

export function snapshotChartOptions(spec: { yLabel: string; timeZone: string; raisedAt: string }): ChartOptions {
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
      { ...AXIS, label: spec.yLabel, size: 64, values: (_u, splits) => splits.map((s) => formatNumber(s, 3)) },
    ],
    series: [
      {},
      { label: 'measured', stroke: INK, width: 1.75, points: { show: false } },
      { label: 'predicted', stroke: TWIN, width: 1.5, dash: [6, 4], points: { show: false } },
    ],
    plugins: [raiseMarker(Date.parse(spec.raisedAt) / 1000)],
  };
}
