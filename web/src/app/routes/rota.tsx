import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';

export function RotaPage() {
  return (
    <div>
      <PageHeader title="Rota" description="Who is on call, when, and for which area, with the escalation timings." />
      <EmptyState title="Nobody is on the rota yet">
        <p>
          The on-call rota will appear here as a week of shifts, each with a primary and a secondary on-call engineer
          per area. Administrators will add the shifts.
        </p>
        <p>
          Once shifts exist, the top strip will name who is on call now, and unacknowledged alerts will escalate from
          the primary to the secondary.
        </p>
      </EmptyState>
    </div>
  );
}
