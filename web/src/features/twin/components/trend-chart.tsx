import { useRef, type ReactNode } from 'react';
import type uPlot from 'uplot';
import { useLiveChart, type ChartDraw } from '../hooks/use-live-chart';
import type { LiveTrend } from '../utils/live-trend';
import { ChartLegend, type LegendItem } from './chart-legend';

type TrendChartProps = {
  title: string;
  note?: ReactNode;
  legend: readonly LegendItem[];
  trend: LiveTrend;
  options: Omit<uPlot.Options, 'width' | 'height'>;
  draw: ChartDraw;
  height?: number;
};

/** One live chart with its title and key; the readout table below gives its numbers in words. */
export function TrendChart({ title, note, legend, trend, options, draw, height = 200 }: TrendChartProps) {
  const containerRef = useRef<HTMLDivElement>(null);
  useLiveChart(containerRef, trend, options, height, draw);
  return (
    <figure aria-label={title} className="min-w-0 rounded-sm border border-rule bg-panel p-2">
      <figcaption className="mb-1 flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 text-sm">
        <span className="font-bold">{title}</span>
        <ChartLegend items={legend} />
        {note ? <span className="w-full text-xs text-ink/75">{note}</span> : null}
      </figcaption>
      <div ref={containerRef} aria-hidden="true" className="w-full" style={{ minHeight: height }} />
    </figure>
  );
}
