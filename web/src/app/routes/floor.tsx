import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';

export function FloorPage() {
  return (
    <div>
      <PageHeader
        title="Floor"
        description="Every loop at a glance: tracking status, measured against predicted, and how much of the residual band is used."
      />
      <EmptyState title="No loops on the floor yet">
        <p>
          Each registered loop will appear here as a tile once a control engineer registers it and
          activates a model version.
        </p>
        <p>
          A tile will show the loop&apos;s tag and name, its tracking status in words and colour, a
          short trend of the main output measured against the twin&apos;s prediction, and how recently
          the last reading arrived.
        </p>
      </EmptyState>
    </div>
  );
}
