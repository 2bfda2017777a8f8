import type uPlot from 'uplot';
import { INK, plantTimeChartOptions, TWIN, type ChartOptions } from '../../twin/utils/trend-chart-options';

type SeriesLike = { t: string[]; measured: (number | null)[][]; predicted: (number | null)[][] };

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
    ...plantTimeChartOptions({
      timeZone: spec.timeZone,
      yLabel: spec.yLabel,
      series: [
        { label: 'measured', stroke: INK, width: 1.75, points: { show: false } },
        { label: 'predicted', stroke: TWIN, width: 1.5, dash: [6, 4], points: { show: false } },
      ],
    }),
    plugins: [raiseMarker(Date.parse(spec.raisedAt) / 1000)],
  };
}
