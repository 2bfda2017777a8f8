import { Button } from '../../../components/ui/button';
import { suggestSigma } from '../api/suggest-sigma';
import { FillSigmaFromBacktest } from './fill-sigma-from-backtest';
import { SigmaFillNote, useSigmaFill } from './sigma-fill';

/**
 * Fills the sigma fields from the loop's recent residuals or from a backtest of its active
 * version, and says where the numbers come from.
 */
export function FillSigmaButton({ loopId, onFill }: { loopId: string; onFill: (sigma: string[]) => void }) {
  const { fill, mutation } = useSigmaFill(() => suggestSigma(loopId), onFill);
  return (
    <div className="flex flex-wrap items-start gap-x-6 gap-y-3">
      <div className="space-y-1">
        <Button onClick={() => fill()} disabled={mutation.isPending}>
          Fill sigma from recent residuals
        </Button>
        <SigmaFillNote mutation={mutation} />
      </div>
      <FillSigmaFromBacktest loopId={loopId} onFill={onFill} />
    </div>
  );
}
