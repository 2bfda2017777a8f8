import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';

type UPlotChartProps = {
  /** Memoise: new options rebuild the chart, new data only redraws it. */
  options: Omit<uPlot.Options, 'width' | 'height'>;
  data: uPlot.AlignedData;
  height?: number;
};

/** A thin home for one uPlot canvas; the numbers it shows are always also given in words or a table. */
export function UPlotChart({ options, data, height = 220 }: UPlotChartProps) {
  const containerRef = useRef<HTMLDivElement>(null);
  const chartRef = useRef<uPlot | null>(null);
  const dataRef = useRef(data);

  useEffect(() => {
    dataRef.current = data;
    chartRef.current?.setData(data);
  }, [data]);

  useEffect(() => {
    const container = containerRef.current;
    if (!container) return;
    const width = () => Math.max(240, container.clientWidth);
    const chart = new uPlot({ ...options, width: width(), height }, dataRef.current, container);
    chartRef.current = chart;
    const observer =
      typeof ResizeObserver === 'function' ? new ResizeObserver(() => chart.setSize({ width: width(), height })) : null;
    observer?.observe(container);
    return () => {
      observer?.disconnect();
      chart.destroy();
      chartRef.current = null;
    };
  }, [options, height]);

  return <div ref={containerRef} aria-hidden="true" className="w-full" style={{ minHeight: height }} />;
}
