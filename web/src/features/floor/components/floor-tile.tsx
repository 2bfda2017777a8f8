import { useMemo } from 'react';
import { Link } from 'react-router';
import { formatNumber } from '../../../lib/format-number';
import type { TrackingStatus } from '../../loops/api/get-loops';
import { TrackingStatusWord } from '../../loops/components/tracking-status-word';
import { useLiveTrend } from '../../twin/hooks/use-live-trend';
import type { LiveTrend } from '../../twin/utils/live-trend';
import { column } from '../../twin/utils/trend-layout';
import type { TrendRange } from '../../twin/utils/trend-window';
import { worstBandFraction } from '../utils/band-use';
import { newest, timeAgo } from '../utils/time-ago';
import type { FloorLoop } from '../utils/tile-order';
import { BandUseBar } from './band-use-bar';
import { Sparkline } from './sparkline';

const LAST_15_MINUTES: TrendRange = { kind: 'live', key: '15m' };
const SPARKLINE_POINTS = 120;

const EDGE: Record<TrackingStatus, string> = {
  in_step: 'border-l-in-step',
  drifting: 'border-l-drifting',
  diverged: 'border-l-diverged',
  stale: 'border-l-stale',
  no_twin: 'border-l-rule',
};

function newestMeasured(trend: LiveTrend): number | null {
  const [, ...columns] = trend.rows();
  const values = columns[column.measured(trend.source.layout, 0)];
  for (let i = values.length - 1; i >= 0; i--) if (values[i] !== null) return values[i];
  return null;
}

/** One loop on the Floor: status in word and colour, a live sparkline, band use and reading age. */
export function FloorTile({ loop, now }: { loop: FloorLoop; now: number }) {
  const source = useMemo(
    () => ({
      loopId: loop.id,
      samplePeriodS: loop.samplePeriodS,
      layout: { outputs: loop.outputs.length, inputs: loop.inputs.length },
    }),
    [loop.id, loop.samplePeriodS, loop.outputs.length, loop.inputs.length],
  );
  const { trend, load } = useLiveTrend(source, LAST_15_MINUTES, SPARKLINE_POINTS);
  const live = trend.lastReading;
  const fraction = worstBandFraction(live?.residual, loop.band) ?? loop.worstBandFraction ?? null;
  const lastReadingMs = newest(loop.lastReadingAt ? Date.parse(loop.lastReadingAt) : null, trend.lastMeasuredMs);
  const main = loop.outputs[0];
  const value = newestMeasured(trend);

  return (
    <Link
      to={`/loops/${loop.id}`}
      aria-label={`${loop.tag} ${loop.name}`}
      className={`block h-full space-y-1.5 rounded-sm border border-rule border-l-[6px] bg-panel px-3 py-2 text-sm hover:border-ink/50 focus-visible:outline-2 focus-visible:outline-twin ${EDGE[loop.status]}`}
    >
      <div className="flex items-baseline justify-between gap-2">
        <span className="font-bold">{loop.tag}</span>
        <TrackingStatusWord status={loop.status} />
      </div>
      <p className="truncate text-ink/85">{loop.name}</p>
      <p className="flex justify-between gap-2 text-xs tabular-nums">
        <span className="truncate">{main?.name}</span>
        <span className="font-medium">{value === null ? '—' : `${formatNumber(value)} ${main?.unit ?? ''}`}</span>
      </p>
      <Sparkline
        empty={load.state === 'ready' && trend.rows()[0].length === 0}
        trend={trend}
        label={`Last 15 minutes of ${main?.name ?? 'the main output'}: measured solid, predicted by the twin dashed`}
      />
      {load.state === 'failed' ? <p className="text-xs text-diverged">The trend could not be loaded.</p> : null}
      <BandUseBar fraction={fraction} />
      <p className="text-xs text-ink/75 tabular-nums">
        {lastReadingMs === null ? 'No reading yet' : `Last reading ${timeAgo(lastReadingMs, now)}`}
      </p>
    </Link>
  );
}
