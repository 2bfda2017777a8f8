import { PageHeader } from '../../../components/ui/page-header';
import { AuditLogView } from '../../../features/audit/components/audit-log-view';

export function ModelsAuditPage() {
  return (
    <div>
      <PageHeader
        title="Audit log"
        description="Who registered and changed loops, and who wrote, submitted, approved, rejected, activated and retired each model version — newest first."
      />
      <AuditLogView />
    </div>
  );
}
