import { useMutation } from '@tanstack/react-query';
import { describeError } from '../../../components/errors/describe-error';
import { Button } from '../../../components/ui/button';
import { suggestSigma } from '../api/suggest-sigma';

/** Fills the sigma fields from the loop's recent residuals, and says where the numbers come from. */
export function FillSigmaButton({ loopId, onFill }: { loopId: string; onFill: (sigma: string[]) => void }) {
  const suggest = useMutation({
    mutationFn: () => suggestSigma(loopId),
    onSuccess: (suggestion) => {
      if (suggestion.sigma) onFill(suggestion.sigma.map(String));
    },
  });
  return (
    <div className="space-y-1">
      <Button onClick={() => suggest.mutate()} disabled={suggest.isPending}>
        Fill sigma from recent residuals
      </Button>
      {suggest.data ? <p className="text-xs text-ink/75">{suggest.data.sentence}</p> : null}
      {suggest.isError ? <p className="text-xs text-diverged">{describeError(suggest.error).explanation}</p> : null}
    </div>
  );
}
