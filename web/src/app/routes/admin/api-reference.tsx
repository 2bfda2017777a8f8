import { PageHeader } from '../../../components/ui/page-header';
import { ApiReference } from '../../../features/api-reference/components/api-reference';

export function AdminApiReferencePage() {
  return (
    <div>
      <PageHeader
        title="API"
        description="Every request Shadowloop answers, read from the api's own OpenAPI document, grouped by topic."
      />
      <ApiReference />
    </div>
  );
}
