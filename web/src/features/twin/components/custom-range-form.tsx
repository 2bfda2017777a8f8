import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { INPUT_CLASSES } from '../../../components/ui/field';
import { fromPlantWallTime, toPlantWallTime } from '../../../lib/plant-time';
import type { TrendRange } from '../utils/trend-window';

const MAX_SPAN_MS = 366 * 86_400_000;

/** What is wrong with a chosen window, in words, or null. */
export function customRangeProblem(fromMs: number, toMs: number): string | null {
  if (Number.isNaN(fromMs) || Number.isNaN(toMs)) return 'Enter both a start and an end.';
  if (fromMs >= toMs) return 'The start must be before the end.';
  if (toMs - fromMs > MAX_SPAN_MS) return 'Choose at most 366 days at a time.';
  return null;
}

type CustomRangeFormProps = {
  range: Extract<TrendRange, { kind: 'fixed' }>;
  onApply: (range: TrendRange) => void;
  timeZone: string;
};

export function CustomRangeForm({ range, onApply, timeZone }: CustomRangeFormProps) {
  const [from, setFrom] = useState(() => toPlantWallTime(range.fromMs, timeZone));
  const [to, setTo] = useState(() => toPlantWallTime(range.toMs, timeZone));
  const [problem, setProblem] = useState<string | null>(null);

  const apply = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const fromMs = fromPlantWallTime(from, timeZone);
    const toMs = fromPlantWallTime(to, timeZone);
    const found = customRangeProblem(fromMs, toMs);
    setProblem(found);
    if (!found) onApply({ kind: 'fixed', fromMs, toMs });
  };

  return (
    <form
      onSubmit={apply}
      aria-label="Custom time range"
      className="flex flex-wrap items-end gap-3 rounded-sm border border-rule bg-panel px-3 py-2 text-sm"
    >
      <label className="flex flex-col gap-1">
        <span className="font-medium">From</span>
        <input type="datetime-local" value={from} onChange={(e) => setFrom(e.target.value)} className={INPUT_CLASSES} />
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-medium">To</span>
        <input type="datetime-local" value={to} onChange={(e) => setTo(e.target.value)} className={INPUT_CLASSES} />
      </label>
      <Button type="submit" variant="primary">
        Show this window
      </Button>
      <span className="text-xs text-ink/70">Plant time ({timeZone}).</span>
      {problem ? (
        <p role="alert" className="w-full text-xs font-medium text-diverged">
          {problem}
        </p>
      ) : null}
    </form>
  );
}
