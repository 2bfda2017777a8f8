import type { Backtest } from '../types';

/** A job that ended without results, in plain words with what to do next. */
export function BacktestOutcome({ backtest, loopTag }: { backtest: Backtest; loopTag: string }) {
  if (backtest.status === 'failed') {
    return (
      <div
        role="alert"
        className="rounded-sm border border-diverged/50 border-l-4 border-l-diverged bg-panel px-4 py-3 text-sm"
      >
        <p className="font-bold">The backtest stopped without results</p>
        <p className="mt-1">{backtest.error ?? 'The server gave no reason.'}</p>
        <p className="mt-1 text-ink/75">
          Check the recording — the range holds readings of every output, or the file maps the right columns — and start
          a new backtest from the Backtests tab of {loopTag}.
        </p>
      </div>
    );
  }
  if (backtest.status === 'cancelled') {
    return (
      <div role="status" className="rounded-sm border border-rule border-l-4 border-l-stale bg-panel px-4 py-3 text-sm">
        <p className="font-bold">This backtest was cancelled</p>
        <p className="mt-1">
          It stopped before it finished, so it has no results. Start a new one from the Backtests tab of {loopTag}.
        </p>
      </div>
    );
  }
  return null;
}
