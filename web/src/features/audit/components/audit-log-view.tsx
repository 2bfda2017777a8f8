import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { auditLogQueryOptions, parseAuditSearch } from '../api/get-audit-log';
import { AuditFilterForm } from './audit-filter-form';
import { AuditLogTable } from './audit-log-table';
import { AuditPager } from './audit-pager';

/** The audit log with its action filter and pages, kept in the address so a view can be shared. */
export function AuditLogView() {
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
