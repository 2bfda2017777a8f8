import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';

export function LoopsPage() {
  return (
    <div>
      <PageHeader
        title="Loops"
        description="The registered control loops, with their tags, areas, sample periods and tracking status."
      />
      <EmptyState title="No loops registered yet">
        <p>
          Loops will be listed here once a control engineer registers them with their tag, area,
          sample period and the names and units of their inputs, states and outputs.
        </p>
        <p>
          Opening a loop will show its trend of measured against predicted signals with the residual
          band, the twin&apos;s forecast, its alerts, its drift rules and its log.
        </p>
      </EmptyState>
    </div>
  );
}
