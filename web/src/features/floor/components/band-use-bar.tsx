import { percentOfBand } from '../utils/band-use';

/** "residual 38 % of band" with a thin bar; the words carry the meaning, the bar the glance. */
export function BandUseBar({ fraction }: { fraction: number | null }) {
  if (fraction === null) return <p className="text-xs text-ink/70">Residual band not known yet</p>;
  const outside = fraction >= 1;
  return (
    <div className="space-y-0.5">
      <p className="text-xs tabular-nums">
        Residual {percentOfBand(fraction)} of band{outside ? ' — outside the band' : ''}
      </p>
      <div aria-hidden="true" className="h-1.5 w-full overflow-hidden rounded-sm bg-rule/60">
        <div
          className={`h-full ${outside ? 'bg-drifting' : 'bg-ink/60'}`}
          style={{ width: `${Math.min(100, fraction * 100)}%` }}
        />
      </div>
    </div>
  );
}
