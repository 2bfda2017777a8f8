import { useSyncExternalStore } from 'react';
import { Button } from '../../../components/ui/button';
import { twinSocket } from '../../../lib/socket';
import { LIVE_RANGES, type TrendRange } from '../utils/trend-window';
import { CustomRangeForm } from './custom-range-form';

type TrendToolbarProps = {
  range: TrendRange;
  onRange: (range: TrendRange) => void;
  paused: boolean;
  onPaused: (paused: boolean) => void;
  showInputs: boolean;
  onShowInputs: (show: boolean) => void;
  timeZone: string;
};

const pressed = (on: boolean) => (on ? 'bg-ink text-paper border-ink' : 'bg-panel border-ink/40 hover:border-ink');

function ConnectionWord({ live }: { live: boolean }) {
  const socket = twinSocket();
  const state = useSyncExternalStore(socket.subscribeState, socket.state);
  if (!live) return <span className="text-ink/75">Fixed window: no live updates</span>;
  if (state === 'live') return <span className="text-in-step">● Live</span>;
  if (state === 'connecting') return <span className="text-ink/75">Connecting…</span>;
  return <span className="font-medium text-drifting">Connection lost, reconnecting; the gap fills in once back</span>;
}

export function TrendToolbar({
  range,
  onRange,
  paused,
  onPaused,
  showInputs,
  onShowInputs,
  timeZone,
}: TrendToolbarProps) {
  const custom = range.kind === 'fixed';
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <div role="group" aria-label="Time range" className="flex flex-wrap gap-1">
          {LIVE_RANGES.map((r) => (
            <button
              key={r.key}
              type="button"
              aria-pressed={range.kind === 'live' && range.key === r.key}
              onClick={() => onRange({ kind: 'live', key: r.key })}
              className={`rounded-sm border px-2.5 py-1 font-medium ${pressed(range.kind === 'live' && range.key === r.key)}`}
            >
              {r.label}
            </button>
          ))}
          <button
            type="button"
            aria-pressed={custom}
            onClick={() =>
              onRange(
                custom
                  ? { kind: 'live', key: '15m' }
                  : { kind: 'fixed', fromMs: Date.now() - 3_600_000, toMs: Date.now() },
              )
            }
            className={`rounded-sm border px-2.5 py-1 font-medium ${pressed(custom)}`}
          >
            Custom
          </button>
        </div>
        <Button onClick={() => onPaused(!paused)} disabled={custom} aria-pressed={paused}>
          {paused ? 'Resume' : 'Pause'}
        </Button>
        <label className="inline-flex items-center gap-1.5">
          <input type="checkbox" checked={showInputs} onChange={(e) => onShowInputs(e.target.checked)} />
          Show inputs
        </label>
        <span className="ml-auto text-xs" aria-live="polite">
          {paused ? (
            <span className="font-medium text-drifting">Paused: samples keep arriving and show when you resume</span>
          ) : (
            <ConnectionWord live={!custom} />
          )}
        </span>
      </div>
      {range.kind === 'fixed' ? <CustomRangeForm range={range} onApply={onRange} timeZone={timeZone} /> : null}
    </div>
  );
}
