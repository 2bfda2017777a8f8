import { Link } from 'react-router';
import { formatAgo } from '../../../lib/format-time';
import { useNow } from '../../../lib/use-now';
import { useWaitingAlerts, WAITING_QUEUE_PATH } from '../hooks/use-waiting-alerts';
import { orderAlerts } from '../utils/alert-order';
import { RULE_WORDS } from '../utils/alert-words';

/** Under the top strip for on-call users while any alert waits for acknowledgement. */
export function WaitingAlertsBanner() {
  const waiting = useWaitingAlerts(true);
  useNow(30_000);
  const alerts = waiting.data ?? [];
  if (alerts.length === 0) return null;
  // the one to look at first: still active before cleared, then by priority
  const first = orderAlerts(alerts, 'urgent')[0];
  const count = alerts.length;
  return (
    <div
      role="status"
      aria-label="Alerts waiting for acknowledgement"
      className="col-span-2 flex flex-wrap items-center gap-x-3 gap-y-1 border-b border-diverged/40 border-l-8 border-l-diverged bg-panel px-4 py-1.5 text-sm"
    >
      <span className="font-bold">{count === 1 ? '1 alert waits' : `${count} alerts wait`} for acknowledgement</span>
      <span>
        — most urgent:{' '}
        <Link to={`/alerts/${first.id}`} className="font-medium underline">
          {first.loopTag} {RULE_WORDS[first.rule]}
        </Link>
        , {first.active ? 'active' : 'cleared'}, raised {formatAgo(first.raisedAt)}
      </span>
      <Link to={WAITING_QUEUE_PATH} className="ml-auto underline">
        Open the waiting alerts
      </Link>
    </div>
  );
}
