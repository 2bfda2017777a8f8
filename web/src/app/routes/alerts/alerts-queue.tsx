import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useSearchParams } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { EmptyState } from '../../../components/ui/empty-state';
import { AckLinkBanner } from '../../../features/alerts/components/ack-link-banner';
import { AlertsTable } from '../../../features/alerts/components/alerts-table';
import { BulkAcknowledge } from '../../../features/alerts/components/bulk-acknowledge';
import { QueueFilters } from '../../../features/alerts/components/queue-filters';
import { alertsQueryOptions } from '../../../features/alerts/api/get-alerts';
import { usePlantTimeZone } from '../../../features/alerts/hooks/use-plant-time-zone';
import { orderAlerts } from '../../../features/alerts/utils/alert-order';
import { isWaiting } from '../../../features/alerts/utils/alert-words';
import { queueFilters, readQueueSearch, writeQueueSearch } from '../../../features/alerts/utils/queue-search';
import { areasQueryOptions } from '../../../features/loops/api/get-areas';
import { loopsQueryOptions } from '../../../features/loops/api/get-loops';
import { hasRole } from '../../../features/session/roles';
import { useSignedInUser } from '../../../features/session/use-signed-in-user';
import { useNow } from '../../../lib/use-now';

function NoAlerts({ filtered }: { filtered: boolean }) {
  if (filtered) {
    return (
      <EmptyState title="No alert matches these filters">
        <p>Choose “Every state, closed too”, another area or loop, or a wider time range to see more alerts.</p>
      </EmptyState>
    );
  }
  return (
    <EmptyState title="No open alerts">
      <p>
        An alert appears here, without reloading, when a loop&apos;s residuals break one of its drift rules: the band,
        the CUSUM, the chi-square test on the innovation, or no readings for too long. The primary on call is e-mailed
        at the same time.
      </p>
      <p>Loops need an active model version running as a twin, and drift rules on their Rules tab, to raise alerts.</p>
    </EmptyState>
  );
}

function useSelection() {
  const [selected, setSelected] = useState<ReadonlySet<string>>(new Set());
  return {
    selected,
    onToggle: (id: string) =>
      setSelected((old) => {
        const next = new Set(old);
        if (!next.delete(id)) next.add(id);
        return next;
      }),
    onToggleAll: (ids: string[], select: boolean) =>
      setSelected((old) => {
        const next = new Set(old);
        ids.forEach((id) => (select ? next.add(id) : next.delete(id)));
        return next;
      }),
    clear: () => setSelected(new Set()),
  };
}

export function AlertsQueuePage() {
  const user = useSignedInUser();
  const mayAcknowledge = hasRole(user, 'oncall');
  const [params, setParams] = useSearchParams();
  const search = readQueueSearch(params);
  const nowMs = useNow(30_000);
  const filters = queueFilters(search, Math.floor(nowMs / 60_000) * 60_000);
  const alerts = useQuery(alertsQueryOptions(filters));
  const areas = useQuery(areasQueryOptions());
  const loops = useQuery(loopsQueryOptions());
  const timeZone = usePlantTimeZone();
  const selection = useSelection();
  const selectedIds = (alerts.data ?? [])
    .filter((alert) => isWaiting(alert.state) && selection.selected.has(alert.id))
    .map((alert) => alert.id);

  return (
    <div className="space-y-4">
      <AckLinkBanner />
      <QueueFilters
        search={search}
        areas={areas.data ?? []}
        loops={loops.data ?? []}
        timeZone={timeZone}
        onChange={(next) => setParams(writeQueueSearch(next), { replace: true })}
      />
      {mayAcknowledge ? (
        <BulkAcknowledge selectedIds={selectedIds} alerts={alerts.data ?? []} onDone={selection.clear} />
      ) : (
        <p className="text-sm text-ink/75">Acknowledging, shelving and closing alerts needs the on-call role.</p>
      )}
      {alerts.isError ? (
        <ErrorNotice error={alerts.error} onRetry={() => void alerts.refetch()} />
      ) : alerts.data?.length === 0 ? (
        <NoAlerts filtered={writeQueueSearch(search).toString() !== ''} />
      ) : (
        <AlertsTable
          caption={
            search.order === 'newest'
              ? 'Alerts, newest first'
              : 'Alerts, most urgent first: waiting for acknowledgement, then by priority'
          }
          alerts={alerts.data && orderAlerts(alerts.data, search.order)}
          timeZone={timeZone}
          nowMs={nowMs}
          selection={mayAcknowledge ? selection : undefined}
        />
      )}
      {alerts.data && alerts.data.length >= (filters.limit ?? Infinity) ? (
        <p className="text-sm text-ink/75">
          {search.order === 'urgent' ? `The ${filters.limit} most urgent` : `The newest ${filters.limit}`} alerts are
          shown. Narrow the filters to find the others.
        </p>
      ) : null}
    </div>
  );
}
