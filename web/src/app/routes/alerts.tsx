import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';

export function AlertsPage() {
  return (
    <div>
      <PageHeader title="Alerts" description="Divergence alerts raised when a loop stops behaving like its model." />
      <EmptyState title="No alerts">
        <p>
          Alerts will appear here when a twin&apos;s residuals leave the residual band and one of the loop&apos;s drift
          rules raises an alert. No alert can be raised until a loop has an active model version running as a twin.
        </p>
        <p>
          The on-call engineer will acknowledge, shelve or close each alert here or from the link in the alert e-mail.
        </p>
      </EmptyState>
    </div>
  );
}
