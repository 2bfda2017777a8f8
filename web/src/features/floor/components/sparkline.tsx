import { useRef } from 'react';
import type uPlot from 'uplot';
import { useLiveChart, type ChartDraw } from '../../twin/hooks/use-live-chart';
import type { LiveTrend } from '../../twin/utils/live-trend';
import { column } from '../../twin/utils/trend-layout';
import { INK, TWIN } from '../../twin/utils/trend-chart-options';

const HEIGHT = 52;

const OPTIONS: Omit<uPlot.Options, 'width' | 'height'> = {
  legend: { show: false },
  cursor: { show: false },
  scales: { x: { time: true } },
  axes: [{ show: false }, { show: false }],
  padding: [4, 2, 4, 2],
  series: [
    {},
    { label: 'measured', stroke: INK, width: 1.5, points: { show: false } },
    { label: 'predicted', stroke: TWIN, width: 1.5, dash: [5, 3], points: { show: false } },
  ],
};

/** The main output only: measured and predicted. */
const DRAW: ChartDraw = {
  data: (trend) => {
    const [t, ...columns] = trend.rows();
    const layout = trend.source.layout;
    return [t, columns[column.measured(layout, 0)], columns[column.predicted(layout, 0)]];
  },
  xRange: (trend) => trend.xRange(),
};

/** A small live trend of a tile; its meaning is given in words by the label. */
export function Sparkline({ trend, label, empty }: { trend: LiveTrend; label: string; empty: boolean }) {
  const containerRef = useRef<HTMLDivElement>(null);
  useLiveChart(containerRef, trend, OPTIONS, HEIGHT, DRAW);
  return (
    <div role="img" aria-label={label}>
      <div className="relative border-b border-rule">
        <div ref={containerRef} style={{ minHeight: HEIGHT }} />
        {empty ? (
          <p className="absolute inset-0 flex items-center justify-center text-xs text-ink/60">
            No readings in the last 15 min
          </p>
        ) : null}
      </div>
      <p aria-hidden="true" className="flex justify-between text-[11px] text-ink/60">
        <span>15 min ago</span>
        <span>now</span>
      </p>
    </div>
  );
}
