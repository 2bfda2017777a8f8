import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { auditLogQueryOptions, auditQueryFor } from '../../../features/audit/api/get-audit-log';
import { AuditLogTable } from '../../../features/audit/components/audit-log-table';
import { AuditPager } from '../../../features/audit/components/audit-pager';
import { useLoopOfPage } from './loop-layout';

export function LoopLogTab() {
  const loop = useLoopOfPage();
  const [page, setPage] = useState(1);
  const query = auditQueryFor('loop', loop.id, page);
  const audit = useQuery(auditLogQueryOptions(query));

  if (audit.isError) return <ErrorNotice error={audit.error} onRetry={() => void audit.refetch()} />;
  return (
    <section aria-label="Log" className="space-y-3">
      <p className="text-sm text-ink/75">
        Who registered and changed {loop.tag}, and every step of its model versions, newest first. Shift notes will join
        these entries.
      </p>
      <AuditLogTable entries={audit.data?.items} loading={audit.isPending} filtered={false} />
      <AuditPager
        offset={query.offset}
        limit={query.limit}
        shown={audit.data?.items.length ?? 0}
        total={audit.data?.total ?? 0}
        loading={audit.isPending}
        onPage={setPage}
      />
    </section>
  );
}
