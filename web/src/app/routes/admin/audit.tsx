import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { PageHeader } from '../../../components/ui/page-header';
import { auditLogQueryOptions, parseAuditSearch } from '../../../features/audit/api/get-audit-log';
import { AuditFilterForm } from '../../../features/audit/components/audit-filter-form';
import { AuditLogTable } from '../../../features/audit/components/audit-log-table';
import { AuditPager } from '../../../features/audit/components/audit-pager';

export function AdminAuditPage() {
  const [searchParams, setSearchParams] = useSearchParams();
  const query = parseAuditSearch(searchParams);
  const audit = useQuery(auditLogQueryOptions(query));

  const showPage = (page: number, action = query.action) => {
    const next = new URLSearchParams();
    if (action) next.set('action', action);
    if (page > 1) next.set('page', String(page));
    setSearchParams(next);
  };

  return (
    <div className="space-y-3">
      <PageHeader
        title="Audit log"
        description="Who changed what in Shadowloop and when, newest first."
      />
      <AuditFilterForm key={query.action} action={query.action} onApply={(action) => showPage(1, action)} />
      {audit.isError ? (
        <ErrorNotice error={audit.error} onRetry={() => void audit.refetch()} />
      ) : (
        <>
          <AuditLogTable entries={audit.data?.items} loading={audit.isPending} filtered={query.action !== ''} />
          <AuditPager
            offset={query.offset}
            limit={query.limit}
            shown={audit.data?.items.length ?? 0}
            total={audit.data?.total ?? 0}
            loading={audit.isPending}
            onPage={(page) => showPage(page)}
          />
        </>
      )}
    </div>
  );
}
