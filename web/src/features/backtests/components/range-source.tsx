import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { INPUT_CLASSES } from '../../../components/ui/field';
import { fromPlantWallTime, toPlantWallTime } from '../../../lib/plant-time';
import type { BacktestSource } from '../types';
import { rangeProblem } from '../utils/range-problem';

const QUICK_PICKS = [
  { label: 'Last 24 h', spanMs: 86_400_000 },
  { label: 'Last 7 days', spanMs: 7 * 86_400_000 },
] as const;

/** The wall-clock texts of the span that ends now. */
function endingNow(spanMs: number, timeZone: string): { from: string; to: string } {
  const now = Date.now();
  return { from: toPlantWallTime(now - spanMs, timeZone), to: toPlantWallTime(now, timeZone) };
}

type RangeSourceProps = {
  timeZone: string;
  samplePeriodS: number;
  busy: boolean;
  onStart: (source: BacktestSource) => void;
};

/** From and to on the plant's clock (as on the trend page), with quick picks that end now. */
export function RangeSource({ timeZone, samplePeriodS, busy, onStart }: RangeSourceProps) {
  const [{ from, to }, setRange] = useState(() => endingNow(QUICK_PICKS[0].spanMs, timeZone));
  const [problem, setProblem] = useState<string | null>(null);

  const pick = (spanMs: number) => setRange(endingNow(spanMs, timeZone));
  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const fromMs = fromPlantWallTime(from, timeZone);
    const toMs = fromPlantWallTime(to, timeZone);
    const found = rangeProblem(fromMs, toMs, samplePeriodS);
    setProblem(found);
    if (!found) onStart({ source: 'range', from: new Date(fromMs).toISOString(), to: new Date(toMs).toISOString() });
  };

  return (
    <form onSubmit={submit} aria-label="Stored readings range" className="space-y-2 text-sm">
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-col gap-1">
          <span className="font-medium">From</span>
          <input
            type="datetime-local"
            value={from}
            onChange={(e) => setRange({ from: e.target.value, to })}
            className={INPUT_CLASSES}
          />
        </label>
        <label className="flex flex-col gap-1">
          <span className="font-medium">To</span>
          <input
            type="datetime-local"
            value={to}
            onChange={(e) => setRange({ from, to: e.target.value })}
            className={INPUT_CLASSES}
          />
        </label>
        {QUICK_PICKS.map((quick) => (
          <Button key={quick.label} onClick={() => pick(quick.spanMs)}>
            {quick.label}
          </Button>
        ))}
        <span className="text-xs text-ink/70">Plant time ({timeZone}).</span>
      </div>
      {problem ? (
        <p role="alert" className="text-xs font-medium text-diverged">
          {problem}
        </p>
      ) : null}
      <Button type="submit" variant="primary" disabled={busy}>
        {busy ? 'Starting…' : 'Start backtest'}
      </Button>
    </form>
  );
}
