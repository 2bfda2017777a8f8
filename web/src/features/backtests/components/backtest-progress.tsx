import { Button } from '../../../components/ui/button';
import { describeError } from '../../../components/errors/describe-error';
import { useCancelBacktest } from '../api/cancel-backtest';
import type { BacktestSummary } from '../types';

type BacktestProgressProps = {
  backtest: Pick<BacktestSummary, 'id' | 'status' | 'progress' | 'stage' | 'cancelRequested'>;
  mayCancel: boolean;
  /** The Cancel button's accessible name where several jobs are listed. */
  cancelLabel?: string;
};

/** The bar, what the job does now in words, and Cancel for engineers. */
export function BacktestProgress({ backtest, mayCancel, cancelLabel }: BacktestProgressProps) {
  const cancel = useCancelBacktest();
  const percent = Math.floor(100 * Math.min(1, Math.max(0, backtest.progress)));
  const words = backtest.cancelRequested
    ? 'Cancelling: the job stops at its next step.'
    : backtest.status === 'queued'
      ? `Waiting for a free worker${backtest.stage ? ` · ${backtest.stage}` : ''}`
      : `${percent} % · ${backtest.stage}`;
  return (
    <div className="space-y-1 text-sm">
      <progress aria-label="Backtest progress" max={100} value={percent} className="h-3 w-full min-w-40 accent-twin" />
      <div className="flex flex-wrap items-center gap-2">
        <span className="tabular-nums" aria-live="polite">
          {words}
        </span>
        {mayCancel && !backtest.cancelRequested ? (
          <Button
            variant="danger"
            aria-label={cancelLabel}
            disabled={cancel.isPending}
            onClick={() => cancel.mutate(backtest.id)}
          >
            {cancel.isPending ? 'Cancelling…' : 'Cancel'}
          </Button>
        ) : null}
      </div>
      {cancel.error ? (
        <p role="alert" className="text-xs font-medium text-diverged">
          {describeError(cancel.error).explanation}
        </p>
      ) : null}
    </div>
  );
}
