import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';

export function ModelsPage() {
  return (
    <div>
      <PageHeader
        title="Models"
        description="Model versions per loop: drafts, versions in review, and the active version each twin runs."
      />
      <EmptyState title="No model versions yet">
        <p>
          The registry of model versions will appear here once loops are registered. Control
          engineers will add a version by entering or uploading the A and B (and C and D) matrices, or
          a continuous model with a sample period.
        </p>
        <p>
          Each version will carry its analysis (eigenvalues, time constants, step response,
          steady-state gain) and go through review by a second engineer before it can be activated.
        </p>
      </EmptyState>
    </div>
  );
}
