import { EmptyState } from '../../../components/ui/empty-state';
import { TrendView } from '../../../features/twin/components/trend-view';
import { useLoopOfPage } from './loop-layout';

export function LoopTrendTab() {
  const loop = useLoopOfPage();
  return (
    <div className="space-y-3">
      {loop.activeVersionId === null ? (
        <EmptyState title="This loop has no twin yet">
          <p>
            Measured readings show below as they arrive, but there is nothing to predict them with: {loop.tag} has no
            active model version. A control engineer registers, reviews and activates one under Models.
          </p>
        </EmptyState>
      ) : null}
      <TrendView loop={loop} />
    </div>
  );
}
