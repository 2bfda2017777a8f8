import { PageHeader } from '../../../components/ui/page-header';
import { AuditLogView } from '../../../features/audit/components/audit-log-view';

export function AdminAuditPage() {
  return (
    <div>
      <PageHeader title="Audit log" description="Who changed what in Shadowloop and when, newest first." />
      <AuditLogView />
    </div>
  );
}
