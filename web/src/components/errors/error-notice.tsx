import { Button } from '../ui/button';
import { describeError } from './describe-error';

type ErrorNoticeProps = {
  error: unknown;
  onRetry?: () => void;
};

export function ErrorNotice({ error, onRetry }: ErrorNoticeProps) {
  const { title, explanation, nextStep } = describeError(error);
  return (
    <div
      role="alert"
      className="rounded-sm border border-diverged/50 border-l-4 border-l-diverged bg-panel px-4 py-3 text-sm"
    >
      <p className="font-bold">{title}</p>
      <p className="mt-1">{explanation}</p>
      <p className="mt-1 text-ink/75">{nextStep}</p>
      {onRetry ? (
        <Button className="mt-2" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}
