import { EmptyState } from '../../../components/ui/empty-state';
import { useLoopOfPage } from './loop-layout';

export function LoopAlertsTab() {
  const loop = useLoopOfPage();
  return (
    <EmptyState title="No alerts for this loop">
      <p>
        When the plant stops behaving like the model of {loop.tag}, a drift rule raises an alert; it will be listed
        here, newest first, with who acknowledged it and when.
      </p>
    </EmptyState>
  );
}

export function LoopRulesTab() {
  const loop = useLoopOfPage();
  return (
    <EmptyState title="No drift rules yet">
      <p>
        Drift rules watch the residuals of {loop.tag}: a band with persistence, a CUSUM, a chi-square test on the
        innovation, and a check for stale readings. Each will show its expected false-alert interval in plain time.
      </p>
      <p>Control engineers will set them up here once the loop has an active model version.</p>
    </EmptyState>
  );
}
