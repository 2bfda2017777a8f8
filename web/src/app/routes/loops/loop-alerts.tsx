import { useQuery } from '@tanstack/react-query';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { EmptyState } from '../../../components/ui/empty-state';
import { alertsQueryOptions } from '../../../features/alerts/api/get-alerts';
import { AlertsTable } from '../../../features/alerts/components/alerts-table';
import { MaintenanceSwitch } from '../../../features/alerts/components/maintenance-switch';
import { SuppressedRaises } from '../../../features/alerts/components/suppressed-raises';
import { hasRole } from '../../../features/session/roles';
import { useSignedInUser } from '../../../features/session/use-signed-in-user';
import { useNow } from '../../../lib/use-now';
import { useLoopOfPage } from './loop-layout';

export function LoopAlertsTab() {
  const loop = useLoopOfPage();
  const user = useSignedInUser();
  const nowMs = useNow(30_000);
  const alerts = useQuery(alertsQueryOptions({ loopId: loop.id, limit: 200 }));
  const mayMaintain = hasRole(user, 'engineer') || hasRole(user, 'oncall');

  let body;
  if (alerts.isError) body = <ErrorNotice error={alerts.error} onRetry={() => void alerts.refetch()} />;
  else if (alerts.data?.length === 0) {
    body = (
      <EmptyState title="No alerts for this loop">
        <p>
          When the plant stops behaving like the model of {loop.tag}, one of its drift rules raises an alert; it is
          listed here, newest first, with who acknowledged it and when. The Rules tab shows what each rule watches.
        </p>
      </EmptyState>
    );
  } else {
    body = (
      <AlertsTable
        caption={`Alerts of ${loop.tag}, newest first`}
        alerts={alerts.data}
        timeZone={loop.timeZone}
        nowMs={nowMs}
        showLoop={false}
      />
    );
  }
  return (
    <div className="space-y-4">
      {body}
      <SuppressedRaises loopId={loop.id} timeZone={loop.timeZone} />
      {mayMaintain ? (
        <MaintenanceSwitch loop={loop} />
      ) : (
        <p className="text-sm text-ink/75">
          Control engineers and on-call engineers can put this loop into maintenance.
        </p>
      )}
    </div>
  );
}
