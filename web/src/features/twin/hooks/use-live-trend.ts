import { useEffect, useMemo, useState } from 'react';
import { twinSocket } from '../../../lib/socket';
import { LiveTrend, type TrendSource } from '../utils/live-trend';
import { spanOf, type TrendRange } from '../utils/trend-window';

export type TrendLoadState = { state: 'loading' } | { state: 'ready' } | { state: 'failed'; error: unknown };

/**
 * A loop's trend for one window: backfilled from the series route, then (for a live window) fed by
 * the loop's twin samples and backfilled again after every reconnect. The buffer lives outside
 * React; only the load state is React state.
 */
export function useLiveTrend(source: TrendSource, range: TrendRange, maxPoints: number) {
  const { loopId, samplePeriodS } = source;
  const { outputs, inputs } = source.layout;
  const trend = useMemo(
    () => new LiveTrend({ loopId, samplePeriodS, layout: { outputs, inputs } }, range, maxPoints),
    [loopId, samplePeriodS, outputs, inputs, range, maxPoints],
  );
  const [load, setLoad] = useState<{ trend: LiveTrend; result: TrendLoadState } | null>(null);
  const [attempt, setAttempt] = useState(0);

  useEffect(() => {
    const aborter = new AbortController();
    trend.load(aborter.signal).then(
      () => setLoad({ trend, result: { state: 'ready' } }),
      (error: unknown) => {
        if (!aborter.signal.aborted) setLoad({ trend, result: { state: 'failed', error } });
      },
    );
    if (!trend.live) return () => aborter.abort();
    const socket = twinSocket();
    const stopWatching = socket.watchLoop(loopId, (sample) => trend.accept(sample));
    const stopBackfilling = socket.onReconnect(() => void trend.backfill(aborter.signal).catch(() => undefined));
    // The window slides with the clock even between samples: about once per pixel, at most once a second.
    const slide = setInterval(() => trend.redraw(), Math.max(1000, spanOf(range) / maxPoints));
    return () => {
      aborter.abort();
      stopWatching();
      stopBackfilling();
      clearInterval(slide);
      trend.dispose();
    };
  }, [trend, loopId, range, maxPoints, attempt]);

  const result: TrendLoadState = load?.trend === trend ? load.result : { state: 'loading' };
  return { trend, load: result, retry: () => setAttempt((n) => n + 1) };
}
