import { PageHeader } from '../../../components/ui/page-header';
import { CreateIngestSourceForm } from '../../../features/ingest-sources/components/create-ingest-source-form';
import { IngestSourceTable } from '../../../features/ingest-sources/components/ingest-source-table';

export function AdminIngestSourcesPage() {
  return (
    <div className="space-y-4">
      <PageHeader
        title="Ingest sources"
        description="The plant bridges allowed to post readings, each with its own token and the loops it may post for. Revoke a source's token when the bridge is retired or the token may have leaked."
      />
      <IngestSourceTable />
      <CreateIngestSourceForm />
    </div>
  );
}
