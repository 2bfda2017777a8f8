import { useQuery } from '@tanstack/react-query';
import { useEffect, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { forecastQueryOptions } from '../api/get-forecast';
import { ErrorNotice } from '../../../components/errors/error-notice';
import type { Loop } from '../../loops/api/get-loops';
import { trackingQueryOptions } from '../api/get-tracking';
import { useLiveTrend } from '../hooks/use-live-trend';
import { bandsComplete } from '../utils/chart-data';
import { createCursorStore } from '../utils/cursor-store';
import { maxPointsForWidth, type TrendRange } from '../utils/trend-window';
import { CursorReadout } from './cursor-readout';
import { ForecastPanel } from './forecast-panel';
import { TrendCharts } from './trend-charts';
import { TrendToolbar } from './trend-toolbar';
import { TryAMove } from './try-a-move';

/** The y axis takes about this much of a chart's width; the rest gets about one point per pixel. */
const AXIS_PIXELS = 70;

export function TrendView({ loop }: { loop: Loop }) {
  const [range, setRange] = useState<TrendRange>({ kind: 'live', key: '15m' });
  const [paused, setPaused] = useState(false);
  const [showInputs, setShowInputs] = useState(false);
  const [width, setWidth] = useState(0);
  const [previewShown, setPreviewShown] = useState(false);
  const columnRef = useRef<HTMLDivElement>(null);
  useLayoutEffect(() => setWidth(columnRef.current?.clientWidth ?? 0), []);

  const source = useMemo(
    () => ({
      loopId: loop.id,
      samplePeriodS: loop.samplePeriodS,
      layout: { outputs: loop.outputs.length, inputs: loop.inputs.length },
    }),
    [loop.id, loop.samplePeriodS, loop.outputs.length, loop.inputs.length],
  );
  const { trend, load, retry } = useLiveTrend(source, range, maxPointsForWidth(width - AXIS_PIXELS));
  const cursor = useMemo(() => createCursorStore(), []);
  const tracking = useQuery(trackingQueryOptions(loop.id));
  const bands = tracking.data?.band;
  // the forecast panel's own query, shared through the cache: no second request
  const forecast = useQuery(
    forecastQueryOptions(loop.id, loop.samplePeriodS, trend.live && loop.activeVersionId !== null),
  );
  const drawn = { forecast: trend.live && Boolean(forecast.data), preview: previewShown };
  useEffect(() => trend.setOverlays({ bands: bands ?? [] }), [trend, bands]);
  useEffect(() => trend.setPaused(paused && trend.live), [trend, paused]);

  return (
    <div className="space-y-3">
      <TrendToolbar
        range={range}
        onRange={(next) => {
          setRange(next);
          setPaused(false);
        }}
        paused={paused}
        onPaused={setPaused}
        showInputs={showInputs}
        onShowInputs={setShowInputs}
        timeZone={loop.timeZone}
      />
      <div className="grid gap-3 xl:grid-cols-[minmax(0,1fr)_19rem]">
        <div ref={columnRef} className="min-w-0 space-y-3">
          {load.state === 'failed' ? <ErrorNotice error={load.error} onRetry={retry} /> : null}
          {load.state === 'loading' ? (
            <p role="status" className="text-sm text-ink/75">
              Loading the trend…
            </p>
          ) : null}
          <TrendCharts
            loop={loop}
            trend={trend}
            cursor={cursor}
            showInputs={showInputs}
            drawn={drawn}
            bandsKnown={bandsComplete(bands ?? [], loop.outputs.length)}
          />
          <CursorReadout loop={loop} trend={trend} cursor={cursor} />
        </div>
        <aside className="space-y-3" aria-label="Model predictions">
          <ForecastPanel loop={loop} trend={trend} />
          <TryAMove loop={loop} trend={trend} onShown={setPreviewShown} />
        </aside>
      </div>
    </div>
  );
}
