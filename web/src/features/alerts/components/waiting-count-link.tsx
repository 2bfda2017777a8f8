import { Link } from 'react-router';
import { useWaitingAlerts, WAITING_QUEUE_PATH } from '../hooks/use-waiting-alerts';

/** For on-call users: how many alerts wait for acknowledgement, linking to them. */
export function WaitingCountLink() {
  const waiting = useWaitingAlerts(true);
  const count = waiting.data?.length;
  const label =
    count === undefined ? 'Unacknowledged alerts: …' : `${count} unacknowledged ${count === 1 ? 'alert' : 'alerts'}`;
  return (
    <Link
      to={WAITING_QUEUE_PATH}
      className={`rounded-sm border px-2 py-0.5 text-sm tabular-nums hover:underline ${
        count ? 'border-diverged font-bold text-diverged' : 'border-rule text-ink/80'
      }`}
    >
      {label}
    </Link>
  );
}
