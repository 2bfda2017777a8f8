import { useEffect, useRef, type RefObject } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { LiveTrend } from '../utils/live-trend';

export type ChartDraw = {
  data: (trend: LiveTrend) => uPlot.AlignedData;
  /** The x window in seconds; null lets uPlot fit the data. */
  xRange: (trend: LiveTrend) => [number, number] | null;
};

/**
 * Binds one uPlot canvas to a live trend: built once per options, then redrawn straight from the
 * trend's buffer whenever the trend says so — no React render per sample.
 */
export function useLiveChart(
  containerRef: RefObject<HTMLDivElement | null>,
  trend: LiveTrend,
  options: Omit<uPlot.Options, 'width' | 'height'>,
  height: number,
  draw: ChartDraw,
): void {
  const drawRef = useRef(draw);
  useEffect(() => {
    drawRef.current = draw;
    trend.redraw();
  }, [draw, trend]);

  useEffect(() => {
    const container = containerRef.current;
    if (!container) return;
    const width = () => Math.max(160, container.clientWidth);
    const chart = new uPlot({ ...options, width: width(), height }, drawRef.current.data(trend), container);
    const paint = () => {
      const range = drawRef.current.xRange(trend);
      chart.batch(() => {
        chart.setData(drawRef.current.data(trend), true);
        if (range) chart.setScale('x', { min: range[0], max: range[1] });
      });
    };
    paint();
    const unsubscribe = trend.subscribe(paint);
    const observer =
      typeof ResizeObserver === 'function' ? new ResizeObserver(() => chart.setSize({ width: width(), height })) : null;
    observer?.observe(container);
    return () => {
      unsubscribe();
      observer?.disconnect();
      chart.destroy();
    };
  }, [containerRef, trend, options, height]);
}
