import { useQuery } from '@tanstack/react-query';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { isApiError } from '../../../lib/api';
import { usePlantTimestamp } from '../../alerts/hooks/use-plant-time-zone';
import { devMailQueryOptions, type CapturedMail } from '../api/get-dev-mail';

function MailItem({ mail }: { mail: CapturedMail }) {
  const formatTimestamp = usePlantTimestamp();
  return (
    <li className="rounded-sm border border-rule bg-panel">
      <details>
        <summary className="flex cursor-pointer flex-wrap gap-x-4 px-3 py-2 text-sm">
          <span className="tabular-nums text-ink/75">{formatTimestamp(mail.receivedAt)}</span>
          <span>To {mail.to}</span>
          <span className="font-bold">{mail.subject}</span>
        </summary>
        <pre className="overflow-x-auto border-t border-rule px-3 py-2 text-xs whitespace-pre-wrap">{mail.text}</pre>
      </details>
    </li>
  );
}

export function DevMailbox() {
  const mail = useQuery(devMailQueryOptions());

  if (mail.isError && isApiError(mail.error) && mail.error.status === 404) {
    return (
      <EmptyState title="The local mail server is not in use">
        <p>
          This Shadowloop sends its e-mail through the site&apos;s mail server, so there is no development mailbox to
          show. Check delivery in the site&apos;s own mail system.
        </p>
      </EmptyState>
    );
  }
  if (mail.isError) return <ErrorNotice error={mail.error} onRetry={() => void mail.refetch()} />;
  if (mail.isPending) {
    return (
      <p role="status" className="h-24 text-sm text-ink/75">
        Loading captured mail…
      </p>
    );
  }
  const newestFirst = [...mail.data].sort((a, b) => Date.parse(b.receivedAt) - Date.parse(a.receivedAt));
  return (
    <div className="space-y-2">
      <div className="flex items-center justify-between text-sm">
        <p className="tabular-nums">{mail.data.length} messages captured, newest first</p>
        <Button onClick={() => void mail.refetch()} disabled={mail.isFetching}>
          {mail.isFetching ? 'Refreshing…' : 'Refresh'}
        </Button>
      </div>
      {newestFirst.length === 0 ? (
        <EmptyState title="No mail captured yet">
          <p>Messages Shadowloop sends, such as alert e-mails to the on-call engineer, will appear here.</p>
        </EmptyState>
      ) : (
        <ul className="space-y-1.5">
          {newestFirst.map((item, index) => (
            <MailItem key={`${item.receivedAt}-${index}`} mail={item} />
          ))}
        </ul>
      )}
    </div>
  );
}
